// A slow, plainly correct reference for the evaluator: every attractor found by following each state (synchronous)
// or by comparing reachable sets (asynchronous: a state lies on an attractor when every state it reaches reaches it
// back), then each outcome decided straight from its definition. Only for networks of a few nodes.
import type { BooleanNetwork } from "../network";
import { slowSuccessor, text } from "../update/random-networks.test-support";
import type { Expectation } from "./expectation";

type Step = (s: number) => number;

function perturbedStep(net: BooleanNetwork, e: Expectation): Step {
  const index = (name: string) => net.names.indexOf(name);
  let clear = 0;
  let set = 0;
  for (const name of e.condition.knockOut) clear |= 1 << index(name);
  for (const name of e.condition.overExpress) set |= 1 << index(name);
  for (const [name, v] of Object.entries(e.condition.inputs)) {
    if (v) set |= 1 << index(name);
    else clear |= 1 << index(name);
  }
  return (s) => (slowSuccessor(net, s) & ~clear) | set;
}

function syncAttractorOf(step: Step, s: number): number[] {
  const seen: number[] = [];
  while (!seen.includes(s)) {
    seen.push(s);
    s = step(s);
  }
  return seen.slice(seen.indexOf(s)).sort((a, b) => a - b);
}

function asyncNeighbours(step: Step, s: number, n: number): number[] {
  const image = step(s);
  const out: number[] = [];
  for (let i = 0; i < n; i++) if (((image >> i) & 1) !== ((s >> i) & 1)) out.push(s ^ (1 << i));
  return out;
}

function reach(step: Step, s: number, n: number): Set<number> {
  const seen = new Set([s]);
  const queue = [s];
  while (queue.length > 0)
    for (const t of asyncNeighbours(step, queue.shift()!, n))
      if (!seen.has(t)) {
        seen.add(t);
        queue.push(t);
      }
  return seen;
}

/** Attractors as sorted state lists, each once. */
function attractors(step: Step, n: number, update: Expectation["update"], from: number[]): number[][] {
  const found = new Map<string, number[]>();
  for (const s of from) {
    if (update === "synchronous") {
      const a = syncAttractorOf(step, s);
      found.set(a.join(","), a);
    } else {
      for (const t of reach(step, s, n)) {
        const r = reach(step, t, n);
        if ([...r].every((u) => reach(step, u, n).has(t))) {
          const a = [...r].sort((x, y) => x - y);
          found.set(a.join(","), a);
        }
      }
    }
  }
  return [...found.values()];
}

/** The status the expectation deserves on this network, from the definitions alone. */
export function referenceStatus(net: BooleanNetwork, e: Expectation): "pass" | "fail" {
  const n = net.names.length;
  const step = perturbedStep(net, e);
  const all = Array.from({ length: 2 ** n }, (_, s) => s);
  const has = (states: number[], pattern: Readonly<Record<string, 0 | 1>>) =>
    Object.entries(pattern).every(([name, v]) =>
      states.every((s) => text(s, n)[net.names.indexOf(name)] === String(v)),
    );
  const o = e.outcome;
  const verdict = (b: boolean) => (b ? "pass" : "fail");
  const compare = (found: number, c: typeof o & { comparison: string; count: number }) =>
    c.comparison === "exactly" ? found === c.count : c.comparison === "at-least" ? found >= c.count : found <= c.count;
  switch (o.kind) {
    case "some-attractor":
      return verdict(attractors(step, n, e.update, all).some((a) => has(a, o.pattern)));
    case "every-attractor":
      return verdict(attractors(step, n, e.update, all).every((a) => has(a, o.pattern)));
    case "no-attractor":
      return verdict(!attractors(step, n, e.update, all).some((a) => has(a, o.pattern)));
    case "fixed-point-count":
      return verdict(compare(all.filter((s) => step(s) === s).length, o));
    case "attractor-count":
      return verdict(compare(attractors(step, n, e.update, all).length, o));
    case "reachable": {
      let start = 0;
      for (const [name, v] of Object.entries(o.from)) if (v) start |= 1 << net.names.indexOf(name);
      return verdict(attractors(step, n, e.update, [start]).some((a) => has(a, o.pattern)));
    }
  }
}
