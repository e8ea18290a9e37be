// Every server call goes through here: JSON in, { data } out, parsed with the shared zod schema;
// failures become ApiError carrying the server's stable code (shared/schemas/api-error.ts) so the UI can switch on it.
import type { z } from "zod";
import { ApiErrorBody, type ApiErrorCode } from "@shared/schemas/api-error";
import { fieldLabel } from "@shared/schemas/issue-words";

/** Failures found on this side: no answer at all, an answer not in the shared shape, or an unreadable error. */
export type ClientErrorCode = "NETWORK" | "BAD_RESPONSE" | `HTTP_${number}`;

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: ApiErrorCode | ClientErrorCode,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = "ApiError";
  }
}

/** A 400 names fields by their path ("body.observe"); people read the field's name and a sentence instead. */
function readableMessage(code: string, message: string, details: unknown): string {
  if (code !== "INVALID_INPUT" || !Array.isArray(details) || details.length === 0) return message;
  const issues = details.filter(
    (d): d is { field: string; message: string } => typeof d?.field === "string" && typeof d?.message === "string",
  );
  if (issues.length === 0) return message;
  return issues.map((d) => `${fieldLabel(d.field)}: ${d.message}.`).join(" ");
}

interface RequestOptions {
  method?: string;
  body?: unknown;
  formData?: FormData;
  signal?: AbortSignal;
}

export async function apiRequest<S extends z.ZodType>(
  path: string,
  schema: S,
  opts: RequestOptions = {},
): Promise<z.infer<S>> {
  const headers: Record<string, string> = { Accept: "application/json" };
  let body: BodyInit | undefined;
  if (opts.formData) body = opts.formData;
  else if (opts.body !== undefined) {
    headers["Content-Type"] = "application/json";
    body = JSON.stringify(opts.body);
  }
  let res: Response;
  try {
    res = await fetch(`/api${path}`, {
      method: opts.method ?? "GET",
      headers,
      body,
      credentials: "same-origin",
      signal: opts.signal,
    });
  } catch (err) {
    if ((err as Error).name === "AbortError") throw err;
    throw new ApiError(0, "NETWORK", "The server could not be reached. Check your connection and try again.");
  }
  const json: unknown = res.status === 204 ? {} : await res.json().catch(() => null);
  if (!res.ok) {
    const parsed = ApiErrorBody.safeParse(json);
    if (parsed.success)
      throw new ApiError(
        res.status,
        parsed.data.error.code,
        readableMessage(parsed.data.error.code, parsed.data.error.message, parsed.data.error.details),
        parsed.data.error.details,
      );
    throw new ApiError(res.status, `HTTP_${res.status}`, `The server answered ${res.status}`);
  }
  const data = (json as { data?: unknown } | null)?.data;
  const parsed = schema.safeParse(data);
  if (!parsed.success)
    throw new ApiError(
      res.status,
      "BAD_RESPONSE",
      `Unexpected response from ${path}: ${parsed.error.issues[0]?.message}`,
    );
  return parsed.data;
}
