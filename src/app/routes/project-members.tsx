import { can } from "@shared/types/roles";
import { InvitationsPanel } from "@/features/projects/components/invitations-panel";
import { MembersPanel } from "@/features/projects/components/members-panel";
import { useProjectOutlet } from "./project-layout";

export function ProjectMembersRoute() {
  const { project, user } = useProjectOutlet();
  const canManage = can(project.role, project.siteRole, "project:manage");
  return (
    <div className="space-y-6">
      <MembersPanel projectId={project.id} canManage={canManage} currentUserId={user.id} />
      {canManage && <InvitationsPanel projectId={project.id} />}
    </div>
  );
}
