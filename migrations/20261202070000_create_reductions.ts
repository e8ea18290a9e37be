import type { Knex } from "knex";

// A reduction is one proven statement "source revision emulates / embeds into / coarse-grains onto target": the
// certificate is self-contained (both networks and the witness), so it can be re-verified without any other row.
// target_revision_id is set only when the target is a model of the project (given-target searches, or a discovered
// target saved as a model); only approved reductions between stored models enter the model hierarchy.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("reductions", (t) => {
    t.uuid("id").primary({ constraintName: "reductions_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("project_id")
      .notNullable()
      .references("id")
      .inTable("projects")
      .onDelete("CASCADE")
      .withKeyName("reductions_project_fkey");
    t.uuid("source_revision_id")
      .notNullable()
      .references("id")
      .inTable("model_revisions")
      .onDelete("CASCADE")
      .withKeyName("reductions_source_revision_fkey");
    t.uuid("target_revision_id")
      .nullable()
      .references("id")
      .inTable("model_revisions")
      .onDelete("SET NULL")
      .withKeyName("reductions_target_revision_fkey");
    t.text("notion").notNullable();
    t.integer("time_scale").notNullable();
    t.integer("target_node_count").notNullable();
    t.text("target_key").notNullable();
    t.jsonb("certificate").notNullable();
    t.jsonb("summary").notNullable();
    t.uuid("found_by")
      .nullable()
      .references("id")
      .inTable("users")
      .onDelete("SET NULL")
      .withKeyName("reductions_found_by_fkey");
    t.uuid("found_in_run_id")
      .nullable()
      .references("id")
      .inTable("runs")
      .onDelete("SET NULL")
      .withKeyName("reductions_found_in_run_fkey");
    t.text("review_state").notNullable().defaultTo("proposed");
    t.uuid("decided_by")
      .nullable()
      .references("id")
      .inTable("users")
      .onDelete("SET NULL")
      .withKeyName("reductions_decided_by_fkey");
    t.timestamp("decided_at", { useTz: true }).nullable();
    t.jsonb("last_verification").nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("notion in ('block-emulation','dynamical-embedding','coarse-graining')", [], "reductions_notion_check");
    t.check("review_state in ('proposed','approved','rejected')", [], "reductions_review_state_check");
    t.check("time_scale >= 1", [], "reductions_time_scale_check");
    t.index(["project_id", "created_at"], "reductions_project_created_idx");
  });
  // The same statement found twice (e.g. by two searches) is stored once.
  await knex.raw(`create unique index reductions_statement_key on reductions
    (project_id, source_revision_id, notion, time_scale, target_key)`);

  await knex.schema.createTable("reduction_events", (t) => {
    t.uuid("id").primary({ constraintName: "reduction_events_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("reduction_id")
      .notNullable()
      .references("id")
      .inTable("reductions")
      .onDelete("CASCADE")
      .withKeyName("reduction_events_reduction_fkey");
    t.uuid("actor_id")
      .nullable()
      .references("id")
      .inTable("users")
      .onDelete("SET NULL")
      .withKeyName("reduction_events_actor_fkey");
    t.text("kind").notNullable();
    t.text("comment").notNullable().defaultTo("");
    t.jsonb("outcome").nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("kind in ('approve','reject','verify','reopen')", [], "reduction_events_kind_check");
    t.check("char_length(comment) <= 4000", [], "reduction_events_comment_check");
    t.index(["reduction_id", "created_at"], "reduction_events_reduction_idx");
  });

  await knex.schema.createTable("reduction_comments", (t) => {
    t.uuid("id").primary({ constraintName: "reduction_comments_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("reduction_id")
      .notNullable()
      .references("id")
      .inTable("reductions")
      .onDelete("CASCADE")
      .withKeyName("reduction_comments_reduction_fkey");
    t.uuid("parent_id")
      .nullable()
      .references("id")
      .inTable("reduction_comments")
      .onDelete("CASCADE")
      .withKeyName("reduction_comments_parent_fkey");
    t.uuid("author_id")
      .nullable()
      .references("id")
      .inTable("users")
      .onDelete("SET NULL")
      .withKeyName("reduction_comments_author_fkey");
    t.text("body").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("char_length(btrim(body)) between 1 and 4000", [], "reduction_comments_body_check");
    t.index(["reduction_id", "created_at"], "reduction_comments_reduction_idx");
  });
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
