// One entry point for reading a model file whatever its format, chosen by the file name's extension:
// .sbml/.xml SBML-qual, .rules/.txt Emulant rule text, .csv truth tables. Used by CLI commands and uploads.
// Files arrive as bytes: decodeModelText reads them as UTF-8 (RFC 3629; well-formed sequences as in The Unicode
// Standard, table 3-7) and says where the first byte that is not UTF-8 is, instead of replacing it silently.
import { EngineError, ParseError } from "../engine/errors";
import type { BooleanNetwork } from "../engine/network";
import { compileDefinition, networkToDefinition, readRuleText, showInput, type ModelDefinition } from "../engine/rules";
import { readSbmlQual } from "./sbml-qual";
import { readTruthTableCsv } from "./truth-table-csv";

export type ModelFormat = "sbml" | "rules" | "csv";

export interface ReadModelResult {
  readonly format: ModelFormat;
  readonly definition: ModelDefinition;
  /** The compiled network of the definition (for CSV input: the same dynamics, regulators that never matter dropped). */
  readonly network: BooleanNetwork;
  /** Model name given inside the file (SBML-qual only). */
  readonly modelName: string | null;
  readonly warnings: string[];
}

/** The format a file name asks for, or null when the extension is not one Emulant reads. */
export function modelFormatOf(fileName: string): ModelFormat | null {
  const lower = fileName.toLowerCase();
  if (lower.endsWith(".sbml") || lower.endsWith(".xml")) return "sbml";
  if (lower.endsWith(".rules") || lower.endsWith(".txt")) return "rules";
  if (lower.endsWith(".csv")) return "csv";
  return null;
}

/** Read a model file. Throws ParseError (with line and column) or EngineError (e.g. code SBML_ERROR). */
export function readModelText(fileName: string, text: string): ReadModelResult {
  const format = modelFormatOf(fileName);
  switch (format) {
    case "sbml": {
      const sbml = readSbmlQual(text);
      return {
        format,
        definition: sbml.definition,
        network: compileDefinition(sbml.definition),
        modelName: sbml.modelName,
        warnings: sbml.warnings,
      };
    }
    case "rules": {
      const definition = readRuleText(text);
      return { format, definition, network: compileDefinition(definition), modelName: null, warnings: [] };
    }
    case "csv": {
      const definition = networkToDefinition(readTruthTableCsv(text));
      return { format, definition, network: compileDefinition(definition), modelName: null, warnings: [] };
    }
    default:
      throw new EngineError(
        "UNSUPPORTED_FORMAT",
        `${showInput(fileName, 120)}: use .sbml or .xml (SBML-qual), .rules or .txt (rule text), or .csv (truth tables)`,
      );
  }
}

/** Offset of the first byte that does not belong to a well-formed UTF-8 sequence, or -1. */
function firstInvalidUtf8(bytes: Uint8Array): number {
  for (let i = 0; i < bytes.length;) {
    const b = bytes[i]!;
    if (b < 0x80) {
      i++;
      continue;
    }
    // Allowed range of the second byte for each lead byte; the later continuation bytes are 80..BF.
    let length: number;
    let lo = 0x80;
    let hi = 0xbf;
    if (b >= 0xc2 && b <= 0xdf) length = 2;
    else if (b >= 0xe0 && b <= 0xef) {
      length = 3;
      if (b === 0xe0) lo = 0xa0;
      if (b === 0xed) hi = 0x9f; // no surrogates
    } else if (b >= 0xf0 && b <= 0xf4) {
      length = 4;
      if (b === 0xf0) lo = 0x90;
      if (b === 0xf4) hi = 0x8f; // nothing above U+10FFFF
    } else return i;
    for (let k = 1; k < length; k++) {
      const c = bytes[i + k];
      if (c === undefined || c < (k === 1 ? lo : 0x80) || c > (k === 1 ? hi : 0xbf)) return i;
    }
    i += length;
  }
  return -1;
}

/**
 * The text of a model file: its bytes read as UTF-8, a leading byte order mark dropped. Throws ParseError (code
 * BAD_ENCODING) at the line and column of the first byte that is not UTF-8.
 */
export function decodeModelText(bytes: Uint8Array): string {
  const bad = firstInvalidUtf8(bytes);
  if (bad >= 0) {
    const before = new TextDecoder().decode(bytes.subarray(0, bad));
    let line = 1;
    for (let i = before.indexOf("\n"); i >= 0; i = before.indexOf("\n", i + 1)) line++;
    const column = before.length - (before.lastIndexOf("\n") + 1) + 1;
    const hex = bytes[bad]!.toString(16).toUpperCase().padStart(2, "0");
    throw new ParseError(
      `the file is not UTF-8 text: byte 0x${hex} cannot start or continue a character here (save the file as UTF-8)`,
      line,
      column,
      "BAD_ENCODING",
    );
  }
  return new TextDecoder("utf-8").decode(bytes);
}
