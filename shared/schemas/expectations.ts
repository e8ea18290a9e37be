// Expectations as the API stores and serves them (shared/engine/expectations is the model of one expectation; these
// schemas check the same shape at the edge), the expectation-by-revision matrix, and the check run's parameters.
import { z } from "zod";
import { nodeName } from "./models";
import { nodeRecord } from "./node-record";

export const EXPECTATION_KEY_PATTERN = /^[A-Za-z0-9][A-Za-z0-9_.-]{0,63}$/;
const bit = z.union([z.literal(0), z.literal(1)]);
const assignment = nodeRecord(nodeName, bit);
const pattern = assignment.refine((a) => Object.keys(a).length > 0, "name at least one node");

export const ExpectationCondition = z.object({
  knockOut: z.array(nodeName).max(64).default([]),
  overExpress: z.array(nodeName).max(64).default([]),
  inputs: assignment.default({}),
});

const count = z.number().int().min(0).max(999_999);
export const ExpectedOutcome = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("some-attractor"), pattern }),
  z.object({ kind: z.literal("every-attractor"), pattern }),
  z.object({ kind: z.literal("no-attractor"), pattern }),
  z.object({ kind: z.literal("fixed-point-count"), comparison: z.enum(["exactly", "at-least", "at-most"]), count }),
  z.object({ kind: z.literal("attractor-count"), comparison: z.enum(["exactly", "at-least", "at-most"]), count }),
  z.object({ kind: z.literal("reachable"), from: assignment, pattern }),
]);

/** One expectation as written by people: the engine's Expectation. */
export const ExpectationInput = z
  .object({
    id: z
      .string()
      .regex(EXPECTATION_KEY_PATTERN, "1 to 64 letters, digits, _, - or ., starting with a letter or digit"),
    update: z.enum(["synchronous", "asynchronous"]).default("synchronous"),
    condition: ExpectationCondition.default({ knockOut: [], overExpress: [], inputs: {} }),
    outcome: ExpectedOutcome,
    source: z.string().trim().min(1, "name the source: a citation or a lab notebook reference").max(1000),
    note: z.string().max(2000).default(""),
  })
  .superRefine((e, ctx) => {
    const both = e.condition.knockOut.filter((n) => e.condition.overExpress.includes(n));
    if (both.length > 0)
      ctx.addIssue({
        code: "custom",
        path: ["condition", "overExpress"],
        message: `${both.join(", ")} is both knocked out and over-expressed`,
      });
  });
export type ExpectationInput = z.input<typeof ExpectationInput>;

export const StoredExpectation = z.object({
  /** The row's id (the expectation's own id is `expectation.id`). */
  id: z.uuid(),
  modelId: z.uuid(),
  expectation: z.object({
    id: z.string(),
    update: z.enum(["synchronous", "asynchronous"]),
    condition: z.object({
      knockOut: z.array(z.string()).readonly(),
      overExpress: z.array(z.string()).readonly(),
      inputs: z.record(z.string(), bit).readonly(),
    }),
    outcome: z.discriminatedUnion("kind", [
      z.object({ kind: z.literal("some-attractor"), pattern: z.record(z.string(), bit) }),
      z.object({ kind: z.literal("every-attractor"), pattern: z.record(z.string(), bit) }),
      z.object({ kind: z.literal("no-attractor"), pattern: z.record(z.string(), bit) }),
      z.object({
        kind: z.literal("fixed-point-count"),
        comparison: z.enum(["exactly", "at-least", "at-most"]),
        count: z.number(),
      }),
      z.object({
        kind: z.literal("attractor-count"),
        comparison: z.enum(["exactly", "at-least", "at-most"]),
        count: z.number(),
      }),
      z.object({
        kind: z.literal("reachable"),
        from: z.record(z.string(), bit),
        pattern: z.record(z.string(), bit),
      }),
    ]),
    source: z.string(),
    note: z.string(),
  }),
  bodyHash: z.string(),
  createdBy: z.object({ id: z.uuid(), displayName: z.string() }).nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type StoredExpectation = z.infer<typeof StoredExpectation>;
export const ExpectationList = z.array(StoredExpectation);

export const ExpectationsParams = z.object({ projectId: z.uuid(), modelId: z.uuid() });
export const ExpectationParams = ExpectationsParams.extend({ expectationId: z.uuid() });

export const ImportExpectationsBody = z.object({
  csv: z.string().min(1, "the table is empty").max(1_000_000),
  /** add: new ids are added and known ids replaced; replace: the table becomes exactly the file's rows. */
  mode: z.enum(["add", "replace"]).default("add"),
});
export const ImportExpectationsResult = z.object({
  added: z.number().int(),
  replaced: z.number().int(),
  removed: z.number().int(),
  checkRunId: z.uuid().nullable(),
});
export type ImportExpectationsResult = z.infer<typeof ImportExpectationsResult>;

export const CheckExpectationsBody = z.object({ revision: z.number().int().min(1).optional() });
export const CheckStarted = z.object({ runId: z.uuid().nullable(), reused: z.boolean() });

export const ExpectationStatus = z.enum(["pass", "fail", "undecided"]);
export const MatrixCell = z.object({
  expectationId: z.uuid(),
  revision: z.number().int(),
  status: ExpectationStatus,
  method: z.string(),
  detail: z.string(),
  reason: z.string().nullable(),
  broke: z.boolean(),
  runId: z.uuid().nullable(),
  checkedAt: z.string(),
});
export type MatrixCell = z.infer<typeof MatrixCell>;
export const ExpectationMatrix = z.object({
  expectations: z.array(z.object({ id: z.uuid(), key: z.string(), source: z.string(), note: z.string() })),
  revisions: z.array(
    z.object({
      revision: z.number().int(),
      revisionId: z.uuid(),
      nodeCount: z.number().int(),
      createdBy: z.string().nullable(),
      createdAt: z.string(),
    }),
  ),
  cells: z.array(MatrixCell),
  /** Check runs of this model not yet finished. */
  pendingRunIds: z.array(z.uuid()),
});
export type ExpectationMatrix = z.infer<typeof ExpectationMatrix>;

/** The "expectation-check" run: every expectation (as checked, with its row and body hash) on one revision. */
export const ExpectationCheckParams = z.object({
  modelId: z.uuid(),
  items: z
    .array(z.object({ rowId: z.uuid(), bodyHash: z.string(), expectation: z.unknown() }))
    .min(1)
    .max(2000),
});
export type ExpectationCheckParams = z.infer<typeof ExpectationCheckParams>;
