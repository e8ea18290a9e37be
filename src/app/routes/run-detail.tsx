// One run: titled by what it did and on what, live progress with elapsed and remaining time, the actions, the
// parameters in words and the result in the view made for its kind; the whole run downloads as JSON.
import { Link, useParams } from "react-router-dom";
import { can } from "@shared/types/roles";
import { Alert } from "@/components/ui/alert";
import { SaveRulesAsModel } from "@/features/models/components/save-rules-as-model";
import { SearchFindings } from "@/features/reductions/components/search-findings";
import { RunActions, RunProgress, RunResultView, RunStateBadge, runTitle, useRun } from "@/features/runs";
import { ApiError } from "@/lib/api-client";
import { downloadJson, fileNameOf } from "@/lib/download";

/** The parameters a person chose: scalars and short lists, without the rule text the run carries along. */
function paramLines(params: unknown, prefix = ""): { label: string; value: string }[] {
  if (typeof params !== "object" || params === null) return [];
  return Object.entries(params).flatMap(([key, value]) => {
    if (/RuleText$|^ruleText$|Id$/.test(key)) return [];
    if (Array.isArray(value)) return [{ label: prefix + key, value: value.join(", ") }];
    if (typeof value === "object" && value !== null) return paramLines(value, `${prefix}${key}.`);
    return [{ label: prefix + key, value: String(value) }];
  });
}
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
  const mayWriteModels = can(project.role, project.siteRole, "model:write") && !project.archived;
  const title = runTitle(run);
  const params = paramLines(run.params);
  return (
    <section className="space-y-5" data-testid="run-detail">
      {back}
      <div className="flex flex-wrap items-center gap-3">
        <h2 className="text-lg font-semibold text-slate-900" data-testid="run-title">
          {title}
        </h2>
        <span className="rounded bg-slate-100 px-1.5 font-mono text-xs text-slate-600">{run.kind}</span>
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
      {run.model && (
        <p className="text-sm text-slate-600">
          Model:{" "}
          <Link
            to={`/projects/${projectId}/models/${run.model.modelId}?revision=${run.model.revision}`}
            className="font-medium text-brand-700 hover:underline"
          >
            {run.model.modelName}, revision {run.model.revision}
          </Link>
          {run.targetModel && (
            <>
              {" · target: "}
              <Link
                to={`/projects/${projectId}/models/${run.targetModel.modelId}?revision=${run.targetModel.revision}`}
                className="font-medium text-brand-700 hover:underline"
              >
                {run.targetModel.modelName}, revision {run.targetModel.revision}
              </Link>
            </>
          )}
        </p>
      )}
      {params.length > 0 && (
        <div>
          <h3 className="mb-1 text-sm font-semibold text-slate-700">Parameters</h3>
          <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-0.5 text-sm" data-testid="run-params">
            {params.map((p) => (
              <div key={p.label} className="contents">
                <dt className="text-slate-600">{p.label}</dt>
                <dd className="font-mono text-slate-900">{p.value}</dd>
              </div>
            ))}
          </dl>
        </div>
      )}
      {run.state === "succeeded" && (
        <div className="space-y-2" data-testid="run-result">
          <div className="flex items-center gap-3">
            <h3 className="text-sm font-semibold text-slate-700">Result</h3>
            <button
              type="button"
              className="text-xs font-medium text-brand-700 hover:underline"
              data-testid="run-json"
              onClick={() => downloadJson(run, fileNameOf(title))}
            >
              Download as JSON
            </button>
          </div>
          <RunResultView
            run={run}
            saveAsModel={
              mayWriteModels
                ? (ruleText, suggestedName) => (
                    <SaveRulesAsModel
                      projectId={projectId}
                      ruleText={ruleText}
                      suggestedName={suggestedName}
                      description={`The coarsest closing grouping found by the run "${title}". A statement about the model, not the cell.`}
                    />
                  )
                : undefined
            }
          />
          {run.kind === "reduction-search" && (
            <SearchFindings projectId={projectId} runId={run.id} result={run.result} canPropose={mayAct} />
          )}
        </div>
      )}
    </section>
  );
}
