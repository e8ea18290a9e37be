import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { StopReason, type ShardTaskOutput } from "../workers/task-protocol";
import { shardOutcome, type ShardEnd } from "./shard-outcome";

const base = { retryCount: 0, retryLimit: 5, timeLimitSeconds: 3600, workerMemoryMb: 2048 };
const returned = (output: ShardTaskOutput | undefined): ShardEnd["ended"] => ({ returned: output });
const end = (over: Partial<ShardEnd>): ShardEnd => ({
  ...base,
  stopReason: StopReason.none,
  ended: returned({ ok: true, partial: 1 }),
  ...over,
});

/** Anything a task can end with: a result, an engine error, no output, or a thrown error (some out of memory). */
const endedArb: fc.Arbitrary<ShardEnd["ended"]> = fc.oneof(
  fc.anything().map((partial) => returned({ ok: true, partial })),
  fc
    .record({ code: fc.constantFrom("CANCELLED", "BAD_TARGET", "TOO_LARGE"), message: fc.string() })
    .map((error) => returned({ ok: false, error })),
  fc.constant(returned(undefined)),
  fc
    .oneof(
      fc.string().map((m) => new Error(m)),
      fc.constant({ code: "ERR_WORKER_OUT_OF_MEMORY" }),
    )
    .map((threw) => ({
      threw,
    })),
);
const attemptArb = fc.record({ retryCount: fc.nat({ max: 10 }), retryLimit: fc.nat({ max: 10 }) });

describe("shardOutcome", () => {
  it("shardOutcome drops the shard after a cancellation or a lost lease, whatever the task did", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(StopReason.cancelled, StopReason.leaseLost),
        endedArb,
        attemptArb,
        (reason, ended, a) => {
          expect(shardOutcome(end({ stopReason: reason, ended, ...a }))).toEqual({ action: "drop" });
        },
      ),
      { seed: 7101 },
    );
  });

  it("shardOutcome hands the shard back when this worker shuts down, whatever the task did", () => {
    fc.assert(
      fc.property(endedArb, attemptArb, (ended, a) => {
        expect(shardOutcome(end({ stopReason: StopReason.shutdown, ended, ...a }))).toEqual({ action: "hand-back" });
      }),
      { seed: 7102 },
    );
  });

  it("shardOutcome fails the run with TIME_LIMIT, naming the limit in minutes, once the time is up", () => {
    fc.assert(
      fc.property(endedArb, fc.integer({ min: 60, max: 24 * 3600 }), (ended, seconds) => {
        const outcome = shardOutcome(end({ stopReason: StopReason.timeLimit, ended, timeLimitSeconds: seconds }));
        expect(outcome).toEqual({
          action: "fail-run",
          error: {
            code: "TIME_LIMIT",
            message: `The run exceeded its time limit of ${Math.round(seconds / 60)} minutes`,
          },
        });
      }),
      { seed: 7103 },
    );
  });

  it("shardOutcome fails the run with MEMORY_LIMIT when the thread ran out of memory, on any attempt", () => {
    fc.assert(
      fc.property(attemptArb, (a) => {
        expect(shardOutcome(end({ ended: { threw: { code: "ERR_WORKER_OUT_OF_MEMORY" } }, ...a }))).toEqual({
          action: "fail-run",
          error: { code: "MEMORY_LIMIT", message: "The computation needed more than 2048 MB of memory" },
        });
      }),
      { seed: 7104 },
    );
  });

  it("shardOutcome retries a thrown error while attempts remain and fails with WORKER_ERROR after the last", () => {
    const error = new Error("connection reset");
    fc.assert(
      fc.property(attemptArb, ({ retryCount, retryLimit }) => {
        const outcome = shardOutcome(end({ ended: { threw: error }, retryCount, retryLimit }));
        if (retryCount < retryLimit) expect(outcome).toEqual({ action: "retry", error });
        else
          expect(outcome).toEqual({
            action: "fail-run",
            error: { code: "WORKER_ERROR", message: `A shard failed ${retryCount + 1} times: connection reset` },
          });
      }),
      { seed: 7105 },
    );
  });

  it("shardOutcome completes the shard with the task's partial result", () => {
    expect(shardOutcome(end({ ended: returned({ ok: true, partial: { sum: 3 } }) }))).toEqual({
      action: "complete",
      partial: { sum: 3 },
    });
  });

  it("shardOutcome fails the run with the task's engine error, but drops a task that stopped for a cancellation", () => {
    const error = { code: "TOO_LARGE", message: "too many nodes" };
    expect(shardOutcome(end({ ended: returned({ ok: false, error }) }))).toEqual({ action: "fail-run", error });
    const cancelled = { code: "CANCELLED", message: "stopped" };
    expect(shardOutcome(end({ ended: returned({ ok: false, error: cancelled }) }))).toEqual({ action: "drop" });
    expect(shardOutcome(end({ ended: returned(undefined) }))).toEqual({ action: "drop" });
  });
});
