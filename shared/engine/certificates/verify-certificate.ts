// Independent checker of reduction certificates (docs/certificates.md): it reads the JSON on its own, evaluates the
// truth tables with its own simulator (word-simulation.ts, 32 states per word) and imports nothing from the searches
// or the update engine, so a search bug cannot vouch for itself (the certifying-algorithm discipline of McConnell,
// Mehlhorn, Näher, Schweitzer, "Certifying algorithms", Computer Science Review, 2011).
import {
  differingLanes,
  laneMask,
  laneStates,
  laneText,
  lowestLane,
  runWords,
  scratchFor,
  stepWords,
  tableWord,
  type WordNet,
} from "./word-simulation";
import { checkCone, MAX_CONE_CLAUSES, planCone, type ConeObservable } from "./cone-check";
import { checkNodeElimination, checkPercolation, SubstitutionProblem } from "./substitution-check";

export interface VerificationReport {
  readonly valid: boolean;
  readonly notion: string | null;
  readonly time: number | null;
  /** Why the certificate fails (empty when valid). */
  readonly problems: string[];
  /**
   * Target (or, for coarse-graining, source) states re-simulated; for a check by cones, support assignments; for
   * node elimination and percolation, truth-table rows compared with the target.
   */
  readonly statesChecked: number;
  /**
   * A coarse-graining of a source above MAX_VERIFIED_SOURCE_NODES is checked target node by target node on the cone
   * of its observable (cone-check.ts): the source nodes each check read and how it was decided.
   */
  readonly cones?: { target: string; support: string[]; method: "table" | "sat" }[];
}

/** Largest source for which coarse-graining certificates are checked state by state; larger ones by cones. */
export const MAX_VERIFIED_SOURCE_NODES = 22;

/**
 * Largest time scale a certificate may state (docs/certificates.md). Searches go to t = 64 and compositions multiply
 * time scales, so 2^16 leaves room for chains of reductions; a bound is needed because the check steps F t times.
 */
export const MAX_CERTIFICATE_TIME = 65_536;

/**
 * Most word evaluations one check may take (32-state batches x time scale x source nodes), about ten seconds on one
 * core: with it a stated time scale near the bound, or a large target, is refused at once instead of simulated.
 */
export const MAX_CHECK_WORK = 2 ** 27;

interface Net extends WordNet {
  names: string[];
  index: Map<string, number>;
  inputs: number[][];
  tables: Uint8Array[];
}

class Invalid extends Error {}

function fail(message: string): never {
  throw new Invalid(message);
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

function stringList(v: unknown, what: string): string[] {
  if (!Array.isArray(v) || !v.every((s) => typeof s === "string")) fail(`${what} must be a list of names`);
  return v as string[];
}

function bits(v: unknown, length: number, what: string): string {
  if (typeof v !== "string" || v.length !== length || !/^[01]*$/.test(v))
    fail(`${what} must be a 0/1 string of length ${length}`);
  return v;
}

function readNet(v: unknown, what: string): Net {
  if (!isRecord(v) || !Array.isArray(v.nodes)) fail(`${what} must have a "nodes" list`);
  const nodes = v.nodes as unknown[];
  const names: string[] = [];
  const index = new Map<string, number>();
  nodes.forEach((node, i) => {
    if (!isRecord(node) || typeof node.name !== "string") fail(`${what} node ${i + 1} has no name`);
    if (index.has(node.name)) fail(`${what} names node "${node.name}" twice`);
    index.set(node.name, i);
    names.push(node.name);
  });
  const inputs: number[][] = [];
  const tables: Uint8Array[] = [];
  nodes.forEach((raw) => {
    const node = raw as Record<string, unknown>;
    const ins = stringList(node.inputs, `${what} node "${String(node.name)}" inputs`);
    if (ins.length > 20) fail(`${what} node "${String(node.name)}" has more than 20 inputs`);
    inputs.push(
      ins.map((name) => {
        const k = index.get(name);
        if (k === undefined) fail(`${what} node "${String(node.name)}" reads unknown node "${name}"`);
        return k;
      }),
    );
    tables.push(toTable(bits(node.table, 2 ** ins.length, `${what} node "${String(node.name)}" table`)));
  });
  return { names, index, inputs, tables };
}

function toTable(text: string): Uint8Array {
  return Uint8Array.from(text, (c) => (c === "1" ? 1 : 0));
}

function stateText(x: number, length: number): string {
  let s = "";
  for (let i = 0; i < length; i++) s += Math.floor(x / 2 ** i) % 2;
  return s;
}

/** Refuse, before simulating, a check whose cost exceeds MAX_CHECK_WORK. */
function boundWork(states: number, t: number, sourceNodes: number): void {
  const work = Math.ceil(states / 32) * t * Math.max(sourceNodes, 1);
  if (work > MAX_CHECK_WORK)
    fail(
      `checking needs ${work} word evaluations (${states} states, time scale ${t}, ${sourceNodes} source nodes); ` +
        `at most ${MAX_CHECK_WORK} are done`,
    );
}

/** States in batch b (0 .. 32 b + 31, clipped to `count`). */
function lanesIn(batch: number, count: number): number {
  return Math.min(32, count - 32 * batch);
}

/** Check a certificate given as parsed JSON; never throws on bad input, it reports it. */
export function verifyCertificate(input: unknown): VerificationReport {
  let notion: string | null = null;
  let time: number | null = null;
  let statesChecked = 0;
  let cones: VerificationReport["cones"];
  try {
    if (!isRecord(input)) fail("a certificate must be a JSON object");
    if (input.format !== "emulant-reduction") fail('"format" must be "emulant-reduction"');
    if (input.version !== 1) fail('"version" must be 1');
    if (typeof input.notion !== "string") fail('"notion" is missing');
    notion = input.notion;
    if (typeof input.time !== "number" || !Number.isInteger(input.time) || input.time < 1)
      fail('"time" must be a whole number of at least 1');
    if (input.time > MAX_CERTIFICATE_TIME) fail(`"time" must be at most ${MAX_CERTIFICATE_TIME}`);
    time = input.time;
    const F = readNet(input.source, "source");
    const G = readNet(input.target, "target");
    const w = input.witness;
    if (!isRecord(w)) fail('"witness" must be an object');
    if (notion === "node-elimination" || notion === "constant-percolation") {
      // Statements about fixed points and attractors, not about t steps: checked function by function, at any size.
      if (time !== 1) fail(`"time" of a ${notion} certificate must be 1`);
      statesChecked =
        notion === "node-elimination"
          ? checkNodeElimination(F, G, stringList(w.eliminated, "the eliminated nodes"))
          : checkPercolation(F, G, w.held, w.fixed);
      return { valid: true, notion, time, problems: [], statesChecked };
    }
    const m = G.names.length;
    if (m > 24) fail("targets of more than 24 nodes are not checked");
    const counter: Counter = { add: (k: number) => (statesChecked += k), cones: (c) => (cones = c) };
    if (notion === "block-emulation") checkBlocks(F, G, w, time, counter);
    else if (notion === "dynamical-embedding") checkEmbedding(F, G, w, time, counter);
    else if (notion === "coarse-graining") checkCoarseGraining(F, G, w, time, counter);
    else fail(`unknown notion "${notion}"`);
    return { valid: true, notion, time, problems: [], statesChecked, ...(cones ? { cones } : {}) };
  } catch (e) {
    if (e instanceof Invalid || e instanceof SubstitutionProblem)
      return { valid: false, notion, time, problems: [e.message], statesChecked };
    throw e;
  }
}

interface Counter {
  add(states: number): void;
  cones(reports: NonNullable<VerificationReport["cones"]>): void;
}

function checkBlocks(F: Net, G: Net, w: Record<string, unknown>, t: number, counter: Counter): void {
  if (!Array.isArray(w.blocks)) fail('a block-emulation witness needs "blocks"');
  if (!isRecord(w.context)) fail('a block-emulation witness needs "context"');
  const n = F.names.length;
  const m = G.names.length;
  const owner = new Array<string | null>(n).fill(null);
  const blockOf = new Array<{ nodes: number[]; zero: string; one: string } | null>(m).fill(null);
  for (const raw of w.blocks as unknown[]) {
    if (!isRecord(raw) || typeof raw.target !== "string") fail("each block names its target node");
    const j = G.index.get(raw.target);
    if (j === undefined) fail(`block for unknown target node "${raw.target}"`);
    if (blockOf[j]) fail(`target node "${raw.target}" has two blocks`);
    const names = stringList(raw.nodes, `block of "${raw.target}"`);
    if (names.length === 0) fail(`block of "${raw.target}" is empty`);
    const nodes = names.map((name) => {
      const v = F.index.get(name);
      if (v === undefined) fail(`block of "${raw.target}" uses unknown source node "${name}"`);
      if (owner[v] !== null) fail(`source node "${name}" lies in two blocks`);
      owner[v] = raw.target as string;
      return v;
    });
    const zero = bits(raw.zero, nodes.length, `codeword 0 of "${raw.target}"`);
    const one = bits(raw.one, nodes.length, `codeword 1 of "${raw.target}"`);
    if (zero === one) fail(`the two codewords of "${raw.target}" are equal`);
    blockOf[j] = { nodes, zero, one };
  }
  blockOf.forEach((b, j) => {
    if (!b) fail(`target node "${G.names[j]}" has no block`);
  });
  const base = new Uint8Array(n);
  for (const [name, value] of Object.entries(w.context)) {
    const v = F.index.get(name);
    if (v === undefined) fail(`context names unknown source node "${name}"`);
    if (owner[v] !== null) fail(`source node "${name}" is both in a block and in the context`);
    if (value !== 0 && value !== 1) fail(`context value of "${name}" must be 0 or 1`);
    base[v] = value;
  }
  for (let v = 0; v < n; v++)
    if (owner[v] === null && !Object.hasOwn(w.context, F.names[v]!))
      fail(`source node "${F.names[v]}" is neither in a block nor in the context`);
  boundWork(2 ** m, t, n);
  const contextWords = Int32Array.from(base, (b) => (b ? -1 : 0));
  const slots = blockOf.flatMap((b, j) =>
    b!.nodes.map((v, i) => ({ v, j, zero: b!.zero[i] === "1" ? -1 : 0, one: b!.one[i] === "1" ? -1 : 0 })),
  );
  const encode = (x: Int32Array, out: Int32Array) => {
    out.set(contextWords);
    for (const { v, j, zero, one } of slots) out[v] = (x[j]! & one) | (~x[j]! & zero);
  };
  const scratch = scratchFor(F, G);
  const x = new Int32Array(m);
  const gx = new Int32Array(m);
  const a = new Int32Array(n);
  const b = new Int32Array(n);
  const want = new Int32Array(n);
  const count = 2 ** m;
  for (let batch = 0; batch < Math.ceil(count / 32); batch++) {
    laneStates(batch, m, x);
    encode(x, a);
    const got = runWords(F, a, b, t, scratch);
    stepWords(G, x, gx, scratch);
    encode(gx, want);
    const bad = differingLanes(got, want, n, laneMask(batch, count));
    if (bad) {
      const lane = lowestLane(bad);
      counter.add(lane + 1);
      fail(
        `target state ${laneText(x, m, lane)}: F^${t}(e(x)) = ${laneText(got, n, lane)} but e(G(x)) = ${laneText(want, n, lane)}`,
      );
    }
    counter.add(lanesIn(batch, count));
  }
}

function checkEmbedding(F: Net, G: Net, w: Record<string, unknown>, t: number, counter: Counter): void {
  if (!isRecord(w.map)) fail('an embedding witness needs "map"');
  const map = w.map;
  const n = F.names.length;
  const m = G.names.length;
  boundWork(2 ** m, t, n);
  if (Object.keys(map).length !== 2 ** m) fail(`the map must list all ${2 ** m} target states`);
  const count = 2 ** m;
  const seen = new Set<string>();
  const images: string[] = [];
  for (let x = 0; x < count; x++) {
    const key = stateText(x, m);
    const image = bits(Object.hasOwn(map, key) ? map[key] : undefined, n, `image of target state ${key}`);
    if (seen.has(image)) fail(`two target states map to source state ${image}`);
    seen.add(image);
    images.push(image);
  }
  const pack = (states: (lane: number) => number, lanes: number, out: Int32Array) => {
    out.fill(0);
    for (let lane = 0; lane < lanes; lane++) {
      const image = images[states(lane)]!;
      for (let v = 0; v < n; v++) if (image[v] === "1") out[v]! |= 1 << lane;
    }
  };
  const scratch = scratchFor(F, G);
  const x = new Int32Array(m);
  const gx = new Int32Array(m);
  const a = new Int32Array(n);
  const b = new Int32Array(n);
  const want = new Int32Array(n);
  const indexOf = (words: Int32Array, lane: number) => {
    let y = 0;
    for (let j = 0; j < m; j++) y += ((words[j]! >>> lane) & 1) * 2 ** j;
    return y;
  };
  for (let batch = 0; batch < Math.ceil(count / 32); batch++) {
    const lanes = lanesIn(batch, count);
    laneStates(batch, m, x);
    pack((lane) => 32 * batch + lane, lanes, a);
    const got = runWords(F, a, b, t, scratch);
    stepWords(G, x, gx, scratch);
    pack((lane) => indexOf(gx, lane), lanes, want);
    const bad = differingLanes(got, want, n, laneMask(batch, count));
    if (bad) {
      const lane = lowestLane(bad);
      counter.add(lane + 1);
      fail(
        `target state ${laneText(x, m, lane)}: F^${t}(e(x)) = ${laneText(got, n, lane)} but e(G(x)) = ${laneText(want, n, lane)}`,
      );
    }
    counter.add(lanes);
  }
}

function checkCoarseGraining(F: Net, G: Net, w: Record<string, unknown>, t: number, counter: Counter): void {
  if (!Array.isArray(w.observables)) fail('a coarse-graining witness needs "observables"');
  const n = F.names.length;
  const m = G.names.length;
  const obs = new Array<{ inputs: number[]; table: Uint8Array } | null>(m).fill(null);
  for (const raw of w.observables as unknown[]) {
    if (!isRecord(raw) || typeof raw.target !== "string") fail("each observable names its target node");
    const j = G.index.get(raw.target);
    if (j === undefined) fail(`observable for unknown target node "${raw.target}"`);
    if (obs[j]) fail(`target node "${raw.target}" has two observables`);
    const inputs = stringList(raw.inputs, `observable "${raw.target}" inputs`).map((name) => {
      const v = F.index.get(name);
      if (v === undefined) fail(`observable "${raw.target}" reads unknown source node "${name}"`);
      return v;
    });
    if (inputs.length > 20) fail(`observable "${raw.target}" reads more than 20 nodes`);
    obs[j] = { inputs, table: toTable(bits(raw.table, 2 ** inputs.length, `observable "${raw.target}" table`)) };
  }
  obs.forEach((o, j) => {
    if (!o) fail(`target node "${G.names[j]}" has no observable`);
  });
  if (n > MAX_VERIFIED_SOURCE_NODES) checkByCones(F, G, obs as ConeObservable[], w, t, counter);
  else if (w.cones !== undefined) fail('"cones" are stated only for sources of more than 22 nodes');
  else checkAllStates(F, G, obs as ConeObservable[], t, counter);
}

function checkAllStates(F: Net, G: Net, obs: ConeObservable[], t: number, counter: Counter): void {
  const n = F.names.length;
  const m = G.names.length;
  boundWork(2 ** n, t, n);
  const observe = (s: Int32Array, out: Int32Array) => {
    obs.forEach((o, j) => (out[j] = tableWord(o.table, o.inputs, s, scratch)));
  };
  const obsNet: WordNet = { inputs: obs.map((o) => o.inputs), tables: obs.map((o) => o.table) };
  const scratch = scratchFor(F, G, obsNet);
  const xs = new Int32Array(n);
  const a = new Int32Array(n);
  const b = new Int32Array(n);
  const px = new Int32Array(m);
  const got = new Int32Array(m);
  const want = new Int32Array(m);
  const count = 2 ** n;
  for (let batch = 0; batch < Math.ceil(count / 32); batch++) {
    laneStates(batch, n, xs);
    a.set(xs);
    observe(runWords(F, a, b, t, scratch), got);
    observe(xs, px);
    stepWords(G, px, want, scratch);
    const bad = differingLanes(got, want, m, laneMask(batch, count));
    if (bad) {
      const lane = lowestLane(bad);
      counter.add(lane + 1);
      fail(
        `source state ${laneText(xs, n, lane)}: p(F^${t}(x)) = ${laneText(got, m, lane)} but G(p(x)) = ${laneText(want, m, lane)}`,
      );
    }
    counter.add(lanesIn(batch, count));
  }
}

/**
 * Sources above MAX_VERIFIED_SOURCE_NODES: each target node's equation is checked on the cone of its observable
 * (cone-check.ts), every cost bounded before any check runs. The certificate may state each check's support and
 * method ("cones"); a stated one must be what the verifier computes, so a reader of the JSON sees what was checked.
 */
function checkByCones(
  F: Net,
  G: Net,
  obs: ConeObservable[],
  w: Record<string, unknown>,
  t: number,
  counter: Counter,
): void {
  if (t > 64) fail("coarse-graining certificates of sources above 22 nodes are checked up to time scale 64");
  const plans = G.names.map((_, j) => planCone(F, G, obs, j, t));
  const tableWork = plans.reduce((sum, p) => sum + (p.method === "table" ? p.cost : 0), 0);
  if (tableWork > MAX_CHECK_WORK)
    fail(`checking the cones needs ${tableWork} word evaluations; at most ${MAX_CHECK_WORK} are done`);
  plans.forEach((p, j) => {
    if (p.method === "sat" && p.cost > MAX_CONE_CLAUSES)
      fail(
        `the check of target node "${G.names[j]}" reads ${p.support.length} source nodes and needs ${p.cost} clauses; at most ${MAX_CONE_CLAUSES} are written`,
      );
  });
  const reports = plans.map((p, j) => ({
    target: G.names[j]!,
    support: p.support.map((v) => F.names[v]!),
    method: p.method,
  }));
  if (w.cones !== undefined) {
    if (!Array.isArray(w.cones) || w.cones.length !== G.names.length)
      fail(`"cones" must list one entry per target node (${G.names.length})`);
    (w.cones as unknown[]).forEach((raw, j) => {
      const want = reports[j]!;
      if (!isRecord(raw) || raw.target !== want.target)
        fail(`cone ${j + 1} must be that of target node "${want.target}"`);
      const stated = stringList(raw.support, `cone of "${want.target}" support`);
      if (stated.length !== want.support.length || stated.some((name, q) => name !== want.support[q]))
        fail(
          `cone of "${want.target}": the stated support is not the one its check reads (${want.support.join(", ")})`,
        );
      if (raw.method !== want.method) fail(`cone of "${want.target}": the method is "${want.method}"`);
    });
  }
  plans.forEach((p, j) => {
    const failure = checkCone(F, G, obs, j, t, p);
    if (failure)
      fail(
        `source state ${failure.state}: after ${t} step${t === 1 ? "" : "s"} observable "${failure.target}" is ${failure.got} but the target predicts ${failure.want}`,
      );
    counter.add(p.method === "table" ? 2 ** p.support.length : 0);
  });
  counter.cones(reports);
}
