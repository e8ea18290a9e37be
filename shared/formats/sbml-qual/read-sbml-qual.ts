// Import of SBML Level 3 qual models, Boolean subset (Chaouiya et al., "SBML qualitative models: a model
// representation format and infrastructure to foster interactions between qualitative modelling formalisms and
// tools", BMC Systems Biology 2013; package specification "SBML Level 3 Package: Qualitative Models", Version 1).
// Only species, transitions and function terms are read; layout, notes, annotations and other packages are skipped,
// but an unknown element inside the qual lists is refused: a misspelt <functionTerm> must not silently drop a rule.
import { ParseError } from "../../engine/errors";
import {
  MAX_NAME_CHARS,
  MAX_NESTING_DEPTH,
  MAX_NODES,
  MAX_REGULATORS,
  PROTOTYPE_KEY,
  firstTooDeep,
  isValidNodeName,
  showInput,
  variablesOf,
  type Expr,
  type ModelDefinition,
  type NodeDefinition,
} from "../../engine/rules";
import { allOf, anyOf, mathToExpr, not } from "./mathml";
import { attr, childNamed, childrenNamed, parseXml, type XmlElement } from "./xml-tree";

export interface SbmlQualModel {
  readonly definition: ModelDefinition;
  /** Model id and name from the file, when given. */
  readonly modelId: string | null;
  readonly modelName: string | null;
  /** Display name of each species that has a name attribute different from its id (a null-prototype object). */
  readonly speciesNames: Readonly<Record<string, string>>;
  /** initialLevel of each species that declares one (a null-prototype object). */
  readonly initialLevels: Readonly<Record<string, 0 | 1>>;
  /** Things read but not used (kept short, one line each). */
  readonly warnings: string[];
}

/** An error about the element `at`, reported at its start tag. */
const failAt = (at: XmlElement, message: string): never => {
  throw new ParseError(message, at.line, at.column, "SBML_ERROR");
};

function level(at: XmlElement, name: string, what: string): number | undefined {
  const raw = attr(at, name);
  if (raw === undefined) return undefined;
  const v = Number(raw);
  if (raw.trim() === "" || !Number.isSafeInteger(v) || v < 0)
    failAt(at, `${what} must be a non-negative integer, found "${showInput(raw)}"`);
  return v;
}

/** Elements SBML lets any element carry, which Emulant skips. */
const SKIPPED = new Set(["notes", "annotation"]);

/** Refuses a child of `list` that is neither one of `allowed` nor notes or an annotation. */
function checkChildren(list: XmlElement, allowed: readonly string[]): void {
  for (const c of list.children) {
    if (allowed.includes(c.name) || SKIPPED.has(c.name)) continue;
    failAt(
      c,
      `unknown element <${showInput(c.name)}> in <${list.name}>; expected ${allowed.map((a) => `<${a}>`).join(" or ")}`,
    );
  }
}

interface SpeciesInfo {
  readonly id: string;
  readonly constant: boolean;
  readonly element: XmlElement;
}

function checkSpeciesId(id: string, el: XmlElement): void {
  if (id.length > MAX_NAME_CHARS)
    failAt(el, `a species id has ${id.length} characters; a node name may have at most ${MAX_NAME_CHARS}`);
  if (id === PROTOTYPE_KEY) failAt(el, `species id ${PROTOTYPE_KEY} cannot be a node name`);
  if (!isValidNodeName(id))
    failAt(
      el,
      `species id "${showInput(id)}" cannot be a node name (letters, digits and _, not starting with a digit, not and, or, not, xor, threshold)`,
    );
}

/** Read an SBML-qual document. Throws ParseError: code PARSE_ERROR for XML, SBML_ERROR or SBML_MATH for the model. */
export function readSbmlQual(text: string): SbmlQualModel {
  const root = parseXml(text);
  if (root.name !== "sbml")
    throw new ParseError(`the root element is <${showInput(root.name)}>, not <sbml>`, root.line, root.column);
  const sbmlLevel = attr(root, "level");
  if (sbmlLevel !== undefined && sbmlLevel !== "3") {
    failAt(root, `SBML-qual needs SBML Level 3; this file is Level ${showInput(sbmlLevel)}`);
  }
  const model = childNamed(root, "model") ?? failAt(root, "the file has no <model>");
  const warnings: string[] = [];
  const speciesList = childNamed(model, "listOfQualitativeSpecies");
  if (speciesList) checkChildren(speciesList, ["qualitativeSpecies"]);
  const speciesElements = speciesList ? childrenNamed(speciesList, "qualitativeSpecies") : [];
  if (speciesElements.length === 0)
    failAt(speciesList ?? model, "the model has no qualitative species; is this an SBML-qual file?");
  if (speciesElements.length > MAX_NODES)
    throw new ParseError(
      `the model has ${speciesElements.length} species; a model may have at most ${MAX_NODES} nodes`,
      speciesElements[MAX_NODES]!.line,
      speciesElements[MAX_NODES]!.column,
      "TOO_LARGE",
    );

  const species: SpeciesInfo[] = [];
  const byId = new Map<string, SpeciesInfo>();
  const initialLevels = Object.create(null) as Record<string, 0 | 1>;
  const speciesNames = Object.create(null) as Record<string, string>;
  for (const el of speciesElements) {
    const id = attr(el, "id") ?? failAt(el, `a qualitative species has no id`);
    checkSpeciesId(id, el);
    if (byId.has(id)) failAt(el, `species ${id} is declared twice (first at line ${byId.get(id)!.element.line})`);
    const maxLevel = level(el, "maxLevel", `maxLevel of species ${id}`);
    if (maxLevel !== undefined && maxLevel > 1) {
      failAt(
        el,
        `species ${id} has maxLevel ${maxLevel}; Emulant reads Boolean models only (maxLevel 1), so multi-valued species must be made Boolean first`,
      );
    }
    if (maxLevel === undefined) warnings.push(`species ${id} has no maxLevel; read as Boolean`);
    const initial = level(el, "initialLevel", `initialLevel of species ${id}`);
    if (initial !== undefined) {
      if (initial > 1) failAt(el, `species ${id} has initialLevel ${initial}, above the Boolean maximum 1`);
      initialLevels[id] = initial as 0 | 1;
    }
    const displayName = attr(el, "name");
    if (displayName !== undefined && displayName !== id) speciesNames[id] = displayName;
    const info = { id, constant: attr(el, "constant") === "true", element: el };
    species.push(info);
    byId.set(id, info);
  }

  const rules = new Map<string, { expr: Expr; transition: string }>();
  const transitionList = childNamed(model, "listOfTransitions");
  if (transitionList) checkChildren(transitionList, ["transition"]);
  const transitions = transitionList ? childrenNamed(transitionList, "transition") : [];
  transitions.forEach((tr, index) => {
    const trId = attr(tr, "id") ?? `#${index + 1}`;
    const where = `transition ${showInput(trId)}`;
    checkChildren(tr, ["listOfInputs", "listOfOutputs", "listOfFunctionTerms"]);
    const thresholds = new Map<string, number>();
    const inputList = childNamed(tr, "listOfInputs");
    if (inputList) checkChildren(inputList, ["input"]);
    for (const input of inputList ? childrenNamed(inputList, "input") : []) {
      const sp = attr(input, "qualitativeSpecies") ?? failAt(input, `${where}: an input has no qualitativeSpecies`);
      if (!byId.has(sp)) failAt(input, `${where}: input species ${showInput(sp)} is not declared`);
      const theta = level(input, "thresholdLevel", `${where}: thresholdLevel of input ${sp}`);
      const inputId = attr(input, "id");
      if (inputId !== undefined) thresholds.set(inputId, theta ?? 0);
    }
    const outputList = childNamed(tr, "listOfOutputs");
    if (outputList) checkChildren(outputList, ["output"]);
    const outputs = outputList ? childrenNamed(outputList, "output") : [];
    if (outputs.length === 0) failAt(tr, `${where} has no output`);
    const termList = childNamed(tr, "listOfFunctionTerms") ?? failAt(tr, `${where} has no listOfFunctionTerms`);
    checkChildren(termList, ["defaultTerm", "functionTerm"]);
    const resultLevel = (el: XmlElement, what: string): 0 | 1 => {
      const v =
        level(el, "resultLevel", `${where}: resultLevel of the ${what}`) ??
        failAt(el, `${where}: the ${what} has no resultLevel`);
      if (v > 1)
        failAt(el, `${where}: the ${what} has resultLevel ${v}; Emulant reads Boolean models only (levels 0 and 1)`);
      return v as 0 | 1;
    };
    const defaultTerm = childNamed(termList, "defaultTerm") ?? failAt(termList, `${where} has no defaultTerm`);
    const ctx = { where, isSpecies: (id: string) => byId.has(id), inputThreshold: (id: string) => thresholds.get(id) };
    const terms = childrenNamed(termList, "functionTerm").map((ft, i) => {
      const math = childNamed(ft, "math") ?? failAt(ft, `${where}: function term ${i + 1} has no <math>`);
      return { level: resultLevel(ft, `function term ${i + 1}`), condition: mathToExpr(math, ctx) };
    });
    const expr = firstMatchingTerm(terms, resultLevel(defaultTerm, "defaultTerm"));
    const deep = firstTooDeep(expr, MAX_NESTING_DEPTH);
    if (deep)
      throw new ParseError(
        `${where}: its function terms nest more than ${MAX_NESTING_DEPTH} levels deep`,
        tr.line,
        tr.column,
        "TOO_DEEP",
      );
    const reads = variablesOf(expr).length;
    if (reads > MAX_REGULATORS)
      throw new ParseError(
        `${where} reads ${reads} species; a node may read at most ${MAX_REGULATORS}`,
        tr.line,
        tr.column,
        "TOO_LARGE",
      );
    for (const out of outputs) {
      const sp = attr(out, "qualitativeSpecies") ?? failAt(out, `${where}: an output has no qualitativeSpecies`);
      if (!byId.has(sp)) failAt(out, `${where}: output species ${showInput(sp)} is not declared`);
      const effect = attr(out, "transitionEffect");
      if (effect !== undefined && effect !== "assignmentLevel")
        failAt(
          out,
          `${where}: output ${sp} has transitionEffect ${showInput(effect)}; only assignmentLevel is supported`,
        );
      const earlier = rules.get(sp);
      if (earlier)
        failAt(
          tr,
          `species ${sp} is the output of two transitions (${earlier.transition} and ${showInput(trId)}); a node needs exactly one rule`,
        );
      rules.set(sp, { expr, transition: showInput(trId) });
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
    modelId: attr(model, "id") ?? null,
    modelName: attr(model, "name") ?? null,
    speciesNames,
    initialLevels,
    warnings,
  };
}

/**
 * The rule of a transition: the first function term whose condition holds gives the level, the default term's
 * level when none holds. A run of terms with the same level is one flat or (level 1) or and of negations (level 0),
 * so the rule is only as deep as the number of changes of level between consecutive terms.
 */
function firstMatchingTerm(terms: readonly { level: 0 | 1; condition: Expr }[], defaultLevel: 0 | 1): Expr {
  let expr: Expr = { kind: "const", value: defaultLevel };
  for (let end = terms.length; end > 0;) {
    const runLevel = terms[end - 1]!.level;
    let start = end - 1;
    while (start > 0 && terms[start - 1]!.level === runLevel) start--;
    const run = terms.slice(start, end).map((t) => (runLevel ? t.condition : not(t.condition)));
    expr = runLevel ? anyOf([...run, expr]) : allOf([...run, expr]);
    end = start;
  }
  return expr;
}
