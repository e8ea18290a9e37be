export { MAX_CSV_CHARS, parseTruthTableCsv, readTruthTableCsv, writeTruthTableCsv } from "./truth-table-csv";
export type { TruthTableCsvResult } from "./truth-table-csv";
