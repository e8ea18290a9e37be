import { useModelList } from "@/features/models/api/list-models";
import { AuditList } from "@/features/projects/components/audit-list";
import { useProjectOutlet } from "./project-layout";

export function ProjectAuditRoute() {
  const { project } = useProjectOutlet();
  const models = useModelList(project.id);
  const names = Object.fromEntries((models.data ?? []).map((m) => [m.id, m.name]));
  return <AuditList projectId={project.id} names={names} />;
}
