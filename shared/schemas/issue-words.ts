// Validation failures in words about the form field, not the schema: zod's default messages ("Too small: expected
// array to have >=1 items") become sentences ("choose at least 1"), and a field path ("body.maxTargetNodes") becomes
// the field's name as a person reads it ("Max target nodes"). Messages a schema wrote itself are kept as they are.
import type { z } from "zod";

const DEFAULT_MESSAGE = /^(Too small|Too big|Invalid|Unrecognized|Expected)/;

/** "body.certificate.target.nodes.0" -> "Certificate target nodes, item 1". */
export function fieldLabel(field: string): string {
  const parts = field.split(".").filter((p, i) => !(i === 0 && (p === "body" || p === "query" || p === "params")));
  const words = parts
    .map((p) => (/^\d+$/.test(p) ? `item ${Number(p) + 1}` : p.replace(/([a-z0-9])([A-Z])/g, "$1 $2").toLowerCase()))
    .join(" ")
    .replace(/ item/g, ", item");
  return words ? words.charAt(0).toUpperCase() + words.slice(1) : "The request";
}

function sizeWords(origin: string | undefined, n: number | bigint): string {
  const count = Number(n);
  if (origin === "array" || origin === "set") return count === 1 ? "1 entry" : `${count} entries`;
  if (origin === "string") return count === 1 ? "1 character" : `${count} characters`;
  return String(count);
}

export function issueSentence(issue: z.core.$ZodIssue): string {
  if (!DEFAULT_MESSAGE.test(issue.message)) return issue.message;
  switch (issue.code) {
    case "too_small":
      if (issue.origin === "array" && Number(issue.minimum) === 1) return "choose at least one";
      if (issue.origin === "string" && Number(issue.minimum) === 1) return "fill this in";
      return `must be at least ${sizeWords(issue.origin, issue.minimum as number)}`;
    case "too_big":
      return issue.origin === "array" || issue.origin === "string"
        ? `must be at most ${sizeWords(issue.origin, issue.maximum as number)}`
        : `must be at most ${Number(issue.maximum)}`;
    case "invalid_type":
      return /received undefined/.test(issue.message) ? "is required" : `must be ${article(issue.expected)}`;
    case "invalid_format":
      return issue.format === "uuid" ? "must be the id of an existing item" : `must be a valid ${issue.format}`;
    case "invalid_value":
      return `must be one of ${issue.values.map((v) => `"${String(v)}"`).join(", ")}`;
    case "unrecognized_keys":
      return `has fields this form does not know: ${issue.keys.join(", ")}`;
    default:
      return "is not valid here";
  }
}

function article(expected: string): string {
  if (expected === "int") return "a whole number";
  if (expected === "array") return "a list";
  if (expected === "object") return "a set of fields";
  return /^[aeiou]/.test(expected) ? `an ${expected}` : `a ${expected}`;
}
