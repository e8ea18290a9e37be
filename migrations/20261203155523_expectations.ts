import type { Knex } from "knex";

// A model's expectations: observations every revision must reproduce (shared/engine/expectations). `key` is the
// expectation's id in the CSV table, unique within the model; `body` holds update, condition and outcome as the
// engine reads them. body_hash lets a result name the exact text it checked.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("expectations", (t) => {
    t.uuid("id").primary({ constraintName: "expectations_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("model_id")
      .notNullable()
      .references("id")
      .inTable("models")
      .onDelete("CASCADE")
      .withKeyName("expectations_model_id_fkey");
    t.text("key").notNullable();
    t.jsonb("body").notNullable();
    t.text("body_hash").notNullable();
    t.text("source").notNullable();
    t.text("note").notNullable().defaultTo("");
    t.uuid("created_by")
      .references("id")
      .inTable("users")
      .onDelete("SET NULL")
      .withKeyName("expectations_created_by_fkey");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["model_id", "key"], { indexName: "expectations_model_id_key_key" });
  });
  await knex.raw(`alter table expectations
    add constraint expectations_key_check check (key ~ '^[A-Za-z0-9][A-Za-z0-9_.-]{0,63}$'),
    add constraint expectations_source_check check (char_length(btrim(source)) between 1 and 1000),
    add constraint expectations_note_check check (char_length(note) <= 2000)`);
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
