// The project's first tab: what it is about, and the owners' settings.
import { useNavigate } from "react-router-dom";
import { can } from "@shared/types/roles";
import { ProjectSettings } from "@/features/projects/components/project-settings";
import { useProjectOutlet } from "./project-layout";

export function ProjectOverviewRoute() {
  const { project } = useProjectOutlet();
  const navigate = useNavigate();
  const canManage = can(project.role, project.siteRole, "project:manage");
  return (
    <div className="space-y-6">
      <div className="rounded-lg border border-slate-200 bg-white p-5">
        <h2 className="mb-2 text-lg font-semibold">About</h2>
        <p className="text-sm text-slate-700">{project.description || "No description yet."}</p>
        <p className="mt-3 text-xs text-slate-500">
          Created {new Date(project.createdAt).toLocaleDateString()} · last change {new Date(project.updatedAt).toLocaleString()}
        </p>
      </div>
      {canManage && <ProjectSettings project={project} onDeleted={() => navigate("/projects", { replace: true })} />}
    </div>
  );
}
