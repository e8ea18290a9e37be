// Checking a table of expectations against one network: each expectation's condition becomes a perturbed network
// (perturbNetwork), the census its outcome needs is taken by the first method that accepts it (exact analysis up to
// its size limit, then any plugged-in methods, then SAT), and the outcome is judged from that census. Censuses are
// shared between expectations with the same condition, update and scope, so a table costs one analysis per condition.
import { CancelledError, EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import { perturbNetwork } from "../perturbation";
import type { LongTaskOptions } from "../update";
import { MAX_ASYNC_NODES } from "../state-graph";
import { MAX_TABLE_NODES } from "../update";
import { formatAssignment, resolveAssignment, type NodePattern } from "./assignment";
import type {
  AttractorCensus,
  AttractorMethod,
  CensusAttractor,
  CensusScope,
  UndecidedReason,
} from "./attractor-census";
import {
  exactAsynchronousMethod,
  exactSynchronousMethod,
  satCyclesMethod,
  satFixedPointsMethod,
  trajectoryMethod,
} from "./census-methods";
import type { Expectation, ExpectationCondition, UpdateKind } from "./expectation";
import { judgeOutcome, type ExpectationStatus } from "./judge-outcome";

export interface ExpectationResult {
  readonly id: string;
  readonly status: ExpectationStatus;
  /** The method that decided (or tried to): e.g. "exact-synchronous", "sat-cycles"; "none" when none could run. */
  readonly method: string;
  /** For people: what was found. */
  readonly detail: string;
  /** Set when undecided: a stable word for why. */
  readonly reason: UndecidedReason | null;
  /** The attractor that decided, when one did. */
  readonly witness: CensusAttractor | null;
}

export interface EvaluationOptions extends LongTaskOptions {
  /** Longest synchronous cycle the SAT search looks for on large models (default 4). */
  readonly maxCycleLength?: number;
  /** Cap on the attractors one SAT census lists (default 10 000). */
  readonly maxSolutions?: number;
  /** Steps a synchronous trajectory may take on a large model before reachability is left undecided (default 100 000). */
  readonly maxTrajectorySteps?: number;
  /** Size limits of the exact methods (defaults: 24 synchronous, 22 asynchronous; lower them to force SAT). */
  readonly exactSynchronousMaxNodes?: number;
  readonly exactAsynchronousMaxNodes?: number;
  /** Extra methods (e.g. trap spaces for asynchronous outcomes on large models), tried after the exact ones. */
  readonly methods?: readonly AttractorMethod[];
}

export const EVALUATION_DEFAULTS = {
  maxCycleLength: 4,
  maxSolutions: 10_000,
  maxTrajectorySteps: 100_000,
  exactSynchronousMaxNodes: MAX_TABLE_NODES,
  exactAsynchronousMaxNodes: MAX_ASYNC_NODES,
} as const;

/** The methods in the order they are tried. */
export function attractorMethods(options: EvaluationOptions = {}): AttractorMethod[] {
  const o = { ...EVALUATION_DEFAULTS, ...options };
  return [
    exactSynchronousMethod(o.exactSynchronousMaxNodes),
    exactAsynchronousMethod(o.exactAsynchronousMaxNodes),
    ...(options.methods ?? []),
    trajectoryMethod(o.maxTrajectorySteps),
    satCyclesMethod(o.maxCycleLength, o.maxSolutions),
    satFixedPointsMethod(o.maxSolutions),
  ];
}

function conditionNetwork(
  net: BooleanNetwork,
  condition: ExpectationCondition,
): BooleanNetwork | { problem: string; reason: UndecidedReason } {
  const index = new Map(net.names.map((name, i) => [name, i]));
  const unknown = [...condition.knockOut, ...condition.overExpress, ...Object.keys(condition.inputs)].filter(
    (name) => !index.has(name),
  );
  if (unknown.length > 0) return { problem: `the condition names ${unknownText(unknown)}`, reason: "unknown-node" };
  try {
    return perturbNetwork(net, {
      knockOut: condition.knockOut.map((name) => index.get(name)!),
      overExpress: condition.overExpress.map((name) => index.get(name)!),
      fixedInputs: new Map(Object.entries(condition.inputs).map(([name, v]) => [index.get(name)!, v])),
    });
  } catch (err) {
    if (err instanceof EngineError && err.code === "BAD_PERTURBATION")
      return { problem: err.message, reason: "bad-condition" };
    throw err;
  }
}

function unknownText(names: string[]): string {
  return `${names.length === 1 ? "node" : "nodes"} ${names.join(", ")}, not in this model`;
}

function scopeOf(expectation: Expectation, net: BooleanNetwork): CensusScope | { problem: string } {
  const o = expectation.outcome;
  if (o.kind === "fixed-point-count") return { kind: "fixed-points" };
  if (o.kind !== "reachable") return { kind: "all" };
  const { pattern, unknown } = resolveAssignment(net, o.from);
  if (unknown.length > 0) return { problem: `the start state names ${unknownText(unknown)}` };
  const state = new Array<string>(net.names.length).fill("0");
  pattern.nodes.forEach((node, q) => (state[node] = pattern.values[q] ? "1" : "0"));
  return { kind: "reachable-from", state: state.join("") };
}

function outcomePattern(
  expectation: Expectation,
  net: BooleanNetwork,
): { pattern: NodePattern | null; unknown: string[] } {
  const o = expectation.outcome;
  if (o.kind === "fixed-point-count" || o.kind === "attractor-count") return { pattern: null, unknown: [] };
  return resolveAssignment(net, o.pattern);
}

function conditionKey(c: ExpectationCondition): string {
  return JSON.stringify([
    [...c.knockOut].sort(),
    [...c.overExpress].sort(),
    Object.entries(c.inputs).sort(([a], [b]) => (a < b ? -1 : 1)),
  ]);
}

/**
 * Indices of the expectations grouped by condition, in order of first appearance: a run that shards a table by
 * these groups keeps one analysis per condition, as one unsplit evaluateExpectations call does.
 */
export function groupByCondition(expectations: readonly Expectation[]): number[][] {
  const groups = new Map<string, number[]>();
  expectations.forEach((e, i) => {
    const key = conditionKey(e.condition);
    groups.set(key, [...(groups.get(key) ?? []), i]);
  });
  return [...groups.values()];
}

/** Evaluate every expectation; results in the order given. Progress counts expectations. */
export function evaluateExpectations(
  net: BooleanNetwork,
  expectations: readonly Expectation[],
  options: EvaluationOptions = {},
): ExpectationResult[] {
  const methods = attractorMethods(options);
  const censuses = new Map<string, AttractorCensus>();
  const networks = new Map<string, ReturnType<typeof conditionNetwork>>();
  const results: ExpectationResult[] = [];
  const { onProgress, shouldStop } = options;
  expectations.forEach((e, index) => {
    if (shouldStop?.()) throw new CancelledError();
    onProgress?.(index / Math.max(1, expectations.length), `expectation ${e.id}`);
    const inner: LongTaskOptions = {
      shouldStop,
      onProgress: onProgress && ((f, phase) => onProgress((index + f) / expectations.length, phase)),
    };
    results.push(evaluateOne(net, e, methods, censuses, networks, inner));
  });
  onProgress?.(1, "expectations");
  return results;
}

/** Evaluate one expectation (see evaluateExpectations). */
export function evaluateExpectation(
  net: BooleanNetwork,
  expectation: Expectation,
  options: EvaluationOptions = {},
): ExpectationResult {
  return evaluateExpectations(net, [expectation], options)[0]!;
}

function evaluateOne(
  net: BooleanNetwork,
  e: Expectation,
  methods: readonly AttractorMethod[],
  censuses: Map<string, AttractorCensus>,
  networks: Map<string, ReturnType<typeof conditionNetwork>>,
  options: LongTaskOptions,
): ExpectationResult {
  const notRun = (detail: string, reason: UndecidedReason): ExpectationResult => ({
    id: e.id,
    status: "undecided",
    method: "none",
    detail,
    reason,
    witness: null,
  });
  const cKey = conditionKey(e.condition);
  if (!networks.has(cKey)) networks.set(cKey, conditionNetwork(net, e.condition));
  const perturbed = networks.get(cKey)!;
  if ("problem" in perturbed) return notRun(perturbed.problem, perturbed.reason);
  const scope = scopeOf(e, net);
  if ("problem" in scope) return notRun(scope.problem, "unknown-node");
  const { pattern, unknown } = outcomePattern(e, net);
  if (unknown.length > 0) return notRun(`the outcome names ${unknownText(unknown)}`, "unknown-node");
  const update: UpdateKind = scope.kind === "fixed-points" ? "synchronous" : e.update;
  const method = methods.find((m) => m.accepts(perturbed, update, scope));
  if (!method)
    return notRun(
      `no method can decide this ${e.update} outcome on a model of ${net.names.length} nodes` +
        (e.update === "asynchronous"
          ? ` (exact asynchronous analysis stops at ${MAX_ASYNC_NODES} nodes; larger models need the trap-space method)`
          : ""),
      e.update === "asynchronous" ? "needs-trap-spaces" : "no-method",
    );
  const key = `${cKey}|${update}|${JSON.stringify(scope)}|${method.name}`;
  let census = censuses.get(key);
  if (!census) {
    census = method.census(perturbed, update, scope, options);
    censuses.set(key, census);
  }
  const o = e.outcome;
  // In the model's node order: a stored expectation's key order is not the author's (JSON columns sort keys), and
  // the same expectation must read the same whether it was checked in the seed, a run or the CLI.
  const patternText =
    o.kind === "fixed-point-count" || o.kind === "attractor-count"
      ? ""
      : formatAssignment(
          Object.fromEntries(Object.entries(o.pattern).sort(([a], [b]) => net.names.indexOf(a) - net.names.indexOf(b))),
        );
  const judgement = judgeOutcome(o, pattern, census, patternText);
  return { id: e.id, method: census.method, ...judgement };
}
