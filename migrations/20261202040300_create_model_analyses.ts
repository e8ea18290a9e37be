import type { Knex } from "knex";

// Analysis results cached per revision: a revision never changes, so a result computed once stays true.
// params_key distinguishes variants of one kind (e.g. which perturbation); results are plain JSON.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("model_analyses", (t) => {
    t.uuid("id").primary({ constraintName: "model_analyses_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("revision_id")
      .notNullable()
      .references("id")
      .inTable("model_revisions")
      .onDelete("CASCADE")
      .withKeyName("model_analyses_revision_id_fkey");
    t.text("kind").notNullable();
    t.text("params_key").notNullable().defaultTo("");
    t.jsonb("result").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["revision_id", "kind", "params_key"], { indexName: "model_analyses_revision_id_kind_params_key_key" });
  });
  await knex.raw(`alter table model_analyses add constraint model_analyses_kind_check check (kind in ('synchronous'))`);
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
