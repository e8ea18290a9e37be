// Which queued run starts next, as a pure function of the unfinished runs, so the worker's job priorities, the place
// in the queue the API shows and the tests all follow one rule: a run whose project has nothing unfinished submitted
// before it (nothing running, nothing queued ahead) goes first, oldest first; every other run follows, oldest first.
// One project's long queue therefore never keeps another project's first run waiting beyond the next free thread.

export interface UnfinishedRun {
  id: string;
  projectId: string;
  /** Submission time in milliseconds. */
  createdAt: number;
  state: "queued" | "running";
}

const before = (a: UnfinishedRun, b: UnfinishedRun) =>
  a.createdAt < b.createdAt || (a.createdAt === b.createdAt && a.id < b.id);

/** How many runs of the same project, submitted before `run`, are still unfinished (queued or running). */
export function runsAheadInProject(run: UnfinishedRun, unfinished: readonly UnfinishedRun[]): number {
  let n = 0;
  for (const other of unfinished) if (other.projectId === run.projectId && before(other, run)) n++;
  return n;
}

/** The queued runs in the order they start: first runs of idle projects, then the rest, each group oldest first. */
export function startOrder(unfinished: readonly UnfinishedRun[]): UnfinishedRun[] {
  const byProject = new Map<string, UnfinishedRun[]>();
  for (const r of unfinished) byProject.set(r.projectId, [...(byProject.get(r.projectId) ?? []), r]);
  const first = new Set<string>();
  for (const runs of byProject.values()) {
    const oldest = runs.reduce((a, b) => (before(b, a) ? b : a));
    if (oldest.state === "queued") first.add(oldest.id);
  }
  return unfinished
    .filter((r) => r.state === "queued")
    .sort((a, b) => Number(first.has(b.id)) - Number(first.has(a.id)) || (before(a, b) ? -1 : before(b, a) ? 1 : 0));
}

/** Each queued run's place in the queue, 1 for the next to start. */
export function queuePositions(unfinished: readonly UnfinishedRun[]): Map<string, number> {
  return new Map(startOrder(unfinished).map((r, i) => [r.id, i + 1]));
}

/** pg-boss takes higher priorities first: the first shard of a run with nothing ahead in its project jumps the queue. */
export function shardJobPriority(runsAhead: number, shardIndex: number): number {
  return runsAhead === 0 && shardIndex === 0 ? 1 : 0;
}
