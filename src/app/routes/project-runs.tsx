// Runs tab of a project: start a run (for roles that may), and the list filtered by kind and state (in the URL).
import { useNavigate, useParams, useSearchParams } from "react-router-dom";
import { can } from "@shared/types/roles";
import { Alert } from "@/components/ui/alert";
import { RunFilters, RunsTable, StartRunForm, useRunList } from "@/features/runs";
import { useProjectOutlet } from "./project-layout";

export function ProjectRunsRoute() {
  const { projectId = "" } = useParams();
  const { project } = useProjectOutlet();
  const navigate = useNavigate();
  const [search, setSearch] = useSearchParams();
  const filter = { kind: search.get("kind") ?? undefined, state: search.get("state") ?? undefined };
  const runs = useRunList(projectId, filter);
  const mayStart = can(project.role, project.siteRole, "run:start") && !project.archived;
  return (
    <section className="space-y-4">
      <div>
        <h2 className="text-lg font-semibold text-slate-900">Runs</h2>
        <p className="text-sm text-slate-600">
          Analyses run in the background on the worker pool; a result is stored once and reused for the same request.
        </p>
      </div>
      {mayStart && (
        <StartRunForm projectId={projectId} onStarted={(runId) => navigate(`/projects/${projectId}/runs/${runId}`)} />
      )}
      <RunFilters
        value={filter}
        onChange={(next) => {
          const params = new URLSearchParams();
          if (next.kind) params.set("kind", next.kind);
          if (next.state) params.set("state", next.state);
          setSearch(params, { replace: true });
        }}
      />
      {runs.isPending && <p className="text-sm text-slate-500">Loading runs…</p>}
      {runs.error && <Alert>{runs.error.message}</Alert>}
      {runs.data && <RunsTable projectId={projectId} runs={runs.data} />}
    </section>
  );
}
