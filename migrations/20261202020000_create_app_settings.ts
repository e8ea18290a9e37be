import type { Knex } from "knex";

// Key/value settings that belong to the installation rather than to a project (e.g. the demo seed version).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("app_settings", (t) => {
    t.text("key").primary({ constraintName: "app_settings_pkey" });
    t.jsonb("value").notNullable();
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
