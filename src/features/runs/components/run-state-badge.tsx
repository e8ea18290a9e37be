import type { RunState } from "@shared/schemas/runs";

const tones: Record<RunState, string> = {
  queued: "bg-slate-100 text-slate-700",
  running: "bg-sky-100 text-sky-800",
  succeeded: "bg-emerald-100 text-emerald-800",
  failed: "bg-red-100 text-red-800",
  cancelled: "bg-amber-100 text-amber-800",
};

/** A queued run shows its place in the queue of every project (1 starts at the next free worker thread). */
export function RunStateBadge({ state, queuePosition = null }: { state: RunState; queuePosition?: number | null }) {
  return (
    <span
      className={`inline-flex rounded-full px-2.5 py-0.5 text-xs font-medium capitalize ${tones[state]}`}
      data-testid="run-state"
      data-state={state}
    >
      {state}
      {state === "queued" && queuePosition !== null && (
        <span className="ml-1 font-normal normal-case" data-testid="queue-position">
          · {queuePosition === 1 ? "next in line" : `place ${queuePosition} in line`}
        </span>
      )}
    </span>
  );
}
