// Just enough RFC 5322/2045 reading to show a caught message: unfolded headers, encoded-word subjects and a
// single-part text body in quoted-printable or base64. Multipart messages keep their raw body; our own mail is
// single-part text, and the fake exists to show that mail.

export interface ParsedMessage {
  subject: string;
  textBody: string;
}

function decodeQuotedPrintable(text: string): Buffer {
  const softBreaksRemoved = text.replace(/=\r?\n/g, "");
  const bytes: number[] = [];
  for (let i = 0; i < softBreaksRemoved.length; i++) {
    const ch = softBreaksRemoved[i]!;
    const hex = softBreaksRemoved.slice(i + 1, i + 3);
    if (ch === "=" && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(ch, "utf8"));
    }
  }
  return Buffer.from(bytes);
}

/** RFC 2047 encoded words, e.g. =?UTF-8?Q?Caf=C3=A9?= or =?UTF-8?B?Q2Fmw6k=?=. */
function decodeEncodedWords(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, "?==?")
    .replace(/=\?([^?]+)\?([QqBb])\?([^?]*)\?=/g, (_m, _charset: string, kind: string, data: string) =>
      kind.toUpperCase() === "B"
        ? Buffer.from(data, "base64").toString("utf8")
        : decodeQuotedPrintable(data.replace(/_/g, " ")).toString("utf8"),
    );
}

export function parseMessage(raw: string): ParsedMessage {
  const split = raw.search(/\r?\n\r?\n/);
  const headerText = split < 0 ? raw : raw.slice(0, split);
  const body = split < 0 ? "" : raw.slice(split).replace(/^\r?\n\r?\n/, "");
  const headers = new Map<string, string>();
  for (const line of headerText.replace(/\r?\n[ \t]+/g, " ").split(/\r?\n/)) {
    const colon = line.indexOf(":");
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim());
  }
  const encoding = (headers.get("content-transfer-encoding") ?? "").toLowerCase();
  const isMultipart = (headers.get("content-type") ?? "").toLowerCase().startsWith("multipart/");
  let textBody = body;
  if (!isMultipart && encoding === "quoted-printable") textBody = decodeQuotedPrintable(body).toString("utf8");
  else if (!isMultipart && encoding === "base64")
    textBody = Buffer.from(body.replace(/\s+/g, ""), "base64").toString("utf8");
  return {
    subject: decodeEncodedWords(headers.get("subject") ?? ""),
    textBody: textBody.replace(/\r\n/g, "\n").trimEnd(),
  };
}
