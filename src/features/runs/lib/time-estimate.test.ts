import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { formatDuration, timeEstimate } from "./time-estimate";

const t0 = Date.parse("2026-01-01T00:00:00Z");
const iso = (ms: number) => new Date(ms).toISOString();

describe("timeEstimate", () => {
  it("timeEstimate(run, now) predicts the exact remaining time of a run progressing at a constant rate", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1_000, max: 10_000_000 }),
        fc.double({ min: 0.02, max: 0.999, noNaN: true }),
        (totalMs, f) => {
          const now = t0 + f * totalMs;
          const e = timeEstimate({ startedAt: iso(t0), finishedAt: null, progressFraction: f }, now);
          // ISO strings keep whole milliseconds, so allow the rounding of the start and of now.
          expect(Math.abs(e.remainingMs! - (1 - f) * totalMs)).toBeLessThanOrEqual(2 / f);
        },
      ),
      { seed: 20261202 },
    );
  });

  it("timeEstimate(run, now) gives no estimate before 2% and none for a queued run", () => {
    expect(timeEstimate({ startedAt: iso(t0), finishedAt: null, progressFraction: 0.01 }, t0 + 5000)).toEqual({
      elapsedMs: 5000,
      remainingMs: null,
    });
    expect(timeEstimate({ startedAt: null, finishedAt: null, progressFraction: 0 }, t0)).toEqual({
      elapsedMs: 0,
      remainingMs: null,
    });
  });

  it("timeEstimate(run, now) measures a finished run from start to finish, whatever now is", () => {
    expect(
      timeEstimate({ startedAt: iso(t0), finishedAt: iso(t0 + 61_000), progressFraction: 0.4 }, t0 + 999_999),
    ).toEqual({ elapsedMs: 61_000, remainingMs: 0 });
  });
});

describe("formatDuration", () => {
  it("formatDuration(ms) writes minutes:seconds, with hours only when needed", () => {
    expect(formatDuration(7_000)).toBe("0:07");
    expect(formatDuration(750_000)).toBe("12:30");
    expect(formatDuration(3_723_000)).toBe("1:02:03");
  });
});
