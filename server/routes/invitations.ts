// Invitations by e-mail: owners and admins send them (project-scoped routes), the invitee previews and accepts one
// by its token (public routes). The rules of a token's life are in server/services/projects/invitations.ts.
import type { Request } from "express";
import type { Knex } from "knex";
import type { Logger } from "pino";
import { z } from "zod";
import {
  AcceptedInvitation,
  AcceptInvitationBody,
  CreateInvitationBody,
  Invitation,
  InvitationParams,
  InvitationPreview,
  ProjectParams,
  TokenParams,
} from "@shared/schemas/projects";
import { listPendingInvitations } from "../db/repositories/invitations";
import { anyone, project, routeGroup, type RouteGroup } from "../http/route-group";
import { startSession } from "../http/session-store";
import type { Mailer } from "../mail/mailer";
import {
  acceptInvitation,
  invitationPreview,
  sendInvitation,
  withdrawInvitation,
} from "../services/projects/invitations";

export interface InvitationDeps {
  db: Knex;
  log: Logger;
  mailer: Pick<Mailer, "send">;
  publicUrl?: string;
  sessionSecret: string;
}

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
    response: z.array(Invitation),
    handler: ({ project }) => listPendingInvitations(db, project.id),
  });

  routes.post("/", {
    summary: "Invite someone by e-mail; the link in the mail works once, for seven days",
    access: project("project:manage"),
    params: ProjectParams,
    body: CreateInvitationBody,
    response: Invitation,
    status: 201,
    handler: ({ body, project, user, req }) =>
      sendInvitation(
        deps,
        { project, user },
        body,
        (token) => `${siteOrigin(req, deps.publicUrl)}/invitations/${token}`,
      ),
  });

  routes.delete("/:invitationId", {
    summary: "Withdraw a pending invitation",
    access: project("project:manage"),
    params: InvitationParams,
    status: 204,
    handler: ({ params, project, user }) => withdrawInvitation(db, { project, user }, params.invitationId),
  });

  return routes;
}

export function invitationsRoutes(deps: InvitationDeps): RouteGroup {
  const { db } = deps;
  const routes = routeGroup({ mountPath: "/invitations", tag: "invitations", db });

  routes.get("/:token", {
    summary: "What an invitation link offers, before accepting it",
    access: anyone,
    params: TokenParams,
    response: InvitationPreview,
    handler: ({ params }) => invitationPreview(db, params.token),
  });

  routes.post("/:token/accept", {
    summary: "Accept an invitation: join the project, creating the account when the address has none",
    access: anyone,
    params: TokenParams,
    body: AcceptInvitationBody,
    response: AcceptedInvitation,
    async handler({ params, body, user, req, res }) {
      const { newAccount, ...accepted } = await acceptInvitation(db, params.token, user, body);
      if (newAccount) await startSession(db, deps.sessionSecret, req, res, newAccount);
      return accepted;
    },
  });

  return routes;
}
