// Fair use of the workers against the real PostgreSQL and pg-boss: one project's queue of long runs must not keep
// another project's first run waiting beyond the next free worker thread, and the API shows each queued run's place.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createDb, type Knex } from "../../server/db/knex";
import { getRun, withQueuePositions } from "../../server/db/repositories/runs";
import { submitRun } from "../../server/jobs/run-lifecycle";
import { lazyRunQueue } from "../../server/jobs/run-queue";
import { loadRunSettings } from "../../server/jobs/run-settings";
import { startRunWorker, type RunWorker } from "../../server/jobs/run-worker";
import { createLogger } from "../../server/logger";
import type { Run } from "@shared/schemas/runs";
import { testConfig } from "../support/test-app";

const config = testConfig();
const log = createLogger(config);
const queue = lazyRunQueue(config.DATABASE_URL, log);
let db: Knex;
let worker: RunWorker;
const projectIds: string[] = [];

async function start(projectId: string, itemCount: number, delayMsPerItem: number): Promise<Run> {
  const { run } = await submitRun(
    { db, queue, queueCap: 1000 },
    {
      projectId,
      startedBy: null,
      // A distinct item count per run keeps a stored result from being reused.
      body: { kind: "sleep-count", modelRevisionId: null, params: { itemCount, shardCount: 1, delayMsPerItem } },
    },
  );
  return run;
}

async function until<T>(what: string, probe: () => Promise<T | null | undefined | false>): Promise<T> {
  const started = Date.now();
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() - started > 60_000) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

const state = async (id: string) => (await getRun(db, id))!;

beforeAll(async () => {
  db = createDb(config.DATABASE_URL, 4);
  // Runs left queued by earlier files (whose tests start no worker) would take places ahead in the queue of every
  // project; files run one at a time, so ending them here touches nothing another file is waiting for.
  await db("runs")
    .whereIn("state", ["queued", "running"])
    .update({ state: "cancelled", finished_at: db.fn.now(), progress_phase: "cancelled" });
  for (const name of ["Fairness busy project", "Fairness idle project"]) {
    const [row] = await db("projects").insert({ name }).returning("id");
    projectIds.push(row.id as string);
  }
  worker = await startRunWorker({
    db,
    log,
    databaseUrl: config.DATABASE_URL,
    mailer: null,
    publicUrl: config.publicUrl,
    // One thread, and a project limit far above the queue, so only the queue order decides who waits.
    settings: loadRunSettings({ ...process.env, RUN_PROJECT_CONCURRENCY: "50", LOG_LEVEL: "warn" }, 1),
  });
});

afterAll(async () => {
  await worker?.stop();
  await queue.stop();
  if (projectIds.length) await db("projects").whereIn("id", projectIds).del();
  await db.destroy();
});

describe("the run queue across projects", () => {
  it("starts an idle project's run at the next free thread, ahead of another project's queued runs", async () => {
    const [busy, idle] = projectIds as [string, string];
    const busyRuns: Run[] = [];
    for (let i = 0; i < 4; i++) busyRuns.push(await start(busy, 20 + i, 60));
    await until("the busy project's first run to start", async () => (await state(busyRuns[0]!.id)).startedAt);

    const lone = await start(idle, 3, 0);
    const [listed] = await withQueuePositions(db, [await state(lone.id)]);
    expect(listed!.state).toBe("queued");
    expect(listed!.queuePosition).toBe(1);
    const behind = await withQueuePositions(db, [await state(busyRuns[3]!.id)]);
    expect(behind[0]!.queuePosition).toBeGreaterThan(1);

    const done = await until("the idle project's run to finish", async () => {
      const r = await state(lone.id);
      return r.state === "succeeded" ? r : null;
    });
    // The one thread went from the busy project's first run straight to the idle project's run.
    const second = await state(busyRuns[1]!.id);
    expect(second.startedAt === null || Date.parse(second.startedAt) >= Date.parse(done.startedAt!)).toBe(true);
    const first = await state(busyRuns[0]!.id);
    expect(first.state === "running" || Date.parse(first.finishedAt!) <= Date.parse(done.startedAt!) + 1000).toBe(true);

    for (const r of busyRuns)
      await until("the busy project's runs to finish", async () => (await state(r.id)).state === "succeeded");
  }, 120_000);
});
