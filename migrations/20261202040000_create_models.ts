import type { Knex } from "knex";

// A model is a named line of immutable revisions inside a project; latest_revision points at the newest one so
// lists need no aggregate. Deleting a project deletes its models.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("models", (t) => {
    t.uuid("id").primary({ constraintName: "models_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("project_id")
      .notNullable()
      .references("id")
      .inTable("projects")
      .onDelete("CASCADE")
      .withKeyName("models_project_id_fkey");
    t.text("name").notNullable();
    t.text("description").notNullable().defaultTo("");
    t.integer("latest_revision").notNullable().defaultTo(1);
    t.uuid("created_by").references("id").inTable("users").onDelete("SET NULL").withKeyName("models_created_by_fkey");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["project_id", "updated_at"], "models_project_id_updated_at_idx");
  });
  await knex.raw(`alter table models
    add constraint models_name_check check (char_length(btrim(name)) between 1 and 120),
    add constraint models_description_check check (char_length(description) <= 2000),
    add constraint models_latest_revision_check check (latest_revision >= 1)`);
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
