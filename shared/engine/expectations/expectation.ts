// An expectation: an observation the model must reproduce, written as a condition (inputs held, knock-outs,
// over-expressions) and an expected outcome about the attractors under that condition, with the source it comes from.
// Everything here is plain JSON so the same object can be read from CSV, stored, sent over the API and evaluated.

/** Node name -> value. Key order is kept (names are identifiers, never integer-like, so JSON keeps it too). */
export type Assignment = Readonly<Record<string, 0 | 1>>;

/** Same nodes with the same values, whatever order the keys were written in. */
export function sameAssignment(a: Assignment, b: Assignment): boolean {
  const keys = Object.keys(a);
  return keys.length === Object.keys(b).length && keys.every((k) => Object.hasOwn(b, k) && a[k] === b[k]);
}

/** Synchronous: all nodes at once (the default). Asynchronous: general asynchronous, one node flips per step. */
export type UpdateKind = "synchronous" | "asynchronous";

export interface ExpectationCondition {
  /** Nodes held at 0. */
  readonly knockOut: readonly string[];
  /** Nodes held at 1. */
  readonly overExpress: readonly string[];
  /** Input nodes (no regulator but themselves) held at a value. */
  readonly inputs: Assignment;
}

export type CountComparison = "exactly" | "at-least" | "at-most";

/**
 * The closed set of outcomes. An attractor *satisfies* a pattern when every named node holds the named value in
 * every state of the attractor (a node that oscillates along a cycle satisfies neither value).
 * - some-attractor / every-attractor / no-attractor: some, every or no attractor satisfies `pattern`;
 * - fixed-point-count / attractor-count: the number of fixed points (or of all attractors) compared with `count`;
 * - reachable: an attractor satisfying `pattern` is reachable from the state `from` (nodes not named in `from` are
 *   0). Under synchronous update one attractor is reached from a state; under asynchronous update any of several.
 */
export type ExpectedOutcome =
  | { readonly kind: "some-attractor"; readonly pattern: Assignment }
  | { readonly kind: "every-attractor"; readonly pattern: Assignment }
  | { readonly kind: "no-attractor"; readonly pattern: Assignment }
  | { readonly kind: "fixed-point-count"; readonly comparison: CountComparison; readonly count: number }
  | { readonly kind: "attractor-count"; readonly comparison: CountComparison; readonly count: number }
  | { readonly kind: "reachable"; readonly from: Assignment; readonly pattern: Assignment };

export type OutcomeKind = ExpectedOutcome["kind"];

export const OUTCOME_KINDS: readonly OutcomeKind[] = [
  "some-attractor",
  "every-attractor",
  "no-attractor",
  "fixed-point-count",
  "attractor-count",
  "reachable",
];

export interface Expectation {
  /** Unique within a table: letters, digits, `_`, `-`, `.`. */
  readonly id: string;
  readonly update: UpdateKind;
  readonly condition: ExpectationCondition;
  readonly outcome: ExpectedOutcome;
  /** Where the observation comes from: a citation or a lab notebook reference. Never empty. */
  readonly source: string;
  /** Optional words for people ("G1 arrest without Cln3"); may be empty. */
  readonly note: string;
}

export const NO_CONDITION: ExpectationCondition = { knockOut: [], overExpress: [], inputs: {} };
