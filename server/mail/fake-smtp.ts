// A local SMTP server on 127.0.0.1 for development and tests: it accepts every message and stores it in
// PostgreSQL (mail_messages), where the admins' mailbox page and the tests read it. It never relays anything.
import type { Knex } from "knex";
import type { AddressInfo } from "node:net";
import type { Logger } from "pino";
import { SMTPServer } from "smtp-server";
import { insertMailMessage } from "../db/repositories/mail";
import { parseMessage } from "./parse-message";

export interface FakeSmtp {
  port: number;
  close(): Promise<void>;
}

const maxMessageBytes = 1024 * 1024;

export async function startFakeSmtp(db: Knex, log: Logger): Promise<FakeSmtp> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    size: maxMessageBytes,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("end", () => {
        if (stream.sizeExceeded) return callback(Object.assign(new Error("Message too large"), { responseCode: 552 }));
        const raw = Buffer.concat(chunks).toString("utf8");
        const parsed = parseMessage(raw);
        const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : "";
        insertMailMessage(db, {
          from,
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: parsed.subject,
          textBody: parsed.textBody,
          raw,
        })
          .then(() => callback(null))
          .catch((err: unknown) => {
            log.error({ err }, "fake SMTP could not store a message");
            callback(err as Error);
          });
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => resolve());
  });
  const { port } = server.server.address() as AddressInfo;
  log.info({ port }, "fake SMTP listening on 127.0.0.1");
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}
