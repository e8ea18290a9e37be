// Invitations by e-mail: owners and admins send them (project-scoped router), the invitee previews and accepts
// one by its token (public router). A token works once, before it expires, and only while it is the newest one
// for that address; accepting creates the account when the address has none.
import { Router, type Request } from "express";
import type { Knex } from "knex";
import type { Logger } from "pino";
import { AcceptInvitationBody, CreateInvitationBody, InvitationParams, TokenParams } from "@shared/schemas/projects";
import type { ProjectRole } from "@shared/types/roles";
import { recordAudit } from "../db/repositories/audit-log";
import {
  findInvitation,
  findInvitationByTokenHash,
  hashInvitationToken,
  insertInvitation,
  listPendingInvitations,
  markAccepted,
  newInvitationToken,
  revokeInvitation,
  revokePendingFor,
  type Invitation,
} from "../db/repositories/invitations";
import { findMember, roleOf, upsertMembership } from "../db/repositories/memberships";
import { findProject } from "../db/repositories/projects";
import { findUserByEmail, insertUser } from "../db/repositories/users";
import { currentProject, currentUser, projectAccess } from "../http/auth";
import { HttpError } from "../http/errors";
import { hashPassword } from "../http/password-hash";
import { setSessionCookie, signSession } from "../http/session";
import { validate } from "../http/validate";
import type { Mailer } from "../mail/mailer";

const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

export interface InvitationDeps {
  db: Knex;
  log: Logger;
  mailer: Pick<Mailer, "send">;
  publicUrl?: string;
  sessionSecret: string;
}

const article = (role: ProjectRole) => (role === "owner" ? "an" : "a");

/** The configured public address when there is one; otherwise the address this request came in on (dev, tests). */
function siteOrigin(req: Request, publicUrl: string | undefined): string {
  return publicUrl ? new URL(publicUrl).origin : `${req.protocol}://${req.get("host")}`;
}

export function projectInvitationsRouter(deps: InvitationDeps): Router {
  const { db } = deps;
  const router = Router({ mergeParams: true });

  router.get("/", projectAccess(db, "project:manage"), async (req, res) => {
    res.json({ data: await listPendingInvitations(db, currentProject(req).id) });
  });

  router.post("/", projectAccess(db, "project:manage"), validate({ body: CreateInvitationBody }), async (req, res) => {
    const body = req.body as { email: string; role: ProjectRole };
    const project = currentProject(req);
    const actor = currentUser(req);
    const existing = await findUserByEmail(db, body.email);
    if (existing && (await roleOf(db, project.id, existing.id))) {
      throw new HttpError(409, "ALREADY_MEMBER", `${body.email} is already a member of this project`);
    }
    const { token, tokenHash } = newInvitationToken();
    const link = `${siteOrigin(req, deps.publicUrl)}/invitations/${token}`;
    // Sending inside the transaction: if the mail cannot be handed over, no invitation is left behind.
    const invitation = await db.transaction(async (trx) => {
      await revokePendingFor(trx, project.id, body.email);
      const inv = await insertInvitation(trx, {
        projectId: project.id,
        email: body.email,
        role: body.role,
        tokenHash,
        invitedBy: actor.id,
        expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
      });
      await recordAudit(trx, {
        projectId: project.id,
        actorId: actor.id,
        action: "invitation.create",
        target: body.email,
        details: { role: body.role },
      });
      try {
        await deps.mailer.send({
          to: body.email,
          subject: `${actor.displayName} invited you to "${project.name}" on Emulant`,
          text:
            `${actor.displayName} invited you to join the project "${project.name}" on Emulant as ${article(body.role)} ${body.role}.\n\n` +
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
    res.status(201).json({ data: publicInvitation(invitation) });
  });

  router.delete(
    "/:invitationId",
    projectAccess(db, "project:manage"),
    validate({ params: InvitationParams }),
    async (req, res) => {
      const { invitationId } = req.params as { invitationId: string };
      const project = currentProject(req);
      const invitation = await findInvitation(db, project.id, invitationId);
      if (!invitation || invitation.acceptedAt || invitation.revokedAt)
        throw new HttpError(404, "NOT_FOUND", "No pending invitation with that id");
      await db.transaction(async (trx) => {
        await revokeInvitation(trx, invitation.id);
        await recordAudit(trx, {
          projectId: project.id,
          actorId: currentUser(req).id,
          action: "invitation.revoke",
          target: invitation.email,
        });
      });
      res.status(204).end();
    },
  );

  return router;
}

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

export function invitationsRouter(deps: InvitationDeps): Router {
  const { db } = deps;
  const router = Router();

  router.get("/:token", validate({ params: TokenParams }), async (req, res) => {
    const { token } = req.params as { token: string };
    const invitation = usable(await findInvitationByTokenHash(db, hashInvitationToken(token), { lock: false }));
    const project = await findProject(db, invitation.projectId);
    if (!project)
      throw new HttpError(
        404,
        "INVITATION_INVALID",
        "This invitation link is not valid. Ask the project owner for a new one.",
      );
    res.json({
      data: {
        projectName: project.name,
        email: invitation.email,
        role: invitation.role,
        invitedByName: invitation.invitedByName,
        expiresAt: invitation.expiresAt,
        accountExists: (await findUserByEmail(db, invitation.email)) !== null,
      },
    });
  });

  router.post("/:token/accept", validate({ params: TokenParams, body: AcceptInvitationBody }), async (req, res) => {
    const { token } = req.params as { token: string };
    const body = req.body as AcceptInvitationBody;
    const result = await db.transaction(async (trx) => {
      const invitation = usable(await findInvitationByTokenHash(trx, hashInvitationToken(token), { lock: true }));
      let user = await findUserByEmail(trx, invitation.email);
      let isNewAccount = false;
      if (user) {
        if (!req.user)
          throw new HttpError(401, "SIGN_IN_REQUIRED", `Sign in as ${invitation.email} to accept this invitation`);
        if (req.user.id !== user.id)
          throw new HttpError(
            403,
            "WRONG_ACCOUNT",
            `This invitation is for ${invitation.email}; sign out and sign in as that address`,
          );
      } else {
        if (req.user)
          throw new HttpError(
            403,
            "WRONG_ACCOUNT",
            `This invitation is for ${invitation.email}; sign out first to create that account`,
          );
        if (!body.displayName || !body.password) {
          throw new HttpError(400, "INVALID_INPUT", "Choose your name and a password to create your account", [
            ...(body.displayName ? [] : [{ field: "body.displayName", message: "Enter a name" }]),
            ...(body.password ? [] : [{ field: "body.password", message: "Choose a password" }]),
          ]);
        }
        user = await insertUser(trx, {
          email: invitation.email,
          displayName: body.displayName,
          passwordHash: await hashPassword(body.password),
        });
        isNewAccount = true;
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
      return { user, isNewAccount, projectId: invitation.projectId, role };
    });
    if (result.isNewAccount)
      setSessionCookie(req, res, await signSession(deps.sessionSecret, result.user.id, result.user.sessionVersion));
    res.json({ data: { projectId: result.projectId, role: result.role } });
  });

  return router;
}
