import type { Knex } from "knex";

// Server-side sessions: the signed token names a row here, so signing out ends the session for every copy of the
// token, not only for the browser whose cookie is cleared. A pending sign-up waits here until the address's owner
// opens the link mailed to it, so sign-up answers alike whether or not the address already has an account.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("sessions", (t) => {
    t.uuid("id").primary({ constraintName: "sessions_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("user_id")
      .notNullable()
      .references("id")
      .inTable("users")
      .onDelete("CASCADE")
      .withKeyName("sessions_user_fkey");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("expires_at", { useTz: true }).notNullable();
    t.timestamp("ended_at", { useTz: true }).nullable();
    t.index(["user_id"], "sessions_user_idx");
  });
  await knex.schema.createTable("sign_up_requests", (t) => {
    t.uuid("id").primary({ constraintName: "sign_up_requests_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.text("email").notNullable();
    t.text("display_name").notNullable();
    t.text("password_hash").notNullable();
    t.text("token_hash").notNullable().unique({ indexName: "sign_up_requests_token_key" });
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("expires_at", { useTz: true }).notNullable();
    t.timestamp("used_at", { useTz: true }).nullable();
  });
}

export async function down(): Promise<void> {
  throw new Error("migrations are forward-only");
}
