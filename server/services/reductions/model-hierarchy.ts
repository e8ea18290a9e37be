// The project's model hierarchy: approved reductions between stored models, closed under composition. A composed
// edge F -> H (from F -> G and G -> H) is shown only when its composed certificate passes the independent verifier,
// so the drawing never claims more than can be re-checked.
import type { Knex } from "knex";
import { composeCertificates, verifyCertificate, type ReductionCertificate } from "@shared/engine/certificates";
import type { Certificate, HierarchyGraph, ReductionNotion } from "@shared/schemas/reductions";
import { listModels } from "../../db/repositories/models";
import { approvedModelEdges } from "../../db/repositories/reductions";

export interface ApprovedEdge {
  id: string;
  notion: ReductionNotion;
  timeScale: number;
  sourceModelId: string;
  targetModelId: string;
  certificate: Certificate;
}

interface Path {
  source: string;
  target: string;
  certificate: ReductionCertificate;
  reductionIds: string[];
}

/** Compositions longer than this many reductions are not attempted: chains in a project are short and each costs a verification. */
const MAX_CHAIN = 4;
const MAX_COMPOSED = 200;

export function composeHierarchy(models: HierarchyGraph["nodes"], approved: ApprovedEdge[]): HierarchyGraph {
  const edges = new Map<string, HierarchyGraph["edges"][number]>();
  const add = (e: HierarchyGraph["edges"][number]) => {
    const key = `${e.source}|${e.target}|${e.notion}|${e.timeScale}`;
    if (!edges.has(key)) edges.set(key, e);
  };
  for (const a of approved) {
    add({
      source: a.sourceModelId,
      target: a.targetModelId,
      notion: a.notion,
      timeScale: a.timeScale,
      reductionIds: [a.id],
      isComposed: false,
      isVerified: true,
    });
  }
  let frontier: Path[] = approved.map((a) => ({
    source: a.sourceModelId,
    target: a.targetModelId,
    certificate: a.certificate as ReductionCertificate,
    reductionIds: [a.id],
  }));
  let composedCount = 0;
  for (let length = 2; length <= MAX_CHAIN && frontier.length && composedCount < MAX_COMPOSED; length++) {
    const next: Path[] = [];
    for (const p of frontier) {
      for (const a of approved) {
        if (a.sourceModelId !== p.target || a.targetModelId === p.source || p.reductionIds.includes(a.id)) continue;
        if (composedCount >= MAX_COMPOSED) break;
        let composed: ReductionCertificate;
        try {
          composed = composeCertificates(p.certificate, a.certificate as ReductionCertificate);
        } catch {
          continue; // different notions that do not compose, or the middle model changed between the two proofs
        }
        composedCount++;
        if (!verifyCertificate(composed).valid) continue;
        const path = {
          source: p.source,
          target: a.targetModelId,
          certificate: composed,
          reductionIds: [...p.reductionIds, a.id],
        };
        next.push(path);
        add({
          source: path.source,
          target: path.target,
          notion: composed.notion,
          timeScale: composed.time,
          reductionIds: path.reductionIds,
          isComposed: true,
          isVerified: true,
        });
      }
    }
    frontier = next;
  }
  return { nodes: models, edges: [...edges.values()] };
}

/** The hierarchy of a project: its models (at their latest revision) joined by its approved reductions. */
export async function projectModelHierarchy(db: Knex, projectId: string): Promise<HierarchyGraph> {
  const models = (await listModels(db, projectId)).map((m) => ({
    modelId: m.id,
    name: m.name,
    nodeCount: m.nodeCount,
    revision: m.latestRevision,
  }));
  return composeHierarchy(models, await approvedModelEdges(db, projectId));
}
