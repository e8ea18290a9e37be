// Invitations by e-mail. The token itself is never stored, only its SHA-256, so the row cannot be turned back
// into a working link; a 256-bit random token needs no slow hash.
import type { Knex } from "knex";
import { createHash, randomBytes } from "node:crypto";
import type { ProjectRole } from "@shared/types/roles";

export interface Invitation {
  id: string;
  projectId: string;
  email: string;
  role: ProjectRole;
  invitedByName: string;
  expiresAt: string;
  createdAt: string;
  acceptedAt: string | null;
  revokedAt: string | null;
}

interface InvitationRow {
  id: string;
  project_id: string;
  email: string;
  role: ProjectRole;
  invited_by_name: string | null;
  expires_at: Date;
  created_at: Date;
  accepted_at: Date | null;
  revoked_at: Date | null;
}

function toInvitation(r: InvitationRow): Invitation {
  return {
    id: r.id,
    projectId: r.project_id,
    email: r.email,
    role: r.role,
    invitedByName: r.invited_by_name ?? "",
    expiresAt: r.expires_at.toISOString(),
    createdAt: r.created_at.toISOString(),
    acceptedAt: r.accepted_at?.toISOString() ?? null,
    revokedAt: r.revoked_at?.toISOString() ?? null,
  };
}

export function newInvitationToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashInvitationToken(token) };
}

export function hashInvitationToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

const selectColumns = [
  "i.id",
  "i.project_id",
  "i.email",
  "i.role",
  "u.display_name as invited_by_name",
  "i.expires_at",
  "i.created_at",
  "i.accepted_at",
  "i.revoked_at",
];

export async function insertInvitation(
  db: Knex,
  input: { projectId: string; email: string; role: ProjectRole; tokenHash: string; invitedBy: string; expiresAt: Date },
): Promise<Invitation> {
  const [row] = await db("invitations")
    .insert({
      project_id: input.projectId,
      email: input.email,
      role: input.role,
      token_hash: input.tokenHash,
      invited_by: input.invitedBy,
      expires_at: input.expiresAt,
    })
    .returning("id");
  return (await findInvitation(db, input.projectId, (row as { id: string }).id))!;
}

export async function findInvitation(db: Knex, projectId: string, id: string): Promise<Invitation | null> {
  const row = await db("invitations as i")
    .leftJoin("users as u", "u.id", "i.invited_by")
    .select(selectColumns)
    .where({ "i.id": id, "i.project_id": projectId })
    .first();
  return row ? toInvitation(row as InvitationRow) : null;
}

/** Locks the row, so two people following the same link at once cannot both use it. */
export async function findInvitationByTokenHash(
  db: Knex,
  tokenHash: string,
  opts: { lock: boolean },
): Promise<Invitation | null> {
  const q = db("invitations as i")
    .leftJoin("users as u", "u.id", "i.invited_by")
    .select(selectColumns)
    .where("i.token_hash", tokenHash)
    .first();
  if (opts.lock) q.forUpdate("i");
  const row = await q;
  return row ? toInvitation(row as InvitationRow) : null;
}

export async function listPendingInvitations(db: Knex, projectId: string): Promise<Invitation[]> {
  const rows = await db("invitations as i")
    .leftJoin("users as u", "u.id", "i.invited_by")
    .select(selectColumns)
    .where("i.project_id", projectId)
    .whereNull("i.accepted_at")
    .whereNull("i.revoked_at")
    .where("i.expires_at", ">", db.fn.now())
    .orderBy("i.created_at", "desc");
  return (rows as InvitationRow[]).map(toInvitation);
}

/** A new invitation to the same address replaces any earlier one still pending, so only the newest link works. */
export async function revokePendingFor(db: Knex, projectId: string, email: string): Promise<void> {
  await db("invitations")
    .where({ project_id: projectId, email })
    .whereNull("accepted_at")
    .whereNull("revoked_at")
    .update({ revoked_at: db.fn.now() });
}

export async function revokeInvitation(db: Knex, id: string): Promise<void> {
  await db("invitations").where({ id }).update({ revoked_at: db.fn.now() });
}

export async function markAccepted(db: Knex, id: string, userId: string): Promise<void> {
  await db("invitations").where({ id }).update({ accepted_at: db.fn.now(), accepted_by: userId });
}
