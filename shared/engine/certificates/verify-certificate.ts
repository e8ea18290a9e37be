// Independent checker of reduction certificates (docs/certificates.md): it reads the JSON on its own, evaluates the
// truth tables with its own few lines of code and re-simulates one synchronous step at a time, sharing nothing with
// the searches, so a search bug cannot vouch for itself (the certifying-algorithm discipline of McConnell, Mehlhorn,
// Näher, Schweitzer, "Certifying algorithms", Computer Science Review, 2011).

export interface VerificationReport {
  readonly valid: boolean;
  readonly notion: string | null;
  readonly time: number | null;
  /** Why the certificate fails (empty when valid). */
  readonly problems: string[];
  /** Target (or, for coarse-graining, source) states re-simulated. */
  readonly statesChecked: number;
}

/** Largest source for which coarse-graining certificates are checked state by state. */
export const MAX_VERIFIED_SOURCE_NODES = 22;

/**
 * Largest time scale a certificate may state (docs/certificates.md). Searches go to t = 64 and compositions multiply
 * time scales, so 2^16 leaves room for chains of reductions; a bound is needed because the check steps F t times.
 */
export const MAX_CERTIFICATE_TIME = 65_536;

interface Net {
  names: string[];
  index: Map<string, number>;
  inputs: number[][];
  tables: string[];
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
  const tables: string[] = [];
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
    tables.push(bits(node.table, 2 ** ins.length, `${what} node "${String(node.name)}" table`));
  });
  return { names, index, inputs, tables };
}

function step(net: Net, s: Uint8Array): Uint8Array {
  const out = new Uint8Array(s.length);
  for (let i = 0; i < s.length; i++) {
    let row = 0;
    const ins = net.inputs[i]!;
    for (let j = 0; j < ins.length; j++) row += s[ins[j]!]! * 2 ** j;
    out[i] = net.tables[i]![row] === "1" ? 1 : 0;
  }
  return out;
}

function run(net: Net, s: Uint8Array, t: number): Uint8Array {
  let cur = s;
  for (let k = 0; k < t; k++) cur = step(net, cur);
  return cur;
}

function same(a: Uint8Array, b: Uint8Array): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

function show(s: Uint8Array): string {
  return Array.from(s).join("");
}

/** All 0/1 vectors of a given length, first coordinate changing fastest (so vector x is state index x). */
function* allStates(length: number): Generator<Uint8Array> {
  const s = new Uint8Array(length);
  for (;;) {
    yield Uint8Array.from(s);
    let i = 0;
    while (i < length && s[i] === 1) s[i++] = 0;
    if (i === length) return;
    s[i] = 1;
  }
}

/** Check a certificate given as parsed JSON; never throws on bad input, it reports it. */
export function verifyCertificate(input: unknown): VerificationReport {
  let notion: string | null = null;
  let time: number | null = null;
  let statesChecked = 0;
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
    const m = G.names.length;
    if (m > 24) fail("targets of more than 24 nodes are not checked");
    const counter = { add: () => statesChecked++ };
    if (notion === "block-emulation") checkBlocks(F, G, w, time, counter);
    else if (notion === "dynamical-embedding") checkEmbedding(F, G, w, time, counter);
    else if (notion === "coarse-graining") checkCoarseGraining(F, G, w, time, counter);
    else fail(`unknown notion "${notion}"`);
    return { valid: true, notion, time, problems: [], statesChecked };
  } catch (e) {
    if (e instanceof Invalid) return { valid: false, notion, time, problems: [e.message], statesChecked };
    throw e;
  }
}

function checkBlocks(F: Net, G: Net, w: Record<string, unknown>, t: number, counter: { add(): void }): void {
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
  const encode = (x: Uint8Array) => {
    const s = Uint8Array.from(base);
    blockOf.forEach((b, j) => b!.nodes.forEach((v, i) => (s[v] = (x[j] ? b!.one : b!.zero)[i] === "1" ? 1 : 0)));
    return s;
  };
  for (const x of allStates(m)) {
    counter.add();
    const got = run(F, encode(x), t);
    const want = encode(step(G, x));
    if (!same(got, want)) fail(`target state ${show(x)}: F^${t}(e(x)) = ${show(got)} but e(G(x)) = ${show(want)}`);
  }
}

function checkEmbedding(F: Net, G: Net, w: Record<string, unknown>, t: number, counter: { add(): void }): void {
  if (!isRecord(w.map)) fail('an embedding witness needs "map"');
  const map = w.map;
  const n = F.names.length;
  const m = G.names.length;
  const images = new Set<string>();
  const e = (x: Uint8Array) => {
    const key = show(x);
    const value = bits(Object.hasOwn(map, key) ? map[key] : undefined, n, `image of target state ${key}`);
    return Uint8Array.from(value, (c) => (c === "1" ? 1 : 0));
  };
  if (Object.keys(map).length !== 2 ** m) fail(`the map must list all ${2 ** m} target states`);
  for (const x of allStates(m)) {
    counter.add();
    const image = e(x);
    const key = show(image);
    if (images.has(key)) fail(`two target states map to source state ${key}`);
    images.add(key);
    const got = run(F, image, t);
    const want = e(step(G, x));
    if (!same(got, want)) fail(`target state ${show(x)}: F^${t}(e(x)) = ${show(got)} but e(G(x)) = ${show(want)}`);
  }
}

function checkCoarseGraining(F: Net, G: Net, w: Record<string, unknown>, t: number, counter: { add(): void }): void {
  if (!Array.isArray(w.observables)) fail('a coarse-graining witness needs "observables"');
  const n = F.names.length;
  const m = G.names.length;
  if (n > MAX_VERIFIED_SOURCE_NODES)
    fail(`coarse-graining certificates are checked for sources of at most ${MAX_VERIFIED_SOURCE_NODES} nodes`);
  const obs = new Array<{ inputs: number[]; table: string } | null>(m).fill(null);
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
    obs[j] = { inputs, table: bits(raw.table, 2 ** inputs.length, `observable "${raw.target}" table`) };
  }
  obs.forEach((o, j) => {
    if (!o) fail(`target node "${G.names[j]}" has no observable`);
  });
  const p = (s: Uint8Array) =>
    Uint8Array.from(obs, (o) => {
      let row = 0;
      o!.inputs.forEach((v, k) => (row += s[v]! * 2 ** k));
      return o!.table[row] === "1" ? 1 : 0;
    });
  for (const x of allStates(n)) {
    counter.add();
    const got = p(run(F, x, t));
    const want = step(G, p(x));
    if (!same(got, want)) fail(`source state ${show(x)}: p(F^${t}(x)) = ${show(got)} but G(p(x)) = ${show(want)}`);
  }
}
