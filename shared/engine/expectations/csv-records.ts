// RFC 4180 records with source positions: each cell keeps the line and column where it starts, so a reader can
// point at the exact cell (or a character inside it). Hand-written because the CSV packages we looked at
// (csv-parse, papaparse) report a record's line but not the column of a cell, and the engine must stay free of I/O.
// Beyond RFC 4180: a line whose first non-blank character is `#` is a comment, blank lines are skipped, a leading
// byte-order mark is dropped, and spaces around an unquoted cell are trimmed.
import { ParseError } from "../errors";

export interface CsvCell {
  readonly text: string;
  readonly line: number;
  /** 1-based column of the cell's first character (its opening quote when quoted). */
  readonly column: number;
  readonly quoted: boolean;
}

export interface CsvRecord {
  readonly line: number;
  readonly cells: CsvCell[];
}

export function readCsvRecords(input: string): { records: CsvRecord[]; errors: ParseError[] } {
  const text = input.startsWith("\uFEFF") ? input.slice(1) : input;
  const records: CsvRecord[] = [];
  const errors: ParseError[] = [];
  let i = 0;
  let line = 1;
  let lineStart = 0;
  const column = () => i - lineStart + 1;
  const newline = () => {
    if (text[i] === "\r" && text[i + 1] === "\n") i++;
    i++;
    line++;
    lineStart = i;
  };
  const atLineEnd = () => i >= text.length || text[i] === "\n" || (text[i] === "\r" && text[i + 1] === "\n");
  while (i < text.length) {
    // At the start of a record: skip blank and comment lines.
    let j = i;
    while (j < text.length && (text[j] === " " || text[j] === "\t")) j++;
    if (j >= text.length) break;
    if (text[j] === "#" || text[j] === "\n" || (text[j] === "\r" && text[j + 1] === "\n")) {
      i = j;
      while (!atLineEnd()) i++;
      if (i < text.length) newline();
      continue;
    }
    const record: CsvRecord = { line, cells: [] };
    for (;;) {
      while (text[i] === " " || text[i] === "\t") i++;
      const cellLine = line;
      const cellColumn = column();
      if (text[i] === '"') {
        i++;
        let value = "";
        let closed = false;
        while (i < text.length) {
          const c = text[i]!;
          if (c === '"') {
            if (text[i + 1] === '"') {
              value += '"';
              i += 2;
              continue;
            }
            i++;
            closed = true;
            break;
          }
          if (c === "\n" || (c === "\r" && text[i + 1] === "\n")) {
            value += "\n";
            newline();
            continue;
          }
          value += c;
          i++;
        }
        if (!closed) errors.push(new ParseError("this quoted cell is never closed", cellLine, cellColumn));
        while (text[i] === " " || text[i] === "\t") i++;
        if (!atLineEnd() && text[i] !== ",") {
          errors.push(new ParseError('after a closing quote, expected "," or the end of the line', line, column()));
          while (!atLineEnd() && text[i] !== ",") i++;
        }
        record.cells.push({ text: value, line: cellLine, column: cellColumn, quoted: true });
      } else {
        const start = i;
        while (!atLineEnd() && text[i] !== ",") i++;
        const raw = text.slice(start, i);
        const trimmed = raw.trimEnd();
        if (trimmed.includes('"'))
          errors.push(
            new ParseError(
              'a quote inside an unquoted cell; quote the whole cell and double the quote ("")',
              cellLine,
              cellColumn + trimmed.indexOf('"'),
            ),
          );
        record.cells.push({ text: trimmed, line: cellLine, column: cellColumn, quoted: false });
      }
      if (text[i] === ",") {
        i++;
        continue;
      }
      break;
    }
    records.push(record);
    if (i < text.length) newline();
  }
  return { records, errors };
}

/** One cell as CSV text: quoted when it holds a comma, quote, line break, surrounding space or a leading `#`. */
export function csvCell(value: string): string {
  if (/[",\r\n]/.test(value) || value !== value.trim() || value.startsWith("#"))
    return `"${value.replace(/"/g, '""')}"`;
  return value;
}
