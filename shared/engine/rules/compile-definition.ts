// Compiles a source-level model to the BooleanNetwork every analysis uses: each node's regulators are the nodes its
// rule reads (in model order) and its truth table is the rule evaluated on every regulator row.
// Threshold semantics follow Li, Long, Lu, Ouyang, Tang, "The yeast cell-cycle network is robustly designed", PNAS 2004.
import { EngineError } from "../errors";
import { checkNetwork, type BooleanNetwork } from "../network";
import { MAX_NESTING_DEPTH, MAX_NODES, MAX_REGULATORS } from "./limits";
import { showInput } from "./show-input";
import {
  firstTooDeep,
  forEachSubexpression,
  isValidNodeName,
  variablesOf,
  type Expr,
  type ModelDefinition,
  type RuleSyntax,
} from "./syntax";

/** Regulators of one rule as node indices in model order; a threshold rule with tie "keep" also reads its own node. */
export function ruleRegulators(
  rule: RuleSyntax,
  self: number,
  indexOf: ReadonlyMap<string, number>,
  nodeName: string,
): number[] {
  const used = new Set<number>();
  for (const name of variablesOf(rule)) {
    const index = indexOf.get(name);
    if (index === undefined) {
      throw new EngineError(
        "UNDEFINED_NODE",
        `node ${showInput(name)} is used in the rule of ${showInput(nodeName)} but has no rule; add \`${showInput(name)}' = ${showInput(name)}\` to make it an input`,
      );
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

/**
 * Evaluate an expression given each variable's value (one state at a time; the compiler uses truthTableOf).
 * Recursive: meant for expressions within MAX_NESTING_DEPTH, as checkDefinition ensures.
 */
export function evaluateExpr(e: Expr, value: (name: string) => number): number {
  switch (e.kind) {
    case "const":
      return e.value;
    case "var":
      return value(e.name);
    case "not":
      return 1 - evaluateExpr(e.arg, value);
    default: {
      let acc = evaluateExpr(e.args[0]!, value);
      for (let i = 1; i < e.args.length; i++) {
        const b = evaluateExpr(e.args[i]!, value);
        acc = e.kind === "and" ? acc & b : e.kind === "or" ? acc | b : acc ^ b;
      }
      return acc;
    }
  }
}

// Bit j of the row number, repeated over a 32-row word (rows 32w .. 32w+31), for j < 5.
const LOW_PATTERNS = [0xaaaaaaaa, 0xcccccccc, 0xf0f0f0f0, 0xff00ff00, 0xffff0000];

/**
 * Truth table of an expression over the given inputs (row bit j = input j), evaluated 32 rows per machine word:
 * each subexpression becomes a bit vector over all rows, so the cost is (expression size) x (rows / 32).
 * The walk recurses once per nesting level, so deeper expressions than MAX_NESTING_DEPTH are refused first.
 */
export function truthTableOf(e: Expr, inputs: readonly string[]): Uint8Array {
  if (firstTooDeep(e, MAX_NESTING_DEPTH))
    throw new EngineError("TOO_DEEP", `the expression is nested more than ${MAX_NESTING_DEPTH} levels deep`);
  const rows = 1 << inputs.length;
  const words = Math.ceil(rows / 32);
  const position = new Map(inputs.map((name, j) => [name, j] as const));
  const patterns = new Map<string, Uint32Array>();
  const varVector = (name: string): Uint32Array => {
    let v = patterns.get(name);
    if (!v) {
      const j = position.get(name);
      if (j === undefined)
        throw new EngineError("UNDEFINED_NODE", `${showInput(name)} is not among the inputs of the table`);
      v = new Uint32Array(words);
      for (let w = 0; w < words; w++) v[w] = j < 5 ? LOW_PATTERNS[j]! : (w >> (j - 5)) & 1 ? 0xffffffff : 0;
      patterns.set(name, v);
    }
    return v;
  };
  const evaluate = (x: Expr): Uint32Array => {
    switch (x.kind) {
      case "const":
        return new Uint32Array(words).fill(x.value ? 0xffffffff : 0);
      case "var":
        return varVector(x.name);
      case "not": {
        const a = evaluate(x.arg);
        const out = new Uint32Array(words);
        for (let w = 0; w < words; w++) out[w] = ~a[w]!;
        return out;
      }
      default: {
        if (x.kind === "or") return evaluateSum(x.args);
        const acc = Uint32Array.from(evaluate(x.args[0]!)); // a copy: cached input patterns must stay intact
        for (let i = 1; i < x.args.length; i++) {
          const b = evaluate(x.args[i]!);
          if (x.kind === "and") for (let w = 0; w < words; w++) acc[w]! &= b[w]!;
          else for (let w = 0; w < words; w++) acc[w]! ^= b[w]!;
        }
        return acc;
      }
    }
  };
  // A product of literals covers the rows that agree with it on its inputs. Inputs 0..4 select rows inside a word,
  // the others select words, so the product is one 32-bit pattern OR-ed into the 2^(free word inputs) words that
  // match: cheaper than building its vector, and the sums of products networkToDefinition writes are all such terms.
  const literalCube = (x: Expr): { mask: number; value: number } | null => {
    let mask = 0;
    let value = 0;
    for (const o of x.kind === "and" ? x.args : [x]) {
      const negated = o.kind === "not";
      const v = negated ? o.arg : o;
      if (v.kind !== "var") return null;
      const bit = 1 << position.get(v.name)!;
      if (mask & bit && ((value & bit) !== 0) === negated) return { mask: -1, value: 0 }; // x & !x covers nothing
      mask |= bit;
      if (!negated) value |= bit;
    }
    return { mask, value };
  };
  const orCube = (acc: Uint32Array, mask: number, value: number): void => {
    let pattern = 0;
    for (let r = 0; r < 32; r++) if ((r & mask & 31) === (value & 31)) pattern |= 1 << r;
    const freeWords = (words - 1) & ~(mask >>> 5);
    const base = value >>> 5;
    for (let sub = freeWords; ; sub = (sub - 1) & freeWords) {
      acc[base | sub]! |= pattern;
      if (sub === 0) break;
    }
  };
  const evaluateSum = (operands: readonly Expr[]): Uint32Array => {
    const acc = new Uint32Array(words);
    for (const o of operands) {
      const cube = literalCube(o);
      if (cube) {
        if (cube.mask !== -1) orCube(acc, cube.mask, cube.value);
        continue;
      }
      const b = evaluate(o);
      for (let w = 0; w < words; w++) acc[w]! |= b[w]!;
    }
    return acc;
  };
  const vector = evaluate(e);
  const table = new Uint8Array(rows);
  for (let row = 0; row < rows; row++) table[row] = (vector[row >>> 5]! >>> (row & 31)) & 1;
  return table;
}

/**
 * Check names, references and the limits of limits.ts (node count, nesting depth) of a model; throws EngineError
 * naming the first problem. Definitions that did not come from a reader (stored, generated, built in code) meet the
 * same bounds here, before anything walks them.
 */
export function checkDefinition(model: ModelDefinition): void {
  if (model.nodes.length > MAX_NODES)
    throw new EngineError(
      "TOO_LARGE",
      `the model has ${model.nodes.length} nodes; a model may have at most ${MAX_NODES}`,
    );
  const seen = new Set<string>();
  for (const node of model.nodes) {
    if (!isValidNodeName(node.name))
      throw new EngineError("BAD_NAME", `"${showInput(node.name)}" is not a valid node name`);
    if (seen.has(node.name)) throw new EngineError("DUPLICATE_NODE", `node ${node.name} has two rules`);
    seen.add(node.name);
    const rule = node.rule;
    // The parser never builds an operator with fewer than two operands; a definition built or stored elsewhere
    // might (or a binary node stored before chains were flat), and walking one would read operands that are not
    // there. Checked before the depth, whose walk reads them.
    if (rule.kind !== "threshold")
      forEachSubexpression(rule, (e) => {
        if ((e.kind === "and" || e.kind === "or" || e.kind === "xor") && !(Array.isArray(e.args) && e.args.length >= 2))
          throw new EngineError("BAD_RULE", `an ${e.kind} in the rule of ${node.name} has fewer than two operands`);
      });
    if (rule.kind !== "threshold" && firstTooDeep(rule, MAX_NESTING_DEPTH))
      throw new EngineError(
        "TOO_DEEP",
        `the rule of ${node.name} is nested more than ${MAX_NESTING_DEPTH} levels deep`,
      );
    if (rule.kind === "threshold") {
      if (!Number.isSafeInteger(rule.offset))
        throw new EngineError("BAD_RULE", `the offset of ${node.name} must be an integer`);
      const terms = new Set<string>();
      for (const t of rule.terms) {
        if (!Number.isSafeInteger(t.weight) || t.weight === 0)
          throw new EngineError(
            "BAD_RULE",
            `the weight of ${showInput(t.node)} in the rule of ${node.name} must be a non-zero integer`,
          );
        if (terms.has(t.node))
          throw new EngineError("BAD_RULE", `${showInput(t.node)} has two weights in the rule of ${node.name}`);
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
    if (regs.length > MAX_REGULATORS)
      throw new EngineError(
        "TOO_MANY_REGULATORS",
        `node ${node.name} reads ${regs.length} nodes; at most ${MAX_REGULATORS} are supported`,
      );
    const inputNames = regs.map((r) => names[r]!);
    let table: Uint8Array;
    if (node.rule.kind === "threshold") {
      const position = new Map(inputNames.map((name, j) => [name, j] as const));
      const selfPosition = position.get(node.name);
      table = new Uint8Array(1 << regs.length);
      for (let row = 0; row < table.length; row++) {
        const value = (name: string) => (row >> position.get(name)!) & 1;
        const current = selfPosition === undefined ? 0 : (row >> selfPosition) & 1;
        table[row] = evaluateRule(node.rule, value, current);
      }
    } else table = truthTableOf(node.rule, inputNames);
    regulators.push(Int32Array.from(regs));
    tables.push(table);
  });
  return checkNetwork({ names, regulators, tables });
}
