// Puts a 400's per-field messages ("body.email": "...") on the matching form fields, so the person sees the
// server's reason where they typed; returns the message for anything that belongs to no field.
import { ApiError } from "../api-client";

interface FieldIssue {
  field: string;
  message: string;
}

export function serverFieldErrors<F extends string>(
  err: unknown,
  fields: readonly F[],
  setError: (field: F, e: { message: string }) => void,
): string | null {
  if (!(err instanceof ApiError)) return err instanceof Error ? err.message : "Something went wrong";
  const issues = Array.isArray(err.details) ? (err.details as FieldIssue[]) : [];
  let placed = false;
  for (const issue of issues) {
    const name = typeof issue?.field === "string" ? issue.field.replace(/^body\./, "") : "";
    if ((fields as readonly string[]).includes(name)) {
      setError(name as F, { message: issue.message });
      placed = true;
    }
  }
  return placed ? null : err.message;
}
