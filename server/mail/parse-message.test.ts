import fc from "fast-check";
import MailComposer from "nodemailer/lib/mail-composer";
import { describe, expect, it } from "vitest";
import { parseMessage } from "./parse-message";

/** Builds the raw message exactly as nodemailer hands it to SMTP. */
async function compose(subject: string, text: string, textEncoding?: "quoted-printable" | "base64"): Promise<string> {
  const buffer = await new MailComposer({ from: "a@example.org", to: "b@example.org", subject, text, textEncoding })
    .compile()
    .build();
  return buffer.toString("utf8");
}

// Printable ASCII plus accents, CJK and an emoji (a surrogate pair); no control characters.
const printable = [...Array.from({ length: 95 }, (_, i) => String.fromCharCode(32 + i)), "é", "ß", "漢", "😀"];
const unit = fc.constantFrom(...printable);
const subjectArb = fc.string({ unit, maxLength: 120 }).map((s) => s.trim().replace(/\s+/g, " "));
const bodyArb = fc.array(fc.string({ unit, maxLength: 200 }), { maxLength: 6 }).map((lines) =>
  lines
    .map((l) => l.trimEnd())
    .join("\n")
    .trimEnd(),
);

describe("parseMessage", () => {
  it("parseMessage(nodemailer output) gives back the subject and text body nodemailer encoded", async () => {
    await fc.assert(
      fc.asyncProperty(
        subjectArb,
        bodyArb,
        fc.constantFrom(undefined, "quoted-printable" as const, "base64" as const),
        async (subject, text, encoding) => {
          const parsed = parseMessage(await compose(subject, text, encoding));
          expect(parsed.subject).toBe(subject);
          expect(parsed.textBody).toBe(text);
        },
      ),
      { seed: 20261202, numRuns: 200 },
    );
  });

  it("parseMessage keeps a long invitation link whole across quoted-printable soft line breaks", async () => {
    const link = "https://emulant.example/invitations/" + "Ab3_-".repeat(12);
    const parsed = parseMessage(await compose("Invitation", `Accept here:\n\n${link}\n`, "quoted-printable"));
    expect(parsed.textBody).toBe(`Accept here:\n\n${link}`);
  });

  it("parseMessage leaves a multipart body as it came", () => {
    const raw =
      "Subject: Hi\r\nContent-Type: multipart/alternative; boundary=x\r\nContent-Transfer-Encoding: 7bit\r\n\r\n--x\r\nContent-Type: text/plain\r\n\r\nplain\r\n--x--";
    expect(parseMessage(raw)).toEqual({ subject: "Hi", textBody: "--x\nContent-Type: text/plain\n\nplain\n--x--" });
  });
});
