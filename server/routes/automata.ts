// The block-emulation hierarchy of the elementary cellular automata, for any signed-in user: read the stored
// hierarchy (small block sizes are computed on first request and stored), one rule's emulations, one witness.
// Larger block sizes are computed only by a background run ("eca-hierarchy") started in a project.
import type { Knex } from "knex";
import { z } from "zod";
import {
  Hierarchy,
  HierarchyQuery,
  HierarchySummary,
  RuleEmulations,
  RuleParams,
  RuleQuery,
  WitnessQuery,
  WitnessReport,
} from "@shared/schemas/automata";
import { findPair, hierarchyPairs, listHierarchies, rulePairs } from "../db/repositories/eca-hierarchies";
import { HttpError } from "../http/errors";
import { routeGroup, signedIn, type RouteGroup } from "../http/route-group";
import { hierarchySymmetryClasses, symmetryClassOf, witnessChecks } from "../services/automata/eca-engine";
import { hierarchyStore } from "../services/automata/stored-hierarchy";

export function automataRoutes(deps: { db: Knex }): RouteGroup {
  const { db } = deps;
  const routes = routeGroup({ mountPath: "/automata", tag: "automata", db });
  const store = hierarchyStore(db);

  routes.get("/hierarchies", {
    summary: "The stored hierarchies (block sizes, when and by whom computed)",
    access: signedIn,
    response: z.array(HierarchySummary),
    async handler() {
      const list = await listHierarchies(db);
      return list.map(({ emulateNothing: _omit, ...summary }) => summary);
    },
  });

  routes.get("/hierarchy", {
    summary: "The hierarchy up to a block size: every pair with its least block size, and the symmetry classes",
    access: signedIn,
    query: HierarchyQuery,
    response: Hierarchy,
    async handler({ query: key, user }) {
      const { hierarchy, computedNow } = await store.storedOrInline(key, user.id);
      return {
        ...hierarchy,
        pairs: await hierarchyPairs(db, hierarchy.id),
        symmetryClasses: hierarchySymmetryClasses(),
        computedNow,
      };
    },
  });

  routes.get("/rules/:rule", {
    summary: "One rule's emulations: the rules it emulates and those that emulate it, with witnesses",
    access: signedIn,
    params: RuleParams,
    query: RuleQuery,
    response: RuleEmulations,
    async handler({ params: { rule }, query: key, user }) {
      const { hierarchy } = await store.storedOrInline(key, user.id);
      const { emulates, emulatedBy } = await rulePairs(db, hierarchy.id, rule);
      return {
        rule,
        maxBlock: key.maxBlock,
        timeMode: key.timeMode,
        symmetryClass: symmetryClassOf(rule),
        emulates,
        emulatedBy,
      };
    },
  });

  routes.get("/witness", {
    summary: "The witness of one emulation, with the eight checks of the definition and the verifier's verdict",
    access: signedIn,
    query: WitnessQuery,
    response: WitnessReport,
    async handler({ query: { source, target, ...key }, user }) {
      const { hierarchy } = await store.storedOrInline(key, user.id);
      const pair = await findPair(db, hierarchy.id, source, target);
      if (!pair) {
        throw new HttpError(
          404,
          "NO_EMULATION",
          `Rule ${source} does not emulate rule ${target} with any block size up to ${key.maxBlock}`,
          { source, target, maxBlock: key.maxBlock },
        );
      }
      const { verified, checks } = witnessChecks(source, target, pair.witness);
      return { source, target, minBlock: pair.minBlock, witness: pair.witness, verified, checks };
    },
  });

  return routes;
}
