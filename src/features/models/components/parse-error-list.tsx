// Parse errors as a list a person can act on: where (line, column) and why.
import type { ParseIssue } from "@shared/schemas/models";

export function ParseErrorList({
  errors,
  title = "The model could not be read",
}: {
  errors: readonly ParseIssue[];
  title?: string;
}) {
  if (errors.length === 0) return null;
  return (
    <div
      role="alert"
      data-testid="parse-errors"
      className="rounded-md border border-red-200 bg-red-50 p-3 text-sm text-red-800"
    >
      <p className="font-medium">{title}</p>
      <ul className="mt-1 space-y-0.5">
        {errors.map((e, i) => (
          <li key={i} data-testid="parse-error" data-line={e.line} data-column={e.column}>
            {e.line > 0 && (
              <span className="font-mono">
                line {e.line}, column {e.column}:{" "}
              </span>
            )}
            {e.message}
          </li>
        ))}
      </ul>
    </div>
  );
}

/** Parse issues carried by an API error (400 PARSE_ERROR), or none. */
export function issuesOf(error: unknown): ParseIssue[] {
  const e = error as { code?: string; details?: unknown } | null;
  if (e?.code !== "PARSE_ERROR" || !Array.isArray(e.details)) return [];
  return e.details.filter(
    (d): d is ParseIssue =>
      typeof d?.line === "number" && typeof d?.column === "number" && typeof d?.message === "string",
  );
}
