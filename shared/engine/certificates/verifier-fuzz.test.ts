// Fuzzing of the verifier: valid certificates with one field replaced by arbitrary JSON, whole garbage values, and
// certificates stating costly checks. verifyCertificate reports every one of them (it never throws) and answers
// well within a generous bound, so a hostile upload cannot stall a worker.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { networkFromFunctions } from "../network";
import { blockEmulationCertificate, coarseGrainingCertificate, embeddingCertificate, verifyCertificate } from "./index";

/** Far above the few milliseconds these small certificates take: only a hang or a runaway loop exceeds it. */
const GENEROUS_MS = 3000;

const swap = networkFromFunctions(["a", "b"], [[1], [0]], (_n, x) => x[0]!);
const keep = networkFromFunctions(["g"], [[0]], (_n, x) => x[0]!);
const valid: unknown[] = [
  blockEmulationCertificate(swap, keep, { time: 2, blocks: [{ nodes: [0], zero: [0], one: [1] }], context: [-1, 1] }),
  embeddingCertificate(swap, keep, 2, [1, 3]),
  coarseGrainingCertificate(swap, keep, 2, [{ inputs: [0], table: [0, 1] }]),
].map((c) => JSON.parse(JSON.stringify(c)));

/** Paths to every value inside a JSON value. */
function paths(v: unknown, at: (string | number)[] = []): (string | number)[][] {
  const out = [at];
  if (Array.isArray(v)) v.forEach((x, i) => out.push(...paths(x, [...at, i])));
  else if (typeof v === "object" && v !== null)
    for (const [k, x] of Object.entries(v)) out.push(...paths(x, [...at, k]));
  return out;
}

function replaceAt(v: unknown, path: (string | number)[], value: unknown): unknown {
  if (path.length === 0) return value;
  const copy = (Array.isArray(v) ? [...v] : { ...(v as object) }) as Record<string | number, unknown>;
  Object.defineProperty(copy, path[0]!, {
    value: replaceAt(copy[path[0]!], path.slice(1), value),
    enumerable: true,
    writable: true,
    configurable: true,
  });
  return copy;
}

const hostile = fc.oneof(
  fc.jsonValue(),
  fc.constantFrom(1e15, 2e9, -1, 0, 65_536, 2 ** 31, Number.MAX_SAFE_INTEGER, 1.5, "1", "__proto__", "toString", null),
  fc.constantFrom({}, [], { __proto__: 1 }, { toString: 1, constructor: 0 }, "0".repeat(4096), "01".repeat(3000)),
  fc.array(fc.constantFrom("a", "b", "g", "toString", "__proto__"), { maxLength: 30 }),
);

function expectReported(input: unknown): void {
  const t0 = performance.now();
  const report = verifyCertificate(input);
  expect(performance.now() - t0).toBeLessThan(GENEROUS_MS);
  expect(typeof report.valid).toBe("boolean");
  if (!report.valid) expect(report.problems.length).toBeGreaterThan(0);
}

describe("verifyCertificate under fuzzing", () => {
  it("verifyCertificate reports a valid certificate with any one value replaced, without throwing", () => {
    fc.assert(
      fc.property(fc.nat(valid.length - 1), fc.nat(), hostile, (which, pick, value) => {
        const base = valid[which]!;
        const all = paths(base);
        expectReported(JSON.parse(JSON.stringify(replaceAt(base, all[pick % all.length]!, value))));
      }),
      { seed: 4242, numRuns: 2000 },
    );
  });

  it("verifyCertificate reports arbitrary JSON values and objects shaped almost like certificates", () => {
    fc.assert(
      fc.property(
        fc.oneof(
          fc.jsonValue(),
          fc.record({
            format: fc.constantFrom("emulant-reduction", "x"),
            version: fc.constantFrom(1, 2, "1"),
            notion: fc.constantFrom("block-emulation", "dynamical-embedding", "coarse-graining", "other"),
            time: hostile,
            source: hostile,
            target: hostile,
            witness: hostile,
          }),
        ),
        expectReported,
      ),
      { seed: 4343, numRuns: 2000 },
    );
  });

  it("verifyCertificate refuses at once a check that would take too long: a 24-node target at t = 65536", () => {
    const names = Array.from({ length: 24 }, (_, i) => `g${i}`);
    const target = networkFromFunctions(
      names,
      names.map((_, i) => [i]),
      (_n, x) => x[0]!,
    );
    const cert = blockEmulationCertificate(target, target, {
      time: 65_536,
      blocks: names.map((_, v) => ({ nodes: [v], zero: [0], one: [1] })),
      context: names.map(() => -1),
    });
    const report = verifyCertificate(cert);
    expect(report).toMatchObject({ valid: false, statesChecked: 0 });
    expect(report.problems[0]).toMatch(/^checking needs \d+ word evaluations .* at most 134217728 are done$/);
  });
});
