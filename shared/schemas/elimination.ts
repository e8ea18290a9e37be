// What a node-elimination run accepts; its own module because both the run schemas and the task schemas read it.
import { z } from "zod";

const eliminationNodeName = z.string().trim().min(1).max(120);

/**
 * Node elimination (shared/engine/elimination): the named nodes in order, every eligible node, or the percolation of
 * constants with some nodes (typically inputs) held at a value.
 */
export const NodeEliminationParams = z.discriminatedUnion("mode", [
  z.object({
    mode: z.literal("nodes"),
    nodes: z
      .array(eliminationNodeName)
      .min(1, "choose at least one node to eliminate")
      .max(10_000)
      .refine((list) => new Set(list).size === list.length, "a node is named twice"),
  }),
  z.object({ mode: z.literal("all-eligible") }),
  z.object({
    mode: z.literal("percolate"),
    hold: z
      .array(z.object({ node: eliminationNodeName, value: z.union([z.literal(0), z.literal(1)]) }))
      .max(10_000)
      .default([])
      .refine((list) => new Set(list.map((h) => h.node)).size === list.length, "a node is held twice"),
  }),
]);
export type NodeEliminationParams = z.infer<typeof NodeEliminationParams>;
