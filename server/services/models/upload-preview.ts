// What an upload would store, shown before anything is stored: the name, nodes, inputs, the first rules, warnings,
// and the project's models with identical content (same file bytes, or the same rule text in their latest
// revision), so the person can open the existing model or add a revision instead of making a duplicate.
import type { Knex } from "knex";
import type { UploadPreview } from "@shared/schemas/models";
import { readUpload } from "./model-formats";
import { networkSummary } from "./network-summary";

const FIRST_RULES = 6;

export async function previewUpload(
  db: Knex,
  projectId: string,
  upload: { originalName: string; bytes: Buffer },
): Promise<UploadPreview> {
  const fileName = upload.originalName.normalize("NFC").slice(-255);
  const { suggestedName, ...read } = readUpload(fileName, upload.bytes);
  const summary = networkSummary(read.definition, read.network);
  const rules = read.ruleText
    .split("\n")
    .map((l) => l.trim())
    .filter((l) => l && !l.startsWith("#"));
  const warnings: string[] = [];
  if (summary.inputs.length)
    warnings.push(
      `${summary.inputs.length === 1 ? "1 node has" : `${summary.inputs.length} nodes have`} no rule of their own and ${summary.inputs.length === 1 ? "is" : "are"} kept as an input (${summary.inputs.join(", ")}).`,
    );
  if (summary.edgeCount === 0) warnings.push("No node reads another: the model has no regulations.");
  const duplicates = (await db("models as m")
    .join("model_revisions as r", function () {
      this.on("r.model_id", "m.id").andOn("r.revision", "m.latest_revision");
    })
    .leftJoin("model_files as f", "f.revision_id", "r.id")
    .where("m.project_id", projectId)
    .andWhere((q) => q.where("r.rule_text", read.ruleText).orWhere("f.bytes", upload.bytes))
    .distinct("m.id", "m.name", "r.revision")
    .orderBy("m.name")) as { id: string; name: string; revision: number }[];
  return {
    fileName,
    suggestedName: (suggestedName ?? fileName.replace(/\.[^.]+$/, "").trim()) || "Imported model",
    source: read.source,
    nodeCount: summary.nodes.length,
    nodes: summary.nodes,
    inputs: summary.inputs,
    firstRules: rules.slice(0, FIRST_RULES),
    moreRules: Math.max(0, rules.length - FIRST_RULES),
    ruleText: read.ruleText,
    warnings,
    duplicates: duplicates.map((d) => ({ modelId: d.id, name: d.name, revision: d.revision })),
  };
}
