// Partial assignments of node values ("Cdh1=1; Sic1=1") and lists of node names ("Cln3 Clb12"), as written in an
// expectation table or on the command line, and their reading against a network's nodes. Items may be separated by
// commas, semicolons or spaces; spaces around `=` are allowed. Offsets are 0-based positions in the text, so a caller
// can turn them into columns of its own file.
import type { BooleanNetwork } from "../network";
import { isValidNodeName } from "../rules";
import type { Assignment } from "./expectation";

export interface TextIssue {
  /** 0-based position in the text where the problem starts. */
  readonly offset: number;
  readonly message: string;
}

interface Item {
  readonly name: string;
  readonly offset: number;
  /** null when the item has no `=`. */
  readonly value: string | null;
  readonly valueOffset: number;
}

const SEPARATOR = /[\s,;]/;

function scanItems(text: string): { items: Item[]; issues: TextIssue[] } {
  const items: Item[] = [];
  const issues: TextIssue[] = [];
  let i = 0;
  const skipSpaces = () => {
    while (i < text.length && /\s/.test(text[i]!)) i++;
  };
  while (i < text.length) {
    if (SEPARATOR.test(text[i]!)) {
      i++;
      continue;
    }
    const start = i;
    while (i < text.length && !SEPARATOR.test(text[i]!) && text[i] !== "=") i++;
    const name = text.slice(start, i);
    const afterName = i;
    skipSpaces();
    if (text[i] !== "=") {
      i = afterName;
      items.push({ name, offset: start, value: null, valueOffset: afterName });
      continue;
    }
    i++;
    skipSpaces();
    const valueStart = i;
    while (i < text.length && !SEPARATOR.test(text[i]!) && text[i] !== "=") i++;
    items.push({ name, offset: start, value: text.slice(valueStart, i), valueOffset: valueStart });
    if (text[i] === "=") {
      issues.push({ offset: i, message: 'a second "=" in one item; separate items with ";"' });
      while (i < text.length && !SEPARATOR.test(text[i]!)) i++;
    }
  }
  return { items, issues };
}

function checkName(item: Item, issues: TextIssue[]): boolean {
  if (item.name === "") {
    issues.push({ offset: item.offset, message: 'a node name is missing before "="' });
    return false;
  }
  if (!isValidNodeName(item.name)) {
    issues.push({
      offset: item.offset,
      message: `"${item.name}" is not a valid node name (letters, digits and _, not starting with a digit)`,
    });
    return false;
  }
  return true;
}

/** Read `A=1; B=0`. Every item needs a value 0 or 1; a node may appear once. */
export function parseAssignment(text: string): { assignment: Assignment; issues: TextIssue[] } {
  const { items, issues } = scanItems(text);
  // A Map: node names such as "toString" or "__proto__" must not meet Object.prototype.
  const out = new Map<string, 0 | 1>();
  for (const item of items) {
    if (!checkName(item, issues)) continue;
    if (item.value === null) {
      issues.push({
        offset: item.offset,
        message: `${item.name} needs a value: write ${item.name}=0 or ${item.name}=1`,
      });
      continue;
    }
    if (item.value !== "0" && item.value !== "1") {
      issues.push({ offset: item.valueOffset, message: `expected 0 or 1 for ${item.name}, found "${item.value}"` });
      continue;
    }
    if (out.has(item.name)) {
      issues.push({ offset: item.offset, message: `${item.name} is given twice` });
      continue;
    }
    out.set(item.name, item.value === "1" ? 1 : 0);
  }
  return { assignment: Object.fromEntries(out), issues };
}

/** Read `A B; C`: node names without values, each once. */
export function parseNodeList(text: string): { nodes: string[]; issues: TextIssue[] } {
  const { items, issues } = scanItems(text);
  const nodes: string[] = [];
  for (const item of items) {
    if (!checkName(item, issues)) continue;
    if (item.value !== null) {
      issues.push({ offset: item.offset, message: `write the node name alone here, without "=${item.value}"` });
      continue;
    }
    if (nodes.includes(item.name)) {
      issues.push({ offset: item.offset, message: `${item.name} is given twice` });
      continue;
    }
    nodes.push(item.name);
  }
  return { nodes, issues };
}

/** Canonical text of an assignment: `A=1; B=0`. */
export function formatAssignment(assignment: Assignment): string {
  return Object.entries(assignment)
    .map(([name, value]) => `${name}=${value}`)
    .join("; ");
}

/** A pattern resolved against a network: node indices and the values they must hold. */
export interface NodePattern {
  readonly nodes: Int32Array;
  readonly values: Uint8Array;
}

/** Resolve names to node indices; the names a network lacks are returned instead. */
export function resolveAssignment(
  net: BooleanNetwork,
  assignment: Assignment,
): { pattern: NodePattern; unknown: string[] } {
  const index = new Map(net.names.map((name, i) => [name, i]));
  const nodes: number[] = [];
  const values: number[] = [];
  const unknown: string[] = [];
  for (const [name, value] of Object.entries(assignment)) {
    const i = index.get(name);
    if (i === undefined) unknown.push(name);
    else {
      nodes.push(i);
      values.push(value);
    }
  }
  return { pattern: { nodes: Int32Array.from(nodes), values: Uint8Array.from(values) }, unknown };
}

/** Does a state (node-ordered 0/1 text) agree with the pattern? */
export function stateMatches(state: string, pattern: NodePattern): boolean {
  for (let q = 0; q < pattern.nodes.length; q++)
    if (state.charCodeAt(pattern.nodes[q]!) - 48 !== pattern.values[q]) return false;
  return true;
}
