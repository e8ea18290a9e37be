// Export of a model as SBML Level 3 Version 1 with the qual package Version 1 ("SBML Level 3 Package: Qualitative
// Models", Chaouiya, Keating, Berenguier et al., Journal of Integrative Bioinformatics 2015): one compartment, one
// Boolean qualitative species per node, and one transition per node that is not a plain input.
import { compileDefinition, tableToExpr, type Expr, type ModelDefinition } from "../../engine/rules";
import { exprToMathMl } from "./mathml";

export interface WriteSbmlOptions {
  /** Model id (made into a valid SBML SId); "model" when omitted. */
  readonly modelId?: string;
  /** Human-readable model name. */
  readonly modelName?: string;
}

const escapeAttr = (s: string) =>
  s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

function toSId(raw: string): string {
  const s = raw.replace(/[^A-Za-z0-9_]/g, "_");
  return /^[A-Za-z_]/.test(s) ? s : `m_${s}`;
}

/** Sign of each regulator's effect, read from the table: does raising the input only raise (or only lower) the output? */
function inputSign(table: Uint8Array, j: number): "positive" | "negative" | "dual" | null {
  let up = false;
  let down = false;
  for (let row = 0; row < table.length; row++) {
    if ((row >> j) & 1) continue;
    const a = table[row]!;
    const b = table[row | (1 << j)]!;
    if (b > a) up = true;
    if (b < a) down = true;
  }
  if (up && down) return "dual";
  if (up) return "positive";
  if (down) return "negative";
  return null;
}

export function writeSbmlQual(model: ModelDefinition, options: WriteSbmlOptions = {}): string {
  const net = compileDefinition(model);
  // Model, compartment and transition ids share one id space with the species, so pick ones no species uses.
  const usedIds = new Set(net.names);
  const freshId = (base: string) => {
    let id = base;
    for (let k = 2; usedIds.has(id); k++) id = `${base}_${k}`;
    usedIds.add(id);
    return id;
  };
  const modelId = freshId(toSId(options.modelId ?? "model"));
  const compartment = freshId("cell");
  const out: string[] = [
    `<?xml version="1.0" encoding="UTF-8"?>`,
    `<sbml xmlns="http://www.sbml.org/sbml/level3/version1/core" level="3" version="1" xmlns:qual="http://www.sbml.org/sbml/level3/version1/qual/version1" qual:required="true">`,
    `  <model id="${modelId}"${options.modelName ? ` name="${escapeAttr(options.modelName)}"` : ""}>`,
    `    <listOfCompartments>`,
    `      <compartment id="${compartment}" constant="true"/>`,
    `    </listOfCompartments>`,
    `    <qual:listOfQualitativeSpecies>`,
  ];
  for (const name of net.names) {
    out.push(
      `      <qual:qualitativeSpecies qual:id="${name}" qual:compartment="${compartment}" qual:constant="false" qual:maxLevel="1"/>`,
    );
  }
  out.push(`    </qual:listOfQualitativeSpecies>`);
  const transitions: string[] = [];
  model.nodes.forEach((node, i) => {
    if (node.rule.kind === "var" && node.rule.name === node.name) return; // an input: no transition keeps the value
    const regs = Array.from(net.regulators[i]!, (r) => net.names[r]!);
    const table = net.tables[i]!;
    const expr: Expr = node.rule.kind === "threshold" ? tableToExpr(table, regs) : node.rule;
    transitions.push(`      <qual:transition qual:id="${freshId(`tr_${node.name}`)}">`);
    if (regs.length > 0) {
      transitions.push(`        <qual:listOfInputs>`);
      regs.forEach((r, j) => {
        const sign = inputSign(table, j);
        transitions.push(
          `          <qual:input qual:qualitativeSpecies="${r}" qual:transitionEffect="none"${sign ? ` qual:sign="${sign}"` : ""}/>`,
        );
      });
      transitions.push(`        </qual:listOfInputs>`);
    }
    transitions.push(
      `        <qual:listOfOutputs>`,
      `          <qual:output qual:qualitativeSpecies="${node.name}" qual:transitionEffect="assignmentLevel"/>`,
      `        </qual:listOfOutputs>`,
      `        <qual:listOfFunctionTerms>`,
    );
    if (expr.kind === "const") {
      transitions.push(`          <qual:defaultTerm qual:resultLevel="${expr.value}"/>`);
    } else {
      transitions.push(
        `          <qual:defaultTerm qual:resultLevel="0"/>`,
        `          <qual:functionTerm qual:resultLevel="1">`,
        `            <math xmlns="http://www.w3.org/1998/Math/MathML">`,
        exprToMathMl(expr, "              "),
        `            </math>`,
        `          </qual:functionTerm>`,
      );
    }
    transitions.push(`        </qual:listOfFunctionTerms>`, `      </qual:transition>`);
  });
  if (transitions.length > 0) out.push(`    <qual:listOfTransitions>`, ...transitions, `    </qual:listOfTransitions>`);
  out.push(`  </model>`, `</sbml>`, ``);
  return out.join("\n");
}
