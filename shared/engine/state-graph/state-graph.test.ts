import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { networkFromFunctions } from "../network";
import { CancelledError } from "../errors";
import { randomNK, slowSuccessor, text } from "../update/random-networks.test-support";
import {
  analyseSynchronous,
  asynchronousAttractors,
  attractorsAsText,
  forEachBasinState,
  sampleAttractors,
} from "./index";
import { yeastCellCycle } from "./yeast-cell-cycle.test-support";
import { faureCellCycle } from "./faure-cell-cycle.test-support";

/** Reference: follow each state one step at a time, keeping the whole path, until a state repeats. */
function referenceSynchronous(net: ReturnType<typeof randomNK>) {
  const n = net.names.length;
  const attractors = new Map<string, { states: string[]; basin: number }>();
  const transient: number[] = [];
  const attractorKey: string[] = [];
  for (let s = 0; s < 2 ** n; s++) {
    const path: number[] = [];
    const at = new Map<number, number>();
    let x = s;
    while (!at.has(x)) {
      at.set(x, path.length);
      path.push(x);
      x = slowSuccessor(net, x);
    }
    const cycle = path.slice(at.get(x)!).map((y) => text(y, n));
    let best = 0;
    cycle.forEach((c, i) => (c < cycle[best]! ? (best = i) : 0));
    const states = [...cycle.slice(best), ...cycle.slice(0, best)];
    const key = states[0]!;
    const entry = attractors.get(key) ?? { states, basin: 0 };
    entry.basin++;
    attractors.set(key, entry);
    transient.push(at.get(x)!);
    attractorKey.push(key);
  }
  const sorted = [...attractors.values()].sort((a, b) => b.basin - a.basin || (a.states[0]! < b.states[0]! ? -1 : 1));
  return { sorted, transient, attractorKey };
}

/** Reference: terminal SCCs as the states that every state they reach can reach back (breadth-first reachability). */
function referenceAsynchronous(net: ReturnType<typeof randomNK>): string[][] {
  const n = net.names.length;
  const N = 2 ** n;
  const next = (s: number) => {
    const f = slowSuccessor(net, s);
    const out: number[] = [];
    for (let i = 0; i < n; i++) if (((f >> i) & 1) !== ((s >> i) & 1)) out.push(s ^ (1 << i));
    return out;
  };
  const reach: Set<number>[] = [];
  for (let s = 0; s < N; s++) {
    const seen = new Set([s]);
    const queue = [s];
    while (queue.length) for (const t of next(queue.shift()!)) if (!seen.has(t)) (seen.add(t), queue.push(t));
    reach.push(seen);
  }
  const groups = new Map<string, string[]>();
  for (let s = 0; s < N; s++) {
    if (![...reach[s]!].every((t) => reach[t]!.has(s))) continue;
    const members = [...reach[s]!].map((t) => text(t, n)).sort();
    groups.set(members[0]!, members);
  }
  return [...groups.values()].sort((a, b) => b.length - a.length || (a[0]! < b[0]! ? -1 : 1));
}

const smallNetwork = fc.record({
  n: fc.integer({ min: 1, max: 9 }),
  k: fc.integer({ min: 0, max: 4 }),
  seed: fc.integer(),
});

describe("state-graph", () => {
  it("analyseSynchronous finds the same attractors, basins, order and transient statistics as path-following reference", () => {
    fc.assert(
      fc.property(smallNetwork, ({ n, k, seed }) => {
        const net = randomNK(n, k, seed);
        const fast = analyseSynchronous(net);
        const ref = referenceSynchronous(net);
        expect(attractorsAsText(fast)).toEqual(
          ref.sorted.map((a) => ({ length: a.states.length, basin: a.basin, states: a.states })),
        );
        for (let s = 0; s < 2 ** n; s++)
          expect(text(fast.attractors[fast.attractorOf[s]!]!.states[0]!, n)).toBe(ref.attractorKey[s]);
        expect(fast.maxTransient).toBe(Math.max(...ref.transient));
        expect(fast.meanTransient).toBeCloseTo(ref.transient.reduce((a, b) => a + b, 0) / 2 ** n, 10);
      }),
      { seed: 31, numRuns: 120 },
    );
  });

  it("analyseSynchronous keeps transients of hundreds of steps exact: a counter that stops at one state", () => {
    // s -> s + 1 (mod 2^n) except at the stop state t, which is fixed: the state after t waits 2^n - 1 steps.
    fc.assert(
      fc.property(fc.integer({ min: 7, max: 10 }), fc.nat(), (n, stopSeed) => {
        const N = 2 ** n;
        const stop = stopSeed % N;
        const all = Array.from({ length: n }, (_, j) => j);
        const net = networkFromFunctions(
          Array.from({ length: n }, (_, i) => `c${i}`),
          all.map(() => all),
          (node, x) => {
            const s = x.reduce((acc, v, j) => acc | (v << j), 0);
            return ((s === stop ? s : (s + 1) % N) >>> node) & 1;
          },
        );
        const fast = analyseSynchronous(net);
        const ref = referenceSynchronous(net as ReturnType<typeof randomNK>);
        expect(fast.attractors).toHaveLength(1);
        expect(fast.attractors[0]!.basin).toBe(N);
        expect(fast.maxTransient).toBe(N - 1);
        expect(Math.max(...ref.transient)).toBe(N - 1);
        expect(fast.meanTransient).toBeCloseTo(ref.transient.reduce((a, b) => a + b, 0) / N, 10);
      }),
      { seed: 7, numRuns: 12 },
    );
  });

  it("analyseSynchronous returns attractors closed under update and basins that partition the state space", () => {
    fc.assert(
      fc.property(fc.integer({ min: 10, max: 14 }), fc.integer({ min: 1, max: 3 }), fc.integer(), (n, k, seed) => {
        const net = randomNK(n, k, seed);
        const a = analyseSynchronous(net);
        let total = 0;
        a.attractors.forEach((att, index) => {
          att.states.forEach((s, q) => expect(slowSuccessor(net, s)).toBe(att.states[(q + 1) % att.length]));
          let count = 0;
          forEachBasinState(a, index, (s) => {
            expect(a.attractorOf[s]).toBe(index);
            count++;
          });
          expect(count).toBe(att.basin);
          total += att.basin;
        });
        expect(total).toBe(2 ** n);
      }),
      { seed: 32, numRuns: 25 },
    );
  });

  it("analyseSynchronous reproduces the seven fixed points and the G1 basin of 1764 states of the yeast cell-cycle model", () => {
    // Li et al., "The yeast cell-cycle network is robustly designed", PNAS 2004, Table 1: seven fixed points with
    // basins 1764, 151, 109, 9, 7, 7, 1 out of 2048 states; the biggest is the G1 state (Cdh1 and Sic1 on).
    // Basin values from memory; the network is rebuilt from memory in yeast-cell-cycle.test-support.ts.
    const a = analyseSynchronous(yeastCellCycle());
    expect(a.stateCount).toBe(2048);
    expect(a.attractors.map((x) => x.length)).toEqual([1, 1, 1, 1, 1, 1, 1]);
    expect(a.attractors.map((x) => x.basin)).toEqual([1764, 151, 109, 9, 7, 7, 1]);
    expect(attractorsAsText(a)[0]!.states).toEqual(["00001000100"]);
  });

  it("analyseSynchronous starts each cycle at its textually smallest state, which need not be the smallest index", () => {
    // 2-node swap: 10 <-> 01. As text "01" < "10", but as indices "01" is 2 and "10" is 1.
    const swap = networkFromFunctions(["a", "b"], [[1], [0]], (_n, x) => x[0]!);
    const cycle = attractorsAsText(analyseSynchronous(swap)).find((x) => x.length === 2)!;
    expect(cycle.states).toEqual(["01", "10"]);
  });

  it("analyseSynchronous reports progress up to 1 and stops with CancelledError on request", () => {
    const fractions: number[] = [];
    analyseSynchronous(randomNK(18, 2, 4), { onProgress: (f) => fractions.push(f) });
    expect(fractions.at(-1)).toBe(1);
    expect(fractions.every((f, i) => i === 0 || f >= fractions[i - 1]!)).toBe(true);
    let calls = 0;
    expect(() => analyseSynchronous(randomNK(18, 2, 4), { shouldStop: () => ++calls > 4 })).toThrow(CancelledError);
  });

  it("asynchronousAttractors equals the terminal components found by breadth-first reachability", () => {
    fc.assert(
      fc.property(
        fc.record({ n: fc.integer({ min: 1, max: 8 }), k: fc.integer({ min: 0, max: 3 }), seed: fc.integer() }),
        ({ n, k, seed }) => {
          const net = randomNK(n, k, seed);
          const fast = asynchronousAttractors(net).attractors.map((a) => Array.from(a.states, (s) => text(s, n)));
          expect(fast).toEqual(referenceAsynchronous(net));
        },
      ),
      { seed: 33, numRuns: 100 },
    );
  });

  it("asynchronousAttractors finds the fixed points of a 16-node network among its attractors, and each fixed point alone", () => {
    const net = randomNK(16, 2, 9);
    const sync = analyseSynchronous(net);
    const asyncAttractors = asynchronousAttractors(net).attractors;
    for (const fp of sync.attractors.filter((a) => a.length === 1)) {
      expect(asyncAttractors.some((a) => a.size === 1 && a.states[0] === fp.states[0])).toBe(true);
    }
    for (const a of asyncAttractors.filter((x) => x.size === 1))
      expect(slowSuccessor(net, a.states[0]!)).toBe(a.states[0]);
  });

  it("asynchronousAttractors of the yeast cell-cycle model are its seven fixed points", () => {
    // Under asynchronous update the fixed points stay attractors; the extra claim that there are no cyclic
    // asynchronous attractors in this reconstruction is our own computation, not a published value.
    const attractors = asynchronousAttractors(yeastCellCycle()).attractors;
    expect(attractors.filter((a) => a.size === 1)).toHaveLength(7);
  });

  it("analyseSynchronous and asynchronousAttractors give the Faure et al. (2006) cell-cycle model its published attractors", () => {
    // Faure, Naldi, Chaouiya, Thieffry, "Dynamical analysis of a generic Boolean model for the control of the
    // mammalian cell cycle", Bioinformatics 2006: with CycD off, one stable state (Rb, p27, Cdh1 on); with CycD on,
    // a single cycle of 7 states under synchronous update and one complex attractor of 112 states under
    // asynchronous update. All three values from memory; the rules are transcribed from a fixture written from memory.
    const net = faureCellCycle();
    const sync = attractorsAsText(analyseSynchronous(net));
    expect(sync.map((a) => [a.length, a.basin])).toEqual([
      [1, 512],
      [7, 512],
    ]);
    expect(sync[0]!.states).toEqual(["0100010100"]);
    const asyncAttractors = asynchronousAttractors(net).attractors;
    expect(asyncAttractors.map((a) => a.size)).toEqual([112, 1]);
    expect(asyncAttractors[0]!.states.every((s) => (s & 1) === 1)).toBe(true);
    expect(text(asyncAttractors[1]!.states[0]!, 10)).toBe("0100010100");
  });

  it("sampleAttractors finds only true attractors, labels the result as found so far, and is reproducible per seed", () => {
    const net = randomNK(14, 2, 12);
    const exact = new Set(attractorsAsText(analyseSynchronous(net)).map((a) => a.states.join(",")));
    const run = () => sampleAttractors(net, { samples: 300, rng: seedrandom("s") });
    const sampled = run();
    expect(sampled.completeness).toBe("found so far");
    expect(sampled.unresolved).toBe(0);
    for (const a of sampled.attractors) expect(exact.has(a.states.join(","))).toBe(true);
    expect(sampled.attractors.reduce((t, a) => t + a.hits, 0)).toBe(300);
    expect(run()).toEqual(sampled);
    // With 300 starts every attractor whose basin exceeds 5% of the space is found (miss chance < 1e-6 each).
    const big = attractorsAsText(analyseSynchronous(net)).filter((a) => a.basin > 0.05 * 2 ** 14);
    for (const a of big) expect(sampled.attractors.some((s) => s.states[0] === a.states[0])).toBe(true);
  });

  it("sampleAttractors counts starts that do not close a cycle within maxSteps as unresolved", () => {
    // A 12-bit binary counter has one cycle of length 4096.
    const n = 12;
    const counter = networkFromFunctions(
      Array.from({ length: n }, (_, i) => `c${i}`),
      Array.from({ length: n }, (_, i) => Array.from({ length: i + 1 }, (_, j) => j)),
      (node, x) => (x.slice(0, node).every((v) => v === 1) ? 1 - x[node]! : x[node]!),
    );
    expect(sampleAttractors(counter, { samples: 5, rng: seedrandom("c"), maxSteps: 100 }).unresolved).toBe(5);
    const full = sampleAttractors(counter, { samples: 2, rng: seedrandom("c") });
    expect(full.attractors).toHaveLength(1);
    expect(full.attractors[0]!.length).toBe(4096);
  });
});
