// Reductions tab: start a search (modelers), follow it as a run and see its findings here, and work through the
// review queue (filters, sort, bulk decisions for reviewers).
import { Link, useParams } from "react-router-dom";
import { isRunFinished } from "@shared/schemas/runs";
import { can } from "@shared/types/roles";
import { useModelList } from "@/features/models/api/list-models";
import { useRefreshWhenSearchEnds } from "@/features/reductions/api/refresh-when-search-ends";
import { useStartSearch } from "@/features/reductions/api/start-search";
import { NotionsHelp } from "@/features/reductions/components/notions-help";
import { ReviewQueue } from "@/features/reductions/components/review-queue";
import { SearchFindings } from "@/features/reductions/components/search-findings";
import { SearchForm } from "@/features/reductions/components/search-form";
import { RunProgress, useRun } from "@/features/runs";
import { useProjectOutlet } from "./project-layout";

export function ProjectReductionsRoute() {
  const { projectId = "" } = useParams();
  const { project } = useProjectOutlet();
  const models = useModelList(projectId);
  const search = useStartSearch(projectId);
  const followed = useRun(search.data ? projectId : null, search.data?.id ?? null);
  useRefreshWhenSearchEnds(followed.data);
  const canSearch = can(project.role, project.siteRole, "run:start");
  const canDecide = can(project.role, project.siteRole, "review:decide");

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
      {followed.data && !isRunFinished(followed.data.state) && <RunProgress run={followed.data} />}
      {followed.data?.state === "succeeded" && (
        <SearchFindings
          projectId={projectId}
          runId={followed.data.id}
          result={followed.data.result}
          canPropose={canSearch}
        />
      )}
      <h3 className="text-sm font-semibold text-slate-900">
        {canDecide ? "Review queue" : "Reductions of this project"}
      </h3>
      <ReviewQueue
        projectId={projectId}
        models={(models.data ?? []).map((m) => ({ id: m.id, name: m.name }))}
        canDecide={canDecide}
      />
    </section>
  );
}
