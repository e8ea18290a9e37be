// Truth tables as CSV text, one table per node (layout in docs/truth-table-csv.md): a `# node: X` line, a header row
// naming the regulators and then `X'`, and one row of 0/1 values per combination of regulator values.
// Cells are comma-separated as in RFC 4180 (no quoting is needed: names are identifiers and values are 0 or 1).
import { EngineError, ParseError } from "../../engine/errors";
import { checkNetwork, type BooleanNetwork } from "../../engine/network";
import { isValidNodeName } from "../../engine/rules";

export interface TruthTableCsvResult {
  readonly network: BooleanNetwork | null;
  readonly errors: ParseError[];
}

interface Cell {
  readonly text: string;
  readonly column: number;
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

interface PendingTable {
  readonly name: string;
  readonly line: number;
  readonly column: number;
  regulators: Cell[] | null;
  headerLine: number;
  table: Uint8Array | null;
  filled: Uint8Array | null;
  rowLines: number[];
  broken: boolean;
}

const NODE_LINE = /^#\s*node\s*:\s*(.*)$/i;

/** Read truth tables, collecting every error with its line and column. */
export function parseTruthTableCsv(text: string): TruthTableCsvResult {
  const errors: ParseError[] = [];
  const tables: PendingTable[] = [];
  let current: PendingTable | null = null;
  const lines = text.split("\n");
  lines.forEach((rawLine, index) => {
    const lineNo = index + 1;
    const line = rawLine.replace(/\r$/, "");
    const trimmed = line.trim();
    if (trimmed === "") return;
    const nodeMatch = NODE_LINE.exec(trimmed);
    if (nodeMatch) {
      const name = nodeMatch[1]!.trim();
      const column = line.indexOf(name) + 1;
      current = {
        name,
        line: lineNo,
        column,
        regulators: null,
        headerLine: 0,
        table: null,
        filled: null,
        rowLines: [],
        broken: false,
      };
      tables.push(current);
      if (!isValidNodeName(name)) {
        errors.push(
          new ParseError(
            `"${name}" is not a valid node name (letters, digits and _, not starting with a digit)`,
            lineNo,
            column,
          ),
        );
        current.broken = true;
      }
      return;
    }
    if (trimmed.startsWith("#")) return;
    if (!current) {
      errors.push(new ParseError("a table must start with a line `# node: NAME`", lineNo, 1));
      return;
    }
    const t: PendingTable = current;
    if (t.broken) return;
    const cells = splitCells(line);
    if (!t.regulators) {
      const out = cells[cells.length - 1]!;
      if (out.text !== `${t.name}'`) {
        errors.push(
          new ParseError(
            `the last header cell must be ${t.name}' (the node's next value), found "${out.text}"`,
            lineNo,
            out.column,
          ),
        );
        t.broken = true;
        return;
      }
      const regs = cells.slice(0, -1);
      const seen = new Set<string>();
      for (const r of regs) {
        if (!isValidNodeName(r.text)) {
          errors.push(new ParseError(`"${r.text}" is not a valid regulator name`, lineNo, r.column));
          t.broken = true;
          return;
        }
        if (seen.has(r.text)) {
          errors.push(new ParseError(`regulator ${r.text} appears twice in the header`, lineNo, r.column));
          t.broken = true;
          return;
        }
        seen.add(r.text);
      }
      if (regs.length > 20) {
        errors.push(
          new ParseError(`node ${t.name} has ${regs.length} regulators; at most 20 are supported`, lineNo, 1),
        );
        t.broken = true;
        return;
      }
      t.regulators = regs;
      t.headerLine = lineNo;
      t.table = new Uint8Array(1 << regs.length);
      t.filled = new Uint8Array(1 << regs.length);
      t.rowLines = new Array<number>(1 << regs.length).fill(0);
      return;
    }
    const k = t.regulators.length;
    if (cells.length !== k + 1) {
      errors.push(
        new ParseError(`expected ${k + 1} cells (${k} regulators and ${t.name}'), found ${cells.length}`, lineNo, 1),
      );
      return;
    }
    let row = 0;
    for (let j = 0; j <= k; j++) {
      const c = cells[j]!;
      if (c.text !== "0" && c.text !== "1") {
        errors.push(new ParseError(`expected 0 or 1, found "${c.text}"`, lineNo, c.column));
        return;
      }
      if (j < k && c.text === "1") row |= 1 << j;
    }
    if (t.filled![row]) {
      errors.push(
        new ParseError(`this combination of regulator values was already given on line ${t.rowLines[row]}`, lineNo, 1),
      );
      return;
    }
    t.filled![row] = 1;
    t.rowLines[row] = lineNo;
    t.table![row] = cells[k]!.text === "1" ? 1 : 0;
  });

  const indexOf = new Map<string, number>();
  tables.forEach((t, i) => {
    const first = indexOf.get(t.name);
    if (first !== undefined)
      errors.push(
        new ParseError(`node ${t.name} has a second table (first on line ${tables[first]!.line})`, t.line, t.column),
      );
    else indexOf.set(t.name, i);
  });
  for (const t of tables) {
    if (t.broken) continue;
    if (!t.regulators) {
      errors.push(new ParseError(`the table of ${t.name} has no header row`, t.line, t.column));
      continue;
    }
    const missing = t.filled!.indexOf(0);
    if (missing >= 0) {
      const values = t.regulators.map((r, j) => `${r.text}=${(missing >> j) & 1}`).join(", ");
      errors.push(
        new ParseError(
          `the table of ${t.name} has ${t.filled!.filter((f) => !f).length} missing row(s), e.g. ${values}`,
          t.headerLine,
          1,
        ),
      );
    }
    for (const r of t.regulators) {
      if (!indexOf.has(r.text))
        errors.push(
          new ParseError(
            `regulator ${r.text} has no table; add a table for ${r.text} (e.g. ${r.text}' = ${r.text})`,
            t.headerLine,
            r.column,
          ),
        );
    }
  }
  if (errors.length === 0 && tables.length === 0)
    errors.push(new ParseError("the text has no tables; start each with `# node: NAME`", 1, 1));
  errors.sort((a, b) => a.line - b.line || a.column - b.column);
  if (errors.length > 0) return { network: null, errors };
  const network = checkNetwork({
    names: tables.map((t) => t.name),
    regulators: tables.map((t) => Int32Array.from(t.regulators!, (r) => indexOf.get(r.text)!)),
    tables: tables.map((t) => t.table!),
  });
  return { network, errors };
}

/** Read truth tables or throw the first ParseError (its message counts the others). */
export function readTruthTableCsv(text: string): BooleanNetwork {
  const { network, errors } = parseTruthTableCsv(text);
  if (network) return network;
  const first = errors[0]!;
  const more = errors.length - 1;
  if (more === 0) throw first;
  throw new ParseError(`${first.reason} (and ${more} more error${more === 1 ? "" : "s"})`, first.line, first.column);
}

/** Write one table per node; rows count up in binary with the first regulator column as the most significant digit. */
export function writeTruthTableCsv(net: BooleanNetwork): string {
  for (const name of net.names) {
    if (!isValidNodeName(name))
      throw new EngineError("BAD_NAME", `node name "${name}" cannot be written to truth-table CSV`);
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
