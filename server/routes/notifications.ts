// The signed-in person's in-app notifications (the bell in the header): list with the unread count, mark read.
import type { Knex } from "knex";
import {
  MarkNotificationsReadBody,
  MarkNotificationsReadResult,
  NotificationList,
  NotificationPreferences,
} from "@shared/schemas/runs";
import {
  listNotifications,
  markNotificationsRead,
  notificationPreferences,
  saveNotificationPreferences,
} from "../db/repositories/notifications";
import { HttpError } from "../http/errors";
import { routeGroup, signedIn, type RouteGroup } from "../http/route-group";

export function notificationsRoutes(deps: { db: Knex }): RouteGroup {
  const { db } = deps;
  const routes = routeGroup({ mountPath: "/notifications", tag: "notifications", db });

  routes.get("/", {
    summary: "The caller's notifications, newest first, with the unread count",
    access: signedIn,
    response: NotificationList,
    handler: ({ user }) => listNotifications(db, user.id),
  });

  routes.post("/read", {
    summary: "Mark some notifications (ids) or all of them read",
    access: signedIn,
    body: MarkNotificationsReadBody,
    response: MarkNotificationsReadResult,
    async handler({ body, user }) {
      if (body.all) return { marked: await markNotificationsRead(db, user.id, "all") };
      if (!body.ids?.length) throw new HttpError(400, "INVALID_INPUT", "Give the ids to mark read, or all: true");
      return { marked: await markNotificationsRead(db, user.id, body.ids) };
    },
  });

  routes.get("/preferences", {
    summary: "Which notifications also reach the caller by e-mail",
    access: signedIn,
    response: NotificationPreferences,
    handler: ({ user }) => notificationPreferences(db, user.id),
  });

  routes.patch("/preferences", {
    summary: "Choose which notifications also reach the caller by e-mail",
    access: signedIn,
    body: NotificationPreferences,
    response: NotificationPreferences,
    handler: ({ body, user }) => saveNotificationPreferences(db, user.id, body),
  });

  return routes;
}
