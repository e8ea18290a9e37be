// Compiles a source-level model to the BooleanNetwork every analysis uses: each node's regulators are the nodes its
// rule reads (in model order) and its truth table is the rule evaluated on every regulator row.
// Threshold semantics follow Li, Long, Lu, Ouyang, Tang, "The yeast cell-cycle network is robustly designed", PNAS 2004.
import { EngineError } from "../errors";
import { checkNetwork, type BooleanNetwork } from "../network";
import { isValidNodeName, variablesOf, type Expr, type ModelDefinition, type RuleSyntax } from "./syntax";

/** Regulators of one rule as node indices in model order; a threshold rule with tie "keep" also reads its own node. */
export function ruleRegulators(rule: RuleSyntax, self: number, indexOf: ReadonlyMap<string, number>, nodeName: string): number[] {
  const used = new Set<number>();
  for (const name of variablesOf(rule)) {
    const index = indexOf.get(name);
    if (index === undefined) {
      throw new EngineError("UNDEFINED_NODE", `node ${name} is used in the rule of ${nodeName} but has no rule; add \`${name}' = ${name}\` to make it an input`);
    }
    used.add(index);
  }
  if (rule.kind === "threshold" && rule.tie === "keep") used.add(self);
  return [...used].sort((a, b) => a - b);
}

/** Evaluate a rule given the value of each node it reads (by name) and its own current value. */
export function evaluateRule(rule: RuleSyntax, value: (name: string) => number, current: number): number {
  if (rule.kind !== "threshold") return evaluateExpr(rule, value);
  let sum = 0;
  for (const t of rule.terms) sum += t.weight * value(t.node);
  if (sum > rule.offset) return 1;
  if (sum < rule.offset) return 0;
  return rule.tie === "keep" ? current : 0;
}

export function evaluateExpr(e: Expr, value: (name: string) => number): number {
  switch (e.kind) {
    case "const":
      return e.value;
    case "var":
      return value(e.name);
    case "not":
      return 1 - evaluateExpr(e.arg, value);
    case "and":
      return evaluateExpr(e.left, value) & evaluateExpr(e.right, value);
    case "or":
      return evaluateExpr(e.left, value) | evaluateExpr(e.right, value);
    case "xor":
      return evaluateExpr(e.left, value) ^ evaluateExpr(e.right, value);
  }
}

/** Check names and references of a model; throws EngineError naming the first problem. */
export function checkDefinition(model: ModelDefinition): void {
  const seen = new Set<string>();
  for (const node of model.nodes) {
    if (!isValidNodeName(node.name)) throw new EngineError("BAD_NAME", `"${node.name}" is not a valid node name`);
    if (seen.has(node.name)) throw new EngineError("DUPLICATE_NODE", `node ${node.name} has two rules`);
    seen.add(node.name);
    const rule = node.rule;
    if (rule.kind === "threshold") {
      if (!Number.isSafeInteger(rule.offset)) throw new EngineError("BAD_RULE", `the offset of ${node.name} must be an integer`);
      const terms = new Set<string>();
      for (const t of rule.terms) {
        if (!Number.isSafeInteger(t.weight) || t.weight === 0) throw new EngineError("BAD_RULE", `the weight of ${t.node} in the rule of ${node.name} must be a non-zero integer`);
        if (terms.has(t.node)) throw new EngineError("BAD_RULE", `${t.node} has two weights in the rule of ${node.name}`);
        terms.add(t.node);
      }
    }
  }
}

/** Compile a model to its BooleanNetwork. */
export function compileDefinition(model: ModelDefinition): BooleanNetwork {
  checkDefinition(model);
  const names = model.nodes.map((n) => n.name);
  const indexOf = new Map(names.map((name, i) => [name, i] as const));
  const regulators: Int32Array[] = [];
  const tables: Uint8Array[] = [];
  model.nodes.forEach((node, self) => {
    const regs = ruleRegulators(node.rule, self, indexOf, node.name);
    if (regs.length > 20) throw new EngineError("TOO_MANY_REGULATORS", `node ${node.name} reads ${regs.length} nodes; at most 20 are supported`);
    const position = new Map(regs.map((r, j) => [names[r]!, j] as const));
    const selfPosition = position.get(node.name);
    const table = new Uint8Array(1 << regs.length);
    for (let row = 0; row < table.length; row++) {
      const value = (name: string) => (row >> position.get(name)!) & 1;
      const current = selfPosition === undefined ? 0 : (row >> selfPosition) & 1;
      table[row] = evaluateRule(node.rule, value, current);
    }
    regulators.push(Int32Array.from(regs));
    tables.push(table);
  });
  return checkNetwork({ names, regulators, tables });
}
