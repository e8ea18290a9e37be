// The block-emulation hierarchy of the 256 elementary rules up to a maximum block size (the preorder studied in
// "Bulking II: classifications of cellular automata", Delorme et al., Theor. Comput. Sci. 412, 2011). Work is split
// into units (symmetry-class representative, block size); emulation is equivariant under reflection and complement
// (Li & Packard, Complex Systems 4, 1990, for the 88 classes), so only representatives are searched.
import { CancelledError, EngineError } from "../errors";
import {
  ecaRule,
  ecaSymmetryClasses,
  ecaSymmetryImages,
  reflectEca,
  reverseString,
  complementString,
} from "../automata";
import type { Emulation } from "./block-emulations";
import { blockEmulations, mergeSliceEmulations } from "./block-emulations";
import { composeWitnesses } from "./compose-emulations";
import { verifyEmulation } from "./verify-emulation";

/** Above this the hierarchy's 2^k enumerations stop being a reasonable background job. */
export const MAX_HIERARCHY_BLOCK = 18;

export interface HierarchyUnit {
  /** The least rule of a symmetry class. */
  readonly rule: number;
  readonly block: number;
  /** Present when the unit is one slice of a search split across shards: slice `part` of `parts`. */
  readonly part?: number;
  readonly parts?: number;
}

export interface HierarchyUnitResult extends HierarchyUnit {
  readonly emulations: Emulation[];
  readonly pairsExamined: number;
}

/** Results for some units; parts of the same maxBlock merge by union. Plain data, so it can be stored as JSON. */
export interface HierarchyPart {
  readonly maxBlock: number;
  readonly units: HierarchyUnitResult[];
}

export interface ShardOptions {
  readonly maxBlock: number;
  readonly shardIndex?: number;
  readonly shardCount?: number;
  /** The block size from which units are sliced across shards (SPLIT_FROM_BLOCK unless a test needs small ones). */
  readonly splitFrom?: number;
  /** Position in this shard's unit list to start from (a previous run's `cursor`). */
  readonly cursor?: number;
  /** Stop after this many units and return; the returned cursor resumes. */
  readonly maxUnits?: number;
  readonly onProgress?: (fraction: number, phase: string) => void;
  readonly shouldStop?: () => boolean;
  /** Called after each unit with the cursor that would resume after it, so a caller can checkpoint. */
  readonly onUnit?: (result: HierarchyUnitResult, cursor: number) => void;
}

export interface ShardRun {
  readonly part: HierarchyPart;
  readonly cursor: number;
  readonly done: boolean;
}

export interface HierarchyRelation {
  readonly source: number;
  readonly target: number;
  readonly minBlock: number;
  readonly u0: string;
  readonly u1: string;
}

/** A pair that holds only through a chain of relations; its witness is the composed one. */
export interface ComposedRelation {
  readonly source: number;
  readonly target: number;
  /** The product of the block sizes along `via` (source, ..., target). */
  readonly block: number;
  readonly via: number[];
  readonly u0: string;
  readonly u1: string;
  /** Whether the independent verifier confirmed the composed witness (undefined when not checked). */
  readonly verified: boolean | undefined;
}

export interface HierarchyEdge {
  /** Indexes into `mutualClasses`. */
  readonly from: number;
  readonly to: number;
  /** The least direct minimal block between members, or the composed block when no direct relation exists. */
  readonly block: number;
  readonly composed: boolean;
}

export interface EcaHierarchy {
  readonly maxBlock: number;
  /** Every pair with F -> G at some 1 <= k <= maxBlock, sorted by source then target. */
  readonly relations: HierarchyRelation[];
  /** Pairs of the transitive closure not among `relations`. */
  readonly composed: ComposedRelation[];
  /** Classes of mutually emulating rules (closure), each sorted, ordered by least member. */
  readonly mutualClasses: number[][];
  /** The transitive reduction of the preorder on mutual classes, for drawing. */
  readonly reduction: HierarchyEdge[];
  readonly symmetryClasses: number[][];
  /** Rules with no emulation at any 2 <= k <= maxBlock. */
  readonly emulateNothing: number[];
  readonly pairsExamined: number;
}

function checkMaxBlock(maxBlock: number): void {
  if (!Number.isInteger(maxBlock) || maxBlock < 1 || maxBlock > MAX_HIERARCHY_BLOCK) {
    throw new EngineError(
      "BAD_BLOCK",
      `the maximum block size is an integer 1..${MAX_HIERARCHY_BLOCK}, got ${maxBlock}`,
    );
  }
}

/** All units, class-major so that consecutive units reuse a rule's tables. */
export function hierarchyUnits(maxBlock: number): HierarchyUnit[] {
  checkMaxBlock(maxBlock);
  const units: HierarchyUnit[] = [];
  for (const cls of ecaSymmetryClasses()) for (let k = 1; k <= maxBlock; k++) units.push({ rule: cls[0]!, block: k });
  return units;
}

/**
 * Shards of a hierarchy run: enough for a few machines, and with every unit from SPLIT_FROM_BLOCK on sliced into
 * one slice per shard, equal shares whatever the number of threads that divides it.
 */
export const HIERARCHY_SHARDS = 8;

/**
 * From this block size on, every shard takes one slice of each unit instead of whole units. Costs are lopsided: at
 * K = 16 the k = 16 unit of rule 154's class pairs about 2 * 10^9 codeword pairs (65,026 of the 65,536 words are
 * fixed by F^16 on the ring), more than the other 87 classes' units of that size together, so no dealing of whole
 * units can balance the shards.
 */
export const SPLIT_FROM_BLOCK = 12;

/**
 * The units of one shard. Below SPLIT_FROM_BLOCK whole units are dealt; dealing every shardCount-th unit of the
 * class-major list would hand all units of one block size to one shard whenever shardCount divides maxBlock, so the
 * classes of each block size are dealt in turn, offset by the block size, giving every shard an equal share of
 * every block size. From SPLIT_FROM_BLOCK on each shard takes one slice of every unit, the slice index rotating
 * with the class so that the first slices (which also carry the cheap unpaired pass) spread evenly.
 */
export function shardUnits(
  maxBlock: number,
  shardIndex: number,
  shardCount: number,
  splitFrom = SPLIT_FROM_BLOCK,
): HierarchyUnit[] {
  if (
    !Number.isInteger(shardCount) ||
    shardCount < 1 ||
    !Number.isInteger(shardIndex) ||
    shardIndex < 0 ||
    shardIndex >= shardCount
  ) {
    throw new EngineError("BAD_SHARD", `shard ${shardIndex} of ${shardCount} does not exist`);
  }
  const units: HierarchyUnit[] = [];
  hierarchyUnits(maxBlock).forEach((u, i) => {
    const cls = Math.floor(i / maxBlock);
    if (shardCount > 1 && u.block >= splitFrom)
      units.push({ ...u, part: (shardIndex + cls) % shardCount, parts: shardCount });
    else if ((cls + u.block) % shardCount === shardIndex) units.push(u);
  });
  return units;
}

/** Work roughly doubles with each block size. */
const unitWeight = (u: HierarchyUnit) => 2 ** u.block / (u.parts ?? 1);

export function runHierarchyShard(options: ShardOptions): ShardRun {
  const { maxBlock, shardIndex = 0, shardCount = 1, cursor = 0, maxUnits = Infinity } = options;
  const units = shardUnits(maxBlock, shardIndex, shardCount, options.splitFrom);
  if (!Number.isInteger(cursor) || cursor < 0 || cursor > units.length)
    throw new EngineError("BAD_CURSOR", `cursor ${cursor} is outside 0..${units.length}`);
  const total = units.reduce((s, u) => s + unitWeight(u), 0);
  let done = units.slice(0, cursor).reduce((s, u) => s + unitWeight(u), 0);
  const results: HierarchyUnitResult[] = [];
  let position = cursor;
  while (position < units.length && results.length < maxUnits) {
    if (options.shouldStop?.()) throw new CancelledError();
    const unit = units[position]!;
    const res = blockEmulations(ecaRule(unit.rule), unit.block, unit.block, {
      shouldStop: options.shouldStop,
      part: unit.part,
      parts: unit.parts,
    });
    const result: HierarchyUnitResult = { ...unit, emulations: res.emulations, pairsExamined: res.pairsExamined };
    results.push(result);
    position++;
    done += unitWeight(unit);
    options.onUnit?.(result, position);
    options.onProgress?.(total === 0 ? 1 : done / total, `rule ${unit.rule}, block ${unit.block}`);
  }
  return { part: { maxBlock, units: results }, cursor: position, done: position === units.length };
}

const unitKey = (u: HierarchyUnit) => `${u.rule}/${u.block}`;

/**
 * The union of parts, with the slices of a split unit joined into the whole unit once all of them are present;
 * slices of a unit still incomplete stay as they are, so a merged part can be merged again later.
 */
export function mergeHierarchyParts(parts: readonly HierarchyPart[]): HierarchyPart {
  if (parts.length === 0) throw new EngineError("BAD_PARTS", "nothing to merge");
  const maxBlock = parts[0]!.maxBlock;
  const whole = new Map<string, HierarchyUnitResult>();
  const slices = new Map<string, Map<number, HierarchyUnitResult>>();
  for (const part of parts) {
    if (part.maxBlock !== maxBlock)
      throw new EngineError("BAD_PARTS", `parts for maxBlock ${part.maxBlock} and ${maxBlock} cannot merge`);
    for (const u of part.units) {
      if (u.parts === undefined) {
        whole.set(unitKey(u), u);
        continue;
      }
      let bySlice = slices.get(unitKey(u));
      if (!bySlice) slices.set(unitKey(u), (bySlice = new Map()));
      const other = bySlice.values().next().value;
      if (other && other.parts !== u.parts)
        throw new EngineError(
          "BAD_PARTS",
          `rule ${u.rule} at block ${u.block} is split into both ${other.parts} and ${u.parts} slices`,
        );
      bySlice.set(u.part!, u);
    }
  }
  const units: HierarchyUnitResult[] = [];
  for (const u of hierarchyUnits(maxBlock)) {
    const key = unitKey(u);
    const done = whole.get(key);
    if (done) {
      units.push(done);
      continue;
    }
    const bySlice = slices.get(key);
    if (!bySlice) continue;
    const ordered = [...bySlice.values()].sort((a, b) => a.part! - b.part!);
    if (ordered.length === ordered[0]!.parts) {
      units.push({
        rule: u.rule,
        block: u.block,
        emulations: mergeSliceEmulations(ordered.map((x) => x.emulations)),
        pairsExamined: ordered.reduce((sum, x) => sum + x.pairsExamined, 0),
      });
    } else units.push(...ordered);
  }
  return { maxBlock, units };
}

/** The emulation of image g (0 id, 1 reflection, 2 complement, 3 both) of the source, from the source's one. */
function transformEmulation(e: Emulation, g: number): Emulation {
  let { target, u0, u1 } = e;
  if (g & 1) {
    target = reflectEca(target);
    u0 = reverseString(u0);
    u1 = reverseString(u1);
  }
  // the complement of F emulates the same G through the complemented codewords
  if (g & 2) {
    u0 = complementString(u0);
    u1 = complementString(u1);
  }
  return { target, u0, u1 };
}

export interface AssembleOptions {
  /** Check every composed witness with the independent verifier (default true). */
  readonly verifyComposed?: boolean;
  readonly onProgress?: (fraction: number, phase: string) => void;
  readonly shouldStop?: () => boolean;
}

export function assembleEcaHierarchy(part: HierarchyPart, options: AssembleOptions = {}): EcaHierarchy {
  const { maxBlock } = part;
  const expected = hierarchyUnits(maxBlock);
  // slices count as missing until mergeHierarchyParts has joined them
  const have = new Map(part.units.filter((u) => u.parts === undefined).map((u) => [unitKey(u), u]));
  const missing = expected.filter((u) => !have.has(unitKey(u)));
  if (missing.length > 0)
    throw new EngineError("INCOMPLETE_HIERARCHY", `${missing.length} of ${expected.length} units are missing`);
  const minBlock = new Uint16Array(65536);
  const witness = new Map<number, Emulation>();
  const emulatesAtTwoOrMore = new Uint8Array(256);
  let pairsExamined = 0;
  for (const u of expected) {
    const res = have.get(unitKey(u))!;
    pairsExamined += res.pairsExamined;
    const images = ecaSymmetryImages(u.rule);
    for (let g = 0; g < 4; g++) {
      const f = images[g]!;
      if (images.indexOf(f) !== g) continue;
      if (u.block >= 2 && res.emulations.length > 0) emulatesAtTwoOrMore[f] = 1;
      for (const e of res.emulations) {
        const t = transformEmulation(e, g);
        const cell = 256 * f + t.target;
        if (minBlock[cell] === 0 || minBlock[cell]! > u.block) {
          minBlock[cell] = u.block;
          witness.set(cell, t);
        }
      }
    }
  }
  const relations: HierarchyRelation[] = [];
  for (let cell = 0; cell < 65536; cell++) {
    if (!minBlock[cell]) continue;
    const w = witness.get(cell)!;
    relations.push({ source: cell >> 8, target: cell & 255, minBlock: minBlock[cell]!, u0: w.u0, u1: w.u1 });
  }
  options.onProgress?.(0.2, "closure");
  // closure with the least product of block sizes along a path; mid[] keeps a midpoint to rebuild the path
  const best = new Float64Array(65536).fill(Infinity);
  const mid = new Int16Array(65536).fill(-1);
  for (let cell = 0; cell < 65536; cell++) if (minBlock[cell]) best[cell] = minBlock[cell]!;
  for (let m = 0; m < 256; m++) {
    if (options.shouldStop?.()) throw new CancelledError();
    for (let i = 0; i < 256; i++) {
      const im = best[256 * i + m]!;
      if (im === Infinity) continue;
      for (let j = 0; j < 256; j++) {
        const via = im * best[256 * m + j]!;
        if (via < best[256 * i + j]!) {
          best[256 * i + j] = via;
          mid[256 * i + j] = m;
        }
      }
    }
  }
  const pathOf = (i: number, j: number): number[] => {
    const m = mid[256 * i + j]!;
    if (m < 0) return [i, j];
    return [...pathOf(i, m), ...pathOf(m, j).slice(1)];
  };
  const composed: ComposedRelation[] = [];
  const pending: number[] = [];
  for (let cell = 0; cell < 65536; cell++) if (!minBlock[cell] && best[cell]! < Infinity) pending.push(cell);
  for (let n = 0; n < pending.length; n++) {
    if (options.shouldStop?.()) throw new CancelledError();
    const cell = pending[n]!;
    const source = cell >> 8;
    const target = cell & 255;
    const via = pathOf(source, target);
    let w: { u0: string; u1: string } = witness.get(256 * via[0]! + via[1]!)!;
    let block = minBlock[256 * via[0]! + via[1]!]!;
    for (let h = 1; h + 1 < via.length; h++) {
      const step = 256 * via[h]! + via[h + 1]!;
      w = composeWitnesses(w, witness.get(step)!);
      block *= minBlock[step]!;
    }
    const verified =
      options.verifyComposed === false ? undefined : verifyEmulation(ecaRule(source), target, w.u0, w.u1).valid;
    composed.push({ source, target, block, via, u0: w.u0, u1: w.u1, verified });
    options.onProgress?.(0.2 + (0.7 * (n + 1)) / pending.length, "verifying composed witnesses");
  }
  const reach = (i: number, j: number) => i === j || best[256 * i + j]! < Infinity;
  const classOf = new Int32Array(256).fill(-1);
  const mutualClasses: number[][] = [];
  for (let i = 0; i < 256; i++) {
    if (classOf[i]! >= 0) continue;
    const members: number[] = [];
    for (let j = i; j < 256; j++) {
      if (classOf[j]! < 0 && reach(i, j) && reach(j, i)) {
        classOf[j] = mutualClasses.length;
        members.push(j);
      }
    }
    mutualClasses.push(members);
  }
  const nc = mutualClasses.length;
  const classReach = (a: number, b: number) => reach(mutualClasses[a]![0]!, mutualClasses[b]![0]!);
  const reduction: HierarchyEdge[] = [];
  for (let a = 0; a < nc; a++) {
    for (let b = 0; b < nc; b++) {
      if (a === b || !classReach(a, b)) continue;
      let implied = false;
      for (let c = 0; c < nc && !implied; c++)
        if (c !== a && c !== b && classReach(a, c) && classReach(c, b)) implied = true;
      if (implied) continue;
      let direct = Infinity;
      let viaComposition = Infinity;
      for (const f of mutualClasses[a]!) {
        for (const g of mutualClasses[b]!) {
          const d = minBlock[256 * f + g]!;
          if (d) direct = Math.min(direct, d);
          viaComposition = Math.min(viaComposition, best[256 * f + g]!);
        }
      }
      reduction.push(
        direct < Infinity
          ? { from: a, to: b, block: direct, composed: false }
          : { from: a, to: b, block: viaComposition, composed: true },
      );
    }
  }
  const emulateNothing: number[] = [];
  if (maxBlock >= 2) for (let f = 0; f < 256; f++) if (!emulatesAtTwoOrMore[f]) emulateNothing.push(f);
  options.onProgress?.(1, "done");
  return {
    maxBlock,
    relations,
    composed,
    mutualClasses,
    reduction,
    symmetryClasses: ecaSymmetryClasses(),
    emulateNothing,
    pairsExamined,
  };
}

/** The whole hierarchy in one call: one shard, then assembly. */
export function ecaHierarchy(
  maxBlock: number,
  options: {
    verifyComposed?: boolean;
    onProgress?: (fraction: number, phase: string) => void;
    shouldStop?: () => boolean;
  } = {},
): EcaHierarchy {
  const run = runHierarchyShard({
    maxBlock,
    onProgress: (f, phase) => options.onProgress?.(0.9 * f, phase),
    shouldStop: options.shouldStop,
  });
  return assembleEcaHierarchy(run.part, {
    verifyComposed: options.verifyComposed,
    shouldStop: options.shouldStop,
    onProgress: (f, phase) => options.onProgress?.(0.9 + 0.1 * f, phase),
  });
}
