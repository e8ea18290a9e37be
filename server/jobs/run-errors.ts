// Refusals of a run request (bad parameters, full queue, nothing to cancel). Jobs know nothing of HTTP, so they throw
// this; the API's error handler (server/http/errors.ts) answers it with its status and code.
import type { ApiErrorCode } from "@shared/schemas/api-error";

export class RunRequestError extends Error {
  constructor(
    readonly status: number,
    readonly code: ApiErrorCode,
    message: string,
  ) {
    super(message);
    this.name = "RunRequestError";
  }
}
