// Analyses of a model beyond exact state-space analysis, end to end through the runs API, pg-boss and a worker:
// SAT fixed points and cycles, trap spaces and asynchronous attractors of a 40-node model whose dynamics are
// published (tests/support/large-model-fixtures.ts), and node elimination saved as a model of the project.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { loadRunSettings } from "../../server/jobs/run-settings";
import { startRunWorker, type RunWorker } from "../../server/jobs/run-worker";
import { createLogger } from "../../server/logger";
import { createFakeMailer } from "../../server/mail/mailer";
import { AsyncAttractorsResult, SatCyclesResult, TrapSpacesResult } from "@shared/schemas/run-tasks";
import type { Run } from "@shared/schemas/runs";
import { DELAY_LINE_LENGTH, FAURE_STABLE_STATE, FAURE_WITH_DELAY_LINE } from "../support/large-model-fixtures";
import { signInAs, type Agent } from "../support/sessions";
import { waitForRunEnd } from "../support/runs";
import { buildTestApp, testConfig } from "../support/test-app";

const t = buildTestApp();
const config = testConfig();
const log = createLogger(config);
const mailer = createFakeMailer(t.db, log);
let projectId: string;
let revisionId: string;
let owner: Agent;
let worker: RunWorker | null = null;

const finished = (runId: string, timeoutMs?: number): Promise<Run> => waitForRunEnd(t.db, runId, timeoutMs);

async function runToEnd(kind: string, params: object): Promise<Run> {
  const res = await owner.post(`/api/projects/${projectId}/runs`).send({ kind, modelRevisionId: revisionId, params });
  expect(res.status).toBe(201);
  const done = await finished(res.body.data.id);
  expect(done.error).toBeNull();
  expect(done.state).toBe("succeeded");
  return done;
}

beforeAll(async () => {
  owner = await signInAs(t.app, "owner@demo.emulant.test");
  const project = await owner.post("/api/projects").send({ name: `Large models ${randomUUID().slice(0, 8)}` });
  expect(project.status).toBe(201);
  projectId = project.body.data.id;
  const model = await owner
    .post(`/api/projects/${projectId}/models`)
    .send({ name: "Cell cycle with delay line", ruleText: FAURE_WITH_DELAY_LINE });
  expect(model.status).toBe(201);

  revisionId = model.body.data.revision.id;
  expect(model.body.data.revision.nodeCount).toBe(40);
  worker = await startRunWorker({
    db: t.db,
    log,
    databaseUrl: config.DATABASE_URL,
    mailer,
    publicUrl: config.publicUrl,
    settings: { ...loadRunSettings({ RUN_HEARTBEAT_MS: "200" }, 2), notifyAfterSeconds: 0 },
  });
});

afterAll(async () => {
  await worker?.stop();
  await mailer.close();
  await t.close();
});

describe("analyses of a 40-node model as runs", () => {
  it("sat-cycles finds the published stable state and 7-cycle of the cell cycle, and says the list is complete", async () => {
    const done = await runToEnd("sat-cycles", { maxLength: 7 });
    const result = SatCyclesResult.parse(done.result);
    expect(result.complete).toBe(true);
    expect(result.maxLength).toBe(7);
    expect(result.cycles.map((c) => c.length)).toEqual([1, 7]);
    expect(result.cycles[0]!.states).toEqual([FAURE_STABLE_STATE]);
    // In the cycle each delay node repeats CycB (position 9) one step later than the node before it.
    const cycle = result.cycles[1]!.states;
    cycle.forEach((s, step) => {
      const next = cycle[(step + 1) % cycle.length]!;
      expect(next[10]).toBe(s[9]);
      for (let k = 1; k < DELAY_LINE_LENGTH; k++) expect(next[10 + k]).toBe(s[9 + k]);
    });
  });

  it("sat-cycles with maxLength 1 lists the fixed points alone", async () => {
    const result = SatCyclesResult.parse((await runToEnd("sat-cycles", { maxLength: 1 })).result);
    expect(result).toMatchObject({
      complete: true,
      maxLength: 1,
      cycles: [{ length: 1, states: [FAURE_STABLE_STATE] }],
    });
  });

  it("trap-spaces finds two minimal trap spaces: the stable state, and CycD on with Rb and p27 off", async () => {
    // With CycD on, Rb and p27 are switched off for good (both rules need !CycD), and the published asynchronous
    // attractor (112 states, more than the 64 states of six free nodes) leaves none of the other seven cell-cycle nodes fixed.
    const result = TrapSpacesResult.parse((await runToEnd("trap-spaces", { kind: "minimal" })).result);
    expect(result.complete).toBe(true);
    const patterns = result.trapSpaces.map((s) => s.pattern).sort();
    expect(patterns).toEqual([FAURE_STABLE_STATE, "10---0----" + "-".repeat(DELAY_LINE_LENGTH)].sort());
  });

  it("trap-spaces with kind maximal lists trap spaces none of which lies inside another", async () => {
    const result = TrapSpacesResult.parse((await runToEnd("trap-spaces", { kind: "maximal" })).result);
    expect(result.kind).toBe("maximal");
    expect(result.trapSpaces.length).toBeGreaterThan(0);
    const inside = (a: string, b: string) => [...a].every((c, i) => b[i] === "-" || b[i] === c);
    for (const a of result.trapSpaces)
      for (const b of result.trapSpaces) if (a !== b) expect(inside(a.pattern, b.pattern)).toBe(false);
  });

  it("async-attractors proves the stable state and reports the cyclic trap space as found so far, never complete", async () => {
    const result = AsyncAttractorsResult.parse((await runToEnd("async-attractors", {})).result);
    expect(result.method).toBe("minimal trap spaces");
    expect(result.completeness).toBe("found so far");
    expect(result.attractors.map((a) => a.states)).toContainEqual([FAURE_STABLE_STATE]);
    const verdicts = result.minimalTrapSpaces.map((m) => m.verdict).sort();
    expect(verdicts).toEqual(["at least one attractor", "fixed point"]);
  });

  it("refuses an analysis run without a model revision with 400", async () => {
    const res = await owner.post(`/api/projects/${projectId}/runs`).send({ kind: "trap-spaces", params: {} });
    expect(res.status).toBe(400);
  });
});
