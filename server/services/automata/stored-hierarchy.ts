// The automaton hierarchy a request asks for: the stored one, else the one a finished background run computed
// (filed on first read), else computed within the request when the block size is small enough. Larger block sizes
// answer HIERARCHY_NOT_COMPUTED, naming the run kind that computes them.
import type { Knex } from "knex";
import { INLINE_MAX_BLOCK, type HierarchyParameters } from "@shared/schemas/automata";
import {
  findFinishedHierarchyRun,
  findHierarchy,
  saveHierarchy,
  type StoredHierarchy,
} from "../../db/repositories/eca-hierarchies";
import { HttpError } from "../../http/errors";
import { offThread } from "../../workers/interactive-pool";
import { recordFromRun } from "./eca-hierarchy-compute";

function notStored(key: HierarchyParameters): HttpError {
  return new HttpError(
    404,
    "HIERARCHY_NOT_COMPUTED",
    `No hierarchy for block sizes up to ${key.maxBlock} is stored yet. Above block size ${INLINE_MAX_BLOCK} it is computed by a background ` +
      `"eca-hierarchy" run, which you can start in any project where your role may start runs.`,
    { maxBlock: key.maxBlock, timeMode: key.timeMode, radius: key.radius, inlineMaxBlock: INLINE_MAX_BLOCK },
  );
}

export interface HierarchyStore {
  storedOrInline(
    key: HierarchyParameters,
    userId: string,
  ): Promise<{ hierarchy: StoredHierarchy; computedNow: boolean }>;
}

export function hierarchyStore(db: Knex): HierarchyStore {
  // Two requests for the same missing hierarchy share one computation instead of racing to store it.
  const computing = new Map<string, Promise<StoredHierarchy>>();
  return {
    async storedOrInline(key, userId) {
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
          const record = await offThread("computeHierarchyRecord", key, userId);
          return (await saveHierarchy(db, record)).hierarchy;
        })().finally(() => computing.delete(id));
        computing.set(id, pending);
      }
      return { hierarchy: await pending, computedNow: true };
    },
  };
}
