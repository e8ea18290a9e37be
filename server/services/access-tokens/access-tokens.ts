// Creating a personal access token: the project list may name only projects the owner is in (a token never reaches
// further than its owner), and the secret leaves the server once, in this answer.
import type { Knex } from "knex";
import type { CreatedAccessToken, NewAccessTokenBody } from "@shared/schemas/access-tokens";
import { insertAccessToken, newAccessTokenSecret } from "../../db/repositories/access-tokens";
import { HttpError } from "../../http/errors";

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
  const stored = await insertAccessToken(db, {
    userId,
    name: body.name,
    scope: body.scope,
    projectIds,
    expiresAt,
    tokenHash,
  });
  return { ...stored, token };
}
