export { parseTruthTableCsv, readTruthTableCsv, writeTruthTableCsv } from "./truth-table-csv";
export type { TruthTableCsvResult } from "./truth-table-csv";
