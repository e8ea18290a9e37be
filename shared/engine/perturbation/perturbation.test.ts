import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { networkFromFunctions } from "../network";
import { analyseSynchronous, attractorsAsText } from "../state-graph";
import { randomNK, slowSuccessor } from "../update/random-networks.test-support";
import { successorTable } from "../update";
import { faureCellCycle } from "../state-graph/faure-cell-cycle.test-support";
import { compareAttractors, perturbNetwork } from "./index";

describe("perturbation", () => {
  it("perturbNetwork steps like the original network with the held nodes overwritten", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 9 }),
        fc.integer({ min: 1, max: 3 }),
        fc.integer(),
        fc.integer({ min: 0, max: 511 }),
        fc.integer({ min: 0, max: 511 }),
        (n, k, seed, koMask, oeMask) => {
          const net = randomNK(n, k, seed);
          const ko = Array.from({ length: n }, (_, i) => i).filter((i) => (koMask >> i) & 1);
          const oe = Array.from({ length: n }, (_, i) => i).filter((i) => (oeMask >> i) & 1 && !ko.includes(i));
          const table = successorTable(perturbNetwork(net, { knockOut: ko, overExpress: oe }));
          for (let s = 0; s < 2 ** n; s++) {
            let expected = slowSuccessor(net, s);
            for (const i of ko) expected &= ~(1 << i);
            for (const i of oe) expected |= 1 << i;
            expect(table[s]).toBe(expected);
          }
        },
      ),
      { seed: 51, numRuns: 60 },
    );
  });

  it("compareAttractors keeps the original fixed points that agree with a knock-out and loses the others", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 9 }),
        fc.integer({ min: 1, max: 3 }),
        fc.integer(),
        fc.nat(),
        (n, k, seed, pick) => {
          const net = randomNK(n, k, seed);
          const node = pick % n;
          const before = attractorsAsText(analyseSynchronous(net));
          const after = attractorsAsText(analyseSynchronous(perturbNetwork(net, { knockOut: [node] })));
          const cmp = compareAttractors(before, after);
          for (const fp of before.filter((a) => a.length === 1)) {
            const survives = fp.states[0]![node] === "0";
            expect(cmp.kept.some((m) => m.before === fp)).toBe(survives);
          }
          expect(cmp.kept.length + cmp.lost.length).toBe(before.length);
          expect(cmp.kept.length + cmp.gained.length).toBe(after.length);
          for (const a of after) for (const s of a.states) expect(s[node]).toBe("0");
        },
      ),
      { seed: 52, numRuns: 60 },
    );
  });

  it("perturbNetwork holds a fixed input and refuses a fixed input on a regulated node or a node held at both values", () => {
    // in' = in (an input keeping its value), out' = in.
    const net = networkFromFunctions(["in", "out"], [[0], [0]], (_n, x) => x[0]!);
    const held = analyseSynchronous(perturbNetwork(net, { fixedInputs: { 0: 1 } }));
    expect(attractorsAsText(held).map((a) => a.states)).toEqual([["11"]]);
    expect(() => perturbNetwork(net, { fixedInputs: new Map([[1, 1 as const]]) })).toThrow(/not an input/);
    expect(() => perturbNetwork(net, { knockOut: [1], overExpress: [1] })).toThrow(/both 0 and 1/);
    expect(() => perturbNetwork(net, { knockOut: [5] })).toThrow(/out of range/);
  });

  it("perturbNetwork with the growth input CycD held on leaves only the 7-state cycle of the Faure et al. (2006) model", () => {
    // Faure et al., "Dynamical analysis of a generic Boolean model for the control of the mammalian cell cycle",
    // Bioinformatics 2006: with CycD on, the synchronous dynamics has one attractor, a cycle of 7 states, and the
    // quiescent stable state disappears (values from memory).
    const net = faureCellCycle();
    const before = attractorsAsText(analyseSynchronous(net));
    const after = attractorsAsText(analyseSynchronous(perturbNetwork(net, { fixedInputs: { 0: 1 } })));
    expect(after.map((a) => [a.length, a.basin])).toEqual([[7, 1024]]);
    const cmp = compareAttractors(before, after);
    expect(cmp.kept.map((m) => m.before.length)).toEqual([7]);
    expect(cmp.lost.map((a) => a.states)).toEqual([["0100010100"]]);
    expect(cmp.gained).toEqual([]);
  });
});
