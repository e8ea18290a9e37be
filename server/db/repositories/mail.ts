// Messages caught by the local SMTP fake.
import type { Knex } from "knex";

export interface MailMessage {
  id: string;
  from: string;
  to: string[];
  subject: string;
  textBody: string;
  receivedAt: string;
}

interface MailRow {
  id: string;
  mail_from: string;
  mail_to: string[];
  subject: string;
  text_body: string;
  received_at: Date;
}

export async function insertMailMessage(
  db: Knex,
  m: { from: string; to: string[]; subject: string; textBody: string; raw: string },
): Promise<void> {
  await db("mail_messages").insert({
    mail_from: m.from,
    mail_to: m.to,
    subject: m.subject,
    text_body: m.textBody,
    raw: m.raw,
  });
}

/** Newest first; `to` narrows the list to one recipient (case-insensitive). */
export async function listMailMessages(db: Knex, opts: { limit: number; to?: string }): Promise<MailMessage[]> {
  const q = db<MailRow>("mail_messages")
    .select("id", "mail_from", "mail_to", "subject", "text_body", "received_at")
    .orderBy("received_at", "desc")
    .limit(opts.limit);
  if (opts.to) q.whereRaw("? = any(mail_to)", [opts.to.toLowerCase()]);
  const rows = await q;
  return rows.map((r) => ({
    id: r.id,
    from: r.mail_from,
    to: r.mail_to,
    subject: r.subject,
    textBody: r.text_body,
    receivedAt: r.received_at.toISOString(),
  }));
}
