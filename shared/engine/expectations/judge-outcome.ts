// Deciding one outcome from a census, in three values: pass and fail only when the census proves them, undecided
// otherwise with the census's own gap as the reason. A satisfied pattern on a listed attractor proves "some"; a
// violated one disproves "every"; "none" and counts need the list to be complete (fixed points or all attractors).
import {
  isFixedPointReading,
  type AttractorCensus,
  type CensusAttractor,
  type UndecidedReason,
} from "./attractor-census";
import type { NodePattern } from "./assignment";
import type { CountComparison, ExpectedOutcome } from "./expectation";

export type ExpectationStatus = "pass" | "fail" | "undecided";

export interface Judgement {
  readonly status: ExpectationStatus;
  readonly detail: string;
  /** Set when undecided. */
  readonly reason: UndecidedReason | null;
  /** The listed attractor that decided, when one did. */
  readonly witness: CensusAttractor | null;
}

type Truth = "yes" | "no" | "maybe";

function satisfies(reading: string, pattern: NodePattern): Truth {
  let truth: Truth = "yes";
  for (let q = 0; q < pattern.nodes.length; q++) {
    const c = reading[pattern.nodes[q]!]!;
    if (c === "*") truth = "maybe";
    else if (c === "~" || c.charCodeAt(0) - 48 !== pattern.values[q]) return "no";
  }
  return truth;
}

/** "fixed point 0100", "cycle of 3 states through 0100, 0110, 0010", "attractor read as 01*~". */
export function describeAttractor(a: CensusAttractor): string {
  if (a.size === 1) return `fixed point ${a.states[0]}`;
  if (a.size !== null && a.states.length > 0) {
    const shown = a.states.slice(0, 4).join(", ");
    return `cycle of ${a.size} states through ${shown}${a.size > 4 ? ", ..." : ""}`;
  }
  return `attractor read as ${a.reading}`;
}

function undecided(census: AttractorCensus, fallback: string): Judgement {
  return {
    status: "undecided",
    detail: census.gap?.text ?? fallback,
    reason: census.gap?.reason ?? "unknown-values",
    witness: null,
  };
}

function compare(comparison: CountComparison, lower: number, upper: number, count: number): ExpectationStatus {
  switch (comparison) {
    case "exactly":
      return lower === count && upper === count ? "pass" : count < lower || count > upper ? "fail" : "undecided";
    case "at-least":
      return lower >= count ? "pass" : upper < count ? "fail" : "undecided";
    case "at-most":
      return upper <= count ? "pass" : lower > count ? "fail" : "undecided";
  }
}

const COMPARISON_WORDS: Record<CountComparison, string> = {
  exactly: "exactly",
  "at-least": "at least",
  "at-most": "at most",
};

function plural(count: number, word: string): string {
  return `${count} ${word}${count === 1 ? "" : "s"}`;
}

/** Judge an outcome; `pattern` is the outcome's pattern resolved against the network (unused for counts). */
export function judgeOutcome(
  outcome: ExpectedOutcome,
  pattern: NodePattern | null,
  census: AttractorCensus,
  patternText: string,
): Judgement {
  const list = census.attractors;
  const scopeWord = outcome.kind === "reachable" ? "reachable attractor" : "attractor";
  const count = (what: string) => `${census.complete ? "" : "at least "}${plural(list.length, what)}`;
  switch (outcome.kind) {
    case "some-attractor":
    case "reachable":
    case "no-attractor": {
      const truths = list.map((a) => satisfies(a.reading, pattern!));
      const hit = truths.indexOf("yes");
      const expectsOne = outcome.kind !== "no-attractor";
      if (hit >= 0) {
        const detail = `${describeAttractor(list[hit]!)} has ${patternText}`;
        return { status: expectsOne ? "pass" : "fail", detail, reason: null, witness: list[hit]! };
      }
      if (census.complete && truths.every((t) => t === "no")) {
        const detail =
          list.length === 0
            ? `no ${scopeWord} was found`
            : list.length === 1
              ? `the only ${scopeWord} does not have ${patternText}`
              : `none of the ${plural(list.length, scopeWord)} has ${patternText}`;
        return { status: expectsOne ? "fail" : "pass", detail, reason: null, witness: null };
      }
      return undecided(census, `the method cannot tell whether an ${scopeWord} has ${patternText}`);
    }
    case "every-attractor": {
      const truths = list.map((a) => satisfies(a.reading, pattern!));
      const miss = truths.indexOf("no");
      if (miss >= 0)
        return {
          status: "fail",
          detail: `${describeAttractor(list[miss]!)} does not have ${patternText}`,
          reason: null,
          witness: list[miss]!,
        };
      if (census.complete && truths.every((t) => t === "yes"))
        return {
          status: "pass",
          detail:
            list.length === 1
              ? `the only attractor has ${patternText}`
              : `all ${plural(list.length, "attractor")} have ${patternText}`,
          reason: null,
          witness: null,
        };
      return undecided(census, `the method cannot tell whether every attractor has ${patternText}`);
    }
    case "fixed-point-count": {
      const definite = list.filter((a) => isFixedPointReading(a.reading)).length;
      const possible = list.filter((a) => !a.reading.includes("~")).length;
      const upper = census.fixedPointsComplete ? possible : Infinity;
      const status = compare(outcome.comparison, definite, upper, outcome.count);
      const found =
        definite === upper ? plural(definite, "fixed point") : `at least ${plural(definite, "fixed point")}`;
      const detail = `${found}; expected ${COMPARISON_WORDS[outcome.comparison]} ${outcome.count}`;
      if (status === "undecided")
        return { ...undecided(census, detail), detail: `${detail}; ${census.gap?.text ?? "the count is not known"}` };
      return { status, detail, reason: null, witness: null };
    }
    case "attractor-count": {
      const lower = list.length;
      const upper = census.complete ? lower : Infinity;
      const status = compare(outcome.comparison, lower, upper, outcome.count);
      const detail = `${count("attractor")}; expected ${COMPARISON_WORDS[outcome.comparison]} ${outcome.count}`;
      if (status === "undecided")
        return { ...undecided(census, detail), detail: `${detail}; ${census.gap?.text ?? "the count is not known"}` };
      return { status, detail, reason: null, witness: null };
    }
  }
}
