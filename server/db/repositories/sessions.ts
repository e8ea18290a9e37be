// Server-side session rows. A session is usable while it has not ended and has not expired; a signed token is
// worth nothing without its row, so ending the row ends every copy of the token.
import type { Knex } from "knex";

export async function createSession(db: Knex, userId: string, expiresAt: Date): Promise<string> {
  const [row] = await db("sessions").insert({ user_id: userId, expires_at: expiresAt }).returning(["id"]);
  return (row as { id: string }).id;
}

/** True when the session exists for this user, has not ended and has not expired. */
export async function sessionIsLive(db: Knex, sessionId: string, userId: string): Promise<boolean> {
  const row = await db("sessions")
    .select("id")
    .where({ id: sessionId, user_id: userId })
    .whereNull("ended_at")
    .andWhere("expires_at", ">", db.fn.now())
    .first();
  return row !== undefined;
}

export async function extendSession(db: Knex, sessionId: string, expiresAt: Date): Promise<void> {
  await db("sessions").where({ id: sessionId }).whereNull("ended_at").update({ expires_at: expiresAt });
}

export async function endSession(db: Knex, sessionId: string): Promise<void> {
  await db("sessions").where({ id: sessionId }).whereNull("ended_at").update({ ended_at: db.fn.now() });
}

/** Signing out everywhere, and what a password change does to the other sessions. */
export async function endSessionsOf(db: Knex, userId: string, exceptSessionId?: string): Promise<void> {
  const q = db("sessions").where({ user_id: userId }).whereNull("ended_at");
  if (exceptSessionId) q.andWhereNot({ id: exceptSessionId });
  await q.update({ ended_at: db.fn.now() });
}
