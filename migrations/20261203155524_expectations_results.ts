import type { Knex } from "knex";

// What checking one revision against one expectation gave. A result keeps the hash of the expectation body it
// checked, so an edited expectation never shows a result about its former text; results are never updated.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("expectation_results", (t) => {
    t.uuid("id").primary({ constraintName: "expectation_results_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("expectation_id")
      .notNullable()
      .references("id")
      .inTable("expectations")
      .onDelete("CASCADE")
      .withKeyName("expectation_results_expectation_id_fkey");
    t.uuid("revision_id")
      .notNullable()
      .references("id")
      .inTable("model_revisions")
      .onDelete("CASCADE")
      .withKeyName("expectation_results_revision_id_fkey");
    t.uuid("run_id")
      .references("id")
      .inTable("runs")
      .onDelete("SET NULL")
      .withKeyName("expectation_results_run_id_fkey");
    t.text("body_hash").notNullable();
    t.text("status").notNullable();
    t.text("method").notNullable();
    t.text("detail").notNullable();
    t.text("reason");
    /** Failed here while the latest earlier checked revision passed the same expectation. */
    t.boolean("broke").notNullable().defaultTo(false);
    t.timestamp("checked_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["expectation_id", "revision_id", "checked_at"], "expectation_results_lookup_idx");
  });
  await knex.raw(`alter table expectation_results
    add constraint expectation_results_status_check check (status in ('pass', 'fail', 'undecided'))`);
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
