// The trap-space census for asynchronous outcomes on models too large for the exact asynchronous analysis. Every
// minimal trap space holds at least one asynchronous attractor, and distinct minimal trap spaces are disjoint
// (Klarner, Bockmayr, Siebert, Natural Computing 2015), so each one is listed as an attractor known by its fixed
// nodes, its free nodes unknown ("*"). Attractors outside every minimal trap space may exist, so the list is never
// claimed complete for attractors; it is complete for fixed points when the enumeration finished.
import { DEFAULT_TRAP_SPACE_LIMIT, MAX_TRAP_SPACE_NODES, trapSpaces } from "../trap-spaces";
import type { AttractorMethod, CensusAttractor } from "./attractor-census";

export const TRAP_SPACE_METHOD = "minimal-trap-spaces";

export function trapSpaceMethod(limit: number = DEFAULT_TRAP_SPACE_LIMIT): AttractorMethod {
  return {
    name: TRAP_SPACE_METHOD,
    accepts: (net, update, scope) =>
      update === "asynchronous" && scope.kind === "all" && net.names.length <= MAX_TRAP_SPACE_NODES,
    census(net, _update, _scope, options) {
      const search = trapSpaces(net, { kind: "minimal", limit, ...options });
      const attractors: CensusAttractor[] = search.trapSpaces.map((t) => {
        const fixedPoint = !t.pattern.includes("-");
        return {
          reading: t.pattern.replaceAll("-", "*"),
          size: fixedPoint ? 1 : null,
          states: fixedPoint ? [t.pattern] : [],
        };
      });
      return {
        method: TRAP_SPACE_METHOD,
        attractors,
        complete: false,
        fixedPointsComplete: search.complete,
        gap: search.complete
          ? {
              reason: "outside-trap-spaces",
              text: "attractors outside every minimal trap space, and the values of free nodes, are not known to this method",
            }
          : { reason: "solution-cap", text: `the search stopped at its cap of ${limit} minimal trap spaces` },
      };
    },
  };
}
