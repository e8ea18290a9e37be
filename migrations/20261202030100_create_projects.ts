import type { Knex } from "knex";

// A project groups models, runs and reductions under one membership list. Archived projects stay readable.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("projects", (t) => {
    t.uuid("id").primary({ constraintName: "projects_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.text("name").notNullable();
    t.text("description").notNullable().defaultTo("");
    t.timestamp("archived_at", { useTz: true });
    t.uuid("created_by").references("id").inTable("users").onDelete("SET NULL").withKeyName("projects_created_by_fkey");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`alter table projects
    add constraint projects_name_check check (char_length(btrim(name)) between 1 and 120),
    add constraint projects_description_check check (char_length(description) <= 2000)`);
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
