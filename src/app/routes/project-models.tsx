// Models tab of a project: the table of models and, for those allowed, the way to add one.
import { Link, useParams } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { useProjectOutlet } from "./project-layout";
import { can } from "@shared/types/roles";
import { useModelList } from "@/features/models/api/list-models";
import { ModelsTable } from "@/features/models/components/models-table";

export function ProjectModelsRoute() {
  const { projectId = "" } = useParams();
  const models = useModelList(projectId);
  const { project } = useProjectOutlet();
  const canWrite = can(project.role, project.siteRole, "model:write");
  return (
    <section className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <div>
          <h2 className="text-lg font-semibold text-slate-900">Models</h2>
          <p className="text-sm text-slate-600">
            Boolean regulatory networks of this project; every edit is kept as a revision.
          </p>
        </div>
        {canWrite && (
          <Link
            to={`/projects/${projectId}/models/new`}
            data-testid="new-model"
            className="rounded-md bg-brand-700 px-4 py-2 text-sm font-medium text-white hover:bg-brand-800"
          >
            New model
          </Link>
        )}
      </div>
      {models.isPending && <p className="text-sm text-slate-500">Loading models…</p>}
      {models.error && <Alert>{models.error.message}</Alert>}
      {models.data && <ModelsTable projectId={projectId} models={models.data} />}
    </section>
  );
}
