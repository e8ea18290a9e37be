// Stored block-emulation hierarchies: one row per parameter set, the relation one row per pair. A hierarchy is
// written whole in one transaction, so a reader sees either none or all of it.
import type { Knex } from "knex";
import type {
  HierarchyPair,
  HierarchyPairWithWitness,
  HierarchySummary,
  TimeMode,
  Witness,
} from "@shared/schemas/automata";

export interface HierarchyKey {
  maxBlock: number;
  timeMode: TimeMode;
  radius: number;
}

export interface HierarchyRecord extends HierarchyKey {
  pairs: HierarchyPairWithWitness[];
  emulateNothing: number[];
  durationMs: number;
  computedBy: string | null;
  runId?: string | null;
}

interface HierarchyRow {
  id: string;
  max_block: number;
  time_mode: TimeMode;
  radius: number;
  pair_count: number;
  emulate_nothing: number[];
  computed_at: Date;
  duration_ms: number;
  computed_by: string | null;
  computed_by_name: string | null;
  run_id: string | null;
}

interface PairRow {
  source: number;
  target: number;
  min_block: number;
  witness: Witness;
}

export interface StoredHierarchy extends HierarchySummary {
  emulateNothing: number[];
}

function toSummary(row: HierarchyRow): StoredHierarchy {
  return {
    id: row.id,
    maxBlock: row.max_block,
    timeMode: row.time_mode,
    radius: row.radius,
    pairCount: row.pair_count,
    computedAt: row.computed_at.toISOString(),
    durationMs: row.duration_ms,
    computedBy: row.computed_by ? { id: row.computed_by, displayName: row.computed_by_name ?? "" } : null,
    runId: row.run_id,
    emulateNothing: row.emulate_nothing,
  };
}

function summaryQuery(db: Knex) {
  return db("eca_hierarchies as h")
    .leftJoin("users as u", "u.id", "h.computed_by")
    .select("h.*", "u.display_name as computed_by_name");
}

export async function findHierarchy(db: Knex, key: HierarchyKey): Promise<StoredHierarchy | null> {
  const row = (await summaryQuery(db)
    .where({ "h.max_block": key.maxBlock, "h.time_mode": key.timeMode, "h.radius": key.radius })
    .first()) as HierarchyRow | undefined;
  return row ? toSummary(row) : null;
}

export async function listHierarchies(db: Knex): Promise<StoredHierarchy[]> {
  const rows = (await summaryQuery(db).orderBy([
    { column: "h.radius" },
    { column: "h.time_mode" },
    { column: "h.max_block" },
  ])) as HierarchyRow[];
  return rows.map(toSummary);
}

/** The relation without witnesses, sorted by source then target. */
export async function hierarchyPairs(db: Knex, hierarchyId: string): Promise<HierarchyPair[]> {
  const rows = (await db("eca_hierarchy_pairs")
    .where({ hierarchy_id: hierarchyId })
    .select(
      "source",
      "target",
      "min_block",
      db.raw("(witness->>'time')::int as time"),
      db.raw("(witness->'via') is not null as composed"),
    )
    .orderBy([{ column: "source" }, { column: "target" }])) as (PairRow & { time: number; composed: boolean })[];
  return rows.map((r) => ({
    source: r.source,
    target: r.target,
    minBlock: r.min_block,
    time: r.time,
    composed: r.composed,
  }));
}

function withWitness(r: PairRow): HierarchyPairWithWitness {
  return { source: r.source, target: r.target, minBlock: r.min_block, witness: r.witness };
}

/** Every stored pair with its witness; the API tests re-verify them all. */
export async function hierarchyPairsWithWitnesses(db: Knex, hierarchyId: string): Promise<HierarchyPairWithWitness[]> {
  const rows = (await db("eca_hierarchy_pairs")
    .where({ hierarchy_id: hierarchyId })
    .select("source", "target", "min_block", "witness")
    .orderBy([{ column: "source" }, { column: "target" }])) as PairRow[];
  return rows.map(withWitness);
}

export async function rulePairs(
  db: Knex,
  hierarchyId: string,
  rule: number,
): Promise<{ emulates: HierarchyPairWithWitness[]; emulatedBy: HierarchyPairWithWitness[] }> {
  const rows = (await db("eca_hierarchy_pairs")
    .where({ hierarchy_id: hierarchyId })
    .andWhere((q) => q.where({ source: rule }).orWhere({ target: rule }))
    .select("source", "target", "min_block", "witness")
    .orderBy([{ column: "min_block" }, { column: "source" }, { column: "target" }])) as PairRow[];
  return {
    emulates: rows.filter((r) => r.source === rule).map(withWitness),
    emulatedBy: rows.filter((r) => r.target === rule).map(withWitness),
  };
}

export async function findPair(
  db: Knex,
  hierarchyId: string,
  source: number,
  target: number,
): Promise<HierarchyPairWithWitness | null> {
  const row = (await db("eca_hierarchy_pairs")
    .where({ hierarchy_id: hierarchyId, source, target })
    .select("source", "target", "min_block", "witness")
    .first()) as PairRow | undefined;
  return row ? withWitness(row) : null;
}

const INSERT_CHUNK = 2000;

/**
 * Stores a computed hierarchy. When another request or run stored the same parameters first, theirs is kept and
 * returned: both computed the same relation, and the first one's provenance is the true one.
 */
export async function saveHierarchy(
  db: Knex,
  record: HierarchyRecord,
): Promise<{ hierarchy: StoredHierarchy; inserted: boolean }> {
  const inserted = await db.transaction(async (trx) => {
    const rows = (await trx("eca_hierarchies")
      .insert({
        max_block: record.maxBlock,
        time_mode: record.timeMode,
        radius: record.radius,
        emulate_nothing: JSON.stringify(record.emulateNothing),
        pair_count: record.pairs.length,
        duration_ms: Math.round(record.durationMs),
        computed_by: record.computedBy,
        run_id: record.runId ?? null,
      })
      .onConflict(["max_block", "time_mode", "radius"])
      .ignore()
      .returning("id")) as { id: string }[];
    const id = rows[0]?.id;
    if (!id) return false;
    for (let i = 0; i < record.pairs.length; i += INSERT_CHUNK) {
      await trx("eca_hierarchy_pairs").insert(
        record.pairs.slice(i, i + INSERT_CHUNK).map((p) => ({
          hierarchy_id: id,
          source: p.source,
          target: p.target,
          min_block: p.minBlock,
          witness: JSON.stringify(p.witness),
        })),
      );
    }
    return true;
  });
  const hierarchy = await findHierarchy(db, record);
  if (!hierarchy) throw new Error("eca hierarchy vanished right after it was stored");
  return { hierarchy, inserted };
}

export async function deleteHierarchy(db: Knex, key: HierarchyKey): Promise<number> {
  return db("eca_hierarchies").where({ max_block: key.maxBlock, time_mode: key.timeMode, radius: key.radius }).delete();
}

export interface FinishedHierarchyRun {
  id: string;
  startedBy: string | null;
  result: unknown;
  wallMs: number | null;
}

/**
 * The latest succeeded background "eca-hierarchy" run for these parameters whose result has not been stored yet
 * (the run queue merges results without knowing about this table, so the first reader files them).
 */
export async function findFinishedHierarchyRun(db: Knex, key: HierarchyKey): Promise<FinishedHierarchyRun | null> {
  const row = (await db("runs")
    .where({ kind: "eca-hierarchy", state: "succeeded" })
    .whereRaw("(params->>'maxBlock')::int = ?", [key.maxBlock])
    .whereRaw("coalesce(params->>'timeMode', 'block') = ?", [key.timeMode])
    .whereNotNull("result")
    .orderBy("finished_at", "desc")
    .select("id", "started_by", "result", db.raw("extract(epoch from (finished_at - started_at)) * 1000 as wall_ms"))
    .first()) as
    { id: string; started_by: string | null; result: unknown; wall_ms: string | number | null } | undefined;
  return row
    ? {
        id: row.id,
        startedBy: row.started_by,
        result: row.result,
        wallMs: row.wall_ms === null ? null : Number(row.wall_ms),
      }
    : null;
}
