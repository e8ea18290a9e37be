// The errors a reader reports: the first MAX_REPORTED_ERRORS by position (line, then column) and a count of the rest.
// A text with a fault on every line must not answer with one message per line, and a ParseError (whose construction
// captures a stack trace) is only made for an error that is kept.
import { ParseError } from "../errors";
import { MAX_REPORTED_ERRORS } from "./limits";

export class ErrorList {
  private readonly kept: ParseError[] = [];
  private total = 0;

  constructor(private readonly limit = MAX_REPORTED_ERRORS) {}

  /**
   * Records an error. `reason` may be a function, called only when the error is kept. Errors at the same position
   * keep the order in which they were added.
   */
  add(line: number, column: number, reason: string | (() => string), code?: string): void {
    this.total++;
    const kept = this.kept;
    const at = upperBound(kept, line, column);
    if (at >= this.limit) return;
    kept.splice(at, 0, new ParseError(typeof reason === "string" ? reason : reason(), line, column, code));
    if (kept.length > this.limit) kept.pop();
  }

  /** The kept errors in position order. */
  get errors(): ParseError[] {
    return this.kept;
  }

  /** How many errors were added beyond the kept ones. */
  get moreErrors(): number {
    return this.total - this.kept.length;
  }

  get count(): number {
    return this.total;
  }
}

/** Index of the first kept error strictly after (line, column). */
function upperBound(kept: readonly ParseError[], line: number, column: number): number {
  let lo = 0;
  let hi = kept.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    const e = kept[mid]!;
    if (e.line < line || (e.line === line && e.column <= column)) lo = mid + 1;
    else hi = mid;
  }
  return hi;
}

/** The message of a reader's first error, counting the others ("... (and 3 more errors)"). */
export function firstErrorCounting(errors: readonly ParseError[], moreErrors: number): ParseError {
  const first = errors[0]!;
  const more = errors.length - 1 + moreErrors;
  if (more === 0) return first;
  return new ParseError(
    `${first.reason} (and ${more} more error${more === 1 ? "" : "s"})`,
    first.line,
    first.column,
    first.code,
  );
}
