// Truth tables as CSV text, one table per node (layout in docs/truth-table-csv.md): a `# node: X` line, a header row
// naming the regulators and then `X'`, and one row of 0/1 values per combination of regulator values.
// Cells are comma-separated as in RFC 4180 (no quoting is needed: names are identifiers and values are 0 or 1).
// Reading is one pass over the lines (each is a node line, a comment, a header or a row) and then the checks that
// need every table; the limits are checked before anything is allocated for a table.
import { EngineError, ParseError } from "../../engine/errors";
import { checkNetwork, type BooleanNetwork } from "../../engine/network";
import {
  ErrorList,
  MAX_NAME_CHARS,
  MAX_NODES,
  MAX_REGULATORS,
  PROTOTYPE_KEY,
  RESERVED_WORDS,
  firstErrorCounting,
  isValidNodeName,
  showInput,
} from "../../engine/rules";

/** Characters a truth-table CSV text may have (16 MiB: one table of 18 regulators takes about 10 MB). */
export const MAX_CSV_CHARS = 16 * 1024 * 1024;

export interface TruthTableCsvResult {
  readonly network: BooleanNetwork | null;
  /** The first errors in line order, at most MAX_REPORTED_ERRORS of them. */
  readonly errors: ParseError[];
  /** How many more errors were found than `errors` lists (after a limit error: found before it). */
  readonly moreErrors: number;
}

interface Cell {
  readonly text: string;
  readonly column: number;
}

/** Why `name` cannot name a node, or null when it can (the rule-text rules; see isValidNodeName). */
function nameProblem(name: string): string | null {
  if (isValidNodeName(name)) return null;
  if (name.length > MAX_NAME_CHARS)
    return `a name of ${name.length} characters ("${showInput(name)}"); a node name may have at most ${MAX_NAME_CHARS}`;
  if (name === PROTOTYPE_KEY) return `"${PROTOTYPE_KEY}" cannot name a node (JavaScript objects treat it specially)`;
  if (RESERVED_WORDS.has(name.toLowerCase())) return `"${name}" is a reserved word and cannot name a node`;
  return `"${showInput(name)}" is not a valid node name (letters, digits and _, not starting with a digit)`;
}

/** Number of comma-separated cells of a line, counted without building them. */
function cellCount(line: string): number {
  let count = 1;
  for (let i = line.indexOf(","); i >= 0; i = line.indexOf(",", i + 1)) count++;
  return count;
}

function splitCells(line: string): Cell[] {
  const cells: Cell[] = [];
  let start = 0;
  for (;;) {
    const comma = line.indexOf(",", start);
    const end = comma < 0 ? line.length : comma;
    const raw = line.slice(start, end);
    const lead = raw.length - raw.trimStart().length;
    cells.push({ text: raw.trim(), column: start + lead + 1 });
    if (comma < 0) return cells;
    start = comma + 1;
  }
}

interface Table {
  readonly name: string;
  readonly line: number;
  readonly column: number;
  regulators: Cell[] | null;
  headerLine: number;
  /** Next value per row, whether the row was given, and on which line (allocated with the header). */
  table: Uint8Array | null;
  filled: Uint8Array | null;
  rowLines: Int32Array | null;
  /** A fault in the node line or header: its rows are skipped, their errors would only repeat it. */
  broken: boolean;
  /** A faulty row: the rows it leaves missing are not reported again. */
  hasRowErrors: boolean;
}

const NODE_LINE = /^#\s*node\s*:(.*)$/i;

/** The reading state over the lines of one text. */
class TableReader {
  readonly tables: Table[] = [];
  private current: Table | null = null;
  /** The previous line was outside any table: a run of such lines is one error. */
  private inOrphanRun = false;
  /** Characters the rows of the tables read so far need at the least (checked against the text's length). */
  private rowCharsNeeded = 0;

  constructor(
    private readonly errors: ErrorList,
    private readonly textLength: number,
  ) {}

  /** Reads one line (without its line end); false when reading must stop at a limit. */
  readLine(line: string, lineNo: number): boolean {
    const trimmed = line.trim();
    if (trimmed === "") return true;
    const nodeMatch = NODE_LINE.exec(trimmed);
    if (nodeMatch) return this.startTable(nodeMatch[1]!.trim(), line, lineNo);
    if (trimmed.startsWith("#")) return true;
    const t = this.current;
    if (!t) {
      if (!this.inOrphanRun) this.errors.add(lineNo, 1, "a table must start with a line `# node: NAME`");
      this.inOrphanRun = true;
      return true;
    }
    if (t.broken) return true;
    if (!t.regulators) this.readHeader(t, line, lineNo);
    else this.readRow(t, line, lineNo);
    return true;
  }

  private startTable(name: string, line: string, lineNo: number): boolean {
    this.inOrphanRun = false;
    const column = line.indexOf(name, line.indexOf(":") + 1) + 1;
    if (this.tables.length === MAX_NODES) {
      this.errors.add(
        lineNo,
        column,
        `the file has more than ${MAX_NODES} tables, the most nodes a model may have; reading stops here`,
        "TOO_LARGE",
      );
      return false;
    }
    const t: Table = {
      name,
      line: lineNo,
      column,
      regulators: null,
      headerLine: 0,
      table: null,
      filled: null,
      rowLines: null,
      broken: false,
      hasRowErrors: false,
    };
    this.current = t;
    this.tables.push(t);
    const problem = nameProblem(name);
    if (problem) {
      this.errors.add(lineNo, column, problem);
      t.broken = true;
    }
    return true;
  }

  private readHeader(t: Table, line: string, lineNo: number): void {
    t.broken = true; // until the header is complete
    const count = cellCount(line);
    if (count - 1 > MAX_REGULATORS) {
      this.errors.add(
        lineNo,
        1,
        `node ${t.name} has ${count - 1} regulators; at most ${MAX_REGULATORS} are supported`,
        "TOO_LARGE",
      );
      return;
    }
    const cells = splitCells(line);
    const out = cells[cells.length - 1]!;
    if (out.text !== `${t.name}'`) {
      this.errors.add(
        lineNo,
        out.column,
        () => `the last header cell must be ${t.name}' (the node's next value), found "${showInput(out.text)}"`,
      );
      return;
    }
    const regs = cells.slice(0, -1);
    const seen = new Set<string>();
    for (const r of regs) {
      const problem = nameProblem(r.text);
      if (problem) {
        this.errors.add(lineNo, r.column, problem);
        return;
      }
      if (seen.has(r.text)) {
        this.errors.add(lineNo, r.column, `regulator ${r.text} appears twice in the header`);
        return;
      }
      seen.add(r.text);
    }
    // Every row is at least k + 1 one-character cells with their commas, and a line end; rows of different tables
    // are different lines. A table the rest of the text cannot hold is refused before its arrays are allocated.
    const k = regs.length;
    const rows = 2 ** k;
    const needed = this.rowCharsNeeded + rows * (2 * k + 2) - 1;
    if (needed > this.textLength) {
      this.errors.add(
        lineNo,
        1,
        `the table of ${t.name} needs ${rows} rows; with the tables before it the file would need at least ${needed} characters, but it has ${this.textLength}`,
      );
      return;
    }
    this.rowCharsNeeded = needed + 1;
    t.regulators = regs;
    t.headerLine = lineNo;
    t.table = new Uint8Array(rows);
    t.filled = new Uint8Array(rows);
    t.rowLines = new Int32Array(rows);
    t.broken = false;
  }

  private readRow(t: Table, line: string, lineNo: number): void {
    const k = t.regulators!.length;
    const count = cellCount(line);
    if (count !== k + 1) {
      t.hasRowErrors = true;
      this.errors.add(lineNo, 1, `expected ${k + 1} cells (${k} regulators and ${t.name}'), found ${count}`);
      return;
    }
    const cells = splitCells(line);
    let row = 0;
    for (let j = 0; j <= k; j++) {
      const c = cells[j]!;
      if (c.text !== "0" && c.text !== "1") {
        t.hasRowErrors = true;
        this.errors.add(lineNo, c.column, () => `expected 0 or 1, found "${showInput(c.text)}"`);
        return;
      }
      if (j < k && c.text === "1") row |= 1 << j;
    }
    if (t.filled![row]) {
      t.hasRowErrors = true;
      this.errors.add(lineNo, 1, `this combination of regulator values was already given on line ${t.rowLines![row]}`);
      return;
    }
    t.filled![row] = 1;
    t.rowLines![row] = lineNo;
    t.table![row] = cells[k]!.text === "1" ? 1 : 0;
  }
}

/** Calls `read` on every line (line end and a leading byte order mark removed) until it answers false. */
function forEachLine(text: string, read: (line: string, lineNo: number) => boolean): void {
  let start = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  for (let lineNo = 1; start <= text.length; lineNo++) {
    const newline = text.indexOf("\n", start);
    const end = newline < 0 ? text.length : newline;
    const line = text.slice(start, end > start && text[end - 1] === "\r" ? end - 1 : end);
    if (!read(line, lineNo)) return;
    start = end + 1;
  }
}

/** The checks that need all tables: one table per node, every header and row present, every regulator a node. */
function checkTables(tables: readonly Table[], errors: ErrorList): Map<string, number> {
  const indexOf = new Map<string, number>();
  tables.forEach((t, i) => {
    const first = indexOf.get(t.name);
    if (first !== undefined)
      errors.add(t.line, t.column, () => `node ${t.name} has a second table (first on line ${tables[first]!.line})`);
    else indexOf.set(t.name, i);
  });
  for (const t of tables) {
    if (t.broken) continue;
    if (!t.regulators) {
      errors.add(t.line, t.column, `the table of ${t.name} has no header row`);
      continue;
    }
    const missing = t.hasRowErrors ? -1 : t.filled!.indexOf(0);
    if (missing >= 0 && t.regulators.length === 0)
      errors.add(t.headerLine, 1, `the table of ${t.name} has no row; write its constant next value, 0 or 1`);
    else if (missing >= 0) {
      let count = 0;
      for (const f of t.filled!) if (!f) count++;
      const values = t.regulators.map((r, j) => `${r.text}=${(missing >> j) & 1}`).join(", ");
      errors.add(t.headerLine, 1, `the table of ${t.name} has ${count} missing row(s), e.g. ${values}`);
    }
    for (const r of t.regulators) {
      if (!indexOf.has(r.text))
        errors.add(
          t.headerLine,
          r.column,
          `regulator ${r.text} has no table; add a table for ${r.text} (e.g. ${r.text}' = ${r.text})`,
        );
    }
  }
  return indexOf;
}

function buildNetwork(tables: readonly Table[], indexOf: ReadonlyMap<string, number>): BooleanNetwork {
  return checkNetwork({
    names: tables.map((t) => t.name),
    regulators: tables.map((t) => Int32Array.from(t.regulators!, (r) => indexOf.get(r.text)!)),
    tables: tables.map((t) => t.table!),
  });
}

/** Read truth tables, collecting the first errors with their line and column and counting the rest. */
export function parseTruthTableCsv(text: string): TruthTableCsvResult {
  const errors = new ErrorList();
  const result = (network: BooleanNetwork | null): TruthTableCsvResult => ({
    network,
    errors: errors.errors,
    moreErrors: errors.moreErrors,
  });
  if (text.length > MAX_CSV_CHARS) {
    errors.add(
      1,
      1,
      `the text has ${text.length} characters; truth-table CSV may have at most ${MAX_CSV_CHARS} (16 MiB)`,
      "TOO_LARGE",
    );
    return result(null);
  }
  const reader = new TableReader(errors, text.length);
  let stopped = false;
  forEachLine(text, (line, lineNo) => {
    if (reader.readLine(line, lineNo)) return true;
    stopped = true;
    return false;
  });
  if (stopped) return result(null);
  const indexOf = checkTables(reader.tables, errors);
  if (errors.count === 0 && reader.tables.length === 0)
    errors.add(1, 1, "the text has no tables; start each with `# node: NAME`");
  if (errors.count > 0) return result(null);
  return result(buildNetwork(reader.tables, indexOf));
}

/** Read truth tables or throw the first ParseError (its message counts the others). */
export function readTruthTableCsv(text: string): BooleanNetwork {
  const { network, errors, moreErrors } = parseTruthTableCsv(text);
  if (network) return network;
  throw firstErrorCounting(errors, moreErrors);
}

/** Write one table per node; rows count up in binary with the first regulator column as the most significant digit. */
export function writeTruthTableCsv(net: BooleanNetwork): string {
  for (const name of net.names) {
    if (!isValidNodeName(name))
      throw new EngineError("BAD_NAME", `node name "${showInput(name)}" cannot be written to truth-table CSV`);
  }
  const out: string[] = [
    "# Emulant truth tables: one table per node; columns are regulators, the last is the next value",
  ];
  net.names.forEach((name, i) => {
    const regs = Array.from(net.regulators[i]!, (r) => net.names[r]!);
    const k = regs.length;
    out.push("", `# node: ${name}`, [...regs, `${name}'`].join(","));
    const table = net.tables[i]!;
    for (let m = 0; m < 1 << k; m++) {
      const cells: string[] = [];
      let row = 0;
      for (let j = 0; j < k; j++) {
        const bit = (m >> (k - 1 - j)) & 1;
        cells.push(String(bit));
        row |= bit << j;
      }
      cells.push(String(table[row]));
      out.push(cells.join(","));
    }
  });
  return out.join("\n") + "\n";
}
