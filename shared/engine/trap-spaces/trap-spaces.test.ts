import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { networkFromFunctions, type BooleanNetwork } from "../network";
import { compileDefinition, readRuleText } from "../rules";
import { randomNK } from "../update/random-networks.test-support";
import { trapSpaces } from "./index";

// Slow, plainly correct reference: every one of the 3^n subspaces, written as a pattern of '0', '1', '-', is a trap
// space when each fixed node's function takes the fixed value on every state of the subspace.
function isTrapSpace(net: BooleanNetwork, pattern: string): boolean {
  const n = pattern.length;
  const free = [...pattern].flatMap((c, i) => (c === "-" ? [i] : []));
  for (let sub = 0; sub < 2 ** free.length; sub++) {
    const state: number[] = [...pattern].map((c) => (c === "1" ? 1 : 0));
    free.forEach((i, q) => (state[i] = (sub >> q) & 1));
    for (let i = 0; i < n; i++) {
      if (pattern[i] === "-") continue;
      const row = Array.from(net.regulators[i]!).reduce((r, reg, j) => r + state[reg]! * 2 ** j, 0);
      if (net.tables[i]![row] !== Number(pattern[i])) return false;
    }
  }
  return true;
}

function allPatterns(n: number): string[] {
  const out: string[] = [];
  for (let code = 0; code < 3 ** n; code++) {
    let p = "";
    for (let i = 0, c = code; i < n; i++, c = Math.floor(c / 3)) p += "01-"[c % 3];
    out.push(p);
  }
  return out;
}

// a lies inside b (as sets of states): every node b fixes, a fixes to the same value.
const inside = (a: string, b: string) => [...b].every((c, i) => c === "-" || a[i] === c);

function bruteForce(net: BooleanNetwork, kind: "minimal" | "maximal"): string[] {
  const n = net.names.length;
  const traps = allPatterns(n).filter((p) => isTrapSpace(net, p));
  const full = "-".repeat(n);
  if (kind === "minimal") return traps.filter((t) => !traps.some((u) => u !== t && inside(u, t))).sort();
  const proper = traps.filter((t) => t !== full);
  return proper.filter((t) => !proper.some((u) => u !== t && inside(t, u))).sort();
}

function rules(text: string): BooleanNetwork {
  return compileDefinition(readRuleText(text));
}

describe("trapSpaces", () => {
  it("trapSpaces(net) lists exactly the minimal trap spaces that enumerating all 3^n subspaces finds", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 8 }), fc.integer({ min: 1, max: 3 }), fc.integer(), (n, k, seed) => {
        const net = randomNK(n, Math.min(k, n), seed);
        const found = trapSpaces(net);
        expect(found.complete).toBe(true);
        expect(found.trapSpaces.map((t) => t.pattern)).toEqual(bruteForce(net, "minimal"));
      }),
      { seed: 1201, numRuns: 60 },
    );
  });

  it("trapSpaces(net, { kind: 'maximal' }) lists exactly the maximal proper trap spaces of the brute force", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 8 }), fc.integer({ min: 1, max: 3 }), fc.integer(), (n, k, seed) => {
        const net = randomNK(n, Math.min(k, n), seed);
        const found = trapSpaces(net, { kind: "maximal" });
        expect(found.complete).toBe(true);
        expect(found.trapSpaces.map((t) => t.pattern)).toEqual(bruteForce(net, "maximal"));
      }),
      { seed: 1202, numRuns: 60 },
    );
  });

  it("trapSpaces agrees with the brute force on 10-node networks of in-degree 2 and 3", () => {
    for (const [k, seed] of [
      [2, 7],
      [3, 8],
      [2, 9],
    ] as const) {
      const net = randomNK(10, k, `ten-${seed}`);
      expect(trapSpaces(net).trapSpaces.map((t) => t.pattern)).toEqual(bruteForce(net, "minimal"));
      expect(trapSpaces(net, { kind: "maximal" }).trapSpaces.map((t) => t.pattern)).toEqual(bruteForce(net, "maximal"));
    }
  });

  it("trapSpaces reports each fixed point as a trap space that fixes every node, with only fixed nodes named", () => {
    // A toggle switch (two mutual repressors): fixed points 01 and 10, and the 2-cycle 00 <-> 11 under synchronous
    // update, which asynchronous update leaves (common practice). Its minimal trap spaces are the two fixed points;
    // its maximal ones are the same two, since a trap space fixing one node fixes the other.
    const toggle = rules("a' = !b\nb' = !a\n");
    const min = trapSpaces(toggle);
    expect(min.trapSpaces.map((t) => t.fixed)).toEqual([
      { a: 0, b: 1 },
      { a: 1, b: 0 },
    ]);
    expect(trapSpaces(toggle, { kind: "maximal" }).trapSpaces.map((t) => t.pattern)).toEqual(["01", "10"]);
  });

  it("trapSpaces finds the cyclic trap space of a negative loop, which has no fixed point", () => {
    // a' = !b, b' = a: a negative feedback loop of two nodes; its only trap space is the whole space (it has no fixed
    // point and fixing either node is undone by the loop), so the single minimal trap space fixes nothing.
    const loop = rules("a' = !b\nb' = a\n");
    expect(trapSpaces(loop).trapSpaces).toEqual([{ fixed: {}, pattern: "--" }]);
    expect(trapSpaces(loop, { kind: "maximal" }).trapSpaces).toEqual([]);
  });

  it("trapSpaces(net, { limit }) stops with complete false only when more trap spaces exist", () => {
    // Four independent self-activations (x' = x): 2^4 = 16 fixed points, each a minimal trap space.
    const net = networkFromFunctions(["p", "q", "r", "s"], [[0], [1], [2], [3]], (_, x) => x[0]!);
    expect(trapSpaces(net).trapSpaces).toHaveLength(16);
    const cut = trapSpaces(net, { limit: 5 });
    expect(cut.complete).toBe(false);
    expect(cut.trapSpaces).toHaveLength(5);
    expect(trapSpaces(net, { limit: 16 }).complete).toBe(true);
  });
});
