// `npm run bench:abuse`: hostile and careless inputs against a running server (BENCH_URL) while a prober asks
// /api/health every 25 ms. For each input it prints the answer (status, code, size, time) and the worst health
// latency seen while that input was in flight; at the end the worst over all inputs, beside the 250 ms target.
// Prints figures, asserts nothing: the API tests assert the answers, this measures whether the event loop stayed free.
import { Buffer } from "node:buffer";
import { performance } from "node:perf_hooks";
const base = process.env.BENCH_URL;
if (!base) {
  process.stderr.write("bench:abuse needs BENCH_URL (run it through `npm run bench:abuse`)\n");
  process.exit(2);
}
const HEALTH_TARGET_MS = 250;
const PROBE_EVERY_MS = 25;
const ATTACK_TIMEOUT_MS = 180_000;

interface Answer {
  status: number;
  bytes: number;
  ms: number;
  code: string;
  body: unknown;
}

async function waitForServer(): Promise<void> {
  const deadline = Date.now() + 120_000;
  for (;;) {
    try {
      const res = await fetch(`${base}/api/health`);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`no server answered at ${base}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

async function signIn(email: string): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ email, password: "demo-password" }),
  });
  if (res.status !== 200) throw new Error(`sign-in as ${email} answered ${res.status}`);
  const cookie = res.headers.getSetCookie().map((c) => c.split(";")[0]);
  return cookie.join("; ");
}

async function call(cookie: string, method: string, path: string, body?: unknown): Promise<Answer> {
  const started = performance.now();
  const init: RequestInit = { method, headers: { cookie }, signal: AbortSignal.timeout(ATTACK_TIMEOUT_MS) };
  if (body instanceof FormData) init.body = body;
  else if (body !== undefined) {
    init.body = typeof body === "string" ? body : JSON.stringify(body);
    init.headers = { cookie, "content-type": "application/json" };
  }
  try {
    const res = await fetch(base + path, init);
    const text = await res.text();
    let parsed: unknown = null;
    try {
      parsed = JSON.parse(text);
    } catch {
      parsed = text.slice(0, 200);
    }
    const code = (parsed as { error?: { code?: string } } | null)?.error?.code ?? "";
    return { status: res.status, bytes: Buffer.byteLength(text), ms: performance.now() - started, code, body: parsed };
  } catch (err) {
    return { status: 0, bytes: 0, ms: performance.now() - started, code: (err as Error).name, body: null };
  }
}

/** Health probes started while `work` runs; the worst latency counts probes still unanswered when it ends. */
async function whileProbing<T>(work: () => Promise<T>): Promise<{ result: T; worstHealthMs: number; probes: number }> {
  const probes: Promise<number>[] = [];
  let running = true;
  const loop = (async () => {
    while (running) {
      const started = performance.now();
      probes.push(
        fetch(`${base}/api/health`, { signal: AbortSignal.timeout(ATTACK_TIMEOUT_MS) })
          .then((r) => r.arrayBuffer())
          .then(() => performance.now() - started)
          .catch(() => performance.now() - started),
      );
      await new Promise((r) => setTimeout(r, PROBE_EVERY_MS));
    }
  })();
  const result = await work();
  running = false;
  await loop;
  const latencies = await Promise.all(probes);
  return { result, worstHealthMs: Math.max(0, ...latencies), probes: latencies.length };
}

// ---- the inputs -------------------------------------------------------------------------------------------------

const chain = (n: number, prefix = "N") =>
  Array.from({ length: n }, (_, i) => `${prefix}${i}' = ${prefix}${(i + 1) % n}`).join("\n");

function identityCertificate(nodeCount: number) {
  const nodes = Array.from({ length: nodeCount }, (_, i) => ({ name: `N${i}`, inputs: [`N${i}`], table: "01" }));
  const context = Object.fromEntries(nodes.slice(1).map((n) => [n.name, 0]));
  return {
    format: "emulant-reduction",
    version: 1,
    notion: "block-emulation",
    time: 1,
    source: { nodes },
    target: { nodes: [{ name: "g", inputs: ["g"], table: "01" }] },
    witness: { blocks: [{ target: "g", nodes: ["N0"], zero: "0", one: "1" }], context },
  };
}

function nestedSbml(depth: number): string {
  const open = "<apply><not/>".repeat(depth);
  const close = "</apply>".repeat(depth);
  return `<?xml version="1.0" encoding="UTF-8"?>
<sbml xmlns="http://www.sbml.org/sbml/level3/version1/core" level="3" version="1"
      xmlns:qual="http://www.sbml.org/sbml/level3/version1/qual/version1" qual:required="true">
<model id="deep"><listOfCompartments><compartment id="c" constant="true"/></listOfCompartments>
<qual:listOfQualitativeSpecies><qual:qualitativeSpecies qual:id="A" qual:compartment="c" qual:constant="false"/>
</qual:listOfQualitativeSpecies><qual:listOfTransitions><qual:transition qual:id="tA">
<qual:listOfInputs><qual:input qual:id="iA" qual:qualitativeSpecies="A" qual:transitionEffect="none"/></qual:listOfInputs>
<qual:listOfOutputs><qual:output qual:id="oA" qual:qualitativeSpecies="A" qual:transitionEffect="assignmentLevel"/></qual:listOfOutputs>
<qual:listOfFunctionTerms><qual:defaultTerm qual:resultLevel="0"/><qual:functionTerm qual:resultLevel="1">
<math xmlns="http://www.w3.org/1998/Math/MathML">${open}<apply><eq/><ci>A</ci><cn type="integer">1</cn></apply>${close}</math>
</qual:functionTerm></qual:listOfFunctionTerms></qual:transition></qual:listOfTransitions></model></sbml>`;
}

function upload(fileName: string, content: string, type: string): FormData {
  const form = new FormData();
  form.append("file", new Blob([content], { type }), fileName);
  return form;
}

function nestedJson(depth: number): string {
  return `{"kind":"sleep-count","params":{"itemCount":1,"shardCount":1,"delayMsPerItem":0,"x":${"[".repeat(depth)}${"]".repeat(depth)}}}`;
}

interface Case {
  name: string;
  run: () => Promise<Answer>;
}

await waitForServer();
const viewer = await signIn("viewer@demo.emulant.test");
const modeler = await signIn("modeler@demo.emulant.test");
const reviewer = await signIn("reviewer@demo.emulant.test");
const projects = (await call(viewer, "GET", "/api/projects")).body as { data: { id: string; name: string }[] };
const projectId = projects.data[0]!.id;
const p = `/api/projects/${projectId}`;
const created: Record<string, string> = {};
const bigNodeCount = 250_000;
// Every large payload is built and serialised here, before any probing: building it inside a case would block this
// process's own event loop and show up as health latency that the server never had.
const json = (body: unknown) => JSON.stringify(body);
const payloads = {
  blankLines: json({ ruleText: "A' = \n".repeat(300_000) }),
  hugeChain: json({ name: "abuse huge", ruleText: chain(bigNodeCount) }),
  denseRules: json({
    ruleText: Array.from(
      { length: 20_000 },
      (_, i) => `D${i}' = ${Array.from({ length: 10 }, (_, k) => `D${(i + k + 1) % 20_000}`).join(" & ")}`,
    ).join("\n"),
  }),
  csv: "0,1,1,0,1,0,0,1,1,0\n".repeat(240_000),
  deepSbml: nestedSbml(100_000),
  nestedParams: nestedJson(200_000),
  oneString: json({ ruleText: "x".repeat(5 * 1024 * 1024 - 100) }),
  allOnes2000: "1".repeat(2000),
};

const cases: Case[] = [
  {
    name: "validate: 300,000 lines of `A' = ` (viewer)",
    run: () => call(viewer, "POST", `${p}/models/validate`, payloads.blankLines),
  },
  {
    name: "validate: 20,000 nodes reading 10 regulators each (2 MB of tables to build)",
    run: () => call(viewer, "POST", `${p}/models/validate`, payloads.denseRules),
  },
  {
    name: "validate: one rule of 4,100 terms",
    run: () =>
      call(viewer, "POST", `${p}/models/validate`, { ruleText: `A' = ${Array(4100).fill("B").join(" & ")}\nB' = B` }),
  },
  {
    name: "create: one rule of 4,100 terms",
    run: () =>
      call(modeler, "POST", `${p}/models`, {
        name: "abuse long rule",
        ruleText: `A' = ${Array(4100).fill("B").join(" & ")}\nB' = B`,
      }),
  },
  {
    name: "create: 100,000 nested parentheses",
    run: () =>
      call(modeler, "POST", `${p}/models`, {
        name: "abuse nesting",
        ruleText: `A' = ${"(".repeat(100_000)}A${")".repeat(100_000)}`,
      }),
  },
  {
    name: "upload: 4.8 MB CSV without a node header",
    run: () => call(modeler, "POST", `${p}/models/upload`, upload("big.csv", payloads.csv, "text/csv")),
  },
  {
    name: "upload: SBML with 100,000 nested <apply><not/>",
    run: () => call(modeler, "POST", `${p}/models/upload`, upload("deep.sbml", payloads.deepSbml, "application/xml")),
  },
  {
    name: `create: a ${bigNodeCount.toLocaleString("en")}-node model`,
    run: async () => {
      const answer = await call(modeler, "POST", `${p}/models`, payloads.hugeChain);
      const id = (answer.body as { data?: { model?: { id: string } } })?.data?.model?.id;
      if (id) created.huge = id;
      return answer;
    },
  },
  {
    name: "structure view of the huge model",
    run: async () =>
      created.huge
        ? call(viewer, "GET", `${p}/models/${created.huge}/revisions/1/structure`)
        : { status: -1, bytes: 0, ms: 0, code: "SKIPPED (model not stored)", body: null },
  },
  {
    name: "trajectory of the huge model, 1,000 steps",
    run: async () =>
      created.huge
        ? call(viewer, "POST", `${p}/models/${created.huge}/revisions/1/trajectory`, {
            initial: "1".repeat(bigNodeCount),
            steps: 1000,
          })
        : { status: -1, bytes: 0, ms: 0, code: "SKIPPED (model not stored)", body: null },
  },
  {
    name: "create: a 2,000-node model (certificate source)",
    run: async () => {
      const rules = Array.from({ length: 2000 }, (_, i) => `N${i}' = N${i}`).join("\n");
      const answer = await call(modeler, "POST", `${p}/models`, { name: "abuse 2000", ruleText: rules });
      const id = (answer.body as { data?: { model?: { id: string } } })?.data?.model?.id;
      if (id) created.twoThousand = id;
      return answer;
    },
  },
  {
    name: "structure view of the 2,000-node model",
    run: async () =>
      created.twoThousand
        ? call(viewer, "GET", `${p}/models/${created.twoThousand}/revisions/1/structure`)
        : { status: -1, bytes: 0, ms: 0, code: "SKIPPED (model not stored)", body: null },
  },
  {
    name: "trajectory of the 2,000-node model, 999 steps (just within the 2,000,000-value limit)",
    run: async () =>
      created.twoThousand
        ? call(viewer, "POST", `${p}/models/${created.twoThousand}/revisions/1/trajectory`, {
            initial: payloads.allOnes2000,
            steps: 999,
          })
        : { status: -1, bytes: 0, ms: 0, code: "SKIPPED (model not stored)", body: null },
  },
  {
    name: "trajectory of the 2,000-node model, 1,000 steps (over the limit)",
    run: async () =>
      created.twoThousand
        ? call(viewer, "POST", `${p}/models/${created.twoThousand}/revisions/1/trajectory`, {
            initial: payloads.allOnes2000,
            steps: 1000,
          })
        : { status: -1, bytes: 0, ms: 0, code: "SKIPPED (model not stored)", body: null },
  },
  {
    name: "store a certificate with a 2,000-node source",
    run: async () => {
      if (!created.twoThousand) return { status: -1, bytes: 0, ms: 0, code: "SKIPPED (source not stored)", body: null };
      const answer = await call(modeler, "POST", `${p}/reductions`, {
        sourceModelId: created.twoThousand,
        certificate: identityCertificate(2000),
      });
      const id = (answer.body as { data?: { id: string } })?.data?.id;
      if (id) created.reduction = id;
      return answer;
    },
  },
  {
    name: "re-verify that certificate (reviewer)",
    run: async () =>
      created.reduction
        ? call(reviewer, "POST", `${p}/reductions/${created.reduction}/verify`)
        : { status: -1, bytes: 0, ms: 0, code: "SKIPPED (reduction not stored)", body: null },
  },
  {
    name: "automata hierarchy at block size 11 (computed on first request)",
    run: () => call(viewer, "GET", "/api/automata/hierarchy?maxBlock=11"),
  },
  {
    name: "run parameters nested 200,000 deep",
    run: () => call(modeler, "POST", `${p}/runs`, payloads.nestedParams),
  },
  {
    name: "5 MB JSON body of one string",
    run: () => call(modeler, "POST", `${p}/models/validate`, payloads.oneString),
  },
];

const rows: { name: string; answer: Answer; worstHealthMs: number; probes: number }[] = [];
for (const c of cases) {
  const { result, worstHealthMs, probes } = await whileProbing(c.run);
  rows.push({ name: c.name, answer: result, worstHealthMs, probes });
  process.stdout.write(
    `${c.name}\n  → ${result.status} ${result.code || ""} ${(result.bytes / 1024).toFixed(1)} KiB in ` +
      `${(result.ms / 1000).toFixed(2)} s; worst /api/health ${worstHealthMs.toFixed(0)} ms over ${probes} probes\n`,
  );
}

const worst = rows.reduce((a, b) => (b.worstHealthMs > a.worstHealthMs ? b : a));
const fiveHundreds = rows.filter((r) => r.answer.status >= 500 || r.answer.status === 0);
process.stdout.write(
  `\n${rows.length} inputs tried. Worst /api/health latency: ${worst.worstHealthMs.toFixed(0)} ms ` +
    `(target < ${HEALTH_TARGET_MS} ms: ${worst.worstHealthMs < HEALTH_TARGET_MS ? "met" : "MISSED"}), during "${worst.name}".\n` +
    `Answers of 5xx or no answer: ${fiveHundreds.length}${fiveHundreds.length ? ` (${fiveHundreds.map((r) => r.name).join("; ")})` : ""}.\n`,
);
