// The Boolean subset of content MathML used in SBML-qual function terms (W3C "Mathematical Markup Language (MathML)
// Version 2.0", chapter 4; SBML Level 3 qual package, Version 1, section 3.6): logical operators, comparisons of
// species levels with numbers, ci, cn, true and false. Reads it into rule expressions and writes expressions back.
import { ParseError } from "../../engine/errors";
import { showInput, type Expr } from "../../engine/rules";
import { attr, type XmlElement } from "./xml-tree";

/** A MathML value during reading: a Boolean expression, a 0/1 species level (which is also a Boolean), or a number. */
type Value = { kind: "bool"; expr: Expr } | { kind: "level"; expr: Expr } | { kind: "number"; value: number };

export interface MathContext {
  /** Where the math is, for messages, e.g. `transition tr_A`. */
  readonly where: string;
  readonly isSpecies: (id: string) => boolean;
  /** Threshold level of an input id (SBML-qual lets math name an input to mean its thresholdLevel). */
  readonly inputThreshold: (id: string) => number | undefined;
}

const TRUE: Expr = { kind: "const", value: 1 };
const FALSE: Expr = { kind: "const", value: 0 };

/** An error in the math at the element `e`. */
const mathError = (e: XmlElement, ctx: MathContext, message: string) =>
  new ParseError(`${ctx.where}: ${message}`, e.line, e.column, "SBML_MATH");

// Constant folding keeps imported rules readable (e.g. a single function term over a default of 0), and operands
// of the same operator are merged into one flat chain, so the rule is as deep as the real nesting of its logic.

/** The conjunction of `args` (true when there are none). */
export function allOf(args: readonly Expr[]): Expr {
  const kept: Expr[] = [];
  for (const a of args) {
    if (a.kind === "const") {
      if (!a.value) return FALSE;
    } else if (a.kind === "and") for (const b of a.args) kept.push(b);
    else kept.push(a);
  }
  return kept.length === 0 ? TRUE : kept.length === 1 ? kept[0]! : { kind: "and", args: kept };
}

/** The disjunction of `args` (false when there are none). */
export function anyOf(args: readonly Expr[]): Expr {
  const kept: Expr[] = [];
  for (const a of args) {
    if (a.kind === "const") {
      if (a.value) return TRUE;
    } else if (a.kind === "or") for (const b of a.args) kept.push(b);
    else kept.push(a);
  }
  return kept.length === 0 ? FALSE : kept.length === 1 ? kept[0]! : { kind: "or", args: kept };
}

/** The exclusive or of `args` (false when there are none). */
export function parityOf(args: readonly Expr[]): Expr {
  const kept: Expr[] = [];
  let flip = false;
  for (const a of args) {
    if (a.kind === "const") flip = flip !== (a.value === 1);
    else if (a.kind === "xor") for (const b of a.args) kept.push(b);
    else kept.push(a);
  }
  const sum: Expr = kept.length === 0 ? FALSE : kept.length === 1 ? kept[0]! : { kind: "xor", args: kept };
  return flip ? not(sum) : sum;
}

export function not(e: Expr): Expr {
  if (e.kind === "const") return e.value ? FALSE : TRUE;
  return { kind: "not", arg: e };
}

// A Map, not an object literal: an element named like an inherited property ("valueOf") must not find one.
const RELATIONS: ReadonlyMap<string, (a: number, b: number) => boolean> = new Map([
  ["eq", (a: number, b: number) => a === b],
  ["neq", (a: number, b: number) => a !== b],
  ["geq", (a: number, b: number) => a >= b],
  ["gt", (a: number, b: number) => a > b],
  ["leq", (a: number, b: number) => a <= b],
  ["lt", (a: number, b: number) => a < b],
]);

/** An operand of a comparison: a constant number or a 0/1-valued expression. */
type Operand = { expr: Expr | null; value: number };

/** The Boolean function R(x, y) of two operands, written with as few operators as its table allows. */
function relation(r: (a: number, b: number) => boolean, x: Operand, y: Operand): Expr {
  const xs = x.expr ? [0, 1] : [x.value];
  const ys = y.expr ? [0, 1] : [y.value];
  const t = (a: number, b: number) => (r(xs[a]!, ys[b]!) ? 1 : 0);
  // One variable operand (or none): the result is a constant, the operand, or its negation.
  const unary = (e: Expr | null, v0: number, v1: number): Expr =>
    v0 === v1 || !e ? (v0 ? TRUE : FALSE) : v1 ? e : not(e);
  if (!y.expr) return unary(x.expr, t(0, 0), t(xs.length - 1, 0));
  if (!x.expr) return unary(y.expr, t(0, 0), t(0, 1));
  const [a, b] = [x.expr, y.expr];
  const cells = [t(0, 0), t(1, 0), t(0, 1), t(1, 1)];
  const lit = (e: Expr, v: number) => (v ? e : not(e));
  if (cells[0] === cells[2] && cells[1] === cells[3]) return unary(a, cells[0]!, cells[1]!);
  if (cells[0] === cells[1] && cells[2] === cells[3]) return unary(b, cells[0]!, cells[2]!);
  if (cells[0] === cells[3] && cells[1] === cells[2]) return cells[1] ? parityOf([a, b]) : not(parityOf([a, b]));
  const ones = cells.filter((c) => c === 1).length;
  const at = (wanted: number) => cells.indexOf(wanted);
  if (ones === 1) {
    const i = at(1);
    return allOf([lit(a, i & 1), lit(b, i >> 1)]);
  }
  const i = at(0);
  return anyOf([lit(a, 1 - (i & 1)), lit(b, 1 - (i >> 1))]);
}

/** Read the content of a <math> element as a Boolean rule expression. Throws ParseError (code SBML_MATH). */
export function mathToExpr(math: XmlElement, ctx: MathContext): Expr {
  const body = math.children.filter((c) => c.name !== "annotation" && c.name !== "annotation-xml");
  if (body.length !== 1) throw mathError(math, ctx, `<math> must hold exactly one expression, found ${body.length}`);
  return asBool(read(body[0]!, ctx), body[0]!, ctx);
}

function asBool(v: Value, at: XmlElement, ctx: MathContext): Expr {
  if (v.kind !== "number") return v.expr;
  if (v.value === 0 || v.value === 1) return v.value ? TRUE : FALSE;
  throw mathError(at, ctx, `the number ${v.value} is used where a true/false value is expected`);
}

function asOperand(v: Value): Operand {
  return v.kind === "number" ? { expr: null, value: v.value } : { expr: v.expr, value: 0 };
}

// Recursive over the element tree, whose depth parseXml has bounded (MAX_XML_DEPTH).
function read(e: XmlElement, ctx: MathContext): Value {
  switch (e.name) {
    case "true":
      return { kind: "bool", expr: TRUE };
    case "false":
      return { kind: "bool", expr: FALSE };
    case "ci": {
      const id = e.text;
      const threshold = ctx.inputThreshold(id);
      if (threshold !== undefined) return { kind: "number", value: threshold };
      if (ctx.isSpecies(id)) return { kind: "level", expr: { kind: "var", name: id } };
      throw mathError(e, ctx, `<ci>${showInput(id)}</ci> names neither a qualitative species nor an input`);
    }
    case "cn": {
      const type = attr(e, "type") ?? "real";
      if (type !== "integer" && type !== "real" && type !== "double") {
        throw mathError(e, ctx, `<cn type="${showInput(type)}"> is not supported; write plain numbers`);
      }
      const value = Number(e.text);
      if (e.text === "" || !Number.isFinite(value))
        throw mathError(e, ctx, `<cn>${showInput(e.text)}</cn> is not a number`);
      return { kind: "number", value };
    }
    case "apply":
      return readApply(e, ctx);
    case "semantics": {
      const first = e.children[0];
      if (!first) throw mathError(e, ctx, `empty <semantics>`);
      return read(first, ctx);
    }
    default:
      throw mathError(e, ctx, `MathML <${showInput(e.name)}> is not part of the Boolean subset Emulant reads`);
  }
}

function readApply(e: XmlElement, ctx: MathContext): Value {
  const [op, ...argElements] = e.children;
  if (!op) throw mathError(e, ctx, `empty <apply>`);
  const args = argElements.map((a) => read(a, ctx));
  const bools = () => args.map((a, i) => asBool(a, argElements[i]!, ctx));
  const arity = (n: number) => {
    if (args.length !== n)
      throw mathError(op, ctx, `<${op.name}> takes ${n} argument${n === 1 ? "" : "s"}, found ${args.length}`);
  };
  switch (op.name) {
    case "and":
      return { kind: "bool", expr: allOf(bools()) };
    case "or":
      return { kind: "bool", expr: anyOf(bools()) };
    case "xor":
      return { kind: "bool", expr: parityOf(bools()) };
    case "not":
      arity(1);
      return { kind: "bool", expr: not(bools()[0]!) };
    case "implies": {
      arity(2);
      const [p, q] = bools();
      return { kind: "bool", expr: anyOf([not(p!), q!]) };
    }
    default: {
      const r = RELATIONS.get(op.name);
      if (!r)
        throw mathError(op, ctx, `MathML <${showInput(op.name)}> is not part of the Boolean subset Emulant reads`);
      if (args.length < 2) throw mathError(op, ctx, `<${op.name}> needs at least 2 arguments, found ${args.length}`);
      // A chain a < b < c means every adjacent pair holds (MathML 2.0, section 4.4.4).
      const pairs: Expr[] = [];
      for (let i = 0; i + 1 < args.length; i++) pairs.push(relation(r, asOperand(args[i]!), asOperand(args[i + 1]!)));
      return { kind: "bool", expr: allOf(pairs) };
    }
  }
}

/** Write an expression as the content of a <math> element; species are compared with level 1. */
export function exprToMathMl(e: Expr, indent: string): string {
  const lines: string[] = [];
  const emit = (x: Expr, depth: string): void => {
    switch (x.kind) {
      case "const":
        lines.push(`${depth}<${x.value ? "true" : "false"}/>`);
        return;
      case "var":
        lines.push(
          `${depth}<apply>`,
          `${depth}  <eq/>`,
          `${depth}  <ci> ${x.name} </ci>`,
          `${depth}  <cn type="integer"> 1 </cn>`,
          `${depth}</apply>`,
        );
        return;
      case "not":
        lines.push(`${depth}<apply>`, `${depth}  <not/>`);
        emit(x.arg, depth + "  ");
        lines.push(`${depth}</apply>`);
        return;
      default: {
        // Each chain is one n-ary apply, as MathML writers usually do.
        lines.push(`${depth}<apply>`, `${depth}  <${x.kind}/>`);
        for (const o of x.args) emit(o, depth + "  ");
        lines.push(`${depth}</apply>`);
      }
    }
  };
  emit(e, indent);
  return lines.join("\n");
}
