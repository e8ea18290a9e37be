import { useNavigate } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { useProjects } from "@/features/projects/api/list-projects";
import { CreateProjectForm } from "@/features/projects/components/create-project-form";
import { ProjectsTable } from "@/features/projects/components/projects-table";

export function ProjectListRoute() {
  const navigate = useNavigate();
  const { data: projects, error, isPending } = useProjects();
  return (
    <section className="space-y-6">
      <h1 className="text-2xl font-semibold">Projects</h1>
      <div className="rounded-lg border border-slate-200 bg-white p-5">
        <CreateProjectForm onCreated={(id) => navigate(`/projects/${id}`)} />
      </div>
      {isPending ? (
        <p className="text-sm text-slate-500">Loading projects…</p>
      ) : error ? (
        <Alert>{error.message}</Alert>
      ) : (
        <ProjectsTable projects={projects} />
      )}
    </section>
  );
}
