// File formats at the edge of the models API: which reader an upload goes to (by file name) and how a revision is
// written for download. The readers and writers themselves live in shared/formats and shared/engine/rules.
import {
  compileDefinition,
  networkToDefinition,
  printRuleText,
  showInput,
  type ModelDefinition,
} from "@shared/engine/rules";
import { decodeModelText, modelFormatOf } from "@shared/formats/read-model";
import { readSbmlQual, writeSbmlQual } from "@shared/formats/sbml-qual";
import { parseTruthTableCsv, writeTruthTableCsv } from "@shared/formats/truth-table-csv";
import type { ExportFormat, ModelSource } from "@shared/schemas/models";
import { HttpError } from "../../http/errors";
import { compileOrFail, issueOf, parseFailure, readRules, type ReadModel } from "./model-reading";

export interface UploadedModel extends ReadModel {
  source: ModelSource;
  ruleText: string;
  suggestedName?: string;
}

export function readUpload(fileName: string, bytes: Buffer): UploadedModel {
  const source = modelFormatOf(fileName);
  if (!source)
    throw new HttpError(
      415,
      "UNSUPPORTED_FORMAT",
      `${showInput(fileName, 120)}: use .sbml or .xml (SBML-qual), .rules or .txt (rule text), or .csv (truth tables)`,
    );
  let text: string;
  try {
    text = decodeModelText(bytes);
  } catch (e) {
    const issue = issueOf(e);
    if (!issue) throw e;
    throw parseFailure([issue], fileName);
  }
  if (source === "rules") {
    const read = readRules(text);
    return { ...read, source, ruleText: text };
  }
  if (source === "sbml") {
    let sbml: ReturnType<typeof readSbmlQual>;
    try {
      sbml = readSbmlQual(text);
    } catch (e) {
      const issue = issueOf(e);
      if (!issue) throw e;
      throw parseFailure([issue], fileName);
    }
    const read = compileOrFail(sbml.definition, fileName);
    return { ...read, source, ruleText: printRuleText(sbml.definition), suggestedName: sbml.modelName ?? undefined };
  }
  const { network, errors, moreErrors } = parseTruthTableCsv(text);
  if (!network)
    throw parseFailure(
      errors.map((e) => issueOf(e)!),
      fileName,
      moreErrors,
    );
  const definition = networkToDefinition(network);
  return { definition, network: compileDefinition(definition), source, ruleText: printRuleText(definition) };
}

export interface ExportedFile {
  fileName: string;
  mediaType: string;
  body: string;
}

export function exportModel(definition: ModelDefinition, format: ExportFormat, baseName: string): ExportedFile {
  const safe = baseName.replace(/[^A-Za-z0-9_-]+/g, "-").replace(/^-+|-+$/g, "") || "model";
  switch (format) {
    case "rules":
      return { fileName: `${safe}.rules`, mediaType: "text/plain; charset=utf-8", body: printRuleText(definition) };
    case "sbml":
      return {
        fileName: `${safe}.sbml`,
        mediaType: "application/xml; charset=utf-8",
        body: writeSbmlQual(definition, { modelId: safe, modelName: baseName }),
      };
    case "csv":
      return {
        fileName: `${safe}.csv`,
        mediaType: "text/csv; charset=utf-8",
        body: writeTruthTableCsv(compileDefinition(definition)),
      };
  }
}
