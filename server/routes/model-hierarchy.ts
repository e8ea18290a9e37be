// /api/projects/:projectId/model-hierarchy: the graph of the project's models joined by approved reductions.
import { Router } from "express";
import type { Knex } from "knex";
import { z } from "zod";
import { listModels } from "../db/repositories/models";
import { approvedModelEdges } from "../db/repositories/reductions";
import { currentProject, projectAccess } from "../http/auth";
import { validate } from "../http/validate";
import { composeHierarchy } from "../reductions/model-hierarchy";

export function modelHierarchyRouter(deps: { db: Knex }): Router {
  const router = Router({ mergeParams: true });
  router.get(
    "/",
    projectAccess(deps.db, "project:read"),
    validate({ params: z.object({ projectId: z.uuid() }) }),
    async (req, res) => {
      const projectId = currentProject(req).id;
      const models = (await listModels(deps.db, projectId)).map((m) => ({
        modelId: m.id,
        name: m.name,
        nodeCount: m.nodeCount,
        revision: m.latestRevision,
      }));
      res.json({ data: composeHierarchy(models, await approvedModelEdges(deps.db, projectId)) });
    },
  );
  return router;
}
