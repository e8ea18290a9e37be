// The block-emulation hierarchy of the elementary cellular automata, for any signed-in user: read the stored
// hierarchy (small block sizes are computed on first request and stored), one rule's emulations, one witness.
// Larger block sizes are computed only by a background run ("eca-hierarchy") started in a project.
import { Router } from "express";
import type { Knex } from "knex";
import {
  HierarchyQuery,
  INLINE_MAX_BLOCK,
  RuleParams,
  RuleQuery,
  WitnessQuery,
  type Hierarchy,
  type HierarchyParameters,
  type RuleEmulations,
  type WitnessReport,
} from "@shared/schemas/automata";
import { hierarchySymmetryClasses, symmetryClassOf, witnessChecks } from "../automata/eca-engine";
import { computeHierarchyRecord, recordFromRun } from "../automata/eca-hierarchy-compute";
import {
  findFinishedHierarchyRun,
  findHierarchy,
  findPair,
  hierarchyPairs,
  listHierarchies,
  rulePairs,
  saveHierarchy,
  type StoredHierarchy,
} from "../db/repositories/eca-hierarchies";
import { currentUser, requireUser } from "../http/auth";
import { HttpError } from "../http/errors";
import { validate } from "../http/validate";

function describe(key: HierarchyParameters): string {
  return `block sizes up to ${key.maxBlock}`;
}

function notStored(key: HierarchyParameters): HttpError {
  return new HttpError(
    404,
    "HIERARCHY_NOT_COMPUTED",
    `No hierarchy for ${describe(key)} is stored yet. Above block size ${INLINE_MAX_BLOCK} it is computed by a background ` +
      `"eca-hierarchy" run, which you can start in any project where your role may start runs.`,
    { maxBlock: key.maxBlock, timeMode: key.timeMode, radius: key.radius, inlineMaxBlock: INLINE_MAX_BLOCK },
  );
}

export function automataRouter(deps: { db: Knex }): Router {
  const { db } = deps;
  const router = Router();
  // Two requests for the same missing hierarchy share one computation instead of racing to store it.
  const computing = new Map<string, Promise<StoredHierarchy>>();

  async function storedOrInline(
    key: HierarchyParameters,
    userId: string,
  ): Promise<{ hierarchy: StoredHierarchy; computedNow: boolean }> {
    const found = await findHierarchy(db, key);
    if (found) return { hierarchy: found, computedNow: false };
    const run = await findFinishedHierarchyRun(db, key);
    if (run) {
      const record = recordFromRun(run, key);
      if (record) return { hierarchy: (await saveHierarchy(db, record)).hierarchy, computedNow: false };
    }
    if (key.maxBlock > INLINE_MAX_BLOCK) throw notStored(key);
    const id = `${key.maxBlock}/${key.timeMode}/${key.radius}`;
    let pending = computing.get(id);
    if (!pending) {
      pending = (async () => {
        const record = computeHierarchyRecord(key, { computedBy: userId });
        return (await saveHierarchy(db, record)).hierarchy;
      })().finally(() => computing.delete(id));
      computing.set(id, pending);
    }
    return { hierarchy: await pending, computedNow: true };
  }

  router.use(requireUser);

  router.get("/hierarchies", async (_req, res) => {
    const list = await listHierarchies(db);
    res.json({ data: list.map(({ emulateNothing: _omit, ...summary }) => summary) });
  });

  router.get("/hierarchy", validate({ query: HierarchyQuery }), async (req, res) => {
    const key = req.query as unknown as HierarchyParameters;
    const { hierarchy, computedNow } = await storedOrInline(key, currentUser(req).id);
    const body: Hierarchy = {
      ...hierarchy,
      pairs: await hierarchyPairs(db, hierarchy.id),
      symmetryClasses: hierarchySymmetryClasses(),
      computedNow,
    };
    res.json({ data: body });
  });

  router.get("/rules/:rule", validate({ params: RuleParams, query: RuleQuery }), async (req, res) => {
    const { rule } = req.params as unknown as { rule: number };
    const key = req.query as unknown as HierarchyParameters;
    const { hierarchy } = await storedOrInline(key, currentUser(req).id);
    const { emulates, emulatedBy } = await rulePairs(db, hierarchy.id, rule);
    const body: RuleEmulations = {
      rule,
      maxBlock: key.maxBlock,
      timeMode: key.timeMode,
      symmetryClass: symmetryClassOf(rule),
      emulates,
      emulatedBy,
    };
    res.json({ data: body });
  });

  router.get("/witness", validate({ query: WitnessQuery }), async (req, res) => {
    const { source, target, ...key } = req.query as unknown as HierarchyParameters & { source: number; target: number };
    const { hierarchy } = await storedOrInline(key, currentUser(req).id);
    const pair = await findPair(db, hierarchy.id, source, target);
    if (!pair) {
      throw new HttpError(
        404,
        "NO_EMULATION",
        `Rule ${source} does not emulate rule ${target} with any block size up to ${key.maxBlock}`,
        {
          source,
          target,
          maxBlock: key.maxBlock,
        },
      );
    }
    const { verified, checks } = witnessChecks(source, target, pair.witness);
    const body: WitnessReport = { source, target, minBlock: pair.minBlock, witness: pair.witness, verified, checks };
    res.json({ data: body });
  });

  return router;
}
