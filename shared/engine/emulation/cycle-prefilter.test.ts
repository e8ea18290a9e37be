import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { cycleLengthCounts, cyclesFit, discoverEmulatedTargets, randomNetwork } from "./index";

describe("cycle prefilter", () => {
  it("cycleLengthCounts counts each cycle once with its length (reference: follow every state to its cycle)", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 1, max: 40 }), (seed, N) => {
        const rng = seedrandom(String(seed));
        const succ = Array.from({ length: N }, () => Math.floor(rng() * N));
        const cycleOf = new Map<string, number>();
        for (let x = 0; x < N; x++) {
          let y = x;
          for (let i = 0; i < N; i++) y = succ[y]!;
          const members: number[] = [y];
          for (let z = succ[y]!; z !== y; z = succ[z]!) members.push(z);
          cycleOf.set(members.sort((a, b) => a - b).join(","), members.length);
        }
        const expected = new Map<number, number>();
        for (const length of cycleOf.values()) expected.set(length, (expected.get(length) ?? 0) + 1);
        expect(cycleLengthCounts(succ)).toEqual(expected);
      }),
      { seed: 1301, numRuns: 200 },
    );
  });

  it("cyclesFit needs at least as many source cycles of every target length", () => {
    expect(
      cyclesFit(
        new Map([
          [1, 2],
          [3, 1],
        ]),
        new Map([[1, 2]]),
      ),
    ).toBe(true);
    expect(
      cyclesFit(
        new Map([
          [1, 2],
          [3, 1],
        ]),
        new Map([[3, 2]]),
      ),
    ).toBe(false);
    expect(cyclesFit(new Map([[1, 2]]), new Map([[2, 1]]))).toBe(false);
  });

  it("discoverEmulatedTargets reports progress and stops with CANCELLED when asked", () => {
    const F = randomNetwork(seedrandom("1302"), 10, 2);
    const fractions: number[] = [];
    discoverEmulatedTargets(
      F,
      { maxTargetNodes: 1, maxTime: 1, maxBlock: 1 },
      { onProgress: (f) => fractions.push(f) },
    );
    expect(fractions.at(-1)).toBe(1);
    expect(fractions.every((f, i) => i === 0 || f >= fractions[i - 1]!)).toBe(true);
    expect(() =>
      discoverEmulatedTargets(F, { maxTargetNodes: 1, maxTime: 1, maxBlock: 1 }, { shouldStop: () => true }),
    ).toThrow(/cancelled/);
  });
});
