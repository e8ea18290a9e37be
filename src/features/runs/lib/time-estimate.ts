// Elapsed and remaining time of a run from its progress fraction, assuming the rate so far continues (the
// estimate a progress bar conventionally shows; common practice). No estimate until 2% is done: early rates mislead.
export interface TimeEstimate {
  elapsedMs: number;
  remainingMs: number | null;
}

const MIN_FRACTION_FOR_ESTIMATE = 0.02;

export function timeEstimate(
  run: { startedAt: string | null; finishedAt: string | null; progressFraction: number },
  nowMs: number,
): TimeEstimate {
  if (!run.startedAt) return { elapsedMs: 0, remainingMs: null };
  const end = run.finishedAt ? Date.parse(run.finishedAt) : nowMs;
  const elapsedMs = Math.max(0, end - Date.parse(run.startedAt));
  if (run.finishedAt) return { elapsedMs, remainingMs: 0 };
  const f = run.progressFraction;
  if (!(f >= MIN_FRACTION_FOR_ESTIMATE) || f >= 1) return { elapsedMs, remainingMs: f >= 1 ? 0 : null };
  return { elapsedMs, remainingMs: (elapsedMs * (1 - f)) / f };
}

/** 0:07, 12:30, 1:02:03 */
export function formatDuration(ms: number): string {
  const total = Math.round(ms / 1000);
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = total % 60;
  const pad = (n: number) => String(n).padStart(2, "0");
  return h > 0 ? `${h}:${pad(m)}:${pad(s)}` : `${m}:${pad(s)}`;
}
