// Outgoing mail through nodemailer over SMTP. With SMTP_URL set it talks to that server; otherwise it talks to the
// local fake (fake-smtp.ts), which is started on the first message so that building the app opens no socket.
import type { Knex } from "knex";
import nodemailer from "nodemailer";
import type { Logger } from "pino";
import { startFakeSmtp, type FakeSmtp } from "./fake-smtp";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export interface Mailer {
  /** True when mail is caught by the local fake, so the admins' mailbox page has something to show. */
  readonly usesFake: boolean;
  send(mail: OutgoingMail): Promise<void>;
  close(): Promise<void>;
}

const sender = "Emulant <no-reply@emulant.test>";

export function createSmtpMailer(smtpUrl: string): Mailer {
  const transport = nodemailer.createTransport(smtpUrl);
  return {
    usesFake: false,
    async send(mail) {
      await transport.sendMail({ from: sender, ...mail });
    },
    async close() {
      transport.close();
    },
  };
}

export interface FakeMailer extends Mailer {
  start(): Promise<FakeSmtp>;
}

export function createFakeMailer(db: Knex, log: Logger): FakeMailer {
  let starting: Promise<{ fake: FakeSmtp; transport: ReturnType<typeof nodemailer.createTransport> }> | null = null;
  const start = () => {
    starting ??= startFakeSmtp(db, log).then((fake) => ({
      fake,
      transport: nodemailer.createTransport({ host: "127.0.0.1", port: fake.port, secure: false, ignoreTLS: true }),
    }));
    return starting;
  };
  return {
    usesFake: true,
    start: async () => (await start()).fake,
    async send(mail) {
      const { transport } = await start();
      await transport.sendMail({ from: sender, ...mail });
    },
    async close() {
      if (!starting) return;
      const { fake, transport } = await starting;
      starting = null;
      transport.close();
      await fake.close();
    },
  };
}

/** SMTP_URL chooses the real server; without it the fake catches everything (development and tests). */
export function createMailer(
  config: { SMTP_URL?: string },
  db: Knex,
  log: Logger,
): Mailer & { start?: () => Promise<FakeSmtp> } {
  return config.SMTP_URL ? createSmtpMailer(config.SMTP_URL) : createFakeMailer(db, log);
}
