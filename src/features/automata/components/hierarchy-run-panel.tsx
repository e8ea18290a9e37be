// Large block sizes: start a background "eca-hierarchy" run in a project the caller may run in, follow its
// progress, and reload the hierarchy once the run has stored it.
import { useQueryClient } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { HierarchyRunParameters, type HierarchyParameters } from "@shared/schemas/automata";
import { RunProgress, useRun, useRunList, useStartRun } from "@/features/runs";
import { useRunnableProjects } from "../api/get-runnable-projects";
import { automataKeys } from "../api/keys";

export function HierarchyRunPanel({ params }: { params: HierarchyParameters }) {
  const projects = useRunnableProjects(true);
  const start = useStartRun();
  const queryClient = useQueryClient();
  const [projectId, setProjectId] = useState<string>("");
  const [started, setStarted] = useState<{ projectId: string; runId: string } | null>(null);
  const chosen = projectId || projects.data?.[0]?.id || "";
  const startedRun = useRun(started?.projectId ?? null, started?.runId ?? null);
  // a run for these parameters started earlier (another visit, another member) is followed instead of a new one
  const earlier = useRunList(started ? null : chosen, { kind: "eca-hierarchy" });
  const matching = earlier.data?.find(
    (r) => HierarchyRunParameters.safeParse(r.params).data?.maxBlock === params.maxBlock && r.state !== "cancelled",
  );
  const run = started ? startedRun.data : matching;

  useEffect(() => {
    if (run?.state === "succeeded") void queryClient.invalidateQueries({ queryKey: automataKeys.hierarchy(params) });
  }, [run?.state, queryClient, params]);

  if (projects.isPending)
    return (
      <p className="text-sm text-slate-600" role="status">
        Looking for projects you can run in…
      </p>
    );
  if (projects.isError)
    return (
      <p className="text-sm text-red-700" role="alert">
        {projects.error.message}
      </p>
    );
  if (projects.data.length === 0) {
    return (
      <p className="text-sm text-slate-600">
        None of your projects lets you start runs; ask a project owner for the modeler role.
      </p>
    );
  }
  return (
    <div className="space-y-3 rounded-lg border border-slate-200 bg-white p-4" data-testid="hierarchy-run-panel">
      <form
        className="flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          const body = {
            kind: "eca-hierarchy" as const,
            modelRevisionId: null,
            params: { maxBlock: params.maxBlock, timeMode: params.timeMode, radius: 1 as const },
          };
          start.mutate(
            { projectId: chosen, body },
            { onSuccess: (r) => setStarted({ projectId: chosen, runId: r.id }) },
          );
        }}
      >
        <label className="flex flex-col gap-1 text-sm text-slate-700">
          Run it in project
          <select
            className="rounded-md border border-slate-300 px-2 py-1 text-sm"
            value={chosen}
            onChange={(e) => setProjectId(e.target.value)}
          >
            {projects.data.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
              </option>
            ))}
          </select>
        </label>
        <button
          type="submit"
          disabled={start.isPending || (run !== undefined && run.state !== "failed")}
          className="rounded-md bg-brand-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-brand-800 disabled:opacity-50"
        >
          Compute block sizes up to {params.maxBlock} in the background
        </button>
      </form>
      {start.isError && (
        <p className="text-sm text-red-700" role="alert">
          {start.error.message}
        </p>
      )}
      {run && (
        <div className="space-y-1" data-testid="hierarchy-run-progress" data-state={run.state}>
          <RunProgress run={run} label="Hierarchy run progress" />
          {run.state === "succeeded" && (
            <p className="text-sm text-brand-700">Done: the hierarchy is stored and shown below once reloaded.</p>
          )}
          {run.error && <p className="text-sm text-red-700">{run.error.message}</p>}
        </div>
      )}
    </div>
  );
}
