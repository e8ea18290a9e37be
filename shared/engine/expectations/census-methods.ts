// The built-in attractor methods and the order they are tried in. Exact state-space analysis decides everything
// up to its size limit (synchronous: Kauffman's functional-graph view, J. Theor. Biol. 1969; asynchronous: terminal
// components after Thomas, J. Theor. Biol. 1991). Above it, SAT enumerates fixed points completely and cycles up to a
// length (Dubrova and Teslenko, IEEE/ACM TCBB 2011), and one synchronous trajectory answers reachability from a state.
import { compareStateIndices, rotateToSmallest } from "../bits";
import { EngineError } from "../errors";
import { stateFromString, stateToString, type BooleanNetwork } from "../network";
import { satCycles, satFixedPoints } from "../sat";
import { asynchronousAttractors, analyseSynchronous, MAX_ASYNC_NODES } from "../state-graph";
import { bytesFromString, bytesToString, successorTable, trajectory, MAX_TABLE_NODES } from "../update";
import {
  MAX_LISTED_STATES,
  readingOfIndices,
  readingOfStates,
  type AttractorCensus,
  type AttractorMethod,
  type CensusAttractor,
} from "./attractor-census";

export const METHOD = {
  exactSynchronous: "exact-synchronous",
  exactAsynchronous: "exact-asynchronous",
  satCycles: "sat-cycles",
  satFixedPoints: "sat-fixed-points",
  trajectory: "synchronous-trajectory",
} as const;

function listed(states: ArrayLike<number>, n: number): string[] {
  const out: string[] = [];
  for (let q = 0; q < Math.min(states.length, MAX_LISTED_STATES); q++) out.push(stateToString(states[q]!, n));
  return out;
}

function fromIndices(states: ArrayLike<number>, n: number): CensusAttractor {
  return { reading: readingOfIndices(states, n), size: states.length, states: listed(states, n) };
}

function exactCensus(method: string, attractors: CensusAttractor[]): AttractorCensus {
  return { method, attractors, complete: true, fixedPointsComplete: true, gap: null };
}

/** The cycle a synchronous walk from `start` ends on, by the successor table (indices, dynamics order). */
function cycleFrom(successors: Uint32Array, start: number): number[] {
  const seen = new Map<number, number>();
  const path: number[] = [];
  let x = start;
  while (!seen.has(x)) {
    seen.set(x, path.length);
    path.push(x);
    x = successors[x]!;
  }
  return path.slice(seen.get(x)!);
}

/** Exact synchronous analysis (up to 24 nodes); also answers fixed-point questions for either update. */
export function exactSynchronousMethod(maxNodes: number = MAX_TABLE_NODES): AttractorMethod {
  return {
    name: METHOD.exactSynchronous,
    accepts: (net, update, scope) =>
      net.names.length <= Math.min(maxNodes, MAX_TABLE_NODES) &&
      (update === "synchronous" || scope.kind === "fixed-points"),
    census(net, _update, scope, options) {
      const n = net.names.length;
      if (scope.kind === "all") {
        const analysis = analyseSynchronous(net, options);
        return exactCensus(
          METHOD.exactSynchronous,
          analysis.attractors.map((a) => fromIndices(a.states, n)),
        );
      }
      const successors = successorTable(net, options);
      if (scope.kind === "fixed-points") {
        const found: CensusAttractor[] = [];
        for (let s = 0; s < successors.length; s++) if (successors[s] === s) found.push(fromIndices([s], n));
        found.sort((a, b) => (a.states[0]! < b.states[0]! ? -1 : 1));
        return exactCensus(METHOD.exactSynchronous, found);
      }
      const cycle = rotateToSmallest(
        cycleFrom(successors, stateFromString(scope.state)),
        (a, b) => compareStateIndices(a, b, n) < 0,
      );
      return exactCensus(METHOD.exactSynchronous, [fromIndices(cycle, n)]);
    },
  };
}

/** Exact asynchronous attractors (up to 22 nodes): all of them, or those reachable from a state. */
export function exactAsynchronousMethod(maxNodes: number = MAX_ASYNC_NODES): AttractorMethod {
  return {
    name: METHOD.exactAsynchronous,
    accepts: (net, update, scope) =>
      update === "asynchronous" &&
      scope.kind !== "fixed-points" &&
      net.names.length <= Math.min(maxNodes, MAX_ASYNC_NODES),
    census(net, _update, scope, options) {
      const n = net.names.length;
      let attractors = asynchronousAttractors(net, options).attractors;
      if (scope.kind === "reachable-from") {
        const reached = asynchronousReach(net, stateFromString(scope.state));
        attractors = attractors.filter((a) => reached[a.states[0]!] === 1);
      }
      return exactCensus(
        METHOD.exactAsynchronous,
        attractors.map((a) => fromIndices(a.states, n)),
      );
    },
  };
}

/** reached[s] = 1 for every state the asynchronous dynamics can reach from `start` (breadth first). */
function asynchronousReach(net: BooleanNetwork, start: number): Uint8Array {
  const image = successorTable(net);
  const reached = new Uint8Array(image.length);
  const queue = new Uint32Array(image.length);
  let head = 0;
  let tail = 0;
  reached[start] = 1;
  queue[tail++] = start;
  while (head < tail) {
    const s = queue[head++]!;
    let flips = (image[s]! ^ s) >>> 0;
    while (flips !== 0) {
      const bit = (flips & -flips) >>> 0;
      const t = (s ^ bit) >>> 0;
      if (reached[t] === 0) {
        reached[t] = 1;
        queue[tail++] = t;
      }
      flips = (flips ^ bit) >>> 0;
    }
  }
  return reached;
}

/** One synchronous trajectory from a state, for networks of any size: exact once it closes within `maxSteps`. */
export function trajectoryMethod(maxSteps: number): AttractorMethod {
  return {
    name: METHOD.trajectory,
    accepts: (_net, update, scope) => update === "synchronous" && scope.kind === "reachable-from",
    census(net, _update, scope) {
      if (scope.kind !== "reachable-from") throw new EngineError("BAD_SCOPE", "a trajectory needs a start state");
      const rows = trajectory(net, bytesFromString(scope.state), {
        scheme: "synchronous",
        steps: maxSteps,
        stopAtRepeat: true,
      }).map(bytesToString);
      const last = rows[rows.length - 1]!;
      const first = rows.indexOf(last);
      if (first === rows.length - 1)
        return {
          method: METHOD.trajectory,
          attractors: [],
          complete: false,
          fixedPointsComplete: false,
          gap: { reason: "trajectory-bound", text: `the trajectory did not close within ${maxSteps} steps` },
        };
      const ordered = rotateToSmallest(rows.slice(first, rows.length - 1), (a, b) => a < b);
      return exactCensus(METHOD.trajectory, [
        { reading: readingOfStates(ordered), size: ordered.length, states: ordered.slice(0, MAX_LISTED_STATES) },
      ]);
    },
  };
}

/** Synchronous fixed points and cycles up to `maxLength` by SAT, for networks of any size. */
export function satCyclesMethod(maxLength: number, maxSolutions: number): AttractorMethod {
  return {
    name: METHOD.satCycles,
    accepts: (_net, update, scope) => update === "synchronous" && scope.kind === "all",
    census(net, _update, _scope, options) {
      const found = satCycles(net, maxLength, { ...options, maxSolutions });
      return {
        method: METHOD.satCycles,
        attractors: found.cycles.map((c) => ({
          reading: readingOfStates(c.states),
          size: c.length,
          states: c.states.slice(0, MAX_LISTED_STATES),
        })),
        complete: false,
        fixedPointsComplete: found.complete,
        gap: found.complete
          ? { reason: "cycle-bound", text: `a cycle longer than ${maxLength} may exist` }
          : { reason: "solution-cap", text: `the search stopped at its cap of ${maxSolutions} attractors` },
      };
    },
  };
}

/**
 * Fixed points by SAT, for networks of any size and either update (a fixed point is an attractor under both).
 * Asked for all asynchronous attractors it lists only the fixed points: the others need the trap-space method.
 */
export function satFixedPointsMethod(maxSolutions: number): AttractorMethod {
  return {
    name: METHOD.satFixedPoints,
    accepts: (_net, update, scope) =>
      scope.kind === "fixed-points" || (update === "asynchronous" && scope.kind === "all"),
    census(net, _update, scope, options) {
      const found = satFixedPoints(net, { ...options, maxSolutions });
      const attractors = found.states.map((s) => ({ reading: s, size: 1, states: [s] }));
      const cap = {
        reason: "solution-cap" as const,
        text: `the search stopped at its cap of ${maxSolutions} fixed points`,
      };
      if (scope.kind === "fixed-points")
        return {
          method: METHOD.satFixedPoints,
          attractors,
          complete: found.complete,
          fixedPointsComplete: found.complete,
          gap: found.complete ? null : cap,
        };
      return {
        method: METHOD.satFixedPoints,
        attractors,
        complete: false,
        fixedPointsComplete: found.complete,
        gap: found.complete
          ? {
              reason: "needs-trap-spaces",
              text: `asynchronous attractors other than fixed points are computed exactly only up to ${MAX_ASYNC_NODES} nodes; larger models need the trap-space method`,
            }
          : cap,
      };
    },
  };
}
