// The expectation table as CSV (our own layout, documented in docs/expectations-csv.md): a header row naming the
// columns, then one expectation per row. The reader collects every error with its line and column (at most the
// first MAX_CSV_ERRORS) and keeps going, so a table can be fixed in one pass; the writer's output reads back equal.
import { ParseError } from "../errors";
import { formatAssignment, parseAssignment, parseNodeList, type TextIssue } from "./assignment";
import { csvCell, readCsvRecords, type CsvCell } from "./csv-records";
import {
  OUTCOME_KINDS,
  type Assignment,
  type CountComparison,
  type Expectation,
  type ExpectedOutcome,
  type OutcomeKind,
  type UpdateKind,
} from "./expectation";

export const MAX_CSV_ERRORS = 100;

export const CSV_COLUMNS = [
  "id",
  "update",
  "knock_out",
  "over_express",
  "inputs",
  "outcome",
  "pattern",
  "from",
  "count",
  "source",
  "note",
] as const;

type Column = (typeof CSV_COLUMNS)[number];

const REQUIRED_COLUMNS: readonly Column[] = ["id", "outcome", "source"];
const ID_PATTERN = /^[A-Za-z0-9][A-Za-z0-9_.-]{0,63}$/;
const COUNT_PATTERN = /^(>=|<=|=)?\s*(\d{1,6})$/;

export interface ExpectationsCsvResult {
  /** The rows that read without error, in file order. */
  readonly expectations: Expectation[];
  /** At most MAX_CSV_ERRORS, in file order. */
  readonly errors: ParseError[];
  /** True when more errors were found than are listed. */
  readonly truncated: boolean;
}

function normalizeHeader(text: string): string {
  return text
    .trim()
    .toLowerCase()
    .replace(/[\s-]+/g, "_");
}

const NEEDS_PATTERN: readonly OutcomeKind[] = ["some-attractor", "every-attractor", "no-attractor", "reachable"];
const NEEDS_COUNT: readonly OutcomeKind[] = ["fixed-point-count", "attractor-count"];

/** Read an expectation table, collecting errors. */
export function parseExpectationsCsv(text: string): ExpectationsCsvResult {
  const { records, errors: recordErrors } = readCsvRecords(text);
  const errors: ParseError[] = [...recordErrors];
  const expectations: Expectation[] = [];
  const header = records[0];
  if (!header) {
    errors.push(
      new ParseError(`the table is empty; the first row must name the columns (${CSV_COLUMNS.join(",")})`, 1, 1),
    );
    return finish(expectations, errors);
  }
  const columns: (Column | null)[] = [];
  let headerBroken = false;
  for (const cell of header.cells) {
    const name = normalizeHeader(cell.text) as Column;
    if (!CSV_COLUMNS.includes(name)) {
      errors.push(
        new ParseError(
          `unknown column "${cell.text}"; the columns are ${CSV_COLUMNS.join(", ")}`,
          cell.line,
          cell.column,
        ),
      );
      columns.push(null);
    } else if (columns.includes(name)) {
      errors.push(new ParseError(`column ${name} is named twice`, cell.line, cell.column));
      columns.push(null);
    } else columns.push(name);
  }
  for (const required of REQUIRED_COLUMNS)
    if (!columns.includes(required)) {
      errors.push(new ParseError(`the header has no ${required} column`, header.line, 1));
      headerBroken = true;
    }
  if (headerBroken) return finish(expectations, errors);

  const firstLineOfId = new Map<string, number>();
  for (const record of records.slice(1)) {
    if (errors.length > MAX_CSV_ERRORS) break;
    if (record.cells.length !== columns.length) {
      errors.push(
        new ParseError(
          `expected ${columns.length} cells as in the header, found ${record.cells.length}`,
          record.line,
          record.cells.length > columns.length ? record.cells[columns.length]!.column : 1,
        ),
      );
      continue;
    }
    const cells = new Map<Column, CsvCell>();
    columns.forEach((c, q) => c && cells.set(c, record.cells[q]!));
    const rowErrors: ParseError[] = [];
    const expectation = readRow(record.line, cells, rowErrors);
    errors.push(...rowErrors);
    if (expectation) {
      const seen = firstLineOfId.get(expectation.id);
      if (seen !== undefined) {
        const cell = cells.get("id")!;
        errors.push(new ParseError(`id ${expectation.id} was already used on line ${seen}`, cell.line, cell.column));
        continue;
      }
      firstLineOfId.set(expectation.id, record.line);
      expectations.push(expectation);
    }
  }
  return finish(expectations, errors);
}

function finish(expectations: Expectation[], errors: ParseError[]): ExpectationsCsvResult {
  errors.sort((a, b) => a.line - b.line || a.column - b.column);
  return { expectations, errors: errors.slice(0, MAX_CSV_ERRORS), truncated: errors.length > MAX_CSV_ERRORS };
}

function issueError(cell: CsvCell, issue: TextIssue): ParseError {
  // Inside a cell that spans lines the offset no longer maps to a column of the first line: point at the cell.
  const column = cell.text.includes("\n") ? cell.column : cell.column + (cell.quoted ? 1 : 0) + issue.offset;
  return new ParseError(issue.message, cell.line, column);
}

function readRow(line: number, cells: Map<Column, CsvCell>, errors: ParseError[]): Expectation | null {
  const at = (c: Column) => cells.get(c);
  const textOf = (c: Column) => at(c)?.text ?? "";
  const fail = (c: Column, message: string) => {
    const cell = at(c);
    errors.push(new ParseError(message, cell?.line ?? line, cell?.column ?? 1));
  };
  const before = errors.length;

  const id = textOf("id");
  if (id === "") fail("id", "the id is missing");
  else if (!ID_PATTERN.test(id))
    fail("id", `id "${id}" must be 1 to 64 letters, digits, "_", "-" or ".", starting with a letter or digit`);

  let update: UpdateKind = "synchronous";
  const updateText = textOf("update").toLowerCase();
  if (updateText === "asynchronous" || updateText === "async") update = "asynchronous";
  else if (updateText !== "" && updateText !== "synchronous" && updateText !== "sync")
    fail("update", `update must be synchronous or asynchronous (empty means synchronous), found "${textOf("update")}"`);

  const list = (c: Column): string[] => {
    const cell = at(c);
    if (!cell) return [];
    const { nodes, issues } = parseNodeList(cell.text);
    for (const issue of issues) errors.push(issueError(cell, issue));
    return nodes;
  };
  const assignment = (c: Column): Assignment => {
    const cell = at(c);
    if (!cell) return {};
    const { assignment: value, issues } = parseAssignment(cell.text);
    for (const issue of issues) errors.push(issueError(cell, issue));
    return value;
  };
  const knockOut = list("knock_out");
  const overExpress = list("over_express");
  const inputs = assignment("inputs");
  for (const name of knockOut)
    if (overExpress.includes(name)) fail("over_express", `${name} is both knocked out and over-expressed`);
  for (const name of Object.keys(inputs))
    if (knockOut.includes(name) || overExpress.includes(name))
      fail("inputs", `${name} is held as an input and also knocked out or over-expressed`);

  const kindText = textOf("outcome").toLowerCase();
  let outcome: ExpectedOutcome | null = null;
  if (!(OUTCOME_KINDS as readonly string[]).includes(kindText)) {
    fail(
      "outcome",
      kindText === ""
        ? `the outcome is missing; write one of ${OUTCOME_KINDS.join(", ")}`
        : `unknown outcome "${textOf("outcome")}"; write one of ${OUTCOME_KINDS.join(", ")}`,
    );
  } else {
    const kind = kindText as OutcomeKind;
    const unused = (c: Column, users: string) => {
      if (textOf(c) !== "") fail(c, `${c} is only used by ${users}; leave it empty for ${kind}`);
    };
    if (NEEDS_PATTERN.includes(kind)) {
      unused("count", NEEDS_COUNT.join(" and "));
      if (kind !== "reachable") unused("from", "reachable");
      const pattern = assignment("pattern");
      if (textOf("pattern") === "") fail("pattern", `${kind} needs a pattern such as A=1; B=0`);
      if (kind === "reachable") {
        if (textOf("from") === "")
          fail(
            at("from") ? "from" : "outcome",
            "reachable needs a start state in from, such as A=1; B=1 (others are 0)",
          );
        const from = assignment("from");
        outcome = { kind, from, pattern };
      } else outcome = { kind, pattern } as ExpectedOutcome;
    } else {
      unused("pattern", NEEDS_PATTERN.join(", "));
      unused("from", "reachable");
      const countText = textOf("count");
      const match = COUNT_PATTERN.exec(countText);
      if (!match) {
        fail("count", `${kind} needs a count such as 2, >=2 or <=2, found "${countText}"`);
      } else {
        const comparison: CountComparison = match[1] === ">=" ? "at-least" : match[1] === "<=" ? "at-most" : "exactly";
        outcome = { kind, comparison, count: Number(match[2]) } as ExpectedOutcome;
      }
    }
  }

  const source = textOf("source").trim();
  if (source === "") fail("source", "the source is missing: cite a publication or a lab notebook entry");

  if (errors.length > before || !outcome) return null;
  return {
    id,
    update,
    condition: { knockOut, overExpress, inputs },
    outcome,
    source: textOf("source"),
    note: textOf("note"),
  };
}

/** Read an expectation table or throw its first error. */
export function readExpectationsCsv(text: string): Expectation[] {
  const result = parseExpectationsCsv(text);
  if (result.errors.length > 0) throw result.errors[0]!;
  return result.expectations;
}

function countText(outcome: ExpectedOutcome): string {
  if (outcome.kind !== "fixed-point-count" && outcome.kind !== "attractor-count") return "";
  const prefix = outcome.comparison === "at-least" ? ">=" : outcome.comparison === "at-most" ? "<=" : "";
  return `${prefix}${outcome.count}`;
}

/** Write an expectation table with every column; reading it back gives the same expectations. */
export function writeExpectationsCsv(expectations: readonly Expectation[]): string {
  const lines = ["# Emulant expectations: one observation per row (docs/expectations-csv.md)", CSV_COLUMNS.join(",")];
  for (const e of expectations) {
    const o = e.outcome;
    const row: Record<Column, string> = {
      id: e.id,
      update: e.update,
      knock_out: e.condition.knockOut.join(" "),
      over_express: e.condition.overExpress.join(" "),
      inputs: formatAssignment(e.condition.inputs),
      outcome: o.kind,
      pattern: "pattern" in o ? formatAssignment(o.pattern) : "",
      from: o.kind === "reachable" ? formatAssignment(o.from) : "",
      count: countText(o),
      source: e.source,
      note: e.note,
    };
    lines.push(CSV_COLUMNS.map((c) => csvCell(row[c])).join(","));
  }
  return lines.join("\n") + "\n";
}
