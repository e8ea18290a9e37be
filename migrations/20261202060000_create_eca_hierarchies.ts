import type { Knex } from "knex";

// Computed block-emulation hierarchies of the elementary cellular automata, one row per parameter set (largest block
// size, time-scale mode, emulator radius), reused by every later request; the relation itself lives one row per
// (emulator, emulated) pair so a rule page reads only its own pairs. Rows are written whole, in one transaction.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("eca_hierarchies", (t) => {
    t.uuid("id").primary({ constraintName: "eca_hierarchies_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.smallint("max_block").notNullable();
    t.text("time_mode").notNullable();
    t.smallint("radius").notNullable().defaultTo(1);
    t.jsonb("emulate_nothing").notNullable().defaultTo("[]");
    t.integer("pair_count").notNullable();
    t.timestamp("computed_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.integer("duration_ms").notNullable();
    t.uuid("computed_by")
      .references("id")
      .inTable("users")
      .onDelete("SET NULL")
      .withKeyName("eca_hierarchies_computed_by_fkey");
    // The background run that produced the row, when there was one (no foreign key: runs are deleted independently).
    t.uuid("run_id");
    t.unique(["max_block", "time_mode", "radius"], { indexName: "eca_hierarchies_parameters_key" });
  });
  await knex.raw(`alter table eca_hierarchies
    add constraint eca_hierarchies_max_block_check check (max_block between 1 and 20),
    add constraint eca_hierarchies_time_mode_check check (time_mode in ('block', 'any')),
    add constraint eca_hierarchies_radius_check check (radius between 1 and 4),
    add constraint eca_hierarchies_pair_count_check check (pair_count >= 0),
    add constraint eca_hierarchies_duration_ms_check check (duration_ms >= 0),
    add constraint eca_hierarchies_emulate_nothing_check check (jsonb_typeof(emulate_nothing) = 'array')`);

  await knex.schema.createTable("eca_hierarchy_pairs", (t) => {
    t.uuid("hierarchy_id")
      .notNullable()
      .references("id")
      .inTable("eca_hierarchies")
      .onDelete("CASCADE")
      .withKeyName("eca_hierarchy_pairs_hierarchy_id_fkey");
    t.integer("source").notNullable();
    t.smallint("target").notNullable();
    t.smallint("min_block").notNullable();
    // { time, encoding: { "0": u0, "1": u1 } }: words leftmost cell first, as the engine prints them.
    t.jsonb("witness").notNullable();
    t.primary(["hierarchy_id", "source", "target"], { constraintName: "eca_hierarchy_pairs_pkey" });
    t.index(["hierarchy_id", "target"], "eca_hierarchy_pairs_target_index");
  });
  await knex.raw(`alter table eca_hierarchy_pairs
    add constraint eca_hierarchy_pairs_source_check check (source >= 0),
    add constraint eca_hierarchy_pairs_target_check check (target between 0 and 255),
    add constraint eca_hierarchy_pairs_min_block_check check (min_block >= 1),
    add constraint eca_hierarchy_pairs_witness_check check (jsonb_typeof(witness) = 'object')`);
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
