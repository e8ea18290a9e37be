// Binary cellular-automaton rules of radius r as lookup tables, with the elementary (r = 1) rules numbered as
// in Wolfram, "Statistical mechanics of cellular automata", Rev. Mod. Phys. 55 (1983): bit (4l + 2c + r) of the number.
import { EngineError } from "../errors";

/**
 * A binary rule of radius `radius`: `table[i]` is the next value of a cell whose neighbourhood, read from the
 * leftmost cell (most significant) to the rightmost, spells i in binary. Length 2^(2r+1).
 */
export interface RuleTable {
  readonly radius: number;
  readonly table: Uint8Array;
}

/** Radii above this make tables of more than 2^17 entries, beyond any use of the block search. */
export const MAX_RADIUS = 8;

export function isEcaNumber(n: unknown): n is number {
  return typeof n === "number" && Number.isInteger(n) && n >= 0 && n <= 255;
}

/** The table of elementary rule `n` (0..255). */
export function ecaRule(n: number): RuleTable {
  if (!isEcaNumber(n)) throw new EngineError("BAD_RULE", `an elementary rule number is an integer 0..255, got ${n}`);
  const table = new Uint8Array(8);
  for (let i = 0; i < 8; i++) table[i] = (n >> i) & 1;
  return { radius: 1, table };
}

/** The table of the radius-r rule whose number (bit i = table entry i) is `n`. */
export function ruleFromNumber(radius: number, n: bigint | number): RuleTable {
  checkRadius(radius);
  const size = 1 << (2 * radius + 1);
  const big = BigInt(n);
  if (big < 0n || big >= 1n << BigInt(size)) {
    throw new EngineError("BAD_RULE", `a radius-${radius} rule number lies in 0..2^${size}-1, got ${n}`);
  }
  const table = new Uint8Array(size);
  for (let i = 0; i < size; i++) table[i] = Number((big >> BigInt(i)) & 1n);
  return { radius, table };
}

/** Build a rule from a table given as 0/1 values; checks the length against the radius. */
export function ruleFromTable(radius: number, values: ArrayLike<number>): RuleTable {
  checkRadius(radius);
  const size = 1 << (2 * radius + 1);
  if (values.length !== size)
    throw new EngineError("BAD_RULE", `a radius-${radius} rule has ${size} table entries, got ${values.length}`);
  const table = new Uint8Array(size);
  for (let i = 0; i < size; i++) {
    const v = values[i];
    if (v !== 0 && v !== 1) throw new EngineError("BAD_RULE", `rule table entries are 0 or 1, entry ${i} is ${v}`);
    table[i] = v;
  }
  return { radius, table };
}

export function ruleNumber(rule: RuleTable): bigint {
  let n = 0n;
  for (let i = rule.table.length - 1; i >= 0; i--) n = (n << 1n) | BigInt(rule.table[i]!);
  return n;
}

/** The elementary number of a radius-1 rule. */
export function ecaNumber(rule: RuleTable): number {
  if (rule.radius !== 1) throw new EngineError("BAD_RULE", `rule of radius ${rule.radius} has no elementary number`);
  let n = 0;
  for (let i = 0; i < 8; i++) n |= rule.table[i]! << i;
  return n;
}

/**
 * Whether the rule is affine over GF(2), i.e. the next value is a XOR of some neighbourhood cells plus a constant.
 * Affine rules get an exact linear-algebra search path.
 */
export function isAffineRule(rule: RuleTable): boolean {
  const t = rule.table;
  const c = t[0]!;
  // an affine function is fixed by its values on 0 and the unit vectors
  for (let i = 1; i < t.length; i++) {
    let v = c;
    for (let b = 0; b < 2 * rule.radius + 1; b++) if ((i >> b) & 1) v ^= t[1 << b]! ^ c;
    if (t[i] !== v) return false;
  }
  return true;
}

function checkRadius(radius: number): void {
  if (!Number.isInteger(radius) || radius < 1 || radius > MAX_RADIUS) {
    throw new EngineError("BAD_RULE", `the radius is an integer 1..${MAX_RADIUS}, got ${radius}`);
  }
}
