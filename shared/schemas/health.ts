import { z } from "zod";

export const Health = z.object({
  status: z.enum(["ok", "degraded"]),
  database: z.object({
    status: z.enum(["up", "down"]),
    latencyMs: z.number().optional(),
    message: z.string().optional(),
  }),
});
export type Health = z.infer<typeof Health>;
