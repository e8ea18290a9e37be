import { describe, expect, it } from "vitest";
import fc from "fast-check";
import Logic from "logic-solver";
import { networkFromFunctions } from "../network";
import { analyseSynchronous, attractorsAsText } from "../state-graph";
import { randomNK, slowSuccessor, text } from "../update/random-networks.test-support";
import { satCycles, satFixedPoints, tableFormula } from "./index";

describe("sat", () => {
  it("tableFormula is true exactly on the rows where the truth table is 1", () => {
    fc.assert(
      fc.property(
        fc
          .integer({ min: 0, max: 4 })
          .chain((k) =>
            fc.tuple(
              fc.constant(k),
              fc.array(fc.integer({ min: 0, max: 1 }), { minLength: 1 << k, maxLength: 1 << k }),
            ),
          ),
        ([k, rows]) => {
          const names = Array.from({ length: k }, (_, j) => `v${j}`);
          const formula = tableFormula(Uint8Array.from(rows), names);
          const solver = new Logic.Solver();
          solver.require(Logic.equiv("out", formula));
          for (let r = 0; r < 1 << k; r++) {
            const row = Logic.and(names.map((name, j) => ((r >> j) & 1 ? name : Logic.not(name))));
            expect(solver.solveAssuming(row)!.evaluate("out")).toBe(rows[r] === 1);
          }
        },
      ),
      { seed: 41, numRuns: 30 },
    );
  });

  it("satCycles finds exactly the synchronous attractors of length up to 4 that exhaustive analysis finds", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 9 }), fc.integer({ min: 1, max: 3 }), fc.integer(), (n, k, seed) => {
        const net = randomNK(n, k, seed);
        const exact = attractorsAsText(analyseSynchronous(net))
          .filter((a) => a.length <= 4)
          .map((a) => ({ length: a.length, states: a.states }))
          .sort((a, b) => a.length - b.length || (a.states[0]! < b.states[0]! ? -1 : 1));
        const found = satCycles(net, 4);
        expect(found.complete).toBe(true);
        expect(found.cycles).toEqual(exact);
      }),
      { seed: 42, numRuns: 15 },
    );
  });

  it("satFixedPoints and satCycles count the attractors of a 200-node network built from 4 toggle switches and a feed-forward tail", () => {
    // Each toggle a' = !b, b' = !a has two fixed points (01, 10) and one 2-cycle (00 <-> 11); the tail nodes are
    // functions of earlier nodes only, so they add no freedom: 2^4 = 16 fixed points and (4^4 - 2^4) / 2 = 120 cycles
    // of length 2 (attractor states with period exactly 2, two per cycle), and none of length 3.
    const n = 200;
    const regulators = Array.from({ length: n }, (_, i) => (i < 8 ? [i ^ 1] : [i - 1, i - 8]));
    const net = networkFromFunctions(
      Array.from({ length: n }, (_, i) => `n${i}`),
      regulators,
      (node, x) => (node < 8 ? 1 - x[0]! : x[0]! & x[1]!),
    );
    const fixed = satFixedPoints(net);
    expect(fixed.complete).toBe(true);
    expect(fixed.states).toHaveLength(16);
    for (const s of fixed.states) {
      const state = Uint8Array.from(s, (c) => Number(c));
      for (let i = 0; i < n; i++) {
        const regs = net.regulators[i]!;
        let row = 0;
        regs.forEach((r, j) => (row |= state[r]! << j));
        expect(net.tables[i]![row]).toBe(state[i]);
      }
    }
    const cycles = satCycles(net, 3);
    expect(cycles.cycles.filter((c) => c.length === 2)).toHaveLength(120);
    expect(cycles.cycles.filter((c) => c.length === 3)).toHaveLength(0);
  });

  it("satCycles marks the result incomplete when maxSolutions cuts the enumeration", () => {
    // Two toggle switches: four fixed points and more cycles of length 2.
    const net = networkFromFunctions(["a", "b", "c", "d"], [[1], [0], [3], [2]], (_n, x) => 1 - x[0]!);
    expect(satCycles(net, 2).cycles.length).toBeGreaterThan(1);
    const cut = satCycles(net, 2, { maxSolutions: 1 });
    expect(cut.complete).toBe(false);
    expect(cut.cycles).toHaveLength(1);
  });

  it("satCycles returns cycles that follow the dynamics from their smallest state", () => {
    const net = randomNK(10, 2, 17);
    for (const c of satCycles(net, 6).cycles) {
      const idx = c.states.map((s) => [...s].reduce((acc, ch, i) => acc + (ch === "1" ? 2 ** i : 0), 0));
      idx.forEach((s, q) => expect(text(slowSuccessor(net, s), 10)).toBe(c.states[(q + 1) % c.length]));
      expect([...c.states].sort()[0]).toBe(c.states[0]);
    }
  });
});
