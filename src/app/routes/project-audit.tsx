import { AuditList } from "@/features/projects/components/audit-list";
import { useProjectOutlet } from "./project-layout";

export function ProjectAuditRoute() {
  const { project } = useProjectOutlet();
  return <AuditList projectId={project.id} />;
}
