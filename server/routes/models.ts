// /api/projects/:projectId/models: models, their immutable revisions, uploads, exports and the analyses that are
// small enough to answer within a request (larger state spaces go through runs). The work is in
// server/services/models; these handlers parse, call it and answer.
import type { RequestHandler } from "express";
import type { Knex } from "knex";
import multer from "multer";
import {
  AttractorsQuery,
  CreateModelBody,
  ExportQuery,
  GenerateModelBody,
  MODEL_UPLOAD_LIMIT_BYTES,
  ModelDetail,
  ModelList,
  ModelParams,
  NewRevisionBody,
  PerturbationBody,
  PerturbationResult,
  RevisionList,
  RevisionParams,
  StructureResult,
  SynchronousResult,
  TrajectoryBody,
  TrajectoryResult,
  UploadFields,
  UploadPreview,
  ValidateBody,
  ValidateResult,
} from "@shared/schemas/models";
import { ProjectParams } from "@shared/schemas/projects";
import { findModelFile } from "../db/repositories/model-files";
import { listModels } from "../db/repositories/models";
import type { Logger } from "pino";
import { HttpError } from "../http/errors";
import type { LifecycleDeps } from "../jobs/run-lifecycle";
import { checkInBackground } from "../services/expectations/expectation-check";
import { project, routeGroup, type RouteGroup } from "../http/route-group";
import { modelDetail, modelRevisions, storedRevision } from "../services/models/model-detail";
import { exportModel } from "../services/models/model-formats";
import { createModelFromRules, generateModel, importModel } from "../services/models/new-model";
import { reviseModel } from "../services/models/new-revision";
import { previewUpload } from "../services/models/upload-preview";
import { checkTrajectorySize, comparePerturbation, revisionAttractors } from "../services/models/revision-analyses";
import { INLINE_INPUT_CHARS, inPlaceIfSmall } from "../workers/interactive-pool";

/** Models up to this many nodes get their trajectory and structure view on the request thread. */
const INLINE_VIEW_NODES = 200;

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MODEL_UPLOAD_LIMIT_BYTES, files: 1, fields: 10 },
});

/** Reads the multipart form into req.file and req.body, answering its failures in the API's error shape. */
const readUploadForm: RequestHandler = (req, res, next) => {
  upload.single("file")(req, res, (err: unknown) => {
    if (err instanceof multer.MulterError) {
      if (err.code === "LIMIT_FILE_SIZE")
        return next(
          new HttpError(413, "TOO_LARGE", `Model files may be at most ${MODEL_UPLOAD_LIMIT_BYTES / (1024 * 1024)} MB`),
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
};

export function modelsRoutes(deps: { db: Knex; log: Logger; runs: LifecycleDeps }): RouteGroup {
  const { db } = deps;
  const routes = routeGroup({ mountPath: "/projects/:projectId/models", tag: "models", db });
  const read = project("project:read");
  const write = project("model:write");

  routes.get("/", {
    summary: "List the project's models with their latest revision",
    access: read,
    params: ProjectParams,
    response: ModelList,
    handler: ({ project }) => listModels(db, project.id),
  });

  routes.post("/validate", {
    summary: "Check rule text without storing it: every problem with its line and column",
    access: read,
    params: ProjectParams,
    body: ValidateBody,
    response: ValidateResult,
    handler: ({ body }) =>
      inPlaceIfSmall(body.ruleText.length <= INLINE_INPUT_CHARS, "validateRuleText", body.ruleText),
  });

  routes.post("/", {
    summary: "Create a model from rule text",
    access: write,
    params: ProjectParams,
    body: CreateModelBody,
    response: ModelDetail,
    status: 201,
    handler: ({ body, project, user }) => createModelFromRules(db, { projectId: project.id, userId: user.id }, body),
  });

  routes.post("/upload", {
    summary: "Import a model from an SBML-qual, rule text or truth-table CSV file",
    access: write,
    params: ProjectParams,
    before: [readUploadForm],
    files: ["file"],
    body: UploadFields,
    response: ModelDetail,
    status: 201,
    handler({ req, body, project, user }) {
      const file = req.file;
      if (!file) throw new HttpError(400, "INVALID_INPUT", 'Attach the model as the form field "file"');
      return importModel(
        db,
        { projectId: project.id, userId: user.id },
        { originalName: file.originalname, mediaType: file.mimetype, bytes: file.buffer },
        body,
      );
    },
  });

  routes.post("/upload/preview", {
    summary: "Read an uploaded file without storing it: what it holds, warnings, and models with identical content",
    access: write,
    params: ProjectParams,
    before: [readUploadForm],
    files: ["file"],
    body: UploadFields,
    response: UploadPreview,
    handler({ req, project }) {
      const file = req.file;
      if (!file) throw new HttpError(400, "INVALID_INPUT", 'Attach the model as the form field "file"');
      return previewUpload(db, project.id, { originalName: file.originalname, bytes: file.buffer });
    },
  });

  routes.post("/generate", {
    summary: "Create a model from a generator: a cellular-automaton ring, an NK network or a threshold network",
    access: write,
    params: ProjectParams,
    body: GenerateModelBody,
    response: ModelDetail,
    status: 201,
    handler: ({ body, project, user }) => generateModel(db, { projectId: project.id, userId: user.id }, body),
  });

  routes.get("/:modelId", {
    summary: "Read a model with its latest revision",
    access: read,
    params: ModelParams,
    response: ModelDetail,
    handler: ({ params }) => modelDetail(db, params.projectId, params.modelId),
  });

  routes.get("/:modelId/revisions", {
    summary: "List a model's revisions, newest first",
    access: read,
    params: ModelParams,
    response: RevisionList,
    handler: ({ params }) => modelRevisions(db, params.projectId, params.modelId),
  });

  routes.post("/:modelId/revisions", {
    summary: "Add a revision from edited rule text",
    access: write,
    params: ModelParams,
    body: NewRevisionBody,
    response: ModelDetail,
    status: 201,
    async handler({ params, body, project, user }) {
      const detail = await reviseModel(db, { projectId: project.id, userId: user.id }, params.modelId, body);
      // Every new revision is checked against the model's expectations, in the background.
      await checkInBackground(deps.runs, deps.log, {
        projectId: project.id,
        modelId: params.modelId,
        revisionId: detail.revision.id,
        startedBy: user.id,
      });
      return detail;
    },
  });

  routes.get("/:modelId/revisions/:revision", {
    summary: "Read a model with one of its revisions",
    access: read,
    params: RevisionParams,
    response: ModelDetail,
    handler: ({ params }) => modelDetail(db, params.projectId, params.modelId, params.revision),
  });

  routes.get("/:modelId/revisions/:revision/export", {
    summary: "Download a revision as SBML-qual, rule text or truth-table CSV",
    access: read,
    params: RevisionParams,
    query: ExportQuery,
    produces: "application/octet-stream",
    async handler({ params, query, res }) {
      const { model, stored } = await storedRevision(db, params.projectId, params.modelId, params.revision);
      const file = exportModel(stored.definition, query.format, `${model.name}-r${stored.revision}`);
      // attachment() guesses a type from the extension; ours is set after it so it wins.
      res.attachment(file.fileName);
      res.setHeader("Content-Type", file.mediaType);
      res.send(file.body);
    },
  });

  routes.get("/:modelId/revisions/:revision/original", {
    summary: "Download the file a revision was imported from, byte for byte",
    access: read,
    params: RevisionParams,
    produces: "application/octet-stream",
    async handler({ params, res }) {
      const { stored } = await storedRevision(db, params.projectId, params.modelId, params.revision);
      const file = await findModelFile(db, stored.id);
      if (!file) throw new HttpError(404, "NOT_FOUND", `Revision ${stored.revision} was not uploaded from a file`);
      // Served as an opaque download: the bytes are whatever the user sent and must never render in our origin.
      res.attachment(file.fileName);
      res.setHeader("Content-Type", "application/octet-stream");
      res.send(file.bytes);
    },
  });

  routes.get("/:modelId/revisions/:revision/attractors", {
    summary: "Every synchronous attractor with its basin, labelled by marker nodes (small models; else NEEDS_RUN)",
    access: read,
    params: RevisionParams,
    query: AttractorsQuery,
    response: SynchronousResult,
    async handler({ params, query }) {
      const { stored } = await storedRevision(db, params.projectId, params.modelId, params.revision);
      return revisionAttractors(db, stored, query.markers);
    },
  });

  routes.post("/:modelId/revisions/:revision/perturbation", {
    summary: "Attractors and phenotype basins before and after knock-outs, over-expression and fixed inputs",
    access: read,
    params: RevisionParams,
    body: PerturbationBody,
    response: PerturbationResult,
    async handler({ params, body }) {
      const { stored } = await storedRevision(db, params.projectId, params.modelId, params.revision);
      return comparePerturbation(db, stored, body);
    },
  });

  routes.post("/:modelId/revisions/:revision/trajectory", {
    summary: "One trajectory from a given state under a chosen update scheme (seeded when asynchronous)",
    access: read,
    params: RevisionParams,
    body: TrajectoryBody,
    response: TrajectoryResult,
    async handler({ params, body }) {
      const { stored } = await storedRevision(db, params.projectId, params.modelId, params.revision);
      checkTrajectorySize(stored, body);
      return inPlaceIfSmall(stored.nodeCount <= INLINE_VIEW_NODES, "revisionTrajectory", stored, body);
    },
  });

  routes.get("/:modelId/revisions/:revision/structure", {
    summary: "The signed interaction graph with per-node degrees and rules",
    access: read,
    params: RevisionParams,
    response: StructureResult,
    async handler({ params }) {
      const { stored } = await storedRevision(db, params.projectId, params.modelId, params.revision);
      return inPlaceIfSmall(stored.nodeCount <= INLINE_VIEW_NODES, "revisionStructure", stored);
    },
  });

  return routes;
}
