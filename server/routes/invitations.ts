// Invitations by e-mail: owners and admins send them (project-scoped router), the invitee previews and accepts
// one by its token (public router). A token works once, before it expires, and only while it is the newest one
// for that address; accepting creates the account when the address has none.
import type { Request } from "express";
import type { Knex } from "knex";
import type { Logger } from "pino";
import { z } from "zod";
import {
  AcceptedInvitation,
  AcceptInvitationBody,
  CreateInvitationBody,
  Invitation as InvitationSchema,
  InvitationParams,
  InvitationPreview,
  ProjectParams,
  TokenParams,
} from "@shared/schemas/projects";
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
import { HttpError } from "../http/errors";
import { hashPassword } from "../http/password-hash";
import { anyone, project, routeGroup, type RouteGroup } from "../http/route-group";
import { setSessionCookie, signSession } from "../http/session";
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

export function projectInvitationsRoutes(deps: InvitationDeps): RouteGroup {
  const { db } = deps;
  const routes = routeGroup({ mountPath: "/projects/:projectId/invitations", tag: "invitations", db });

  routes.get("/", {
    summary: "List the project's pending invitations",
    access: project("project:manage"),
    params: ProjectParams,
    response: z.array(InvitationSchema),
    handler: ({ project }) => listPendingInvitations(db, project.id),
  });

  routes.post("/", {
    summary: "Invite someone by e-mail; the link in the mail works once, for seven days",
    access: project("project:manage"),
    params: ProjectParams,
    body: CreateInvitationBody,
    response: InvitationSchema,
    status: 201,
    async handler({ body, project, user: actor, req }) {
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
      return publicInvitation(invitation);
    },
  });

  routes.delete("/:invitationId", {
    summary: "Withdraw a pending invitation",
    access: project("project:manage"),
    params: InvitationParams,
    status: 204,
    async handler({ params, project, user }) {
      const invitation = await findInvitation(db, project.id, params.invitationId);
      if (!invitation || invitation.acceptedAt || invitation.revokedAt)
        throw new HttpError(404, "NOT_FOUND", "No pending invitation with that id");
      await db.transaction(async (trx) => {
        await revokeInvitation(trx, invitation.id);
        await recordAudit(trx, {
          projectId: project.id,
          actorId: user.id,
          action: "invitation.revoke",
          target: invitation.email,
        });
      });
    },
  });

  return routes;
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

export function invitationsRoutes(deps: InvitationDeps): RouteGroup {
  const { db } = deps;
  const routes = routeGroup({ mountPath: "/invitations", tag: "invitations", db });

  routes.get("/:token", {
    summary: "What an invitation link offers, before accepting it",
    access: anyone,
    params: TokenParams,
    response: InvitationPreview,
    async handler({ params }) {
      const invitation = usable(
        await findInvitationByTokenHash(db, hashInvitationToken(params.token), { lock: false }),
      );
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
    },
  });

  routes.post("/:token/accept", {
    summary: "Accept an invitation: join the project, creating the account when the address has none",
    access: anyone,
    params: TokenParams,
    body: AcceptInvitationBody,
    response: AcceptedInvitation,
    async handler({ params, body, user: caller, req, res }) {
      const result = await db.transaction(async (trx) => {
        const invitation = usable(
          await findInvitationByTokenHash(trx, hashInvitationToken(params.token), { lock: true }),
        );
        let user = await findUserByEmail(trx, invitation.email);
        let isNewAccount = false;
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
      return { projectId: result.projectId, role: result.role };
    },
  });

  return routes;
}
