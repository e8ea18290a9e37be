// The project page: title, the caller's role, a tab bar and the active tab below it. Features add their tab to
// `projectTabs` and a child route at the same path; each tab reads the project through useProjectOutlet().
import { Link, Outlet, useOutletContext, useParams } from "react-router-dom";
import type { SessionUser } from "@shared/schemas/accounts";
import type { ProjectDetail } from "@shared/schemas/projects";
import { Alert } from "@/components/ui/alert";
import { TabBar, type TabLink } from "@/components/ui/tabs";
import { useSession } from "@/features/accounts/api/get-session";
import { useProject } from "@/features/projects/api/get-project";
import { ApiError } from "@/lib/api-client";

/** Paths relative to /projects/:projectId; the empty path is the overview. */
export const projectTabs: TabLink[] = [
  { to: "", label: "Overview", end: true },
  { to: "models", label: "Models" },
  { to: "runs", label: "Runs" },
  { to: "reductions", label: "Reductions" },
  { to: "hierarchy", label: "Model hierarchy" },
  { to: "members", label: "Members" },
  { to: "audit", label: "Audit log" },
];

export interface ProjectOutlet {
  project: ProjectDetail;
  user: SessionUser;
}

export function useProjectOutlet(): ProjectOutlet {
  return useOutletContext<ProjectOutlet>();
}

export function ProjectLayoutRoute() {
  const { projectId = "" } = useParams();
  const { data: project, error, isPending } = useProject(projectId);
  const { data: session } = useSession();
  if (isPending || !session?.user) return <p className="text-sm text-slate-500">Loading the project…</p>;
  if (error) {
    return (
      <div className="space-y-3">
        <Alert>
          {error instanceof ApiError && error.status === 404
            ? "There is no such project, or you are not a member of it."
            : error.message}
        </Alert>
        <Link to="/projects" className="text-sm font-medium text-brand-700 hover:underline">
          Back to your projects
        </Link>
      </div>
    );
  }
  const outlet: ProjectOutlet = { project, user: session.user };
  return (
    <section className="space-y-5">
      <div className="flex flex-wrap items-baseline gap-3">
        <h1 className="text-2xl font-semibold" data-testid="project-name">
          {project.name}
        </h1>
        <span
          className="rounded-full bg-brand-50 px-2.5 py-0.5 text-xs font-medium capitalize text-brand-800"
          data-testid="project-role"
        >
          {project.role ?? "site admin"}
        </span>
        {project.archived && (
          <span className="rounded-full bg-amber-100 px-2.5 py-0.5 text-xs font-medium text-amber-800">archived</span>
        )}
      </div>
      <TabBar
        tabs={projectTabs.map((t) => ({
          ...t,
          to: t.to ? `/projects/${project.id}/${t.to}` : `/projects/${project.id}`,
        }))}
        label="Project sections"
      />
      <Outlet context={outlet} />
    </section>
  );
}
