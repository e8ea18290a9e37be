// Import of SBML Level 3 qual models, Boolean subset (Chaouiya et al., "SBML qualitative models: a model
// representation format and infrastructure to foster interactions between qualitative modelling formalisms and
// tools", BMC Systems Biology 2013; package specification "SBML Level 3 Package: Qualitative Models", Version 1).
// Only species, transitions and function terms are read; layout, notes, annotations and other packages are skipped.
import { EngineError, ParseError } from "../../engine/errors";
import { isValidNodeName, type Expr, type ModelDefinition, type NodeDefinition } from "../../engine/rules";
import { and, mathToExpr, not, or } from "./mathml";
import { childNamed, childrenNamed, parseXml, whereIs, type XmlElement } from "./xml-tree";

export interface SbmlQualModel {
  readonly definition: ModelDefinition;
  /** Model id and name from the file, when given. */
  readonly modelId: string | null;
  readonly modelName: string | null;
  /** Display name of each species that has a name attribute different from its id. */
  readonly speciesNames: Readonly<Record<string, string>>;
  /** initialLevel of each species that declares one. */
  readonly initialLevels: Readonly<Record<string, 0 | 1>>;
  /** Things read but not used (kept short, one line each). */
  readonly warnings: string[];
}

const fail = (message: string): never => {
  throw new EngineError("SBML_ERROR", message);
};

function level(raw: string | undefined, what: string): number | undefined {
  if (raw === undefined) return undefined;
  const v = Number(raw);
  if (!Number.isInteger(v) || v < 0) fail(`${what} must be a non-negative integer, found "${raw}"`);
  return v;
}

interface SpeciesInfo {
  readonly id: string;
  readonly constant: boolean;
  readonly element: XmlElement;
}

/** Read an SBML-qual document. Throws ParseError for XML syntax, EngineError (code SBML_ERROR / SBML_MATH) otherwise. */
export function readSbmlQual(text: string): SbmlQualModel {
  const root = parseXml(text);
  if (root.name !== "sbml")
    throw new ParseError(`the root element is <${root.name}>, not <sbml>`, root.line, root.column);
  if (root.attrs["level"] !== undefined && root.attrs["level"] !== "3") {
    fail(`SBML-qual needs SBML Level 3; this file is Level ${root.attrs["level"]}`);
  }
  const model = childNamed(root, "model") ?? fail("the file has no <model>");
  const warnings: string[] = [];
  const speciesList = childNamed(model, "listOfQualitativeSpecies");
  const speciesElements = speciesList ? childrenNamed(speciesList, "qualitativeSpecies") : [];
  if (speciesElements.length === 0) fail("the model has no qualitative species; is this an SBML-qual file?");

  const species: SpeciesInfo[] = [];
  const byId = new Map<string, SpeciesInfo>();
  const initialLevels: Record<string, 0 | 1> = {};
  const speciesNames: Record<string, string> = {};
  for (const el of speciesElements) {
    const id = el.attrs["id"] ?? fail(`a qualitative species has no id${whereIs(el)}`);
    if (byId.has(id)) fail(`species ${id} is declared twice${whereIs(el)}`);
    if (!isValidNodeName(id))
      fail(`species id ${id} cannot be a node name (it is a reserved word: and, or, not, xor, threshold)`);
    const maxLevel = level(el.attrs["maxLevel"], `maxLevel of species ${id}`);
    if (maxLevel !== undefined && maxLevel > 1) {
      fail(
        `species ${id} has maxLevel ${maxLevel}; Emulant reads Boolean models only (maxLevel 1), so multi-valued species must be made Boolean first${whereIs(el)}`,
      );
    }
    if (maxLevel === undefined) warnings.push(`species ${id} has no maxLevel; read as Boolean`);
    const initial = level(el.attrs["initialLevel"], `initialLevel of species ${id}`);
    if (initial !== undefined) {
      if (initial > 1) fail(`species ${id} has initialLevel ${initial}, above the Boolean maximum 1${whereIs(el)}`);
      initialLevels[id] = initial as 0 | 1;
    }
    const displayName = el.attrs["name"];
    if (displayName !== undefined && displayName !== id) speciesNames[id] = displayName;
    const info = { id, constant: el.attrs["constant"] === "true", element: el };
    species.push(info);
    byId.set(id, info);
  }

  const rules = new Map<string, { expr: Expr; transition: string }>();
  const transitionList = childNamed(model, "listOfTransitions");
  const transitions = transitionList ? childrenNamed(transitionList, "transition") : [];
  transitions.forEach((tr, index) => {
    const trId = tr.attrs["id"] ?? `#${index + 1}`;
    const where = `transition ${trId}`;
    const thresholds = new Map<string, number>();
    const inputList = childNamed(tr, "listOfInputs");
    for (const input of inputList ? childrenNamed(inputList, "input") : []) {
      const sp =
        input.attrs["qualitativeSpecies"] ?? fail(`${where}: an input has no qualitativeSpecies${whereIs(input)}`);
      if (!byId.has(sp)) fail(`${where}: input species ${sp} is not declared`);
      const theta = level(input.attrs["thresholdLevel"], `${where}: thresholdLevel of input ${sp}`);
      if (input.attrs["id"] !== undefined) thresholds.set(input.attrs["id"], theta ?? 0);
    }
    const outputList = childNamed(tr, "listOfOutputs");
    const outputs = outputList ? childrenNamed(outputList, "output") : [];
    if (outputs.length === 0) fail(`${where} has no output${whereIs(tr)}`);
    const termList = childNamed(tr, "listOfFunctionTerms") ?? fail(`${where} has no listOfFunctionTerms`);
    const resultLevel = (el: XmlElement, what: string): 0 | 1 => {
      const v =
        level(el.attrs["resultLevel"], `${where}: resultLevel of the ${what}`) ??
        fail(`${where}: the ${what} has no resultLevel`);
      if (v > 1)
        fail(
          `${where}: the ${what} has resultLevel ${v}; Emulant reads Boolean models only (levels 0 and 1)${whereIs(el)}`,
        );
      return v as 0 | 1;
    };
    const defaultTerm = childNamed(termList, "defaultTerm") ?? fail(`${where} has no defaultTerm`);
    const ctx = { where, isSpecies: (id: string) => byId.has(id), inputThreshold: (id: string) => thresholds.get(id) };
    const terms = childrenNamed(termList, "functionTerm").map((ft, i) => {
      const math = childNamed(ft, "math") ?? fail(`${where}: function term ${i + 1} has no <math>`);
      let condition: Expr;
      try {
        condition = mathToExpr(math, ctx);
      } catch (e) {
        if (e instanceof EngineError && e.code === "SBML_MATH")
          throw new EngineError("SBML_MATH", `${e.message}${whereIs(ft)}`);
        throw e;
      }
      return { level: resultLevel(ft, `function term ${i + 1}`), condition };
    });
    // The first function term whose condition holds gives the level; if none holds, the default term does.
    let expr: Expr = { kind: "const", value: resultLevel(defaultTerm, "defaultTerm") };
    for (let i = terms.length - 1; i >= 0; i--) {
      const t = terms[i]!;
      expr = t.level ? or(t.condition, expr) : and(not(t.condition), expr);
    }
    for (const out of outputs) {
      const sp =
        out.attrs["qualitativeSpecies"] ?? fail(`${where}: an output has no qualitativeSpecies${whereIs(out)}`);
      if (!byId.has(sp)) fail(`${where}: output species ${sp} is not declared`);
      const effect = out.attrs["transitionEffect"];
      if (effect !== undefined && effect !== "assignmentLevel")
        fail(`${where}: output ${sp} has transitionEffect ${effect}; only assignmentLevel is supported`);
      const earlier = rules.get(sp);
      if (earlier)
        fail(
          `species ${sp} is the output of two transitions (${earlier.transition} and ${trId}); a node needs exactly one rule${whereIs(tr)}`,
        );
      rules.set(sp, { expr, transition: trId });
    }
  });

  const nodes: NodeDefinition[] = species.map((s) => {
    const rule = rules.get(s.id);
    if (s.constant) {
      if (rule) warnings.push(`species ${s.id} is constant, so ${rule.transition} is not used`);
      return { name: s.id, rule: { kind: "var", name: s.id } };
    }
    // A species no transition sets keeps its value: it is an input of the model.
    return { name: s.id, rule: rule ? rule.expr : { kind: "var", name: s.id } };
  });
  return {
    definition: { nodes },
    modelId: model.attrs["id"] ?? null,
    modelName: model.attrs["name"] ?? null,
    speciesNames,
    initialLevels,
    warnings,
  };
}
