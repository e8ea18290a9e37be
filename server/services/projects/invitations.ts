// Invitations by e-mail. Owners and admins send them; the invitee previews and accepts one by its token. A token
// works once, before it expires, and only while it is the newest one for that address; accepting creates the
// account when the address has none, and never changes the role of someone already in the project.
import type { Knex } from "knex";
import type { Logger } from "pino";
import type { z } from "zod";
import type {
  AcceptedInvitation,
  AcceptInvitationBody,
  CreateInvitationBody,
  Invitation as PublicInvitation,
  InvitationPreview,
} from "@shared/schemas/projects";
import type { ProjectRole } from "@shared/types/roles";
import { recordAudit } from "../../db/repositories/audit-log";
import {
  findInvitation,
  findInvitationByTokenHash,
  hashInvitationToken,
  insertInvitation,
  markAccepted,
  newInvitationToken,
  revokeInvitation,
  revokePendingFor,
  type Invitation,
} from "../../db/repositories/invitations";
import { findMember, roleOf, upsertMembership } from "../../db/repositories/memberships";
import { findProject } from "../../db/repositories/projects";
import { findUserByEmail, insertUser, type User } from "../../db/repositories/users";
import { HttpError } from "../../http/errors";
import { hashPassword } from "../../http/password-hash";
import type { Mailer } from "../../mail/mailer";

const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

const article = (role: ProjectRole) => (role === "owner" ? "an" : "a");

function publicInvitation(i: Invitation) {
  return {
    id: i.id,
    projectId: i.projectId,
    email: i.email,
    role: i.role,
    invitedByName: i.invitedByName,
    expiresAt: i.expiresAt,
    createdAt: i.createdAt,
  };
}

/** Refuses a token that is unknown, used, replaced or expired, each with its own code and a clear message. */
function usable(invitation: Invitation | null): Invitation {
  if (!invitation)
    throw new HttpError(
      404,
      "INVITATION_INVALID",
      "This invitation link is not valid. Ask the project owner for a new one.",
    );
  if (invitation.acceptedAt)
    throw new HttpError(410, "INVITATION_USED", "This invitation has already been used. Sign in to open the project.");
  if (invitation.revokedAt)
    throw new HttpError(410, "INVITATION_REVOKED", "This invitation was withdrawn or replaced by a newer one.");
  if (new Date(invitation.expiresAt).getTime() <= Date.now()) {
    throw new HttpError(
      410,
      "INVITATION_EXPIRED",
      "This invitation has expired. Ask the project owner to send a new one.",
    );
  }
  return invitation;
}

export interface InvitationSender {
  project: { id: string; name: string };
  user: { id: string; displayName: string };
}

/** Stores the invitation and mails its link; if the mail cannot be handed over, nothing is saved. */
export async function sendInvitation(
  deps: { db: Knex; log: Logger; mailer: Pick<Mailer, "send"> },
  by: InvitationSender,
  invite: z.output<typeof CreateInvitationBody>,
  linkFor: (token: string) => string,
): Promise<PublicInvitation> {
  const { db } = deps;
  const { project, user: actor } = by;
  const existing = await findUserByEmail(db, invite.email);
  if (existing && (await roleOf(db, project.id, existing.id))) {
    throw new HttpError(409, "ALREADY_MEMBER", `${invite.email} is already a member of this project`);
  }
  const { token, tokenHash } = newInvitationToken();
  const link = linkFor(token);
  // Sending inside the transaction: if the mail cannot be handed over, no invitation is left behind.
  const invitation = await db.transaction(async (trx) => {
    await revokePendingFor(trx, project.id, invite.email);
    const inv = await insertInvitation(trx, {
      projectId: project.id,
      email: invite.email,
      role: invite.role,
      tokenHash,
      invitedBy: actor.id,
      expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
    });
    await recordAudit(trx, {
      projectId: project.id,
      actorId: actor.id,
      action: "invitation.create",
      target: invite.email,
      details: { role: invite.role },
    });
    try {
      await deps.mailer.send({
        to: invite.email,
        subject: `${actor.displayName} invited you to "${project.name}" on Emulant`,
        text:
          `${actor.displayName} invited you to join the project "${project.name}" on Emulant as ${article(invite.role)} ${invite.role}.\n\n` +
          `Accept the invitation here (the link works once, until ${new Date(inv.expiresAt).toUTCString()}):\n\n${link}\n\n` +
          `If you did not expect this, ignore this message.\n`,
      });
    } catch (err) {
      deps.log.error({ err }, "invitation mail could not be sent");
      throw new HttpError(
        502,
        "MAIL_FAILED",
        "The invitation e-mail could not be sent; nothing was saved. Try again later.",
      );
    }
    return inv;
  });
  return publicInvitation(invitation);
}

export async function withdrawInvitation(db: Knex, by: InvitationSender, invitationId: string): Promise<void> {
  const invitation = await findInvitation(db, by.project.id, invitationId);
  if (!invitation || invitation.acceptedAt || invitation.revokedAt)
    throw new HttpError(404, "NOT_FOUND", "No pending invitation with that id");
  await db.transaction(async (trx) => {
    await revokeInvitation(trx, invitation.id);
    await recordAudit(trx, {
      projectId: by.project.id,
      actorId: by.user.id,
      action: "invitation.revoke",
      target: invitation.email,
    });
  });
}

export async function invitationPreview(db: Knex, token: string): Promise<InvitationPreview> {
  const invitation = usable(await findInvitationByTokenHash(db, hashInvitationToken(token), { lock: false }));
  const project = await findProject(db, invitation.projectId);
  if (!project)
    throw new HttpError(
      404,
      "INVITATION_INVALID",
      "This invitation link is not valid. Ask the project owner for a new one.",
    );
  return {
    projectName: project.name,
    email: invitation.email,
    role: invitation.role,
    invitedByName: invitation.invitedByName,
    expiresAt: invitation.expiresAt,
    accountExists: (await findUserByEmail(db, invitation.email)) !== null,
  };
}

/**
 * Accepts for the signed-in caller (who must own the invited address), or creates the invited account for an
 * anonymous caller. `newAccount` is the account created, which the caller then signs in.
 */
export async function acceptInvitation(
  db: Knex,
  token: string,
  caller: { id: string } | undefined,
  form: z.output<typeof AcceptInvitationBody>,
): Promise<AcceptedInvitation & { newAccount: User | null }> {
  return db.transaction(async (trx) => {
    const invitation = usable(await findInvitationByTokenHash(trx, hashInvitationToken(token), { lock: true }));
    let user = await findUserByEmail(trx, invitation.email);
    let newAccount: User | null = null;
    if (user) {
      if (!caller)
        throw new HttpError(401, "SIGN_IN_REQUIRED", `Sign in as ${invitation.email} to accept this invitation`);
      if (caller.id !== user.id)
        throw new HttpError(
          403,
          "WRONG_ACCOUNT",
          `This invitation is for ${invitation.email}; sign out and sign in as that address`,
        );
    } else {
      if (caller)
        throw new HttpError(
          403,
          "WRONG_ACCOUNT",
          `This invitation is for ${invitation.email}; sign out first to create that account`,
        );
      if (!form.displayName || !form.password) {
        throw new HttpError(400, "INVALID_INPUT", "Choose your name and a password to create your account", [
          ...(form.displayName ? [] : [{ field: "body.displayName", message: "Enter a name" }]),
          ...(form.password ? [] : [{ field: "body.password", message: "Choose a password" }]),
        ]);
      }
      user = await insertUser(trx, {
        email: invitation.email,
        displayName: form.displayName,
        passwordHash: await hashPassword(form.password),
      });
      newAccount = user;
    }
    // Someone already in the project keeps their role: an invitation must not demote an owner.
    const member = await findMember(trx, invitation.projectId, user.id);
    const role = member?.role ?? invitation.role;
    if (!member) await upsertMembership(trx, invitation.projectId, user.id, role);
    await markAccepted(trx, invitation.id, user.id);
    await recordAudit(trx, {
      projectId: invitation.projectId,
      actorId: user.id,
      action: "invitation.accept",
      target: user.email,
      details: { role },
    });
    return { projectId: invitation.projectId, role, newAccount };
  });
}
