// Tells people what happened to the work they care about: always in the app, and by e-mail when the person chose
// that kind in their settings. Called after the change is committed, so a mail failure never undoes the change.
import type { Knex } from "knex";
import type { Logger } from "pino";
import { can } from "@shared/types/roles";
import type { NotificationPreferences } from "@shared/schemas/runs";
import { insertNotification, notificationPreferences } from "../../db/repositories/notifications";
import { listMembers } from "../../db/repositories/memberships";
import { findUserById } from "../../db/repositories/users";
import type { Mailer } from "../../mail/mailer";

export interface NotifyPeopleDeps {
  db: Knex;
  log: Logger;
  mailer: Pick<Mailer, "send"> | null;
  publicUrl: string;
}

/** The three kinds people choose e-mail for, and the preference each reads. */
export const NOTIFICATION_KINDS = {
  "reduction.decided": "emailOnDecision",
  "review.waiting": "emailOnReviewWaiting",
  "comment.mention": "emailOnMention",
} as const satisfies Record<string, keyof NotificationPreferences>;
export type NotificationKind = keyof typeof NOTIFICATION_KINDS;

export interface Message {
  kind: NotificationKind;
  title: string;
  body: string;
  link: string;
}

export async function notifyPeople(deps: NotifyPeopleDeps, userIds: Iterable<string>, m: Message): Promise<void> {
  for (const userId of new Set(userIds)) {
    await insertNotification(deps.db, { userId, kind: m.kind, title: m.title, body: m.body, link: m.link });
    const prefs = await notificationPreferences(deps.db, userId);
    if (!deps.mailer || !prefs[NOTIFICATION_KINDS[m.kind]]) continue;
    const user = await findUserById(deps.db, userId);
    if (!user) continue;
    try {
      await deps.mailer.send({
        to: user.email,
        subject: `Emulant: ${m.title}`,
        text: `Hello ${user.displayName},\n\n${m.body}\n\nOpen it: ${deps.publicUrl}${m.link}\n\nChoose which notifications come by e-mail on your profile page: ${deps.publicUrl}/profile\n`,
      });
    } catch (err) {
      deps.log.warn({ err: { message: (err as Error).message }, kind: m.kind }, "notification e-mail failed");
    }
  }
}

/** Members who may decide reductions (reviewers and owners), except the person who caused the notification. */
export async function reviewersOf(db: Knex, projectId: string, except: string | null): Promise<string[]> {
  const members = await listMembers(db, projectId);
  return members.filter((m) => m.userId !== except && can(m.role, "member", "review:decide")).map((m) => m.userId);
}

/**
 * Members named in a comment as "@Display Name" (case-insensitive; the longest matching name wins, so "@Ada Byron"
 * names Ada Byron, not Ada). The author is never notified of their own mention.
 */
export async function mentionedMembers(db: Knex, projectId: string, text: string, authorId: string): Promise<string[]> {
  return mentionsIn(text, await listMembers(db, projectId)).filter((id) => id !== authorId);
}

export function mentionsIn(text: string, members: { userId: string; displayName: string }[]): string[] {
  const byLength = [...members].sort((a, b) => b.displayName.length - a.displayName.length);
  const lower = text.toLowerCase();
  const found = new Set<string>();
  for (let at = lower.indexOf("@"); at >= 0; at = lower.indexOf("@", at + 1)) {
    const rest = lower.slice(at + 1);
    const m = byLength.find((p) => {
      const name = p.displayName.toLowerCase();
      return rest.startsWith(name) && !/[\p{L}\p{N}]/u.test(rest.charAt(name.length));
    });
    if (m) found.add(m.userId);
  }
  return [...found];
}

/** Short words for what a reduction is about, for notification texts. */
export function reductionWords(r: {
  source: { modelName: string };
  target: { modelName: string } | null;
  targetNames: string[];
}): string {
  const onto = r.target ? `"${r.target.modelName}"` : `a network of ${r.targetNames.join(", ")}`;
  return `the reduction of "${r.source.modelName}" onto ${onto}`;
}

/** Reviewers hear that new reductions wait for them (after a search, an upload or a proposal). */
export async function notifyReviewWaiting(
  deps: NotifyPeopleDeps,
  projectId: string,
  causedBy: string | null,
  count: number,
  what: string,
): Promise<void> {
  if (count === 0) return;
  const reviewers = await reviewersOf(deps.db, projectId, causedBy);
  await notifyPeople(deps, reviewers, {
    kind: "review.waiting",
    title: count === 1 ? "A reduction waits for your review" : `${count} reductions wait for your review`,
    body: `${what} The review queue lists ${count === 1 ? "it" : "them"}.`,
    link: `/projects/${projectId}/reductions`,
  });
}
