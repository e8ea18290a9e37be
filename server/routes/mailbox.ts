// The local mail fake's catch, for site admins, and only while the fake is in use.
import { Router } from "express";
import type { Knex } from "knex";
import { MailboxQuery } from "@shared/schemas/accounts";
import { listMailMessages } from "../db/repositories/mail";
import { requireSiteAdmin } from "../http/auth";
import { HttpError } from "../http/errors";
import { validate } from "../http/validate";
import type { Mailer } from "../mail/mailer";

export function mailboxRouter(deps: { db: Knex; mailer: Pick<Mailer, "usesFake"> }): Router {
  const router = Router();
  router.get("/", requireSiteAdmin, validate({ query: MailboxQuery }), async (req, res) => {
    if (!deps.mailer.usesFake)
      throw new HttpError(404, "NOT_FOUND", "Mail goes to a real SMTP server; there is no local mailbox");
    const query = req.query as { to?: string };
    res.json({ data: await listMailMessages(deps.db, { limit: 100, to: query.to }) });
  });
  return router;
}
