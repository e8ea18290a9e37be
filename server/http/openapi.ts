// The OpenAPI 3.1 document of the API, generated from the route registry: the same zod schemas that validate each
// route describe it, so the document cannot drift from what the server checks. Answers are documented as the group
// sends them ({ data }), errors with the one error shape.
import { OpenAPIRegistry, OpenApiGeneratorV31 } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import { ApiErrorBody } from "@shared/schemas/api-error";
import type { ApiRoute } from "./route-registry";

type OpenApiDocument = ReturnType<OpenApiGeneratorV31["generateDocument"]>;

const statusText: Record<number, string> = { 200: "OK", 201: "Created", 204: "No content", 503: "Degraded" };

function accessText(route: ApiRoute): string {
  const who = {
    public: "Anyone.",
    user: "Any signed-in caller.",
    "site-admin": "Site administrators (browser session only).",
    project: `Project members whose role grants ${route.access.kind === "project" ? route.access.capability : ""}.`,
  }[route.access.kind];
  const tokens =
    route.tokenScope === null
      ? "Access tokens are refused."
      : `Access tokens: ${route.tokenScope === "read" ? "read or write" : "write"} scope.`;
  return `${who} ${tokens}`;
}

/** Request parts the generator documents as parameters must be objects; other shapes stay undocumented there. */
const asObject = (schema: z.ZodType | undefined) => (schema instanceof z.ZodObject ? schema : undefined);

export function openApiDocument(routes: readonly ApiRoute[], info: { version: string }): OpenApiDocument {
  const registry = new OpenAPIRegistry();
  registry.registerComponent("securitySchemes", "accessToken", {
    type: "http",
    scheme: "bearer",
    description: "A personal access token from the profile page",
  });
  registry.registerComponent("securitySchemes", "session", { type: "apiKey", in: "cookie", name: "emulant_session" });
  const error = { description: "Error", content: { "application/json": { schema: ApiErrorBody } } };
  for (const route of routes) {
    const responses: Record<string, object> = {};
    for (const status of route.statuses) {
      const description = statusText[status] ?? String(status);
      if (status === 204) responses[status] = { description };
      else if (route.produces) responses[status] = { description, content: { [route.produces]: { schema: {} } } };
      else
        responses[status] = {
          description,
          content: { "application/json": { schema: z.object({ data: route.response ?? z.unknown() }) } },
        };
    }
    responses["4XX"] = error;
    const body = route.files
      ? {
          content: {
            "multipart/form-data": {
              schema: z.object(Object.fromEntries(route.files.map((f) => [f, z.string().meta({ format: "binary" })]))),
            },
          },
        }
      : route.body
        ? { content: { "application/json": { schema: route.body } } }
        : undefined;
    registry.registerPath({
      method: route.method,
      path: route.openApiPath,
      operationId: `${route.method}${route.openApiPath.replace(/[^A-Za-z0-9]+(.)?/g, (_m, c?: string) => (c ?? "").toUpperCase())}`,
      summary: route.summary,
      description: accessText(route),
      tags: [route.tag],
      security:
        route.access.kind === "public"
          ? []
          : route.tokenScope
            ? [{ session: [] }, { accessToken: [] }]
            : [{ session: [] }],
      request: { params: route.params, query: asObject(route.query), body },
      responses,
    });
  }
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: "3.1.0",
    info: {
      title: "Emulant API",
      version: info.version,
      description:
        "Boolean-network models, analyses and certified reductions. Every answer is { data } or { error: { code, message, details? } }.",
    },
    servers: [{ url: "/" }],
  });
}
