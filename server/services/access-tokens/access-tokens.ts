// Creating and revoking personal access tokens: the project list may name only projects the owner is in (a token
// never reaches further than its owner), and the secret leaves the server once, in the creation answer. Both are
// written to the audit log of every project the token reaches, so a project's managers can see that someone's
// scripts may act in it, and when that ended.
import type { Knex } from "knex";
import type { CreatedAccessToken, NewAccessTokenBody } from "@shared/schemas/access-tokens";
import { insertAccessToken, newAccessTokenSecret, revokeAccessToken } from "../../db/repositories/access-tokens";
import { recordAudit } from "../../db/repositories/audit-log";
import { HttpError } from "../../http/errors";

/** The projects a token reaches now: those it names that its owner is still in, or all of the owner's projects. */
async function projectsReached(db: Knex, userId: string, projectIds: string[] | null): Promise<string[]> {
  const q = db("memberships").select("project_id").where({ user_id: userId });
  if (projectIds) q.whereIn("project_id", projectIds);
  return ((await q) as { project_id: string }[]).map((r) => r.project_id);
}

export async function createAccessToken(
  db: Knex,
  userId: string,
  body: NewAccessTokenBody,
): Promise<CreatedAccessToken> {
  const projectIds = body.projectIds ? [...new Set(body.projectIds)] : null;
  if (projectIds) {
    const rows = (await db("memberships")
      .select("project_id")
      .where({ user_id: userId })
      .whereIn("project_id", projectIds)) as { project_id: string }[];
    const mine = new Set(rows.map((r) => r.project_id));
    const details = body
      .projectIds!.map((id, i) => ({ id, i }))
      .filter(({ id }) => !mine.has(id))
      .map(({ i }) => ({ field: `body.projectIds.${i}`, message: "You are not a member of this project" }));
    if (details.length)
      throw new HttpError(400, "INVALID_INPUT", `${details[0]!.field}: ${details[0]!.message}`, details);
  }
  const { token, tokenHash } = newAccessTokenSecret();
  const expiresAt = new Date(Date.now() + body.expiresInDays * 86_400_000);
  return db.transaction(async (trx) => {
    const stored = await insertAccessToken(trx, {
      userId,
      name: body.name,
      scope: body.scope,
      projectIds,
      expiresAt,
      tokenHash,
    });
    for (const projectId of await projectsReached(trx, userId, projectIds))
      await recordAudit(trx, {
        projectId,
        actorId: userId,
        action: "token.create",
        target: stored.name,
        details: { scope: stored.scope, expiresAt: stored.expiresAt },
      });
    return { ...stored, token };
  });
}

/** False when the user has no live token with this id. */
export function revokeToken(db: Knex, userId: string, tokenId: string): Promise<boolean> {
  return db.transaction(async (trx) => {
    const revoked = await revokeAccessToken(trx, userId, tokenId);
    if (!revoked) return false;
    for (const projectId of await projectsReached(trx, userId, revoked.projectIds))
      await recordAudit(trx, { projectId, actorId: userId, action: "token.revoke", target: revoked.name });
    return true;
  });
}
