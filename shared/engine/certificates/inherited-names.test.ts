// Node names that are also properties every JavaScript object inherits ("toString", "constructor", "__proto__")
// must count as names like any other: a context that omits such a node is incomplete.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { networkFromFunctions } from "../network";
import { BUILT_IN_NAMES } from "./built-in-names.test-support";
import { blockEmulationCertificate, composeCertificates, MAX_CERTIFICATE_TIME, verifyCertificate } from "./index";

/** The swap a' = b, b' = a emulates a kept bit at t = 2 with block {a} and context b = 1. */
function swapCertificate(a: string, b: string, time = 2) {
  const swap = networkFromFunctions([a, b], [[1], [0]], (_n, x) => x[0]!);
  const keep = networkFromFunctions(["g"], [[0]], (_n, x) => x[0]!);
  return blockEmulationCertificate(swap, keep, {
    time,
    blocks: [{ nodes: [0], zero: [0], one: [1] }],
    context: [-1, 1],
  });
}

const builtInPair = fc
  .tuple(fc.constantFrom(...BUILT_IN_NAMES), fc.constantFrom(...BUILT_IN_NAMES))
  .filter(([a, b]) => a !== b);

describe("verifyCertificate with node names inherited by every object", () => {
  it("verifyCertificate accepts a complete context and rejects one that omits a node named after a built-in property", () => {
    fc.assert(
      fc.property(builtInPair, ([a, b]) => {
        const cert = swapCertificate(a, b);
        // Through JSON, as the CLI and the API receive it.
        const json = JSON.parse(JSON.stringify(cert)) as typeof cert & { witness: { context: object } };
        expect(Object.keys(json.witness.context)).toEqual([b]);
        expect(verifyCertificate(json).valid).toBe(true);
        const omitted = { ...json, witness: { ...json.witness, context: {} } };
        expect(verifyCertificate(omitted).problems).toEqual([
          `source node "${b}" is neither in a block nor in the context`,
        ]);
      }),
      { seed: 1010, numRuns: 300 },
    );
  });

  it("composeCertificates keeps a context node named after a built-in property", () => {
    fc.assert(
      fc.property(builtInPair, ([a, b]) => {
        const cert = swapCertificate(a, b);
        const keep = networkFromFunctions(["g"], [[0]], (_n, x) => x[0]!);
        const identity = blockEmulationCertificate(keep, keep, {
          time: 1,
          blocks: [{ nodes: [0], zero: [0], one: [1] }],
          context: [-1],
        });
        const composed = composeCertificates(cert, identity);
        expect(Object.keys(composed.witness as object)).toContain("context");
        expect(verifyCertificate(JSON.parse(JSON.stringify(composed))).valid).toBe(true);
      }),
      { seed: 1011, numRuns: 100 },
    );
  });

  it("verifyCertificate refuses a time scale above the documented bound at once, however large", () => {
    for (const time of [MAX_CERTIFICATE_TIME + 1, 2e9, 1e15]) {
      const r = verifyCertificate({ ...swapCertificate("a", "b"), time });
      expect(r).toMatchObject({ valid: false, statesChecked: 0 });
      expect(r.problems).toEqual([`"time" must be at most ${MAX_CERTIFICATE_TIME}`]);
    }
    // The bound itself is allowed: the swap has period 2, so an even time scale is valid.
    expect(verifyCertificate(swapCertificate("a", "b", MAX_CERTIFICATE_TIME)).valid).toBe(true);
  });
});
