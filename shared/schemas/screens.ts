// Perturbation screens as runs: the parameters a client starts one with, and the merged result it reads back
// (the engine's ScreenResult, with minimal trap spaces per row under asynchronous update).
import { z } from "zod";
import { nodeName } from "./models";
import { nodeRecord } from "./node-record";
import { TrapSpaceCount } from "./run-tasks";

const bit = z.union([z.literal(0), z.literal(1)]);

/** The largest screen one run takes: 64 nodes singly (128 units), or 24 nodes with pairs (1 152 units). */
export const MAX_SCREEN_UNITS = 1200;

export const ScreenParams = z
  .object({
    nodes: z.array(nodeName).min(1, "choose at least one node to perturb").max(64),
    pairs: z.boolean().default(false),
    phenotype: nodeRecord(nodeName, bit).refine((p) => Object.keys(p).length > 0, "the phenotype names no node"),
    update: z.enum(["synchronous", "asynchronous"]).default("synchronous"),
  })
  .superRefine((p, ctx) => {
    if (new Set(p.nodes).size !== p.nodes.length)
      ctx.addIssue({ code: "custom", path: ["nodes"], message: "a node is chosen twice" });
    const m = p.nodes.length;
    const units = 2 * m + (p.pairs ? 2 * m * (m - 1) : 0);
    if (units > MAX_SCREEN_UNITS)
      ctx.addIssue({
        code: "custom",
        path: ["nodes"],
        message: `${units} perturbations are more than one screen takes (${MAX_SCREEN_UNITS}); choose fewer nodes`,
      });
  });
export type ScreenParams = z.infer<typeof ScreenParams>;

export const ScreenRunRow = z.object({
  unit: z.number().int(),
  perturbation: z.record(z.string(), bit).readonly(),
  basinShare: z.number().nullable(),
  basinShareChange: z.number().nullable(),
  attractorsBefore: z.number().int(),
  attractorsAfter: z.number().int(),
  phenotypeAttractorsBefore: z.number().int(),
  phenotypeAttractorsAfter: z.number().int(),
  attractorsLost: z.number().int(),
  attractorsGained: z.number().int(),
  phenotypeFixedPoints: z.array(z.string()).readonly().nullable(),
  complete: z.boolean(),
  trapSpaces: TrapSpaceCount.nullable(),
});
export type ScreenRunRow = z.infer<typeof ScreenRunRow>;

export const ScreenRunResult = z.object({
  phenotype: z.record(z.string(), bit),
  method: z.enum(["exact-synchronous", "sat-fixed-points"]),
  counted: z.enum(["attractors", "fixed-points"]),
  update: z.enum(["synchronous", "asynchronous"]),
  totalUnits: z.number().int(),
  baseline: z.object({
    attractors: z.number().int(),
    phenotypeAttractors: z.number().int(),
    basinShare: z.number().nullable(),
  }),
  baselineTrapSpaces: TrapSpaceCount.nullable(),
  rows: z.array(ScreenRunRow),
});
export type ScreenRunResult = z.infer<typeof ScreenRunResult>;
