// The Boolean subset of content MathML used in SBML-qual function terms (W3C "Mathematical Markup Language (MathML)
// Version 2.0", chapter 4; SBML Level 3 qual package, Version 1, section 3.6): logical operators, comparisons of
// species levels with numbers, ci, cn, true and false. Reads it into rule expressions and writes expressions back.
import { EngineError } from "../../engine/errors";
import { chainOperands, type Expr } from "../../engine/rules";
import type { XmlElement } from "./xml-tree";

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

// Constant folding keeps imported rules readable (e.g. a single function term over a default of 0).
export function and(l: Expr, r: Expr): Expr {
  if (l.kind === "const") return l.value ? r : FALSE;
  if (r.kind === "const") return r.value ? l : FALSE;
  return { kind: "and", left: l, right: r };
}
export function or(l: Expr, r: Expr): Expr {
  if (l.kind === "const") return l.value ? TRUE : r;
  if (r.kind === "const") return r.value ? TRUE : l;
  return { kind: "or", left: l, right: r };
}
export function xor(l: Expr, r: Expr): Expr {
  if (l.kind === "const") return l.value ? not(r) : r;
  if (r.kind === "const") return r.value ? not(l) : l;
  return { kind: "xor", left: l, right: r };
}
export function not(e: Expr): Expr {
  if (e.kind === "const") return e.value ? FALSE : TRUE;
  return { kind: "not", arg: e };
}

const RELATIONS: Record<string, (a: number, b: number) => boolean> = {
  eq: (a, b) => a === b,
  neq: (a, b) => a !== b,
  geq: (a, b) => a >= b,
  gt: (a, b) => a > b,
  leq: (a, b) => a <= b,
  lt: (a, b) => a < b,
};

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
  if (cells[0] === cells[3] && cells[1] === cells[2]) return cells[1] ? xor(a, b) : not(xor(a, b));
  const ones = cells.filter((c) => c === 1).length;
  const at = (wanted: number) => cells.indexOf(wanted);
  if (ones === 1) {
    const i = at(1);
    return and(lit(a, i & 1), lit(b, i >> 1));
  }
  const i = at(0);
  return or(lit(a, 1 - (i & 1)), lit(b, 1 - (i >> 1)));
}

/** Read the content of a <math> element as a Boolean rule expression. */
export function mathToExpr(math: XmlElement, ctx: MathContext): Expr {
  const body = math.children.filter((c) => c.name !== "annotation" && c.name !== "annotation-xml");
  if (body.length !== 1)
    throw new EngineError("SBML_MATH", `${ctx.where}: <math> must hold exactly one expression, found ${body.length}`);
  return asBool(read(body[0]!, ctx), ctx);
}

function asBool(v: Value, ctx: MathContext): Expr {
  if (v.kind !== "number") return v.expr;
  if (v.value === 0 || v.value === 1) return v.value ? TRUE : FALSE;
  throw new EngineError(
    "SBML_MATH",
    `${ctx.where}: the number ${v.value} is used where a true/false value is expected`,
  );
}

function asOperand(v: Value): Operand {
  return v.kind === "number" ? { expr: null, value: v.value } : { expr: v.expr, value: 0 };
}

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
      throw new EngineError(
        "SBML_MATH",
        `${ctx.where}: <ci>${id}</ci> names neither a qualitative species nor an input`,
      );
    }
    case "cn": {
      const type = e.attrs["type"] ?? "real";
      if (type !== "integer" && type !== "real" && type !== "double") {
        throw new EngineError("SBML_MATH", `${ctx.where}: <cn type="${type}"> is not supported; write plain numbers`);
      }
      const value = Number(e.text);
      if (e.text === "" || !Number.isFinite(value))
        throw new EngineError("SBML_MATH", `${ctx.where}: <cn>${e.text}</cn> is not a number`);
      return { kind: "number", value };
    }
    case "apply":
      return readApply(e, ctx);
    case "semantics": {
      const first = e.children[0];
      if (!first) throw new EngineError("SBML_MATH", `${ctx.where}: empty <semantics>`);
      return read(first, ctx);
    }
    default:
      throw new EngineError(
        "SBML_MATH",
        `${ctx.where}: MathML <${e.name}> is not part of the Boolean subset Emulant reads`,
      );
  }
}

function readApply(e: XmlElement, ctx: MathContext): Value {
  const [op, ...argElements] = e.children;
  if (!op) throw new EngineError("SBML_MATH", `${ctx.where}: empty <apply>`);
  const args = argElements.map((a) => read(a, ctx));
  const bools = () => args.map((a) => asBool(a, ctx));
  const arity = (n: number) => {
    if (args.length !== n)
      throw new EngineError(
        "SBML_MATH",
        `${ctx.where}: <${op.name}> takes ${n} argument${n === 1 ? "" : "s"}, found ${args.length}`,
      );
  };
  switch (op.name) {
    case "and":
      return { kind: "bool", expr: bools().reduce(and, TRUE) };
    case "or":
      return { kind: "bool", expr: bools().reduce(or, FALSE) };
    case "xor":
      return { kind: "bool", expr: bools().reduce(xor, FALSE) };
    case "not":
      arity(1);
      return { kind: "bool", expr: not(bools()[0]!) };
    case "implies": {
      arity(2);
      const [p, q] = bools();
      return { kind: "bool", expr: or(not(p!), q!) };
    }
    default: {
      const r = RELATIONS[op.name];
      if (!r)
        throw new EngineError(
          "SBML_MATH",
          `${ctx.where}: MathML <${op.name}> is not part of the Boolean subset Emulant reads`,
        );
      if (args.length < 2)
        throw new EngineError(
          "SBML_MATH",
          `${ctx.where}: <${op.name}> needs at least 2 arguments, found ${args.length}`,
        );
      // A chain a < b < c means every adjacent pair holds (MathML 2.0, section 4.4.4).
      let result: Expr = TRUE;
      for (let i = 0; i + 1 < args.length; i++)
        result = and(result, relation(r, asOperand(args[i]!), asOperand(args[i + 1]!)));
      return { kind: "bool", expr: result };
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
        // Same-operator chains become one n-ary apply, as MathML writers usually do.
        const operands = chainOperands(x);
        lines.push(`${depth}<apply>`, `${depth}  <${x.kind}/>`);
        for (const o of operands) emit(o, depth + "  ");
        lines.push(`${depth}</apply>`);
      }
    }
  };
  emit(e, indent);
  return lines.join("\n");
}
