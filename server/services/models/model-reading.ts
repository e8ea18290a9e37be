// Turns what a user sends (rule text, an uploaded file, generator parameters) into a checked ModelDefinition, or an
// HttpError 400 PARSE_ERROR whose details list every problem with its line and column, before anything is stored.
import { EngineError, ParseError } from "@shared/engine/errors";
import { compileDefinition, parseRuleText, variablesOf, type ModelDefinition } from "@shared/engine/rules";
import type { BooleanNetwork } from "@shared/engine/network";
import type { ParseIssue, ValidateResult } from "@shared/schemas/models";
import { HttpError } from "../../http/errors";

export interface ReadModel {
  definition: ModelDefinition;
  network: BooleanNetwork;
}

function issueOf(e: unknown): ParseIssue | null {
  if (e instanceof ParseError) return { line: e.line, column: e.column, message: e.reason };
  if (e instanceof EngineError) {
    // Importers name the line in the message (" (line 12)") when they know it; line 0 means "the whole file".
    const at = / \(line (\d+)\)/.exec(e.message);
    return { line: at ? Number(at[1]) : 0, column: at ? 1 : 0, message: e.message.replace(/ \(line \d+\)/, "") };
  }
  return null;
}

/** Truth-table rows a model may have in all: compiling holds a byte per row, so this bounds what one request may ask. */
const MAX_TABLE_ROWS = 2 ** 26;

/** Refuses, before any table is built, a model whose nodes together read too many regulators (20 each is 2^20 rows). */
function checkTableRows(
  definition: ModelDefinition,
  lineOf: (name: string) => number | undefined = () => undefined,
): void {
  let rows = 0;
  for (const node of definition.nodes) {
    // Counted like compileDefinition's regulators; other problems are left for it to report in its own order.
    const reads = new Set(variablesOf(node.rule));
    if (node.rule.kind === "threshold" && node.rule.tie === "keep") reads.add(node.name);
    rows += 2 ** Math.min(20, reads.size);
    if (rows > MAX_TABLE_ROWS) {
      const line = lineOf(node.name);
      throw new EngineError(
        "TOO_LARGE",
        `up to node ${node.name} the truth tables already have more than 2^26 rows in all; let fewer nodes read many regulators${line ? ` (line ${line})` : ""}`,
      );
    }
  }
}

/** `issues` are the first problems (readers keep at most MAX_REPORTED_ERRORS); `moreIssues` counts the rest. */
export function parseFailure(issues: ParseIssue[], what = "The model", moreIssues = 0): HttpError {
  const first = issues[0]!;
  const more = issues.length - 1 + moreIssues;
  const others = more > 0 ? ` and ${more} more problem${more === 1 ? "" : "s"}` : "";
  return new HttpError(
    400,
    "PARSE_ERROR",
    `${what} could not be read: ${first.message} (line ${first.line}, column ${first.column})${others}`,
    issues,
  );
}

/**
 * The first problems of a rule text (syntax, duplicates, undefined nodes, then compile checks) in line order, at
 * most MAX_REPORTED_ERRORS of them, and how many more there were.
 */
export function ruleTextIssues(text: string): {
  issues: ParseIssue[];
  moreIssues: number;
  nodes: string[];
  read: ReadModel | null;
} {
  const result = parseRuleText(text);
  const nodes = result.rules.map((r) => r.name);
  if (!result.definition)
    return { issues: result.errors.map((e) => issueOf(e)!), moreIssues: result.moreErrors, nodes, read: null };
  try {
    const lines = new Map(result.rules.map((r) => [r.name, r.line] as const));
    checkTableRows(result.definition, (name) => lines.get(name));
    return {
      issues: [],
      moreIssues: 0,
      nodes,
      read: { definition: result.definition, network: compileDefinition(result.definition) },
    };
  } catch (e) {
    const issue = issueOf(e);
    if (!issue) throw e;
    return { issues: [issue], moreIssues: 0, nodes, read: null };
  }
}

/** The editor's live check: the nodes read so far and every problem, without storing anything. */
export function validateRuleText(text: string): ValidateResult {
  const { issues, nodes, read } = ruleTextIssues(text);
  return {
    ok: issues.length === 0,
    nodeCount: read ? read.network.names.length : nodes.length,
    nodes: read ? [...read.network.names] : nodes,
    errors: issues,
  };
}

export function readRules(text: string): ReadModel {
  const { issues, moreIssues, read } = ruleTextIssues(text);
  if (!read) throw parseFailure(issues, "The rule text", moreIssues);
  return read;
}

/** Compile a definition produced by an importer or generator; its problems are reported like parse errors. */
export function compileOrFail(definition: ModelDefinition, what: string): ReadModel {
  try {
    checkTableRows(definition);
    return { definition, network: compileDefinition(definition) };
  } catch (e) {
    const issue = issueOf(e);
    if (!issue) throw e;
    throw parseFailure([issue], what);
  }
}

export { issueOf };
