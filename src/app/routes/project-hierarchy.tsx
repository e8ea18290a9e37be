// Model hierarchy tab: the project's models joined by approved reductions (and their verified compositions).
import { useParams } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { useModelHierarchy } from "@/features/reductions/api/get-model-hierarchy";
import { ModelHierarchyGraph } from "@/features/reductions/components/model-hierarchy-graph";

export function ProjectHierarchyRoute() {
  const { projectId = "" } = useParams();
  const hierarchy = useModelHierarchy(projectId);
  return (
    <section className="space-y-3">
      <div>
        <h2 className="text-lg font-semibold text-slate-900">Model hierarchy</h2>
        <p className="text-sm text-slate-600">
          An arrow from a model to each model it emulates or coarse-grains onto, from approved reductions only. Click a
          model to open it.
        </p>
      </div>
      {hierarchy.error && <Alert>{hierarchy.error.message}</Alert>}
      {hierarchy.data && <ModelHierarchyGraph projectId={projectId} graph={hierarchy.data} />}
    </section>
  );
}
