import type { Knex } from "knex";

// People who sign in. E-mail is stored lower-cased so the unique constraint is case-insensitive; session_version
// is bumped when the password changes so that older session tokens stop working.
export async function up(knex: Knex): Promise<void> {
  await knex.raw("create extension if not exists pgcrypto");
  await knex.schema.createTable("users", (t) => {
    t.uuid("id").primary({ constraintName: "users_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.text("email").notNullable().unique({ indexName: "users_email_key" });
    t.text("display_name").notNullable();
    t.text("password_hash").notNullable();
    t.text("site_role").notNullable().defaultTo("member");
    t.integer("session_version").notNullable().defaultTo(1);
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`alter table users
    add constraint users_email_lower_check check (email = lower(email) and char_length(email) between 3 and 254),
    add constraint users_display_name_check check (char_length(display_name) between 1 and 120),
    add constraint users_site_role_check check (site_role in ('admin', 'member'))`);
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
