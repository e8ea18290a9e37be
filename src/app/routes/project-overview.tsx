// The project's first tab: what it is about, where things stand (models, searches running, reductions waiting
// for review), and the owners' settings.
import type { ReactNode } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link, useNavigate } from "react-router-dom";
import { can } from "@shared/types/roles";
import { useModelList } from "@/features/models/api/list-models";
import { projectQuery } from "@/features/projects/api/get-project";
import { ProjectSettings } from "@/features/projects/components/project-settings";
import { useReductions } from "@/features/reductions/api/list-reductions";
import { useRunList } from "@/features/runs";
import { useProjectOutlet } from "./project-layout";

function Stat({ to, value, label, testId }: { to: string; value: ReactNode; label: string; testId: string }) {
  return (
    <Link
      to={to}
      data-testid={testId}
      className="rounded-lg border border-slate-200 bg-white p-4 hover:border-brand-600"
    >
      <p className="text-2xl font-semibold text-slate-900">{value}</p>
      <p className="text-sm text-slate-600">{label}</p>
    </Link>
  );
}

export function ProjectOverviewRoute() {
  const { project } = useProjectOutlet();
  const navigate = useNavigate();
  const canManage = can(project.role, project.siteRole, "project:manage");
  const models = useModelList(project.id);
  const proposed = useReductions(project.id, { state: "proposed" });
  const running = useRunList(project.id, { state: "running" });
  // Work done in other tabs moves "last change" on the server; read it afresh whenever the overview opens.
  const fresh = useQuery({ ...projectQuery(project.id), staleTime: 0 });
  const lastChange = fresh.data?.updatedAt ?? project.updatedAt;
  const base = `/projects/${project.id}`;
  return (
    <div className="space-y-6">
      <div className="grid gap-3 sm:grid-cols-3">
        <Stat to={`${base}/models`} value={models.data?.length ?? "…"} label="models" testId="stat-models" />
        <Stat
          to={`${base}/reductions`}
          value={proposed.data?.length ?? "…"}
          label="reductions waiting for review"
          testId="stat-proposed"
        />
        <Stat to={`${base}/runs`} value={running.data?.length ?? "…"} label="runs in progress" testId="stat-running" />
      </div>
      <div className="rounded-lg border border-slate-200 bg-white p-5">
        <h2 className="mb-2 text-lg font-semibold">About</h2>
        <p className="text-sm text-slate-700">{project.description || "No description yet."}</p>
        <p className="mt-3 text-xs text-slate-500">
          Created {new Date(project.createdAt).toLocaleDateString()} · last change{" "}
          <time dateTime={lastChange} data-testid="project-last-change">
            {new Date(lastChange).toLocaleString()}
          </time>
        </p>
      </div>
      {canManage && <ProjectSettings project={project} onDeleted={() => navigate("/projects", { replace: true })} />}
    </div>
  );
}
