import type { Knex } from "knex";

// Invitations by e-mail. Only a SHA-256 hash of the token is stored, so a database leak does not leak usable links.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("invitations", (t) => {
    t.uuid("id").primary({ constraintName: "invitations_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("project_id")
      .notNullable()
      .references("id")
      .inTable("projects")
      .onDelete("CASCADE")
      .withKeyName("invitations_project_id_fkey");
    t.text("email").notNullable();
    t.text("role").notNullable();
    t.text("token_hash").notNullable().unique({ indexName: "invitations_token_hash_key" });
    t.uuid("invited_by")
      .references("id")
      .inTable("users")
      .onDelete("SET NULL")
      .withKeyName("invitations_invited_by_fkey");
    t.timestamp("expires_at", { useTz: true }).notNullable();
    t.timestamp("accepted_at", { useTz: true });
    t.uuid("accepted_by")
      .references("id")
      .inTable("users")
      .onDelete("SET NULL")
      .withKeyName("invitations_accepted_by_fkey");
    t.timestamp("revoked_at", { useTz: true });
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["project_id"], "invitations_project_id_index");
  });
  await knex.raw(`alter table invitations
    add constraint invitations_role_check check (role in ('owner', 'modeler', 'reviewer', 'viewer')),
    add constraint invitations_email_check check (email = lower(email) and char_length(email) between 3 and 254)`);
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
