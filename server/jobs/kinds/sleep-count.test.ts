import fc from "fast-check";
import { MessageChannel } from "node:worker_threads";
import { describe, expect, it } from "vitest";
import type { SleepCountPartial, SleepCountShard } from "@shared/schemas/run-tasks";
import sleepCountTask, { itemValue } from "../../workers/tasks/sleep-count";
import { paramsHash } from "../run-lifecycle";
import { sleepCountKind } from "./sleep-count";

/** The plainly correct reference: one loop over [from, to). */
function reference(from: number, to: number): SleepCountPartial {
  const out = { itemCount: 0, sum: 0, oddCount: 0 };
  for (let i = from; i < to; i++) {
    out.itemCount += 1;
    out.sum += itemValue(i);
    if (itemValue(i) % 2 === 1) out.oddCount += 1;
  }
  return out;
}

async function runShard(
  shard: SleepCountShard,
  cursor: number | null,
  partial: SleepCountPartial | null,
): Promise<SleepCountPartial> {
  const { port1, port2 } = new MessageChannel();
  const out = await sleepCountTask({
    input: shard,
    cursor,
    partial,
    port: port2,
    stopFlag: new Int32Array(new SharedArrayBuffer(4)),
  });
  port1.close();
  if (!out.ok) throw new Error(out.error.message);
  return out.partial;
}

const params = fc.record({
  itemCount: fc.integer({ min: 1, max: 5000 }),
  shardCount: fc.integer({ min: 1, max: 64 }),
  delayMsPerItem: fc.constant(0),
});

describe("sleep-count run kind", () => {
  it("plan(params) splits [0, itemCount) into contiguous, non-empty shards covering every item once", () => {
    fc.assert(
      fc.property(params, (p) => {
        const shards = sleepCountKind.plan(p, null);
        expect(shards.length).toBe(Math.min(p.shardCount, p.itemCount));
        expect(shards[0]!.from).toBe(0);
        expect(shards.at(-1)!.to).toBe(p.itemCount);
        shards.forEach((s, i) => {
          expect(s.to).toBeGreaterThan(s.from);
          if (i > 0) expect(s.from).toBe(shards[i - 1]!.to);
        });
      }),
      { seed: 5001 },
    );
  });

  it("merge(shard results) equals one loop over all items, whatever the shard count", async () => {
    await fc.assert(
      fc.asyncProperty(params, async (p) => {
        const shards = sleepCountKind.plan(p, null);
        const partials = await Promise.all(shards.map((s) => runShard(s, null, null)));
        expect(sleepCountKind.merge(partials, p)).toEqual(reference(0, p.itemCount));
      }),
      { seed: 5002, numRuns: 40 },
    );
  });

  it("the shard task resumed from a checkpoint (cursor, partial) gives the uninterrupted result", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.integer({ min: 0, max: 2000 }),
        fc.integer({ min: 1, max: 2000 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        async (from, length, at) => {
          const shard = { from, to: from + length, delayMsPerItem: 0 };
          const cursor = from + Math.floor(at * length);
          const resumed = await runShard(shard, cursor, reference(from, cursor));
          expect(resumed).toEqual(reference(from, from + length));
        },
      ),
      { seed: 5003, numRuns: 60 },
    );
  });
});

describe("paramsHash", () => {
  it("paramsHash(params) ignores key order but tells different values apart", () => {
    fc.assert(
      fc.property(
        fc.dictionary(fc.string({ minLength: 1, maxLength: 6 }), fc.oneof(fc.integer(), fc.string(), fc.boolean()), {
          minKeys: 1,
          maxKeys: 6,
        }),
        (obj) => {
          const reversed = Object.fromEntries(Object.entries(obj).reverse());
          expect(paramsHash(reversed)).toBe(paramsHash(obj));
          const [key, value] = Object.entries(obj)[0]!;
          expect(paramsHash({ ...obj, [key]: typeof value === "number" ? value + 1 : `${String(value)}!` })).not.toBe(
            paramsHash(obj),
          );
        },
      ),
      { seed: 5004 },
    );
  });
});
