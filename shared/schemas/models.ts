// Request and response shapes of the models API (server validates with them, the client parses with them).
import { z } from "zod";
import { nodeRecord, PROTOTYPE_KEY_MESSAGE } from "./node-record";

export const MODEL_UPLOAD_LIMIT_BYTES = 5 * 1024 * 1024;
/** Above this many nodes the synchronous analysis is a run (a background job), not part of a request. */
export const INLINE_ANALYSIS_MAX_NODES = 16;

// `__proto__` is refused by name: as a key of a record (`fixed`) zod would otherwise drop it without a word, because
// assigning it to a plain object sets the prototype instead of adding the key. Rule text refuses it too.
export const nodeName = z
  .string()
  .regex(/^[A-Za-z_][A-Za-z0-9_]*$/, "must be a node name")
  .refine((name) => name !== "__proto__", PROTOTYPE_KEY_MESSAGE);

export const ModelParams = z.object({ projectId: z.uuid(), modelId: z.uuid() });
export const RevisionParams = ModelParams.extend({ revision: z.coerce.number().int().min(1).max(2_147_483_647) });

/** Where reading stopped (1-based); line 0 and column 0 when the problem concerns the whole file. */
export const ParseIssue = z.object({ line: z.number().int(), column: z.number().int(), message: z.string() });
export type ParseIssue = z.infer<typeof ParseIssue>;

export const ModelSource = z.enum(["rules", "sbml", "csv", "generator", "edit"]);
export type ModelSource = z.infer<typeof ModelSource>;

const Person = z.object({ id: z.string(), displayName: z.string() }).nullable();

export const ModelSummary = z.object({
  id: z.string(),
  projectId: z.string(),
  name: z.string(),
  description: z.string(),
  nodeCount: z.number().int(),
  latestRevision: z.number().int(),
  source: ModelSource,
  createdBy: Person,
  updatedBy: Person,
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ModelSummary = z.infer<typeof ModelSummary>;
export const ModelList = z.array(ModelSummary);

export const NetworkSummary = z.object({
  nodes: z.array(z.string()),
  edgeCount: z.number().int(),
  inputs: z.array(z.string()),
  thresholdNodes: z.array(z.string()),
});
export type NetworkSummary = z.infer<typeof NetworkSummary>;

export const RevisionSummary = z.object({
  id: z.string(),
  revision: z.number().int(),
  nodeCount: z.number().int(),
  source: ModelSource,
  message: z.string(),
  createdBy: Person,
  createdAt: z.string(),
  file: z.object({ fileName: z.string(), mediaType: z.string(), sizeBytes: z.number().int() }).nullable(),
});
export type RevisionSummary = z.infer<typeof RevisionSummary>;
export const RevisionList = z.array(RevisionSummary);

export const RevisionDetail = RevisionSummary.extend({
  ruleText: z.string(),
  network: NetworkSummary,
  generator: z.record(z.string(), z.unknown()).nullable(),
});
export type RevisionDetail = z.infer<typeof RevisionDetail>;

export const ModelDetail = z.object({ model: ModelSummary, revision: RevisionDetail });
export type ModelDetail = z.infer<typeof ModelDetail>;

export const CreateModelBody = z.object({
  name: z.string().trim().min(1).max(120),
  description: z.string().max(2000).default(""),
  ruleText: z.string().min(1).max(MODEL_UPLOAD_LIMIT_BYTES),
});
export type CreateModelBody = z.input<typeof CreateModelBody>;

export const UploadFields = z.object({
  name: z.string().trim().min(1).max(120).optional(),
  description: z.string().max(2000).default(""),
});

/** An upload read but not stored: what the person checks before saving, and models with identical content. */
export const UploadPreview = z.object({
  fileName: z.string(),
  suggestedName: z.string(),
  source: ModelSource,
  nodeCount: z.number().int(),
  nodes: z.array(z.string()),
  inputs: z.array(z.string()),
  firstRules: z.array(z.string()),
  moreRules: z.number().int(),
  /** The whole model as rule text, so "add as a revision" of an existing model needs no second upload. */
  ruleText: z.string(),
  warnings: z.array(z.string()),
  duplicates: z.array(z.object({ modelId: z.string(), name: z.string(), revision: z.number().int() })),
});
export type UploadPreview = z.infer<typeof UploadPreview>;

export const NewRevisionBody = z.object({
  ruleText: z.string().min(1).max(MODEL_UPLOAD_LIMIT_BYTES),
  message: z.string().max(500).default(""),
});
export type NewRevisionBody = z.input<typeof NewRevisionBody>;

export const ValidateBody = z.object({ ruleText: z.string().max(MODEL_UPLOAD_LIMIT_BYTES) });
export const ValidateResult = z.object({
  ok: z.boolean(),
  nodeCount: z.number().int(),
  nodes: z.array(z.string()),
  errors: z.array(ParseIssue),
});
export type ValidateResult = z.infer<typeof ValidateResult>;

export const GeneratorSpec = z.discriminatedUnion("kind", [
  z.object({
    kind: z.literal("eca"),
    rule: z.number().int().min(0),
    // Radius 3 rule numbers exceed what JSON numbers hold exactly, so the API stops at radius 2.
    radius: z.number().int().min(1).max(2).default(1),
    cells: z.number().int().min(3).max(200),
  }),
  z.object({
    kind: z.literal("nk"),
    n: z.number().int().min(1).max(200),
    k: z.number().int().min(0).max(10),
    p: z.number().min(0).max(1).default(0.5),
    seed: z.number().int().min(0),
  }),
  z.object({
    kind: z.literal("threshold"),
    n: z.number().int().min(1).max(200),
    k: z.number().int().min(1).max(10),
    tie: z.enum(["keep", "zero"]).default("keep"),
    seed: z.number().int().min(0),
  }),
]);
export type GeneratorSpec = z.input<typeof GeneratorSpec>;
export type GeneratorParams = z.infer<typeof GeneratorSpec>;

export const GenerateModelBody = z.object({
  name: z.string().trim().min(1).max(120),
  description: z.string().max(2000).default(""),
  generator: GeneratorSpec,
});
export type GenerateModelBody = z.input<typeof GenerateModelBody>;

export const ExportFormat = z.enum(["sbml", "rules", "csv"]);
export type ExportFormat = z.infer<typeof ExportFormat>;
export const ExportQuery = z.object({ format: ExportFormat });

// --- analyses ---

export const AttractorsQuery = z.object({
  markers: z
    .string()
    .optional()
    .transform((s) =>
      s
        ? s
            .split(",")
            .map((m) => m.trim())
            .filter(Boolean)
        : [],
    ),
});

export const AttractorRow = z.object({
  length: z.number().int(),
  basin: z.number().int(),
  states: z.array(z.string()),
  /** Marker pattern: per marker '1' (always on), '0' (always off) or '~' (oscillates on the cycle). */
  phenotype: z.string().nullable(),
});
export type AttractorRow = z.infer<typeof AttractorRow>;

export const SynchronousResult = z.object({
  nodes: z.array(z.string()),
  stateCount: z.number().int(),
  attractors: z.array(AttractorRow),
  maxTransient: z.number().int(),
  meanTransient: z.number(),
  markers: z.array(z.string()),
});
export type SynchronousResult = z.infer<typeof SynchronousResult>;

export const PerturbationBody = z.object({
  knockOut: z.array(nodeName).max(64).default([]),
  overExpress: z.array(nodeName).max(64).default([]),
  /** Fixed input conditions: node name to 0 or 1. */
  fixed: nodeRecord(nodeName, z.union([z.literal(0), z.literal(1)])).default({}),
  markers: z.array(nodeName).max(64).default([]),
});
export type PerturbationBody = z.input<typeof PerturbationBody>;

export const PerturbationResult = z.object({
  before: SynchronousResult,
  after: SynchronousResult,
  /** Phenotype labels present before and after (only meaningful when markers were given). */
  phenotypes: z.array(z.object({ phenotype: z.string(), basinBefore: z.number().int(), basinAfter: z.number().int() })),
});
export type PerturbationResult = z.infer<typeof PerturbationResult>;

export const UpdateSchemeName = z.enum(["synchronous", "random-order", "general-asynchronous"]);

export const TrajectoryBody = z.object({
  initial: z.string().regex(/^[01]+$/, "must be a string of 0 and 1"),
  scheme: UpdateSchemeName.default("synchronous"),
  steps: z.number().int().min(1).max(1000).default(30),
  seed: z.number().int().min(0).default(1),
});
export type TrajectoryBody = z.input<typeof TrajectoryBody>;

export const TrajectoryResult = z.object({
  nodes: z.array(z.string()),
  scheme: UpdateSchemeName,
  seed: z.number().int().nullable(),
  states: z.array(z.string()),
});
export type TrajectoryResult = z.infer<typeof TrajectoryResult>;

export const EdgeSign = z.enum(["positive", "negative", "dual", "non-essential"]);
export type EdgeSign = z.infer<typeof EdgeSign>;

export const StructureResult = z.object({
  nodes: z.array(
    z.object({
      name: z.string(),
      inDegree: z.number().int(),
      outDegree: z.number().int(),
      isInput: z.boolean(),
      rule: z.string(),
    }),
  ),
  edges: z.array(z.object({ source: z.string(), target: z.string(), sign: EdgeSign })),
});
export type StructureResult = z.infer<typeof StructureResult>;
