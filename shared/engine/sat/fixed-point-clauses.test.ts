import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { randomNK, slowSuccessor, text } from "../update/random-networks.test-support";
import { satFixedPoints, tableCubes } from "./index";

describe("fixed points by clauses", () => {
  it("tableCubes(table, k, v) covers exactly the rows where the table is v, narrow and wide tables alike", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 12 }), fc.integer(), fc.integer({ min: 0, max: 1 }), (k, seed, v) => {
        // Tables with structure (a few cubes) as well as noise, so the Shannon split meets equal halves.
        let x = seed >>> 0;
        const next = () => ((x = (Math.imul(x, 1103515245) + 12345) >>> 0), x >>> 16);
        const table = new Uint8Array(1 << k);
        const dense = next() % 2 === 0;
        for (let r = 0; r < table.length; r++) table[r] = dense ? next() & 1 : (r & (next() | 1)) === 0 ? 1 : 0;
        const covered = new Uint8Array(1 << k);
        for (const c of tableCubes(table, k, v as 0 | 1))
          for (let r = 0; r < table.length; r++) if ((r & c.mask) === c.value) covered[r] = 1;
        for (let r = 0; r < table.length; r++) expect(covered[r]).toBe(table[r] === v ? 1 : 0);
      }),
      { seed: 1240, numRuns: 200 },
    );
  });

  it("satFixedPoints(net) lists exactly the states equal to their successor, checked on every state", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10 }), fc.integer({ min: 1, max: 4 }), fc.integer(), (n, k, seed) => {
        const net = randomNK(n, Math.min(k, n), seed);
        const expected: string[] = [];
        for (let x = 0; x < 2 ** n; x++) if (slowSuccessor(net, x) === x) expected.push(text(x, n));
        const found = satFixedPoints(net);
        expect(found.complete).toBe(true);
        expect(found.states).toEqual(expected.sort());
      }),
      { seed: 1241, numRuns: 80 },
    );
  });
});
