// The API's OpenAPI document, read by the API reference page. It is the one answer not wrapped in { data }, so it
// is fetched here and parsed with the outline of the document the page shows.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { ApiError } from "@/lib/api-client";
import { systemKeys } from "./get-health";

export type JsonSchema = { [key: string]: unknown };
const Schema = z.record(z.string(), z.unknown());

const Parameter = z.object({
  name: z.string(),
  in: z.string(),
  required: z.boolean().optional(),
  schema: Schema.optional(),
});
const Content = z.record(z.string(), z.object({ schema: Schema.optional() }));
export const Operation = z.object({
  operationId: z.string().optional(),
  summary: z.string().optional(),
  description: z.string().optional(),
  tags: z.array(z.string()).optional(),
  parameters: z.array(Parameter).optional(),
  requestBody: z.object({ content: Content }).optional(),
  responses: z.record(z.string(), z.object({ description: z.string().optional(), content: Content.optional() })),
});
export type Operation = z.infer<typeof Operation>;

export const OpenApiOutline = z.object({
  openapi: z.string(),
  info: z.object({ title: z.string(), version: z.string(), description: z.string().optional() }),
  paths: z.record(z.string(), z.record(z.string(), Operation)),
  components: z.object({ schemas: z.record(z.string(), Schema).optional() }).optional(),
});
export type OpenApiOutline = z.infer<typeof OpenApiOutline>;

export async function getOpenApi(): Promise<OpenApiOutline> {
  const res = await fetch("/api/openapi.json", { headers: { Accept: "application/json" } });
  if (!res.ok) throw new ApiError(res.status, `HTTP_${res.status}`, `The server answered ${res.status}`);
  const parsed = OpenApiOutline.safeParse(await res.json());
  if (!parsed.success) throw new ApiError(res.status, "BAD_RESPONSE", "The API description could not be read");
  return parsed.data;
}

export const openApiQuery = () =>
  queryOptions({ queryKey: [...systemKeys.all, "openapi"] as const, queryFn: getOpenApi, staleTime: Infinity });

export function useOpenApi() {
  return useQuery(openApiQuery());
}
