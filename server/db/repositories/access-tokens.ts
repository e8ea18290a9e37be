// Personal access tokens: rows become AccessToken records here; the hash is looked up but never returned.
import { createHash, randomBytes } from "node:crypto";
import type { Knex } from "knex";
import type { AccessToken, TokenScope } from "@shared/schemas/access-tokens";

/** A prefix makes a leaked token recognisable (secret scanners, logs) without revealing anything about it. */
export const TOKEN_PREFIX = "emu_";

interface TokenRow {
  id: string;
  user_id: string;
  name: string;
  scope: TokenScope;
  project_ids: string[] | null;
  expires_at: Date;
  last_used_at: Date | null;
  revoked_at: Date | null;
  created_at: Date;
}

const columns = [
  "id",
  "user_id",
  "name",
  "scope",
  "project_ids",
  "expires_at",
  "last_used_at",
  "revoked_at",
  "created_at",
];

function toToken(r: TokenRow): AccessToken {
  return {
    id: r.id,
    name: r.name,
    scope: r.scope,
    projectIds: r.project_ids,
    expiresAt: r.expires_at.toISOString(),
    lastUsedAt: r.last_used_at?.toISOString() ?? null,
    revokedAt: r.revoked_at?.toISOString() ?? null,
    createdAt: r.created_at.toISOString(),
  };
}

export function hashAccessToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

export function newAccessTokenSecret(): { token: string; tokenHash: string } {
  const token = TOKEN_PREFIX + randomBytes(32).toString("base64url");
  return { token, tokenHash: hashAccessToken(token) };
}

export async function insertAccessToken(
  db: Knex,
  t: {
    userId: string;
    name: string;
    scope: TokenScope;
    projectIds: string[] | null;
    expiresAt: Date;
    tokenHash: string;
  },
): Promise<AccessToken> {
  const [row] = await db("access_tokens")
    .insert({
      user_id: t.userId,
      name: t.name,
      scope: t.scope,
      project_ids: t.projectIds,
      expires_at: t.expiresAt,
      token_hash: t.tokenHash,
    })
    .returning(columns);
  return toToken(row as TokenRow);
}

export async function listAccessTokens(db: Knex, userId: string): Promise<AccessToken[]> {
  const rows = (await db("access_tokens")
    .select(columns)
    .where({ user_id: userId })
    .orderBy("created_at", "desc")) as TokenRow[];
  return rows.map(toToken);
}

/** Revokes one of the user's tokens; null when the user has no such token (or it was revoked already). */
export async function revokeAccessToken(db: Knex, userId: string, tokenId: string): Promise<AccessToken | null> {
  const [row] = (await db("access_tokens")
    .where({ id: tokenId, user_id: userId })
    .whereNull("revoked_at")
    .update({ revoked_at: db.fn.now() })
    .returning(columns)) as TokenRow[];
  return row ? toToken(row) : null;
}

export interface LiveToken extends AccessToken {
  userId: string;
}

/** The token with this secret if it is neither expired nor revoked, marking it used now. */
export async function useAccessToken(db: Knex, token: string): Promise<LiveToken | null> {
  const [row] = (await db("access_tokens")
    .where({ token_hash: hashAccessToken(token) })
    .whereNull("revoked_at")
    .where("expires_at", ">", db.fn.now())
    .update({ last_used_at: db.fn.now() })
    .returning(columns)) as TokenRow[];
  return row ? { ...toToken(row), userId: row.user_id } : null;
}
