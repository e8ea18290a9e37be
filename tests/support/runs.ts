// Waiting in API tests for a run to end: its row is polled until the state is final.
import type { Knex } from "knex";
import type { Run } from "@shared/schemas/runs";
import { getRun } from "../../server/db/repositories/runs";

export async function waitForRunEnd(db: Knex, runId: string, timeoutMs = 60_000): Promise<Run> {
  const started = Date.now();
  for (;;) {
    const run = await getRun(db, runId);
    if (run && ["succeeded", "failed", "cancelled"].includes(run.state)) return run;
    if (Date.now() - started > timeoutMs) throw new Error(`run ${runId} still ${run?.state}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
