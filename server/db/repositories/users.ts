// Accounts: rows become domain objects here; the password hash never leaves this module except for verification.
import type { Knex } from "knex";
import type { SiteRole } from "@shared/types/roles";

export interface User {
  id: string;
  email: string;
  displayName: string;
  siteRole: SiteRole;
  sessionVersion: number;
  createdAt: string;
}

interface UserRow {
  id: string;
  email: string;
  display_name: string;
  site_role: SiteRole;
  session_version: number;
  created_at: Date;
  password_hash?: string;
}

const columns = ["id", "email", "display_name", "site_role", "session_version", "created_at"];

function toUser(r: UserRow): User {
  return {
    id: r.id,
    email: r.email,
    displayName: r.display_name,
    siteRole: r.site_role,
    sessionVersion: r.session_version,
    createdAt: r.created_at.toISOString(),
  };
}

export async function findUserById(db: Knex, id: string): Promise<User | null> {
  const row = (await db("users").select(columns).where({ id }).first()) as UserRow | undefined;
  return row ? toUser(row) : null;
}

export async function findUserByEmail(db: Knex, email: string): Promise<User | null> {
  const row = (await db("users").select(columns).where({ email: email.toLowerCase() }).first()) as UserRow | undefined;
  return row ? toUser(row) : null;
}

/** The stored hash for a sign-in check, together with the user it belongs to. */
export async function findCredentials(db: Knex, email: string): Promise<{ user: User; passwordHash: string } | null> {
  const row = (await db("users")
    .select([...columns, "password_hash"])
    .where({ email: email.toLowerCase() })
    .first()) as UserRow | undefined;
  return row ? { user: toUser(row), passwordHash: row.password_hash! } : null;
}

interface NewUser {
  email: string;
  displayName: string;
  passwordHash: string;
  siteRole?: SiteRole;
}

const userRow = (input: NewUser) => ({
  email: input.email.toLowerCase(),
  display_name: input.displayName,
  password_hash: input.passwordHash,
  site_role: input.siteRole ?? "member",
});

export async function insertUser(db: Knex, input: NewUser): Promise<User> {
  const [row] = await db("users").insert(userRow(input)).returning(columns);
  return toUser(row as UserRow);
}

export async function updateDisplayName(db: Knex, id: string, displayName: string): Promise<User> {
  const [row] = await db("users")
    .where({ id })
    .update({ display_name: displayName, updated_at: db.fn.now() })
    .returning(columns);
  return toUser(row as UserRow);
}

/** Changing the password bumps the session version, which signs out every other session of this user. */
export async function updatePassword(db: Knex, id: string, passwordHash: string): Promise<User> {
  const [row] = await db("users")
    .where({ id })
    .update({ password_hash: passwordHash, session_version: db.raw("session_version + 1"), updated_at: db.fn.now() })
    .returning(columns);
  return toUser(row as UserRow);
}

export async function passwordHashOf(db: Knex, id: string): Promise<string | null> {
  const row = (await db("users").select("password_hash").where({ id }).first()) as
    { password_hash: string } | undefined;
  return row?.password_hash ?? null;
}

/** The seed's upsert: an account with this address gets the given name, role and hash, or is created with them. */
export async function upsertUser(db: Knex, input: Required<NewUser>): Promise<User> {
  const [row] = await db("users")
    .insert(userRow(input))
    .onConflict("email")
    .merge(["display_name", "site_role", "password_hash"])
    .returning(columns);
  return toUser(row as UserRow);
}
