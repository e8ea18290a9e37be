// The signed-in person's in-app notifications (the bell in the header): list with the unread count, mark read.
import { Router } from "express";
import type { Knex } from "knex";
import { MarkNotificationsReadBody } from "@shared/schemas/runs";
import type { z } from "zod";
import { listNotifications, markNotificationsRead } from "../db/repositories/notifications";
import { currentUser, requireUser } from "../http/auth";
import { HttpError } from "../http/errors";
import { validate } from "../http/validate";

export function notificationsRouter(deps: { db: Knex }): Router {
  const { db } = deps;
  const router = Router();

  router.get("/", requireUser, async (req, res) => {
    res.json({ data: await listNotifications(db, currentUser(req).id) });
  });

  router.post("/read", requireUser, validate({ body: MarkNotificationsReadBody }), async (req, res) => {
    const body = req.body as z.infer<typeof MarkNotificationsReadBody>;
    if (!body.all && !body.ids?.length)
      throw new HttpError(400, "INVALID_INPUT", "Give the ids to mark read, or all: true");
    const marked = await markNotificationsRead(db, currentUser(req).id, body.all ? "all" : body.ids!);
    res.json({ data: { marked } });
  });

  return router;
}
