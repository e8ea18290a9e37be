// Crash safety of the run queue against the real PostgreSQL: worker processes (`npx tsx server/worker-main.ts`)
// share one database; one is killed with SIGKILL mid-run, and PostgreSQL itself is restarted mid-run.
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createDb, type Knex } from "../../server/db/knex";
import { getRun } from "../../server/db/repositories/runs";
import { submitRun } from "../../server/jobs/run-lifecycle";
import { lazyRunQueue } from "../../server/jobs/run-queue";
import { loadRunSettings } from "../../server/jobs/run-settings";
import { startRunWorker } from "../../server/jobs/run-worker";
import { createLogger } from "../../server/logger";
import { itemValue } from "../../server/workers/tasks/sleep-count";
import type { Run, SleepCountResult } from "@shared/schemas/runs";
import { testConfig } from "../support/test-app";

const root = path.resolve(import.meta.dirname, "../..");
const projectId = "00000000-0000-4000-8000-000000000001";
// Fast failure detection so the test stays short: heartbeats every 250 ms, a holder silent for 3 s is dead.
/** Each worker process takes ~6 s to start (tsx, pg-boss) when the shared 2-core machine is busy. */
const PROCESS_TEST_TIMEOUT_MS = 120_000;
const fastEnv = {
  RUN_STALE_SECONDS: "3",
  RUN_HEARTBEAT_MS: "250",
  RUN_REAP_EVERY_MS: "500",
  RUN_PROJECT_CONCURRENCY: "50",
  LOG_LEVEL: "warn",
};

const config = testConfig();
const log = createLogger(config);
let db: Knex;
const queue = lazyRunQueue(config.DATABASE_URL, log);
const children: ChildProcess[] = [];
/** Node pids of the worker processes (npx runs tsx, which runs node: not the spawned pid). */
const workerPids: number[] = [];

function startWorkerProcess(threads: number): Promise<ChildProcess> {
  const child = spawn("npx", ["tsx", "server/worker-main.ts"], {
    cwd: root,
    env: { ...process.env, ...fastEnv, NODE_ENV: "test", WORKER_THREADS: String(threads) },
    stdio: ["ignore", "pipe", "pipe"],
  });
  children.push(child);
  return new Promise((resolve, reject) => {
    let out = "";
    child.stdout!.on("data", (d: Buffer) => {
      out += d.toString();
      const started = /Emulant worker (\d+) is taking runs/.exec(out);
      if (started) {
        workerPids.push(Number(started[1]));
        resolve(child);
      }
    });
    child.stderr!.on("data", (d: Buffer) => void (out += d.toString()));
    child.on("exit", (code) => reject(new Error(`worker exited early (${code}): ${out}`)));
  });
}

async function waitFor<T>(
  what: string,
  probe: () => Promise<T | null | undefined | false>,
  timeoutMs = 60_000,
): Promise<T> {
  const started = Date.now();
  for (;;) {
    try {
      const v = await probe();
      if (v) return v;
    } catch {
      // The database may be restarting; keep asking.
    }
    if (Date.now() - started > timeoutMs) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

const finished = (runId: string) =>
  waitFor("the run to finish", async () => {
    const run = await getRun(db, runId);
    return run && ["succeeded", "failed", "cancelled"].includes(run.state) ? run : null;
  });

/** The plainly correct reference: one loop over every item. */
function reference(itemCount: number): SleepCountResult {
  const out = { itemCount, sum: 0, oddCount: 0 };
  for (let i = 0; i < itemCount; i++) {
    out.sum += itemValue(i);
    if (itemValue(i) % 2 === 1) out.oddCount += 1;
  }
  return out;
}

async function start(params: { itemCount: number; shardCount: number; delayMsPerItem: number }): Promise<Run> {
  const { run, reused } = await submitRun(
    { db, queue, queueCap: 1000 },
    { projectId, startedBy: null, body: { kind: "sleep-count", modelRevisionId: null, params } },
  );
  expect(reused).toBe(false);
  return run;
}

function killTree(child: ChildProcess, signal: NodeJS.Signals) {
  try {
    process.kill(child.pid!, signal);
  } catch {
    // already gone
  }
}

beforeAll(async () => {
  db = createDb(config.DATABASE_URL, 4);
  // Earlier runs of this file must not be reused as stored results.
  await db("runs").where({ project_id: projectId, kind: "sleep-count" }).del();
});

afterAll(async () => {
  for (const c of children) killTree(c, "SIGKILL");
  for (const pid of workerPids) {
    try {
      process.kill(pid, "SIGKILL");
    } catch {
      // already gone
    }
  }
  await queue.stop();
  await db.destroy();
});

describe("sharded runs across worker processes", () => {
  it(
    "a run survives SIGKILL of one of two workers with the single-process result, each shard counted once",
    async () => {
      const itemCount = 1200;
      // The single-process run: one in-process worker, one thread, one shard, no delay.
      const local = await startRunWorker({
        db,
        log,
        databaseUrl: config.DATABASE_URL,
        mailer: null,
        publicUrl: config.publicUrl,
        settings: { ...loadRunSettings({ ...process.env, ...fastEnv }, 1) },
      });
      const single = await finished((await start({ itemCount, shardCount: 1, delayMsPerItem: 0 })).id);
      await local.stop();
      expect(single.state).toBe("succeeded");
      expect(single.result).toEqual(reference(itemCount));

      await Promise.all([startWorkerProcess(2), startWorkerProcess(2)]);
      const run = await start({ itemCount, shardCount: 6, delayMsPerItem: 8 });
      // Wait until some worker holds a shard that has checkpointed part of its range, then kill that worker.
      const victim = await waitFor("a checkpointed shard", async () => {
        const s = await db("run_shards").where({ run_id: run.id, state: "running" }).whereNotNull("cursor").first();
        const pid = s ? Number(String(s.held_by).split(":").pop()) : null;
        return pid && workerPids.includes(pid) ? pid : null;
      });
      const beforeKill = await db("run_shards")
        .where({ run_id: run.id, state: "running" })
        .whereRaw("held_by like ?", [`%:${victim}`])
        .select("id");
      expect(beforeKill.length).toBeGreaterThan(0);
      process.kill(victim, "SIGKILL");

      const done = await finished(run.id);
      expect(done.state).toBe("succeeded");
      expect(done.result).toEqual(single.result);
      const shards = await db("run_shards").where({ run_id: run.id }).orderBy("shard_index");
      expect(shards.every((s) => s.state === "done")).toBe(true);
      // Each shard's partial covers exactly its own range: nothing lost, nothing doubled.
      for (const s of shards) expect(s.partial.itemCount).toBe(s.input.to - s.input.from);
      // The killed worker's shards were taken over by the survivor and resumed from their checkpoints.
      const takenOver = shards.filter((s) => beforeKill.some((k) => k.id === s.id));
      for (const s of takenOver) {
        expect(s.claims).toBeGreaterThanOrEqual(2);
        expect(String(s.held_by ?? "")).not.toContain(`:${victim}`);
      }
    },
    PROCESS_TEST_TIMEOUT_MS,
  );
});

describe("a worker stopped with SIGTERM", () => {
  it(
    "hands its shards back with their checkpoints at once, and another worker finishes the run",
    async () => {
      const stopping = await startWorkerProcess(2);
      const stoppingPid = workerPids[workerPids.length - 1]!;
      // Only this worker may take the shards, so that it holds some when it is stopped.
      for (const pid of workerPids.slice(0, -1)) {
        try {
          process.kill(pid, "SIGKILL");
        } catch {
          // already gone
        }
      }
      const run = await start({ itemCount: 1000, shardCount: 4, delayMsPerItem: 8 });
      const held = await waitFor("a checkpointed shard of the worker", async () => {
        const rows = await db("run_shards")
          .where({ run_id: run.id, state: "running" })
          .whereNotNull("cursor")
          .whereRaw("held_by like ?", [`%:${stoppingPid}`]);
        return rows.length ? rows : null;
      });
      const exited = new Promise((r) => stopping.once("exit", r));
      process.kill(stoppingPid, "SIGTERM");
      await exited;
      // Back in the queue right away (no heartbeat timeout), still with the cursor they had reached.
      const after = await db("run_shards").whereIn(
        "id",
        held.map((h) => h.id),
      );
      for (const s of after) {
        expect(s.state).toBe("queued");
        expect(s.boss_job_id).not.toBeNull();
        expect(s.cursor).toBeGreaterThanOrEqual(held.find((h) => h.id === s.id)!.cursor);
      }
      await startWorkerProcess(2);
      const done = await finished(run.id);
      expect(done.state).toBe("succeeded");
      expect(done.result).toEqual(reference(1000));
    },
    PROCESS_TEST_TIMEOUT_MS,
  );
});

describe("a PostgreSQL restart during a run", () => {
  const dataDir = process.env.EMULANT_TEST_DATA_DIR ?? path.join(root, ".data/pg-test");
  const pgCtl = () => {
    const bin = fs
      .readdirSync("/usr/lib/postgresql")
      .sort()
      .map((v) => `/usr/lib/postgresql/${v}/bin/pg_ctl`)
      .filter((p) => fs.existsSync(p))
      .pop();
    if (!bin) throw new Error("pg_ctl not found under /usr/lib/postgresql");
    return bin;
  };
  const asPostgres = (args: string[]) =>
    (process.getuid?.() === 0 ? ["runuser", ["-u", "postgres", "--", pgCtl(), ...args]] : [pgCtl(), args]) as [
      string,
      string[],
    ];

  it(
    "the run completes after the restart and the shards finished before it keep their stored results",
    async () => {
      expect(fs.existsSync(path.join(dataDir, "PG_VERSION")), `test cluster at ${dataDir}`).toBe(true);
      if (!children.some((c) => c.exitCode === null && c.signalCode === null)) await startWorkerProcess(2);
      const run = await start({ itemCount: 1600, shardCount: 8, delayMsPerItem: 6 });
      const doneBefore = await waitFor("a finished shard", async () => {
        const rows = await db("run_shards").where({ run_id: run.id, state: "done" }).select("id", "partial");
        return rows.length >= 1 ? rows : null;
      });
      // Restart (fast mode drops every connection); postmaster.opts keeps the port and listen options.
      const [cmd, args] = asPostgres([
        "-D",
        dataDir,
        "-m",
        "fast",
        "-w",
        "-l",
        path.join(dataDir, "server.log"),
        "restart",
      ]);
      execFileSync(cmd, args, { stdio: "ignore" });

      const done = await finished(run.id);
      expect(done.state).toBe("succeeded");
      expect(done.result).toEqual(reference(1600));
      const after = await db("run_shards")
        .whereIn(
          "id",
          doneBefore.map((r) => r.id),
        )
        .select("id", "state", "partial");
      for (const s of after) {
        expect(s.state).toBe("done");
        expect(s.partial).toEqual(doneBefore.find((b) => b.id === s.id)!.partial);
      }
    },
    PROCESS_TEST_TIMEOUT_MS,
  );
});
