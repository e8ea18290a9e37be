// In-app notifications: one row per message to one user; unread until read_at is set.
import type { Knex } from "knex";
import { NOTIFICATION_DEFAULTS, type Notification, type NotificationPreferences } from "@shared/schemas/runs";

interface NotificationRow {
  id: string;
  kind: string;
  title: string;
  body: string;
  link: string | null;
  run_id: string | null;
  created_at: Date;
  read_at: Date | null;
}

function toNotification(r: NotificationRow): Notification {
  return {
    id: r.id,
    kind: r.kind,
    title: r.title,
    body: r.body,
    link: r.link,
    runId: r.run_id,
    createdAt: r.created_at.toISOString(),
    readAt: r.read_at ? r.read_at.toISOString() : null,
  };
}

export async function insertNotification(
  db: Knex,
  n: { userId: string; kind: string; title: string; body: string; link?: string | null; runId?: string | null },
): Promise<Notification> {
  const [row] = await db("notifications")
    .insert({
      user_id: n.userId,
      kind: n.kind,
      title: n.title,
      body: n.body,
      link: n.link ?? null,
      run_id: n.runId ?? null,
    })
    .returning("*");
  return toNotification(row);
}

export async function listNotifications(
  db: Knex,
  userId: string,
  limit = 30,
): Promise<{ items: Notification[]; unreadCount: number }> {
  const rows = await db("notifications").where({ user_id: userId }).orderBy("created_at", "desc").limit(limit);
  const unread = await db("notifications")
    .where({ user_id: userId })
    .whereNull("read_at")
    .count<{ count: string }[]>("* as count")
    .first();
  return { items: rows.map(toNotification), unreadCount: Number(unread?.count ?? 0) };
}

export async function markNotificationsRead(db: Knex, userId: string, ids: string[] | "all"): Promise<number> {
  const q = db("notifications").where({ user_id: userId }).whereNull("read_at");
  if (ids !== "all") q.whereIn("id", ids);
  return q.update({ read_at: db.fn.now() });
}

export async function notificationPreferences(db: Knex, userId: string): Promise<NotificationPreferences> {
  const row = (await db("notification_preferences").where({ user_id: userId }).first()) as
    { email_on_decision: boolean; email_on_review_waiting: boolean; email_on_mention: boolean } | undefined;
  if (!row) return { ...NOTIFICATION_DEFAULTS };
  return {
    emailOnDecision: row.email_on_decision,
    emailOnReviewWaiting: row.email_on_review_waiting,
    emailOnMention: row.email_on_mention,
  };
}

export async function saveNotificationPreferences(
  db: Knex,
  userId: string,
  p: NotificationPreferences,
): Promise<NotificationPreferences> {
  await db("notification_preferences")
    .insert({
      user_id: userId,
      email_on_decision: p.emailOnDecision,
      email_on_review_waiting: p.emailOnReviewWaiting,
      email_on_mention: p.emailOnMention,
    })
    .onConflict("user_id")
    .merge({
      email_on_decision: p.emailOnDecision,
      email_on_review_waiting: p.emailOnReviewWaiting,
      email_on_mention: p.emailOnMention,
      updated_at: db.fn.now(),
    });
  return notificationPreferences(db, userId);
}
