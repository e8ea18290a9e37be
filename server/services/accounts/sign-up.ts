// Sign-up by mailed link. The answer to a sign-up request is the same whether or not the address already has an
// account (the owner of a known address gets a note instead of a link), so the form cannot be used to find out
// who has an account. The account is created only when the link is opened, which also proves the address.
import { createHash, randomBytes } from "node:crypto";
import type { Knex } from "knex";
import type { Logger } from "pino";
import type { SignUpAccepted, SignUpBody } from "@shared/schemas/accounts";
import { findUserByEmail, insertUser, type User } from "../../db/repositories/users";
import { HttpError } from "../../http/errors";
import { hashPassword } from "../../http/password-hash";
import type { Mailer } from "../../mail/mailer";

export const SIGN_UP_LINK_TTL_MS = 24 * 60 * 60 * 1000;

export interface SignUpDeps {
  db: Knex;
  log: Logger;
  mailer: Pick<Mailer, "send">;
  /** Builds the link the mail carries from the one-time token. */
  linkFor: (token: string) => string;
  signInUrl: string;
}

const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");

async function send(deps: SignUpDeps, mail: Parameters<Mailer["send"]>[0]): Promise<void> {
  try {
    await deps.mailer.send(mail);
  } catch (err) {
    deps.log.error({ err }, "sign-up mail could not be sent");
    throw new HttpError(502, "MAIL_FAILED", "The e-mail could not be sent; nothing was saved. Try again later.");
  }
}

export async function requestSignUp(deps: SignUpDeps, body: SignUpBody): Promise<SignUpAccepted> {
  // Hash in both branches so the answer takes as long for a known address as for a new one.
  const passwordHash = await hashPassword(body.password);
  const existing = await findUserByEmail(deps.db, body.email);
  if (existing) {
    await send(deps, {
      to: existing.email,
      subject: "Someone asked to create an Emulant account with your address",
      text:
        `Someone asked to create a new Emulant account with ${existing.email}, which already has one.\n\n` +
        `If it was you, sign in instead: ${deps.signInUrl}\n\n` +
        `If it was not you, nothing has changed and you can ignore this message.\n`,
    });
    return { email: body.email };
  }
  const token = randomBytes(32).toString("base64url");
  await deps.db.transaction(async (trx) => {
    await trx("sign_up_requests").insert({
      email: body.email,
      display_name: body.displayName,
      password_hash: passwordHash,
      token_hash: hashToken(token),
      expires_at: new Date(Date.now() + SIGN_UP_LINK_TTL_MS),
    });
    await send(deps, {
      to: body.email,
      subject: "Finish creating your Emulant account",
      text:
        `Open this link to finish creating your Emulant account (it works once, for 24 hours):\n\n` +
        `${deps.linkFor(token)}\n\nIf you did not ask for an account, ignore this message.\n`,
    });
  });
  return { email: body.email };
}

interface SignUpRequestRow {
  id: string;
  email: string;
  display_name: string;
  password_hash: string;
  expires_at: Date;
  used_at: Date | null;
}

/** Creates the account a mailed link stands for; the link works once. */
export async function confirmSignUp(db: Knex, token: string): Promise<User> {
  return db.transaction(async (trx) => {
    const row = (await trx("sign_up_requests")
      .where({ token_hash: hashToken(token) })
      .forUpdate()
      .first()) as SignUpRequestRow | undefined;
    if (!row || row.used_at || row.expires_at.getTime() < Date.now())
      throw new HttpError(
        404,
        "SIGN_UP_LINK_INVALID",
        "This sign-up link is not valid any more (it works once, for 24 hours). Sign up again for a new one.",
      );
    await trx("sign_up_requests").where({ id: row.id }).update({ used_at: trx.fn.now() });
    // Two links for one address: the first one opened creates the account.
    if (await findUserByEmail(trx, row.email))
      throw new HttpError(409, "EMAIL_TAKEN", "This address has an account already; sign in instead");
    return insertUser(trx, { email: row.email, displayName: row.display_name, passwordHash: row.password_hash });
  });
}
