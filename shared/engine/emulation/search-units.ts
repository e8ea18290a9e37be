// Splitting a search into numbered units so that it can run as shards and resume from a cursor; the unit order
// is fixed, so merged shards report exactly what one unsplit run reports (first unit in order wins).
import { EngineError } from "../errors";

export interface UnitRange {
  readonly start: number;
  readonly end: number;
}

/** The contiguous range of units that shard `index` of `count` covers. */
export function shardRange(totalUnits: number, index: number, count: number): UnitRange {
  if (!Number.isInteger(count) || count < 1 || !Number.isInteger(index) || index < 0 || index >= count) {
    throw new EngineError("BAD_SHARD", `shard ${index} of ${count} does not exist`);
  }
  return { start: Math.floor((totalUnits * index) / count), end: Math.floor((totalUnits * (index + 1)) / count) };
}
