// /api/projects/:projectId/models: models, their immutable revisions, uploads, exports and the analyses that are
// small enough to answer within a request (larger state spaces go through runs). Input is read and checked
// completely before anything is stored, so a parse error never leaves a half-made model behind.
import { Router, type Request } from "express";
import type { Knex } from "knex";
import multer from "multer";
import seedrandom from "seedrandom";
import { z } from "zod";
import { EngineError } from "@shared/engine/errors";
import type { BooleanNetwork } from "@shared/engine/network";
import { compileDefinition, printRuleText, type ModelDefinition } from "@shared/engine/rules";
import { bytesFromString, bytesToString, trajectory } from "@shared/engine/update";
import {
  AttractorsQuery,
  CreateModelBody,
  ExportQuery,
  GenerateModelBody,
  INLINE_ANALYSIS_MAX_NODES,
  MODEL_UPLOAD_LIMIT_BYTES,
  ModelParams,
  NewRevisionBody,
  PerturbationBody,
  RevisionParams,
  TrajectoryBody,
  UploadFields,
  ValidateBody,
  type ModelDetail,
  type ModelSource,
  type PerturbationResult,
  type StructureResult,
  type SynchronousResult,
  type ValidateResult,
} from "@shared/schemas/models";
import { recordAudit } from "../db/repositories/audit-log";
import { findModelFile, insertModelFile, type ModelFile } from "../db/repositories/model-files";
import {
  findAnalysis,
  findAttractorRunResult,
  findRevision,
  insertRevision,
  listRevisions,
  storeAnalysis,
  type StoredRevision,
} from "../db/repositories/model-revisions";
import { findModel, insertModel, listModels, lockNextRevision, setLatestRevision } from "../db/repositories/models";
import { currentProject, currentUser, projectAccess } from "../http/auth";
import { HttpError } from "../http/errors";
import { validate } from "../http/validate";
import { generatedModel } from "../models/generated-model";
import { exportModel, readUpload } from "../models/model-formats";
import { readRules, ruleTextIssues, type ReadModel } from "../models/model-reading";
import { networkSummary } from "../models/network-summary";
import { perturbedNetwork } from "../models/perturbed-network";
import { structureView } from "../models/structure-view";
import { synchronousAttractors, withPhenotypes } from "../models/synchronous-view";

const ProjectParams = ModelParams.pick({ projectId: true });

const AttractorRunResult = z.object({
  nodeNames: z.array(z.string()),
  stateCount: z.number().int(),
  maxTransient: z.number().int(),
  meanTransient: z.number(),
  attractors: z.array(z.object({ length: z.number().int(), basin: z.number().int(), states: z.array(z.string()) })),
});

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MODEL_UPLOAD_LIMIT_BYTES, files: 1, fields: 10 },
});

interface NewModelInput extends ReadModel {
  name: string;
  description: string;
  ruleText: string;
  source: ModelSource;
  generator?: Record<string, unknown>;
  file?: ModelFile;
  action: string;
}

type CachedSynchronous = Omit<SynchronousResult, "markers">;

export function modelsRouter(deps: { db: Knex }): Router {
  const { db } = deps;
  const router = Router({ mergeParams: true });
  const read = projectAccess(db, "project:read");
  const write = projectAccess(db, "model:write");

  async function createModel(req: Request, input: NewModelInput): Promise<ModelDetail> {
    const project = currentProject(req);
    const user = currentUser(req);
    const modelId = await db.transaction(async (trx) => {
      const id = await insertModel(trx, {
        projectId: project.id,
        name: input.name,
        description: input.description,
        createdBy: user.id,
      });
      const revisionId = await insertRevision(trx, {
        modelId: id,
        revision: 1,
        definition: input.definition,
        ruleText: input.ruleText,
        network: networkSummary(input.definition, input.network),
        source: input.source,
        generator: input.generator ?? null,
        message: "",
        createdBy: user.id,
      });
      if (input.file) await insertModelFile(trx, revisionId, input.file);
      await recordAudit(trx, {
        projectId: project.id,
        actorId: user.id,
        action: input.action,
        target: id,
        details: {
          name: input.name,
          source: input.source,
          nodeCount: input.network.names.length,
          ...(input.file ? { fileName: input.file.fileName } : {}),
        },
      });
      return id;
    });
    return detail(project.id, modelId, 1);
  }

  async function detail(projectId: string, modelId: string, revision?: number): Promise<ModelDetail> {
    const model = await findModel(db, projectId, modelId);
    if (!model) throw new HttpError(404, "NOT_FOUND", "No such model in this project");
    const stored = await findRevision(db, model.id, revision ?? model.latestRevision);
    if (!stored) throw new HttpError(404, "NOT_FOUND", `Model ${model.name} has no revision ${revision}`);
    const { modelId: _m, definition: _d, ...rev } = stored;
    return { model, revision: rev };
  }

  async function loadRevision(req: Request): Promise<{ name: string; stored: StoredRevision }> {
    const { modelId, revision } = req.params as unknown as { modelId: string; revision: number };
    const model = await findModel(db, currentProject(req).id, modelId);
    if (!model) throw new HttpError(404, "NOT_FOUND", "No such model in this project");
    const stored = await findRevision(db, model.id, revision);
    if (!stored) throw new HttpError(404, "NOT_FOUND", `Model ${model.name} has no revision ${revision}`);
    return { name: model.name, stored };
  }

  function compileStored(definition: ModelDefinition): BooleanNetwork {
    return compileDefinition(definition);
  }

  function requireInlineSize(nodeCount: number, revisionId: string): void {
    if (nodeCount > INLINE_ANALYSIS_MAX_NODES) {
      throw new HttpError(
        409,
        "NEEDS_RUN",
        `This model has ${nodeCount} nodes; the exact synchronous analysis of more than ${INLINE_ANALYSIS_MAX_NODES} nodes runs as a background run (kind "attractors")`,
        { kind: "attractors", nodeCount, revisionId },
      );
    }
  }

  async function synchronousOf(stored: StoredRevision): Promise<CachedSynchronous> {
    const cached = await findAnalysis<CachedSynchronous>(db, stored.id, "synchronous");
    if (cached) return cached;
    const fromRun = fromAttractorRun(await findAttractorRunResult(db, stored.id));
    if (fromRun) {
      await storeAnalysis(db, stored.id, "synchronous", fromRun);
      return fromRun;
    }
    requireInlineSize(stored.nodeCount, stored.id);
    const result = synchronousAttractors(compileStored(stored.definition));
    await storeAnalysis(db, stored.id, "synchronous", result);
    return result;
  }

  /** An "attractors" run result (server/workers/tasks/attractors.ts) in the shape this API answers with. */
  function fromAttractorRun(result: unknown): CachedSynchronous | null {
    const parsed = AttractorRunResult.safeParse(result);
    if (!parsed.success) return null;
    const r = parsed.data;
    return {
      nodes: r.nodeNames,
      stateCount: r.stateCount,
      maxTransient: r.maxTransient,
      meanTransient: r.meanTransient,
      attractors: r.attractors.map((a) => ({ ...a, phenotype: null })),
    };
  }

  router.get("/", read, validate({ params: ProjectParams }), async (req, res) => {
    res.json({ data: await listModels(db, currentProject(req).id) });
  });

  router.post("/validate", read, validate({ params: ProjectParams, body: ValidateBody }), (req, res) => {
    const { ruleText } = req.body as { ruleText: string };
    const { issues, nodes, read: model } = ruleTextIssues(ruleText);
    const data: ValidateResult = {
      ok: issues.length === 0,
      nodeCount: model ? model.network.names.length : nodes.length,
      nodes: model ? [...model.network.names] : nodes,
      errors: issues,
    };
    res.json({ data });
  });

  router.post("/", write, validate({ params: ProjectParams, body: CreateModelBody }), async (req, res) => {
    const body = req.body as { name: string; description: string; ruleText: string };
    const model = readRules(body.ruleText);
    res
      .status(201)
      .json({
        data: await createModel(req, {
          ...model,
          name: body.name,
          description: body.description,
          ruleText: body.ruleText,
          source: "rules",
          action: "model.create",
        }),
      });
  });

  router.post(
    "/upload",
    write,
    validate({ params: ProjectParams }),
    (req, res, next) => {
      upload.single("file")(req, res, (err: unknown) => {
        if (err instanceof multer.MulterError) {
          if (err.code === "LIMIT_FILE_SIZE")
            return next(
              new HttpError(
                413,
                "TOO_LARGE",
                `Model files may be at most ${MODEL_UPLOAD_LIMIT_BYTES / (1024 * 1024)} MB`,
              ),
            );
          return next(new HttpError(400, "INVALID_INPUT", `Upload refused: ${err.message}`));
        }
        // Anything else the form parser throws (no boundary, a truncated body) is a malformed request, not our failure.
        if (err)
          return next(
            new HttpError(
              400,
              "INVALID_INPUT",
              `Upload refused: the form data could not be read (${(err as Error).message})`,
            ),
          );
        next();
      });
    },
    validate({ body: UploadFields }),
    async (req, res) => {
      const file = req.file;
      if (!file) throw new HttpError(400, "INVALID_INPUT", 'Attach the model as the form field "file"');
      const fileName = file.originalname.normalize("NFC").slice(-255);
      const model = readUpload(fileName, file.buffer);
      const body = req.body as { name?: string; description: string };
      const name = body.name ?? model.suggestedName ?? (fileName.replace(/\.[^.]+$/, "").trim() || "Imported model");
      const data = await createModel(req, {
        ...model,
        name: name.slice(0, 120),
        description: body.description,
        file: {
          fileName,
          mediaType: file.mimetype || "application/octet-stream",
          bytes: file.buffer,
          sizeBytes: file.size,
        },
        action: "model.import",
      });
      res.status(201).json({ data });
    },
  );

  router.post("/generate", write, validate({ params: ProjectParams, body: GenerateModelBody }), async (req, res) => {
    const body = req.body as z.infer<typeof GenerateModelBody>;
    const model = generatedModel(body.generator);
    const data = await createModel(req, {
      ...model,
      name: body.name,
      description: body.description,
      ruleText: printRuleText(model.definition),
      source: "generator",
      generator: body.generator,
      action: "model.generate",
    });
    res.status(201).json({ data });
  });

  router.get("/:modelId", read, validate({ params: ModelParams }), async (req, res) => {
    const { modelId } = req.params as { modelId: string };
    res.json({ data: await detail(currentProject(req).id, modelId) });
  });

  router.get("/:modelId/revisions", read, validate({ params: ModelParams }), async (req, res) => {
    const { modelId } = req.params as { modelId: string };
    const model = await findModel(db, currentProject(req).id, modelId);
    if (!model) throw new HttpError(404, "NOT_FOUND", "No such model in this project");
    res.json({ data: await listRevisions(db, model.id) });
  });

  router.post(
    "/:modelId/revisions",
    write,
    validate({ params: ModelParams, body: NewRevisionBody }),
    async (req, res) => {
      const { modelId } = req.params as { modelId: string };
      const body = req.body as { ruleText: string; message: string };
      const project = currentProject(req);
      const user = currentUser(req);
      const model = readRules(body.ruleText);
      const revision = await db.transaction(async (trx) => {
        const next = await lockNextRevision(trx, project.id, modelId);
        if (next === null) throw new HttpError(404, "NOT_FOUND", "No such model in this project");
        await insertRevision(trx, {
          modelId,
          revision: next,
          definition: model.definition,
          ruleText: body.ruleText,
          network: networkSummary(model.definition, model.network),
          source: "edit",
          message: body.message,
          createdBy: user.id,
        });
        await setLatestRevision(trx, modelId, next);
        await recordAudit(trx, {
          projectId: project.id,
          actorId: user.id,
          action: "model.revise",
          target: modelId,
          details: { revision: next, nodeCount: model.network.names.length },
        });
        return next;
      });
      res.status(201).json({ data: await detail(project.id, modelId, revision) });
    },
  );

  router.get("/:modelId/revisions/:revision", read, validate({ params: RevisionParams }), async (req, res) => {
    const { modelId, revision } = req.params as unknown as { modelId: string; revision: number };
    res.json({ data: await detail(currentProject(req).id, modelId, revision) });
  });

  router.get(
    "/:modelId/revisions/:revision/export",
    read,
    validate({ params: RevisionParams, query: ExportQuery }),
    async (req, res) => {
      const { name, stored } = await loadRevision(req);
      const { format } = req.query as unknown as { format: "sbml" | "rules" | "csv" };
      const file = exportModel(stored.definition, format, `${name}-r${stored.revision}`);
      // attachment() guesses a type from the extension; ours is set after it so it wins.
      res.attachment(file.fileName);
      res.setHeader("Content-Type", file.mediaType);
      res.send(file.body);
    },
  );

  router.get("/:modelId/revisions/:revision/original", read, validate({ params: RevisionParams }), async (req, res) => {
    const { stored } = await loadRevision(req);
    const file = await findModelFile(db, stored.id);
    if (!file) throw new HttpError(404, "NOT_FOUND", `Revision ${stored.revision} was not uploaded from a file`);
    // Served as an opaque download: the bytes are whatever the user sent and must never render in our origin.
    res.attachment(file.fileName);
    res.setHeader("Content-Type", "application/octet-stream");
    res.send(file.bytes);
  });

  router.get(
    "/:modelId/revisions/:revision/attractors",
    read,
    validate({ params: RevisionParams, query: AttractorsQuery }),
    async (req, res) => {
      const { stored } = await loadRevision(req);
      const { markers } = req.query as unknown as { markers: string[] };
      res.json({ data: withPhenotypes(await synchronousOf(stored), markers) });
    },
  );

  router.post(
    "/:modelId/revisions/:revision/perturbation",
    read,
    validate({ params: RevisionParams, body: PerturbationBody }),
    async (req, res) => {
      const { stored } = await loadRevision(req);
      const body = req.body as z.infer<typeof PerturbationBody>;
      requireInlineSize(stored.nodeCount, stored.id);
      const view = perturbedNetwork(compileStored(stored.definition), body);
      const before = withPhenotypes(await synchronousOf(stored), body.markers);
      const after = withPhenotypes(synchronousAttractors(view), body.markers);
      const phenotypes = new Map<string, { basinBefore: number; basinAfter: number }>();
      const tally = (result: SynchronousResult, key: "basinBefore" | "basinAfter") => {
        for (const a of result.attractors) {
          const label = a.phenotype ?? "";
          const entry = phenotypes.get(label) ?? { basinBefore: 0, basinAfter: 0 };
          entry[key] += a.basin;
          phenotypes.set(label, entry);
        }
      };
      tally(before, "basinBefore");
      tally(after, "basinAfter");
      const data: PerturbationResult = {
        before,
        after,
        phenotypes: [...phenotypes]
          .map(([phenotype, v]) => ({ phenotype, ...v }))
          .sort((a, b) => b.basinBefore - a.basinBefore || a.phenotype.localeCompare(b.phenotype)),
      };
      res.json({ data });
    },
  );

  router.post(
    "/:modelId/revisions/:revision/trajectory",
    read,
    validate({ params: RevisionParams, body: TrajectoryBody }),
    async (req, res) => {
      const { stored } = await loadRevision(req);
      const body = req.body as z.infer<typeof TrajectoryBody>;
      const net = compileStored(stored.definition);
      if (body.initial.length !== net.names.length) {
        throw new HttpError(
          400,
          "INVALID_INPUT",
          `The initial state has ${body.initial.length} values but the model has ${net.names.length} nodes`,
        );
      }
      const rng = body.scheme === "synchronous" ? undefined : seedrandom(String(body.seed));
      let rows: Uint8Array[];
      try {
        rows = trajectory(net, bytesFromString(body.initial), { scheme: body.scheme, steps: body.steps, rng });
      } catch (e) {
        if (e instanceof EngineError) throw new HttpError(400, "INVALID_INPUT", e.message);
        throw e;
      }
      res.json({
        data: {
          nodes: [...net.names],
          scheme: body.scheme,
          seed: rng ? body.seed : null,
          states: rows.map(bytesToString),
        },
      });
    },
  );

  router.get(
    "/:modelId/revisions/:revision/structure",
    read,
    validate({ params: RevisionParams }),
    async (req, res) => {
      const { stored } = await loadRevision(req);
      const net = compileStored(stored.definition);
      const data: StructureResult = structureView(stored.definition, net, stored.network.inputs);
      res.json({ data });
    },
  );

  return router;
}
