import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { compileDefinition, readRuleText } from "../rules";
import { asynchronousAttractors } from "../state-graph";
import { randomNK, text } from "../update/random-networks.test-support";
import { asynchronousAttractorReport } from "./index";

const exactSets = (net: ReturnType<typeof randomNK>) =>
  asynchronousAttractors(net)
    .attractors.map((a) => Array.from(a.states, (x) => text(x, net.names.length)).sort())
    .sort((a, b) => (a[0]! < b[0]! ? -1 : 1));

describe("asynchronousAttractorReport", () => {
  it("asynchronousAttractorReport proves the same attractors as exhaustive analysis, and every minimal trap space holds one", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 9 }), fc.integer({ min: 1, max: 3 }), fc.integer(), (n, k, seed) => {
        const net = randomNK(n, Math.min(k, n), seed);
        const report = asynchronousAttractorReport(net);
        expect(report.completeness).toBe("proved complete");
        expect(report.attractors.map((a) => a.states!).sort((a, b) => (a[0]! < b[0]! ? -1 : 1))).toEqual(
          exactSets(net),
        );
        // Each minimal trap space holds at least one attractor (Klarner et al., Natural Computing 2015).
        for (const t of report.minimalTrapSpaces) expect(t.attractorCount).toBeGreaterThanOrEqual(1);
        const outside = report.attractors.filter((a) => a.trapSpace === null).length;
        expect(report.outsideMinimalTrapSpaces).toBe(outside > 0 ? "found" : "excluded");
      }),
      { seed: 1210, numRuns: 60 },
    );
  });

  it("asynchronousAttractorReport through trap spaces only lists proved attractors and never claims completeness", () => {
    fc.assert(
      fc.property(fc.integer({ min: 4, max: 9 }), fc.integer({ min: 1, max: 3 }), fc.integer(), (n, k, seed) => {
        const net = randomNK(n, k, seed);
        const report = asynchronousAttractorReport(net, { maxExactNodes: 3 });
        const exact = exactSets(net).map((s) => s.join(","));
        for (const a of report.attractors) expect(exact).toContain(a.states!.join(","));
        if (report.method === "minimal trap spaces") {
          expect(report.completeness).toBe("found so far");
          expect(report.outsideMinimalTrapSpaces).toBe("not excluded");
          report.minimalTrapSpaces.forEach((t, index) => {
            if (t.verdict === "at least one attractor") expect(t.freeNodes).toBeGreaterThan(3);
            else expect(report.attractors.filter((a) => a.trapSpace === index)).toHaveLength(t.attractorCount!);
          });
        } else expect(report.completeness).toBe("proved complete");
      }),
      { seed: 1211, numRuns: 60 },
    );
  });

  it("asynchronousAttractorReport resolves each minimal trap space of a 25-node network beyond the exact limit", () => {
    // Four toggle switches (x' = !y, y' = !x; two stable states each) and a three-node repressor ring a' = !c,
    // b' = !a, c' = !b driving a chain of 14 followers. Nothing percolates, so the 25 nodes exceed the exact limit.
    // Each toggle must settle (a trap space fixing one toggle node fixes its partner), and the ring never does (an odd
    // negative loop has no fixed point; common practice), so there are 2^4 = 16 minimal trap spaces, each freeing
    // the ring and its followers: 17 nodes, analysed exactly.
    const lines = ["a' = !c", "b' = !a", "c' = !b", "f1' = a"];
    for (let i = 2; i <= 14; i++) lines.push(`f${i}' = f${i - 1}`);
    for (let t = 1; t <= 4; t++) lines.push(`x${t}' = !y${t}`, `y${t}' = !x${t}`);
    const net = compileDefinition(readRuleText(lines.join("\n") + "\n"));
    const report = asynchronousAttractorReport(net);
    expect(report.method).toBe("minimal trap spaces");
    expect(report.completeness).toBe("found so far");
    expect(report.minimalTrapSpaces).toHaveLength(16);
    for (const t of report.minimalTrapSpaces) {
      expect(t.freeNodes).toBe(17);
      expect(t.verdict).toBe("one attractor");
    }
    // Inside each, the attractor is that of the ring with its followers on their own (checked by exact analysis).
    const module = compileDefinition(readRuleText(lines.slice(0, 17).join("\n") + "\n"));
    const [alone] = asynchronousAttractors(module).attractors;
    expect(asynchronousAttractors(module).attractors).toHaveLength(1);
    for (const a of report.attractors) expect(a.size).toBe(alone!.size);
    expect(report.attractors).toHaveLength(16);
  });
});
