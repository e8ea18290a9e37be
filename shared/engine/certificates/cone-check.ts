// Coarse-graining certificates of sources too large to enumerate (docs/certificates.md, "Checking large sources"):
// p(F^t(s)) = G(p(s)) holds for all states exactly when, for each target node j, the function
// s -> obs_j(F^t(s)) xor G_j(p(s)) is identically 0. That function reads only its support: the t-step cone of
// obs_j's inputs plus the inputs of the observables that G_j reads. A small support is checked by its truth table
// (all 2^|support| assignments, 32 at a time); a large one by asking a SAT solver for an assignment that makes it 1
// (bounded unrolling, as in Biere, Cimatti, Clarke, Zhu, "Symbolic model checking without BDDs", TACAS 1999). The
// encoding below is written here, on logic-solver's public formula API, and shares nothing with the search's.
import Logic from "logic-solver";
import { laneStates, laneText, lowestLane, scratchFor, tableWord, type WordNet } from "./word-simulation";

/** Supports up to this many source nodes are checked by truth table; larger ones by SAT. */
export const MAX_TABLE_SUPPORT = 20;
/** Most clauses one SAT check may write (each row of each unrolled table is one clause). */
export const MAX_CONE_CLAUSES = 2 ** 18;

export interface ConeNet extends WordNet {
  readonly names: readonly string[];
}

export interface ConeObservable {
  readonly inputs: readonly number[];
  readonly table: Uint8Array;
}

export interface ConeReport {
  /** Target node name. */
  readonly target: string;
  /** Source nodes the check of this target node reads (sorted by source order). */
  readonly support: number[];
  readonly method: "table" | "sat";
  /** Assignments of the support enumerated (0 for SAT). */
  readonly assignments: number;
}

/** The failure of one target node's check: a whole source state (nodes outside the support at 0) and both sides. */
export interface ConeFailure {
  readonly target: string;
  readonly state: string;
  readonly got: number;
  readonly want: number;
}

/** Layer s of target node j: the source nodes whose value at step s the check reads; layer t is obs_j's inputs. */
export function coneLayers(F: WordNet, inputs: readonly number[], t: number): number[][] {
  const layers: number[][] = new Array(t + 1);
  layers[t] = [...new Set(inputs)].sort((a, b) => a - b);
  for (let s = t - 1; s >= 0; s--) {
    const set = new Set<number>();
    for (const i of layers[s + 1]!) for (const r of F.inputs[i]!) set.add(r);
    layers[s] = [...set].sort((a, b) => a - b);
  }
  return layers;
}

function supportOf(G: WordNet, obs: readonly ConeObservable[], j: number, layers: number[][]): number[] {
  const set = new Set(layers[0]);
  for (const g of G.inputs[j]!) for (const v of obs[g]!.inputs) set.add(v);
  return [...set].sort((a, b) => a - b);
}

/** Cost of target node j's check in word evaluations (table) or clauses (SAT), computed before any check runs. */
export function planCone(
  F: ConeNet,
  G: ConeNet,
  obs: readonly ConeObservable[],
  j: number,
  t: number,
): { layers: number[][]; support: number[]; method: "table" | "sat"; cost: number } {
  const layers = coneLayers(F, obs[j]!.inputs, t);
  const support = supportOf(G, obs, j, layers);
  if (support.length <= MAX_TABLE_SUPPORT) {
    const perBatch = layers.slice(1).reduce((sum, layer) => sum + layer.length, 0) + 1 + G.inputs[j]!.length;
    return { layers, support, method: "table", cost: Math.ceil(2 ** support.length / 32) * perBatch };
  }
  let clauses = 0;
  for (let s = 1; s <= t; s++) for (const i of layers[s]!) clauses += 2 ** F.inputs[i]!.length;
  clauses += 2 ** obs[j]!.inputs.length + 2 ** G.inputs[j]!.length + 1;
  for (const g of G.inputs[j]!) clauses += 2 ** obs[g]!.inputs.length;
  return { layers, support, method: "sat", cost: clauses };
}

/** Check target node j; returns its failure, or null when obs_j(F^t(s)) = G_j(p(s)) for every state s. */
export function checkCone(
  F: ConeNet,
  G: ConeNet,
  obs: readonly ConeObservable[],
  j: number,
  t: number,
  plan: { layers: number[][]; support: number[]; method: "table" | "sat" },
): ConeFailure | null {
  return plan.method === "table" ? byTable(F, G, obs, j, plan) : bySat(F, G, obs, j, t, plan);
}

/** Both sides of target node j's equation on 32 states at once (`start` holds the support's words). */
function sides(
  F: ConeNet,
  G: ConeNet,
  obs: readonly ConeObservable[],
  j: number,
  layers: number[][],
  start: Int32Array,
  scratch: Int32Array,
): { got: number; want: number } {
  const n = F.names.length;
  let cur = Int32Array.from(start);
  for (let s = 1; s < layers.length; s++) {
    const next = new Int32Array(n);
    for (const i of layers[s]!) next[i] = tableWord(F.tables[i]!, F.inputs[i]!, cur, scratch);
    cur = next;
  }
  const got = tableWord(obs[j]!.table, obs[j]!.inputs, cur, scratch);
  const px = new Int32Array(G.names.length);
  for (const g of G.inputs[j]!) px[g] = tableWord(obs[g]!.table, obs[g]!.inputs, start, scratch);
  const want = tableWord(G.tables[j]!, G.inputs[j]!, px, scratch);
  return { got, want };
}

function scratchOf(F: ConeNet, G: ConeNet, obs: readonly ConeObservable[]): Int32Array {
  return scratchFor(F, G, { inputs: obs.map((o) => o.inputs), tables: obs.map((o) => o.table) });
}

function byTable(
  F: ConeNet,
  G: ConeNet,
  obs: readonly ConeObservable[],
  j: number,
  plan: { layers: number[][]; support: number[] },
): ConeFailure | null {
  const k = plan.support.length;
  const count = 2 ** k;
  const scratch = scratchOf(F, G, obs);
  const low = new Int32Array(k);
  const start = new Int32Array(F.names.length);
  for (let batch = 0; batch < Math.ceil(count / 32); batch++) {
    laneStates(batch, k, low);
    plan.support.forEach((v, q) => (start[v] = low[q]!));
    const { got, want } = sides(F, G, obs, j, plan.layers, start, scratch);
    const lanes = Math.min(32, count - 32 * batch);
    const bad = (got ^ want) & (lanes >= 32 ? -1 : (1 << lanes) - 1);
    if (bad) {
      const lane = lowestLane(bad);
      return {
        target: G.names[j]!,
        state: laneText(start, F.names.length, lane),
        got: (got >>> lane) & 1,
        want: (want >>> lane) & 1,
      };
    }
  }
  return null;
}

function bySat(
  F: ConeNet,
  G: ConeNet,
  obs: readonly ConeObservable[],
  j: number,
  t: number,
  plan: { layers: number[][]; support: number[] },
): ConeFailure | null {
  const at = (s: number, i: number) => `x${s}_${i}`;
  const solver = new Logic.Solver();
  // out <-> table(ins), one clause per row: "inputs equal row r" implies "out equals table[r]".
  const define = (table: Uint8Array, ins: readonly string[], out: string) => {
    for (let r = 0; r < table.length; r++) {
      const lits = ins.map((name, q) => ((r >> q) & 1 ? `-${name}` : name));
      lits.push(table[r] ? out : `-${out}`);
      solver.require(Logic.or(lits));
    }
  };
  Logic.disablingAssertions(() => {
    for (let s = 1; s <= t; s++)
      for (const i of plan.layers[s]!)
        define(
          F.tables[i]!,
          F.inputs[i]!.map((r) => at(s - 1, r)),
          at(s, i),
        );
    define(
      obs[j]!.table,
      obs[j]!.inputs.map((v) => at(t, v)),
      "got",
    );
    for (const g of new Set(G.inputs[j]!))
      define(
        obs[g]!.table,
        obs[g]!.inputs.map((v) => at(0, v)),
        `p_${g}`,
      );
    define(
      G.tables[j]!,
      G.inputs[j]!.map((g) => `p_${g}`),
      "want",
    );
    solver.require(Logic.xor("got", "want"));
  });
  const solution = solver.solve();
  if (!solution) return null;
  // The solver's state is re-simulated, so what is reported is a fact about the networks, not about the encoding.
  const start = new Int32Array(F.names.length);
  for (const v of plan.support) start[v] = solution.evaluate(at(0, v)) ? -1 : 0;
  const { got, want } = sides(F, G, obs, j, plan.layers, start, scratchOf(F, G, obs));
  if (((got ^ want) & 1) === 0) throw new Error("the verifier's SAT encoding disagrees with its simulation");
  return { target: G.names[j]!, state: laneText(start, F.names.length, 0), got: got & 1, want: want & 1 };
}
