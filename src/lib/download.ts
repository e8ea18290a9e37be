// Downloads made in the browser: tables as CSV (RFC 4180 quoting, so a spreadsheet reads names with commas or quotes
// as one cell), results as JSON, and any blob under a file name.
export function downloadBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = fileName;
  document.body.appendChild(a);
  a.click();
  a.remove();
  // the download has started from the click; the object URL is not needed after this turn
  setTimeout(() => URL.revokeObjectURL(url), 0);
}

export type CsvCell = string | number | boolean | null | undefined;

function csvCell(value: CsvCell): string {
  const text = value === null || value === undefined ? "" : String(value);
  return /[",\r\n]/.test(text) || /^\s|\s$/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The rows as CSV text, lines ended by CRLF as RFC 4180 asks. */
export function csvText(rows: readonly (readonly CsvCell[])[]): string {
  return rows.map((row) => row.map(csvCell).join(",")).join("\r\n") + "\r\n";
}

export function downloadCsv(rows: readonly (readonly CsvCell[])[], fileName: string): void {
  downloadBlob(new Blob([csvText(rows)], { type: "text/csv;charset=utf-8" }), `${fileName}.csv`);
}

export function downloadJson(value: unknown, fileName: string): void {
  downloadBlob(new Blob([JSON.stringify(value, null, 2)], { type: "application/json" }), `${fileName}.json`);
}

/** A file name made of the words of a title: letters, digits and dashes only. */
export function fileNameOf(title: string): string {
  return (
    title
      .normalize("NFKD")
      .replace(/[^\w.-]+/g, "-")
      .replace(/^-+|-+$/g, "")
      .slice(0, 80) || "download"
  );
}
