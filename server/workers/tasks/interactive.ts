// The interactive pool's one task: runs the named operation of interactive-ops.ts and answers its value, or the
// HttpError it threw as data (a class does not survive structured cloning).
import "../yield-to-requests";
import { HttpError } from "../../http/errors";
import { interactiveOps, type InteractiveAnswer, type InteractiveCall } from "../interactive-ops";

export default function interactive({ op, args }: InteractiveCall): InteractiveAnswer {
  try {
    const fn = interactiveOps[op] as (...a: unknown[]) => unknown;
    return { ok: true, value: fn(...args) };
  } catch (e) {
    if (e instanceof HttpError)
      return { ok: false, error: { status: e.status, code: e.code, message: e.message, details: e.details } };
    throw e;
  }
}
