// Changing a member's role and removing a member. A project always keeps at least one owner: the owners are locked
// first, so two owners demoting each other at once cannot leave the project without one.
import type { Knex } from "knex";
import type { Member } from "@shared/schemas/projects";
import type { ProjectRole } from "@shared/types/roles";
import { recordAudit } from "../../db/repositories/audit-log";
import { deleteMembership, findMember, lockOwners, setRole } from "../../db/repositories/memberships";
import { HttpError } from "../../http/errors";

const lastOwner = () =>
  new HttpError(409, "LAST_OWNER", "A project needs at least one owner: make someone else owner first");
const notAMember = () => new HttpError(404, "NOT_FOUND", "That person is not a member of this project");

export interface ProjectManager {
  projectId: string;
  actorId: string;
}

export function changeRole(db: Knex, by: ProjectManager, userId: string, role: ProjectRole): Promise<Member> {
  return db.transaction(async (trx) => {
    const owners = await lockOwners(trx, by.projectId);
    const before = await findMember(trx, by.projectId, userId);
    if (!before) throw notAMember();
    if (before.role === role) return before;
    if (before.role === "owner" && owners.length === 1) throw lastOwner();
    await setRole(trx, by.projectId, userId, role);
    await recordAudit(trx, {
      projectId: by.projectId,
      actorId: by.actorId,
      action: "member.role",
      target: before.email,
      details: { from: before.role, to: role },
    });
    return { ...before, role };
  });
}

export function removeMember(db: Knex, by: ProjectManager, userId: string): Promise<void> {
  return db.transaction(async (trx) => {
    const owners = await lockOwners(trx, by.projectId);
    const member = await findMember(trx, by.projectId, userId);
    if (!member) throw notAMember();
    if (member.role === "owner" && owners.length === 1) throw lastOwner();
    await deleteMembership(trx, by.projectId, userId);
    await recordAudit(trx, {
      projectId: by.projectId,
      actorId: by.actorId,
      action: "member.remove",
      target: member.email,
      details: { role: member.role },
    });
  });
}
