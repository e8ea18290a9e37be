import type { Knex } from "knex";

// Revisions never change once written (analyses and results point at them): a trigger refuses any UPDATE of their
// content, so even a mistaken query cannot rewrite history. definition is the source-level model (shared/engine/rules ModelDefinition).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("model_revisions", (t) => {
    t.uuid("id").primary({ constraintName: "model_revisions_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("model_id")
      .notNullable()
      .references("id")
      .inTable("models")
      .onDelete("CASCADE")
      .withKeyName("model_revisions_model_id_fkey");
    t.integer("revision").notNullable();
    t.jsonb("definition").notNullable();
    t.text("rule_text").notNullable();
    t.jsonb("network_summary").notNullable();
    t.integer("node_count").notNullable();
    t.text("source").notNullable();
    t.jsonb("generator");
    t.text("message").notNullable().defaultTo("");
    t.uuid("created_by")
      .references("id")
      .inTable("users")
      .onDelete("SET NULL")
      .withKeyName("model_revisions_created_by_fkey");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["model_id", "revision"], { indexName: "model_revisions_model_id_revision_key" });
  });
  await knex.raw(`alter table model_revisions
    add constraint model_revisions_revision_check check (revision >= 1),
    add constraint model_revisions_node_count_check check (node_count >= 1),
    add constraint model_revisions_source_check check (source in ('rules', 'sbml', 'csv', 'generator', 'edit')),
    add constraint model_revisions_message_check check (char_length(message) <= 500)`);
  await knex.raw(`create function model_revisions_refuse_update() returns trigger language plpgsql as $$
    begin
      -- Only the author link may change, and only because deleting a user sets it to null.
      if (new.id, new.model_id, new.revision, new.definition, new.rule_text, new.network_summary, new.node_count,
          new.source, new.generator, new.message, new.created_at)
         is distinct from (old.id, old.model_id, old.revision, old.definition, old.rule_text, old.network_summary,
          old.node_count, old.source, old.generator, old.message, old.created_at) then
        raise exception 'model revisions are immutable; write a new revision' using errcode = '55000';
      end if;
      return new;
    end $$`);
  await knex.raw(`create trigger model_revisions_immutable before update on model_revisions
    for each row execute function model_revisions_refuse_update()`);
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
