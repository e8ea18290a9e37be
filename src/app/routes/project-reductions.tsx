// Reductions tab: start a search (modelers), follow it as a run, and browse the reductions found, by review state.
import { useState } from "react";
import { Link, useParams } from "react-router-dom";
import type { ReviewState } from "@shared/schemas/reductions";
import { can } from "@shared/types/roles";
import { Alert } from "@/components/ui/alert";
import { useModelList } from "@/features/models/api/list-models";
import { useReductions } from "@/features/reductions/api/list-reductions";
import { useStartSearch } from "@/features/reductions/api/start-search";
import { NotionsHelp } from "@/features/reductions/components/notions-help";
import { ReductionsTable } from "@/features/reductions/components/reductions-table";
import { SearchForm } from "@/features/reductions/components/search-form";
import { useProjectOutlet } from "./project-layout";

const stateFilters: { value: ReviewState | undefined; label: string }[] = [
  { value: undefined, label: "All" },
  { value: "proposed", label: "Proposed" },
  { value: "approved", label: "Approved" },
  { value: "rejected", label: "Rejected" },
];

export function ProjectReductionsRoute() {
  const { projectId = "" } = useParams();
  const { project } = useProjectOutlet();
  const [state, setState] = useState<ReviewState | undefined>(undefined);
  const models = useModelList(projectId);
  const reductions = useReductions(projectId, { state });
  const search = useStartSearch(projectId);
  const canSearch = can(project.role, project.siteRole, "run:start");

  return (
    <section className="space-y-5">
      <div>
        <h2 className="text-lg font-semibold text-slate-900">Reductions</h2>
        <p className="text-sm text-slate-600">
          Smaller networks this project's models emulate, embed or coarse-grain onto, each with a certificate anyone can
          re-check.
        </p>
      </div>
      <NotionsHelp />
      {canSearch && models.data && models.data.length > 0 && (
        <SearchForm
          models={models.data.map((m) => ({ id: m.id, name: m.name, nodeCount: m.nodeCount }))}
          isPending={search.isPending}
          error={search.error}
          onSubmit={(body) => search.mutate(body)}
        />
      )}
      {search.data && (
        <p className="rounded-md bg-brand-50 px-3 py-2 text-sm text-brand-800" data-testid="search-started">
          {search.data.reused ? "This search was run before; its stored result is reused." : "Search started."}{" "}
          <Link to={`/projects/${projectId}/runs/${search.data.id}`} className="font-medium underline">
            Follow the run
          </Link>
        </p>
      )}
      <div className="flex flex-wrap gap-2" role="group" aria-label="Filter by review state">
        {stateFilters.map((f) => (
          <button
            key={f.label}
            type="button"
            onClick={() => setState(f.value)}
            aria-pressed={state === f.value}
            className={`rounded-full px-3 py-1 text-xs font-medium ${state === f.value ? "bg-slate-800 text-white" : "bg-slate-100 text-slate-700 hover:bg-slate-200"}`}
          >
            {f.label}
          </button>
        ))}
      </div>
      {reductions.error && <Alert>{reductions.error.message}</Alert>}
      {reductions.data && <ReductionsTable projectId={projectId} reductions={reductions.data} />}
    </section>
  );
}
