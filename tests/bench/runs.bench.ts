// `npm run bench:runs`: figures for the run queue against the database in DATABASE_URL (migrated).
//  1. throughput of many small runs through pg-boss and one in-process worker with two threads;
//  2. speed-up of one sharded run from 1 to 2 threads, for CPU-bound shards and for shards that mostly wait.
// Prints figures, asserts nothing. The machine's cores are shared with other work, so repeat before trusting a number.
import { randomUUID } from "node:crypto";
import { createDb } from "../../server/db/knex";
import { getRun } from "../../server/db/repositories/runs";
import { submitRun } from "../../server/jobs/run-lifecycle";
import { lazyRunQueue } from "../../server/jobs/run-queue";
import { loadRunSettings } from "../../server/jobs/run-settings";
import { startRunWorker } from "../../server/jobs/run-worker";
import { createLogger } from "../../server/logger";

const url = process.env.DATABASE_URL;
if (!url) {
  process.stderr.write(
    'bench:runs needs DATABASE_URL (e.g. source scripts/lib.sh; bootstrap_database "$PWD/.data/pg" 54329 emulant)\n',
  );
  process.exit(2);
}
const log = createLogger({ LOG_LEVEL: "warn", NODE_ENV: "production" });
const db = createDb(url, 8);
const queue = lazyRunQueue(url, log);
const [project] = await db("projects")
  .insert({ name: `Benchmark scratch ${randomUUID().slice(0, 8)}` })
  .returning("id");
const projectId = (project as { id: string }).id;
const settings = (threads: number) => ({
  ...loadRunSettings({ RUN_PROJECT_CONCURRENCY: "1000" }, threads),
  heartbeatMs: 250,
});
const deps = { db, queue, queueCap: 100_000 };
let warmUps = 0;

async function waitAll(ids: string[]): Promise<void> {
  for (const id of ids) {
    for (;;) {
      const run = await getRun(db, id);
      if (run && ["succeeded", "failed", "cancelled"].includes(run.state)) {
        if (run.state !== "succeeded") throw new Error(`run ${id} ${run.state}: ${run.error?.message}`);
        break;
      }
      await new Promise((r) => setTimeout(r, 20));
    }
  }
}

async function timedRun(
  threads: number,
  params: { itemCount: number; shardCount: number; delayMsPerItem: number },
): Promise<number> {
  const worker = await startRunWorker({
    db,
    log,
    databaseUrl: url!,
    mailer: null,
    publicUrl: "http://localhost",
    settings: settings(threads),
  });
  // Warm the threads (tsx loads in each) so the figure is the run, not the start-up.
  await waitAll([
    (
      await submitRun(deps, {
        projectId,
        startedBy: null,
        body: {
          kind: "sleep-count",
          modelRevisionId: null,
          params: { itemCount: 10 + ++warmUps, shardCount: threads, delayMsPerItem: 0 },
        },
      })
    ).run.id,
  ]);
  const started = performance.now();
  const { run } = await submitRun(deps, {
    projectId,
    startedBy: null,
    body: { kind: "sleep-count", modelRevisionId: null, params },
  });
  await waitAll([run.id]);
  const ms = performance.now() - started;
  await db("runs").where({ id: run.id }).del();
  await worker.stop();
  return ms;
}

try {
  console.log(
    "Run queue benchmark (pg-boss on PostgreSQL, piscina threads; shared 2-core machine, figures are noisy)\n",
  );

  {
    const count = 200;
    const worker = await startRunWorker({
      db,
      log,
      databaseUrl: url,
      mailer: null,
      publicUrl: "http://localhost",
      settings: settings(2),
    });
    await waitAll([
      (
        await submitRun(deps, {
          projectId,
          startedBy: null,
          body: {
            kind: "sleep-count",
            modelRevisionId: null,
            params: { itemCount: 7, shardCount: 2, delayMsPerItem: 0 },
          },
        })
      ).run.id,
    ]);
    const started = performance.now();
    const ids: string[] = [];
    for (let i = 0; i < count; i++) {
      ids.push(
        (
          await submitRun(deps, {
            projectId,
            startedBy: null,
            body: {
              kind: "sleep-count",
              modelRevisionId: null,
              params: { itemCount: 1000 + i, shardCount: 1, delayMsPerItem: 0 },
            },
          })
        ).run.id,
      );
    }
    const submittedMs = performance.now() - started;
    await waitAll(ids);
    const totalMs = performance.now() - started;
    await worker.stop();
    console.log(`1. ${count} small runs (1 shard of ~1000 items each), 1 worker process, 2 threads:`);
    console.log(
      `   submitted in ${(submittedMs / 1000).toFixed(2)} s (${(count / (submittedMs / 1000)).toFixed(0)} submissions/s)`,
    );
    console.log(
      `   all finished in ${(totalMs / 1000).toFixed(2)} s: ${(count / (totalMs / 1000)).toFixed(1)} runs/s\n`,
    );
  }

  const cases = [
    {
      label: "CPU-bound: 8 shards, 300,000,000 items, no delay",
      params: { itemCount: 300_000_000, shardCount: 8, delayMsPerItem: 0 },
    },
    {
      label: "waiting: 8 shards, 1,600 items at 2 ms each",
      params: { itemCount: 1_600, shardCount: 8, delayMsPerItem: 2 },
    },
  ];
  console.log("2. One sharded run, 1 thread vs 2 threads (wall time from submit to merged result):");
  for (const c of cases) {
    const one = await timedRun(1, c.params);
    const two = await timedRun(2, c.params);
    console.log(
      `   ${c.label}: 1 thread ${(one / 1000).toFixed(2)} s, 2 threads ${(two / 1000).toFixed(2)} s, speed-up ${(one / two).toFixed(2)}x`,
    );
  }
} finally {
  await db("projects").where({ id: projectId }).del();
  await queue.stop();
  await db.destroy();
}
