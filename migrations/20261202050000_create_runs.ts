import type { Knex } from "knex";

// A run is our record of one analysis: who asked for what, where it stands, and its stored result. The queue job
// (pg-boss) only carries ids; everything a person sees lives here. Succeeded results are reused by
// (project, kind, revision, params hash), hence the partial unique index.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("runs", (t) => {
    t.uuid("id").primary({ constraintName: "runs_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("project_id")
      .notNullable()
      .references("id")
      .inTable("projects")
      .onDelete("CASCADE")
      .withKeyName("runs_project_fkey");
    // A stored result belongs to its revision: it goes when the revision goes.
    t.uuid("model_revision_id")
      .nullable()
      .references("id")
      .inTable("model_revisions")
      .onDelete("CASCADE")
      .withKeyName("runs_model_revision_fkey");
    t.text("kind").notNullable();
    t.jsonb("params").notNullable();
    t.text("params_hash").notNullable();
    t.uuid("started_by")
      .nullable()
      .references("id")
      .inTable("users")
      .onDelete("SET NULL")
      .withKeyName("runs_started_by_fkey");
    t.text("state").notNullable().defaultTo("queued");
    t.double("progress_fraction").notNullable().defaultTo(0);
    t.text("progress_phase").notNullable().defaultTo("queued");
    t.integer("shard_count").notNullable().defaultTo(1);
    t.integer("time_limit_seconds").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("started_at", { useTz: true }).nullable();
    t.timestamp("finished_at", { useTz: true }).nullable();
    t.jsonb("result").nullable();
    t.jsonb("error").nullable();
    t.integer("attempt").notNullable().defaultTo(1);
    t.check("state in ('queued','running','succeeded','failed','cancelled')", [], "runs_state_check");
    t.check("progress_fraction >= 0 and progress_fraction <= 1", [], "runs_progress_fraction_check");
    t.index(["project_id", "created_at"], "runs_project_created_idx");
  });
  await knex.raw(
    `create unique index runs_reuse_key on runs (project_id, kind, coalesce(model_revision_id, '00000000-0000-0000-0000-000000000000'::uuid), params_hash) where state = 'succeeded'`,
  );

  // One row per shard. The checkpoint (cursor + partial) is written together so a resumed shard never counts an
  // item twice; the lease and heartbeat say which worker holds it and whether that worker is still alive.
  await knex.schema.createTable("run_shards", (t) => {
    t.uuid("id").primary({ constraintName: "run_shards_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("run_id")
      .notNullable()
      .references("id")
      .inTable("runs")
      .onDelete("CASCADE")
      .withKeyName("run_shards_run_fkey");
    t.integer("shard_index").notNullable();
    t.jsonb("input").notNullable();
    t.text("state").notNullable().defaultTo("queued");
    t.jsonb("cursor").nullable();
    t.jsonb("partial").nullable();
    t.double("progress_fraction").notNullable().defaultTo(0);
    t.text("progress_phase").nullable();
    t.uuid("lease").nullable();
    /** host:pid of the worker holding the lease, for operators (and tests) to see who computes what. */
    t.text("held_by").nullable();
    t.timestamp("heartbeat_at", { useTz: true }).nullable();
    t.text("boss_job_id").nullable();
    t.timestamp("queued_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.integer("claims").notNullable().defaultTo(0);
    t.timestamp("completed_at", { useTz: true }).nullable();
    t.unique(["run_id", "shard_index"], { indexName: "run_shards_run_index_key" });
    t.check("state in ('queued','running','done')", [], "run_shards_state_check");
  });

  await knex.schema.createTable("notifications", (t) => {
    t.uuid("id").primary({ constraintName: "notifications_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("user_id")
      .notNullable()
      .references("id")
      .inTable("users")
      .onDelete("CASCADE")
      .withKeyName("notifications_user_fkey");
    t.text("kind").notNullable();
    t.text("title").notNullable();
    t.text("body").notNullable();
    t.text("link").nullable();
    t.uuid("run_id")
      .nullable()
      .references("id")
      .inTable("runs")
      .onDelete("SET NULL")
      .withKeyName("notifications_run_fkey");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("read_at", { useTz: true }).nullable();
    t.index(["user_id", "created_at"], "notifications_user_created_idx");
  });
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
