import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { ecaRule, reflectEca, complementEca } from "../automata";
import {
  ecaHierarchy,
  runHierarchyShard,
  mergeHierarchyParts,
  assembleEcaHierarchy,
  hierarchyUnits,
  shardUnits,
  naiveEcaMinBlocks,
  verifyEmulation,
  composeWitnesses,
  blockEmulations,
} from "./index";
import type { HierarchyPart, HierarchyUnit } from "./index";
import { SPLIT_FROM_BLOCK } from "./index";

const K = 6;
const whole = ecaHierarchy(K);
const minBlockOf = (h: typeof whole) => {
  const table = new Uint8Array(65536);
  for (const r of h.relations) table[256 * r.source + r.target] = r.minBlock;
  return table;
};
const table = minBlockOf(whole);

describe("ecaHierarchy", () => {
  it("ecaHierarchy gives the same least block size for every ordered pair as the naive all-pairs search over all 256 rules (K = 5)", () => {
    const naive = naiveEcaMinBlocks(5);
    const fast = minBlockOf(ecaHierarchy(5));
    expect([...fast]).toEqual([...naive.minBlock]);
  });

  it("ecaHierarchy keeps a witness for every relation that the independent verifier accepts at the least block size", () => {
    for (const r of whole.relations) {
      expect(verifyEmulation(ecaRule(r.source), r.target, r.u0, r.u1).valid, `${r.source} -> ${r.target}`).toBe(true);
      expect(r.u0.length).toBe(r.minBlock);
    }
  });

  it("ecaHierarchy relations are sorted by source then target and include every rule emulating itself at k = 1", () => {
    const keys = whole.relations.map((r) => 256 * r.source + r.target);
    expect(keys).toEqual([...keys].sort((a, b) => a - b));
    for (let f = 0; f < 256; f++) expect(table[257 * f]).toBe(1);
  });

  it("ecaHierarchy is equivariant: F -> G at k exactly when reflect F -> reflect G and complement F -> complement G at k", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 255 }), fc.integer({ min: 0, max: 255 }), (f, g) => {
        const k = table[256 * f + g];
        expect(table[256 * reflectEca(f) + reflectEca(g)]).toBe(k);
        expect(table[256 * complementEca(f) + complementEca(g)]).toBe(k);
        expect(table[256 * complementEca(f) + g]).toBe(k);
      }),
      { seed: 29, numRuns: 2000 },
    );
  });

  it("ecaHierarchy lists as emulating nothing exactly the rules without a relation at 2 <= k <= K", () => {
    for (let f = 0; f < 256; f++) {
      const any = [2, 3, 4, 5, 6].some((k) => blockEmulations(ecaRule(f), k).emulations.length > 0);
      expect(whole.emulateNothing.includes(f), `rule ${f}`).toBe(!any);
    }
  });

  it("ecaHierarchy composes chains into witnesses at the product block size that the verifier confirms", () => {
    const small = ecaHierarchy(4);
    expect(small.composed.length).toBeGreaterThan(0);
    for (const c of small.composed) {
      expect(c.verified).toBe(true);
      expect(c.u0.length).toBe(c.block);
      expect(verifyEmulation(ecaRule(c.source), c.target, c.u0, c.u1).valid).toBe(true);
      expect(c.via[0]).toBe(c.source);
      expect(c.via[c.via.length - 1]).toBe(c.target);
    }
  });

  it("composeWitnesses of two relations found by the search yields an emulation at block k*j confirmed by the verifier", () => {
    const byKey = new Map(whole.relations.map((r) => [256 * r.source + r.target, r]));
    const chains = whole.relations
      .filter((r) => r.minBlock >= 2 && r.minBlock <= 3 && r.source !== r.target)
      .slice(0, 60);
    let checked = 0;
    for (const outer of chains) {
      for (const inner of whole.relations) {
        if (inner.source !== outer.target || inner.minBlock < 2 || inner.minBlock > 3 || checked >= 40) continue;
        const w = composeWitnesses(outer, inner);
        expect(w.u0.length).toBe(outer.minBlock * inner.minBlock);
        expect(
          verifyEmulation(ecaRule(outer.source), inner.target, w.u0, w.u1).valid,
          `${outer.source}->${outer.target}->${inner.target}`,
        ).toBe(true);
        expect(
          byKey.has(256 * outer.source + inner.target) ||
            whole.composed.some((c) => c.source === outer.source && c.target === inner.target),
        ).toBe(true);
        checked++;
      }
    }
    expect(checked).toBe(40);
  });

  it("ecaHierarchy mutual classes partition the rules, and reduction edges join distinct classes without a shortcut", () => {
    expect(whole.mutualClasses.flat().sort((a, b) => a - b)).toEqual(Array.from({ length: 256 }, (_, i) => i));
    const reach = new Set<string>();
    for (const e of whole.reduction) {
      expect(e.from).not.toBe(e.to);
      reach.add(`${e.from}>${e.to}`);
    }
    // a reduction edge is never implied by two other reduction edges
    for (const e of whole.reduction) {
      const middle = whole.reduction.filter((x) => x.from === e.from && reach.has(`${x.to}>${e.to}`));
      expect(middle.length).toBe(0);
    }
    // rule 0 and rule 255 emulate each other at k = 1, so they share a class
    const zero = whole.mutualClasses.find((c) => c.includes(0))!;
    expect(zero).toContain(255);
    expect(whole.symmetryClasses.length).toBe(88);
  });

  it("runHierarchyShard parts from any sharding and resumed cursors merge to the same hierarchy", () => {
    const parts: HierarchyPart[] = [];
    for (let s = 0; s < 3; s++) {
      let cursor = 0;
      for (;;) {
        const run = runHierarchyShard({ maxBlock: K, shardIndex: s, shardCount: 3, cursor, maxUnits: 50 });
        parts.push(run.part);
        cursor = run.cursor;
        if (run.done) break;
      }
    }
    const merged = mergeHierarchyParts(parts);
    expect(merged.units.length).toBe(hierarchyUnits(K).length);
    const again = assembleEcaHierarchy(merged);
    expect(again.relations).toEqual(whole.relations);
    expect(again.emulateNothing).toEqual(whole.emulateNothing);
    expect(again.mutualClasses).toEqual(whole.mutualClasses);
  });

  it("shardUnits covers every unit once, whole below SPLIT_FROM_BLOCK and as one slice per shard from there on, with near-equal shares of every block size", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 18 }), fc.integer({ min: 1, max: 16 }), (maxBlock, shardCount) => {
        const shards = Array.from({ length: shardCount }, (_, s) => shardUnits(maxBlock, s, shardCount));
        const key = (u: HierarchyUnit) => `${u.rule}/${u.block}/${u.part ?? "-"}/${u.parts ?? "-"}`;
        const expected = hierarchyUnits(maxBlock).flatMap((u) =>
          shardCount > 1 && u.block >= SPLIT_FROM_BLOCK
            ? Array.from({ length: shardCount }, (_, part) => ({ ...u, part, parts: shardCount }))
            : [u],
        );
        expect(shards.flat().map(key).sort()).toEqual(expected.map(key).sort());
        for (let k = 1; k <= maxBlock; k++) {
          const counts = shards.map((units) => units.filter((u) => u.block === k).length);
          expect(Math.max(...counts) - Math.min(...counts)).toBeLessThanOrEqual(1);
        }
        // each shard holds one slice of every split unit, and the first slices are spread over the shards
        if (shardCount > 1 && maxBlock >= SPLIT_FROM_BLOCK) {
          const firsts = shards.map((units) => units.filter((u) => u.part === 0).length);
          expect(Math.max(...firsts) - Math.min(...firsts)).toBeLessThanOrEqual(maxBlock - SPLIT_FROM_BLOCK + 1);
        }
      }),
      { numRuns: 40 },
    );
  });

  it("runHierarchyShard with units sliced across shards merges to exactly the unsliced hierarchy, witnesses included, even when slices arrive in pieces", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 5 }), fc.integer({ min: 3, max: K }), (shardCount, splitFrom) => {
        const parts = Array.from(
          { length: shardCount },
          (_, shardIndex) => runHierarchyShard({ maxBlock: K, shardIndex, shardCount, splitFrom }).part,
        );
        // merging a subset first leaves incomplete slices that a later merge completes
        const early = mergeHierarchyParts(parts.slice(0, 1));
        expect(early.units.some((u) => u.parts === shardCount)).toBe(true);
        expect(() => assembleEcaHierarchy(early)).toThrow(/missing/);
        const merged = mergeHierarchyParts([early, ...parts.slice(1)]);
        expect(merged.units.every((u) => u.parts === undefined)).toBe(true);
        const again = assembleEcaHierarchy(merged);
        expect(again.relations).toEqual(whole.relations);
        expect(again.pairsExamined).toBe(whole.pairsExamined);
      }),
      { numRuns: 6, seed: 16 },
    );
  });

  it("runHierarchyShard reports progress, calls onUnit with resumable cursors and throws CancelledError when told to stop", () => {
    const fractions: number[] = [];
    const cursors: number[] = [];
    runHierarchyShard({ maxBlock: 3, onProgress: (f) => fractions.push(f), onUnit: (_, c) => cursors.push(c) });
    expect(fractions[fractions.length - 1]).toBe(1);
    expect(cursors).toEqual(Array.from({ length: 88 * 3 }, (_, i) => i + 1));
    let calls = 0;
    expect(() => runHierarchyShard({ maxBlock: 3, shouldStop: () => ++calls > 5 })).toThrow(/cancelled/);
    expect(() => assembleEcaHierarchy({ maxBlock: 3, units: [] })).toThrow(/missing/);
  });
});
