// The remote command line against a running test server with a worker: push a model with a token, analyse it, run
// a discovery, wait for it, list the reductions and download a certificate that the local `verify` accepts.
import { mkdtemp, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { captureOutput } from "../../server/cli/capture-output.test-support";
import { run as remote } from "../../server/cli/commands/remote";
import { run as verify } from "../../server/cli/commands/verify";
import { startRunWorker, type RunWorker } from "../../server/jobs/run-worker";
import { loadRunSettings } from "../../server/jobs/run-settings";
import { createLogger } from "../../server/logger";
import { createFakeMailer } from "../../server/mail/mailer";
import { signUpFresh } from "../support/sessions";
import { startTestServer, testConfig, type RunningServer } from "../support/test-app";

let s: RunningServer;
let worker: RunWorker;
let projectId: string;
let dir: string;

beforeAll(async () => {
  s = await startTestServer();
  const config = testConfig();
  const log = createLogger(config);
  worker = await startRunWorker({
    db: s.db,
    log,
    databaseUrl: config.DATABASE_URL,
    mailer: createFakeMailer(s.db, log),
    publicUrl: config.publicUrl,
    settings: { ...loadRunSettings({}, 1), notifyAfterSeconds: 0 },
  });
  const person = await signUpFresh(s.app, "remote");
  projectId = (await person.agent.post("/api/projects").send({ name: "Remote CLI" })).body.data.id;
  const token = await person.agent.post("/api/users/me/tokens").send({ name: "cli", scope: "write", expiresInDays: 1 });
  process.env.EMULANT_TOKEN = token.body.data.token;
  dir = await mkdtemp(path.join(tmpdir(), "emulant-remote-"));
}, 60_000);
afterAll(async () => {
  delete process.env.EMULANT_TOKEN;
  await worker?.stop();
  await s?.close();
});

async function cli(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  const streams = captureOutput();
  try {
    const code = await remote([...args, "--server", s.baseUrl]);
    return { code, out: streams.out.join(""), err: streams.err.join("") };
  } finally {
    vi.restoreAllMocks();
  }
}

describe("remote commands", () => {
  it("push, runs start/wait/show, reductions list/certificate work end to end and the certificate verifies", async () => {
    // Toggle switch as two mutually repressing genes: under synchronous update its fixed points are 01 and 10
    // and 00/11 form a 2-cycle (common practice: the textbook example of bistability).
    const file = path.join(dir, "toggle.rules");
    await writeFile(file, "A' = !B\nB' = !A\n");
    const pushed = await cli("push", file, "--project", projectId, "--name", "Toggle");
    expect(pushed.code, pushed.err).toBe(0);
    const modelId = JSON.parse(pushed.out).model.id as string;

    const started = await cli("runs", "start", "--project", projectId, "--kind", "attractors", "--model", modelId);
    expect(started.code, started.err).toBe(0);
    const runId = JSON.parse(started.out).id as string;
    const waited = await cli("runs", "wait", runId, "--project", projectId, "--interval-ms", "100");
    expect(waited.code, waited.err).toBe(0);
    expect(waited.err).toMatch(/\[#{30}\] 100% succeeded/);
    const result = JSON.parse(waited.out).result as { attractors: { states: unknown[] }[] };
    expect(result.attractors.map((a) => a.states.length).sort()).toEqual([1, 1, 2]);
    const shown = await cli("runs", "show", runId, "--project", projectId);
    expect(JSON.parse(shown.out).state).toBe("succeeded");

    const search = await cli("runs", "start", "--project", projectId, "--kind", "discover", "--model", modelId);
    expect(search.code, search.err).toBe(0);
    const searchId = JSON.parse(search.out).id as string;
    expect((await cli("runs", "wait", searchId, "--project", projectId, "--interval-ms", "100")).code).toBe(0);
    const listed = await cli("reductions", "list", "--project", projectId, "--source-model", modelId);
    expect(listed.code, listed.err).toBe(0);
    const reductions = JSON.parse(listed.out) as { id: string }[];
    expect(reductions.length).toBeGreaterThan(0);
    const certFile = path.join(dir, "certificate.json");
    const cert = await cli("reductions", "certificate", reductions[0]!.id, "--project", projectId, "--out", certFile);
    expect(cert.code, cert.err).toBe(0);
    const streams = captureOutput();
    const verified = await verify([certFile]);
    vi.restoreAllMocks();
    expect(verified, streams.out.join("")).toBe(0);
  }, 120_000);

  it("answers usage errors with 2 and refusals with 1, naming the failing field", async () => {
    expect((await cli("runs", "wait")).code).toBe(2);
    expect((await cli("push", "x.rules")).code).toBe(2); // no --project
    const token = process.env.EMULANT_TOKEN;
    delete process.env.EMULANT_TOKEN;
    expect((await cli("runs", "show", projectId, "--project", projectId)).code).toBe(2);
    process.env.EMULANT_TOKEN = "emu_not-a-token";
    const refused = await cli("runs", "show", projectId, "--project", projectId);
    expect(refused.code).toBe(1);
    expect(refused.err).toContain("401 TOKEN_INVALID");
    process.env.EMULANT_TOKEN = token;
    const bad = path.join(dir, "bad.rules");
    await writeFile(bad, "A' = B &\n");
    const parse = await cli("push", bad, "--project", projectId);
    expect(parse.code).toBe(1);
    expect(parse.err).toMatch(/PARSE_ERROR/);
  });
});
