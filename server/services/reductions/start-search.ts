// A search is a run of kind "reduction-search" on the source's latest revision. The networks are fixed at
// submission (their rule text goes into the run's parameters), so a later edit of either model cannot change what
// the run proves. What zod cannot check (sizes the engine accepts, node names of the source) is checked here.
import { isDeepStrictEqual } from "node:util";
import type { z } from "zod";
import { networkToCertificate } from "@shared/engine/certificates";
import { MAX_SAT_COARSE_GRAINING_NODES } from "@shared/engine/coarse-graining";
import type { SearchBody } from "@shared/schemas/reductions";
import type { Run } from "@shared/schemas/runs";
import { findRevision } from "../../db/repositories/model-revisions";
import { HttpError } from "../../http/errors";
import { submitRun, type LifecycleDeps } from "../../jobs/run-lifecycle";
import { latestRevisionNetwork, type RevisionNetwork } from "./revision-network";
import { MAX_TABULATED_SOURCE_NODES, MAX_TARGET_NODES } from "./search-limits";

type Search = z.output<typeof SearchBody>;

function checkSearch(search: Search, source: RevisionNetwork, target: RevisionNetwork | null): void {
  const n = source.network.names.length;
  // Coarse-graining of a larger source is decided by SAT on the observed nodes' cone (search-plan.ts).
  const tabulates = search.mode === "given-target" && search.notion === "dynamical-embedding";
  if (search.mode === "coarse-grain" && n > MAX_SAT_COARSE_GRAINING_NODES) {
    throw new HttpError(
      400,
      "TOO_LARGE",
      `sourceModelId: "${source.modelName}" has ${n} nodes; coarse-graining by SAT accepts at most ${MAX_SAT_COARSE_GRAINING_NODES}`,
    );
  }
  if (tabulates && n > MAX_TABULATED_SOURCE_NODES) {
    throw new HttpError(
      400,
      "TOO_LARGE",
      `sourceModelId: "${source.modelName}" has ${n} nodes; this notion enumerates all states and accepts at most ${MAX_TABULATED_SOURCE_NODES}`,
    );
  }
  if (target && target.network.names.length > MAX_TARGET_NODES) {
    throw new HttpError(
      400,
      "TOO_LARGE",
      `targetModelId: "${target.modelName}" has ${target.network.names.length} nodes; targets have at most ${MAX_TARGET_NODES}`,
    );
  }
  if (target && isDeepStrictEqual(networkToCertificate(source.network), networkToCertificate(target.network))) {
    throw new HttpError(
      400,
      "SELF_REDUCTION",
      `targetModelId: "${target.modelName}" has the same rules as "${source.modelName}" (F = G proves nothing)`,
      [{ field: "body.targetModelId", message: "the target must differ from the source" }],
    );
  }
  if (search.mode === "coarse-grain") {
    if (new Set(search.observe).size !== search.observe.length)
      throw new HttpError(400, "INVALID_INPUT", "observe: a node is listed twice", [
        { field: "body.observe", message: "listed twice" },
      ]);
    const missing = search.observe.filter((name) => !source.network.names.includes(name));
    if (missing.length)
      throw new HttpError(
        400,
        "INVALID_INPUT",
        `observe: ${missing.map((m) => `"${m}"`).join(", ")} ${missing.length > 1 ? "are not nodes" : "is not a node"} of "${source.modelName}"`,
        [{ field: "body.observe", message: "unknown node" }],
      );
  }
}

export async function startSearch(
  deps: LifecycleDeps,
  by: { projectId: string; userId: string },
  search: Search,
): Promise<{ run: Run; reused: boolean }> {
  const { db } = deps;
  if (search.mode === "given-target" && search.targetModelId === search.sourceModelId) {
    throw new HttpError(
      400,
      "SELF_REDUCTION",
      "targetModelId: choose another model than the source (F = G proves nothing)",
      [{ field: "body.targetModelId", message: "the target must differ from the source" }],
    );
  }
  const source = await latestRevisionNetwork(db, by.projectId, search.sourceModelId, "sourceModelId");
  const target =
    search.mode === "given-target"
      ? await latestRevisionNetwork(db, by.projectId, search.targetModelId, "targetModelId")
      : null;
  checkSearch(search, source, target);
  const ruleTextOf = async (r: RevisionNetwork) => (await findRevision(db, r.modelId, r.revision))!.ruleText;
  const params = {
    search,
    sourceRevisionId: source.revisionId,
    targetRevisionId: target?.revisionId ?? null,
    sourceRuleText: await ruleTextOf(source),
    targetRuleText: target ? await ruleTextOf(target) : null,
  };
  return submitRun(deps, {
    projectId: by.projectId,
    startedBy: by.userId,
    body: { kind: "reduction-search", modelRevisionId: source.revisionId, params },
    audit: { action: "reduction.search", details: { mode: search.mode } },
  });
}
