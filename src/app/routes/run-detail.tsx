// One run: what was asked, live progress with elapsed and remaining time, the actions, and the result or error.
import { Link, useParams } from "react-router-dom";
import { can } from "@shared/types/roles";
import { Alert } from "@/components/ui/alert";
import { RunActions, RunProgress, RunStateBadge, useRun } from "@/features/runs";
import { ApiError } from "@/lib/api-client";
import { useProjectOutlet } from "./project-layout";

export function RunDetailRoute() {
  const { projectId = "", runId = "" } = useParams();
  const { project } = useProjectOutlet();
  const { data: run, error, isPending } = useRun(projectId, runId);
  const back = (
    <Link to={`/projects/${projectId}/runs`} className="text-sm font-medium text-brand-700 hover:underline">
      ← All runs
    </Link>
  );
  if (isPending) return <p className="text-sm text-slate-500">Loading the run…</p>;
  if (error)
    return (
      <div className="space-y-3">
        {back}
        <Alert>
          {error instanceof ApiError && error.status === 404 ? "There is no such run in this project." : error.message}
        </Alert>
      </div>
    );
  const mayAct = can(project.role, project.siteRole, "run:start");
  return (
    <section className="space-y-5" data-testid="run-detail">
      {back}
      <div className="flex flex-wrap items-center gap-3">
        <h2 className="text-lg font-semibold text-slate-900">{run.kind}</h2>
        <RunStateBadge state={run.state} queuePosition={run.queuePosition} />
        {run.attempt > 1 && <span className="text-xs text-slate-500">attempt {run.attempt}</span>}
      </div>
      <RunProgress run={run} />
      {mayAct && <RunActions run={run} />}
      {run.error && run.state !== "cancelled" && (
        <Alert>
          {run.error.message} ({run.error.code})
        </Alert>
      )}
      {run.state === "cancelled" && run.error && <Alert tone="info">{run.error.message}</Alert>}
      <div className="grid gap-4 md:grid-cols-2">
        <div>
          <h3 className="mb-1 text-sm font-semibold text-slate-700">Parameters</h3>
          <pre className="overflow-x-auto rounded-md bg-slate-50 p-3 text-xs text-slate-800">
            {JSON.stringify(run.params, null, 2)}
          </pre>
        </div>
        {run.state === "succeeded" && (
          <div>
            <h3 className="mb-1 text-sm font-semibold text-slate-700">Result</h3>
            <pre
              className="max-h-96 overflow-auto rounded-md bg-slate-50 p-3 text-xs text-slate-800"
              data-testid="run-result"
            >
              {JSON.stringify(run.result, null, 2)}
            </pre>
          </div>
        )}
      </div>
    </section>
  );
}
