// The local mail fake's catch, for site admins, and only while the fake is in use.
import type { Knex } from "knex";
import { z } from "zod";
import { MailboxQuery, MailMessage } from "@shared/schemas/accounts";
import { listMailMessages } from "../db/repositories/mail";
import { HttpError } from "../http/errors";
import { routeGroup, siteAdmin, type RouteGroup } from "../http/route-group";
import type { Mailer } from "../mail/mailer";

export function mailboxRoutes(deps: { db: Knex; mailer: Pick<Mailer, "usesFake"> }): RouteGroup {
  const routes = routeGroup({ mountPath: "/mailbox", tag: "mailbox", db: deps.db });
  routes.get("/", {
    summary: "Mail the local SMTP fake received, newest first (site administrators, only while the fake is used)",
    access: siteAdmin,
    query: MailboxQuery,
    response: z.array(MailMessage),
    handler({ query }) {
      if (!deps.mailer.usesFake)
        throw new HttpError(404, "NOT_FOUND", "Mail goes to a real SMTP server; there is no local mailbox");
      return listMailMessages(deps.db, { limit: 100, to: query.to });
    },
  });
  return routes;
}
