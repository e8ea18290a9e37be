import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { networkFromFunctions, type BooleanNetwork } from "../network";
import { compileDefinition, networkToDefinition, printRuleText, readRuleText } from "../rules";
import { analyseSynchronous, asynchronousAttractors, attractorsAsText } from "../state-graph";
import { randomNK, slowSuccessor, text } from "../update/random-networks.test-support";
import { eliminateNodes, eligibleNodes, percolateConstants } from "./index";

// Slow reference: every state, kept when it equals its synchronous successor.
function fixedPoints(net: BooleanNetwork): string[] {
  const n = net.names.length;
  const out: string[] = [];
  for (let x = 0; x < 2 ** n; x++) if (slowSuccessor(net, x) === x) out.push(text(x, n));
  return out;
}

/** The original fixed points projected onto the reduced network's nodes (by name). */
function projected(original: BooleanNetwork, reduced: BooleanNetwork): string[] {
  const at = reduced.names.map((name) => original.names.indexOf(name));
  return fixedPoints(original).map((s) => at.map((i) => s[i]).join(""));
}

const rules = (text: string) => compileDefinition(readRuleText(text));

describe("eliminateNodes", () => {
  it("eliminateNodes(net, 'all-eligible') keeps the fixed points one to one (against all states of random networks)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 9 }), fc.integer({ min: 1, max: 3 }), fc.integer(), (n, k, seed) => {
        const net = randomNK(n, Math.min(k, n), seed);
        const reduced = eliminateNodes(net, "all-eligible").network;
        const image = projected(net, reduced);
        // One to one: the projection is injective and onto the reduced network's fixed points.
        expect(new Set(image).size).toBe(image.length);
        expect(image.sort()).toEqual(fixedPoints(reduced).sort());
      }),
      { seed: 1220, numRuns: 80 },
    );
  });

  it("eliminateNodes(net, [one node]) keeps the fixed points one to one for every eligible node", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 8 }), fc.integer({ min: 1, max: 3 }), fc.integer(), (n, k, seed) => {
        const net = randomNK(n, k, seed);
        for (const node of eligibleNodes(net)) {
          const reduced = eliminateNodes(net, [node]).network;
          expect(reduced.names).not.toContain(node);
          const image = projected(net, reduced);
          expect(new Set(image).size).toBe(image.length);
          expect(image.sort()).toEqual(fixedPoints(reduced).sort());
        }
      }),
      { seed: 1221, numRuns: 40 },
    );
  });

  it("eliminateNodes substitutes a node's function into its targets", () => {
    // b' = a & c, c' = !b: eliminating c gives b' = a & !b (b now regulates itself, so it is no longer eligible).
    const result = eliminateNodes(rules("a' = a\nb' = a & c\nc' = !b\n"), ["c"]);
    expect(printRuleText(networkToDefinition(result.network))).toBe("a' = a\nb' = a & !b\n");
    expect(result.eliminated).toEqual(["c"]);
    expect(() => eliminateNodes(result.network, ["b"])).toThrow(/regulates itself/);
  });

  it("eliminateNodes refuses an elimination that would exceed the regulator limit, naming the node", () => {
    // Hub h reads 12 inputs; t reads h, itself and 10 other inputs: substituting h into t gives t 23 regulators.
    const inputs = Array.from({ length: 22 }, (_, i) => `i${i}`);
    const lines = inputs.map((x) => `${x}' = ${x}`);
    lines.push(`h' = ${inputs.slice(0, 12).join(" | ")}`, `t' = (h | t) & (${inputs.slice(12).join(" | ")})`);
    const net = rules(lines.join("\n") + "\n");
    expect(() => eliminateNodes(net, ["h"])).toThrow(/"t" 23 regulators; at most 20/);
    const all = eliminateNodes(net, "all-eligible");
    expect(all.skipped).toEqual([{ node: "h", regulators: 23 }]);
    expect(all.eliminated).toEqual([]);
  });

  it("eliminateNodes rejects unknown and self-regulated nodes with their names", () => {
    const net = rules("a' = a\nb' = a\n");
    expect(() => eliminateNodes(net, ["zz"])).toThrow(/no node named "zz"/);
    expect(() => eliminateNodes(net, ["a"])).toThrow(/"a" regulates itself/);
  });
});

describe("percolateConstants", () => {
  it("percolateConstants keeps every synchronous and asynchronous attractor one to one (against exhaustive analysis)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 9 }), fc.integer({ min: 1, max: 3 }), fc.integer(), (n, k, seed) => {
        const net = randomNK(n, Math.min(k, n), seed);
        const result = percolateConstants(net);
        const at = result.network.names.map((name) => net.names.indexOf(name));
        const cut = (s: string) => at.map((i) => s[i]).join("");
        const syncOriginal = attractorsAsText(analyseSynchronous(net)).map((a) => a.states.map(cut).join(","));
        const syncReduced = attractorsAsText(analyseSynchronous(result.network)).map((a) => a.states.join(","));
        expect(syncOriginal.sort()).toEqual(syncReduced.sort());
        const asyncSets = (g: BooleanNetwork, project: (s: string) => string) =>
          asynchronousAttractors(g)
            .attractors.map((a) =>
              Array.from(a.states, (x) => project(text(x, g.names.length)))
                .sort()
                .join(","),
            )
            .sort();
        expect(asyncSets(net, cut)).toEqual(asyncSets(result.network, (s) => s));
        // Every attractor state of the original has the percolated values.
        for (const s of fixedPoints(net))
          for (const [name, v] of Object.entries(result.fixed)) expect(Number(s[net.names.indexOf(name)])).toBe(v);
      }),
      { seed: 1222, numRuns: 60 },
    );
  });

  it("percolateConstants with a held input fixes what follows from it", () => {
    // s' = s is an input; held at 1, a' = s fixes a = 1, b' = a | b fixes b = 1, and c' = !c & a stays free.
    const net = rules("s' = s\na' = s\nb' = a | b\nc' = !c & a\n");
    const result = percolateConstants(net, { s: 1 });
    expect(result.fixed).toEqual({ s: 1, a: 1, b: 1 });
    expect(printRuleText(networkToDefinition(result.network))).toBe("c' = !c\n");
    expect(() => percolateConstants(net, { q: 1 })).toThrow(/no node named "q"/);
  });
});

describe("elimination of a large network", () => {
  it("eliminateNodes handles a 400-node chain of substitutions without growing in-degree", () => {
    // A cascade x0' = x0, x_i' = !x_{i-1}: every node but x0 is eligible; eliminating them all leaves x0 alone.
    const n = 400;
    const net = networkFromFunctions(
      Array.from({ length: n }, (_, i) => `x${i}`),
      Array.from({ length: n }, (_, i) => [i === 0 ? 0 : i - 1]),
      (node, x) => (node === 0 ? x[0]! : 1 - x[0]!),
    );
    const result = eliminateNodes(net, "all-eligible");
    expect(result.network.names).toEqual(["x0"]);
    expect(result.eliminated).toHaveLength(n - 1);
  });
});
