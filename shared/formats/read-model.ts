// One entry point for reading a model file whatever its format, chosen by the file name's extension:
// .sbml/.xml SBML-qual, .rules/.txt Emulant rule text, .csv truth tables. Used by CLI commands and uploads.
import { EngineError } from "../engine/errors";
import type { BooleanNetwork } from "../engine/network";
import { compileDefinition, networkToDefinition, readRuleText, type ModelDefinition } from "../engine/rules";
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
        `${fileName}: use .sbml or .xml (SBML-qual), .rules or .txt (rule text), or .csv (truth tables)`,
      );
  }
}
