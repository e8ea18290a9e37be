// The OpenAPI document: it lists every route Express actually serves (found by walking the app's router stack, not
// the registry it is built from), and its response schemas accept real answers of a sample of routes.
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { signInAs, type Agent } from "../support/sessions";
import { buildTestApp } from "../support/test-app";

const t = buildTestApp();
afterAll(() => t.close());

interface Layer {
  rawPath?: string;
  name: string;
  route?: { path: string; methods: Record<string, boolean> };
  handle: { stack?: Layer[] };
}

/** Every method and path in the Express app, with the mount paths of nested routers joined in. */
function expressRoutes(stack: Layer[], prefix = ""): string[] {
  return stack.flatMap((layer) => {
    if (layer.route) {
      const path = (prefix + layer.route.path).replace(/\/+$/, "") || "/";
      return Object.keys(layer.route.methods)
        .filter((m) => m !== "_all")
        .map((m) => `${m} ${path}`);
    }
    if (layer.name === "router" && layer.handle.stack)
      return expressRoutes(layer.handle.stack, prefix + (layer.rawPath ?? ""));
    return [];
  });
}

type Doc = {
  paths: Record<
    string,
    Record<string, { responses: Record<string, { content?: Record<string, { schema: object }> }> }>
  >;
  components?: { schemas?: Record<string, object> };
};

let doc: Doc;
let agent: Agent;
beforeAll(async () => {
  const res = await request(t.app).get("/api/openapi.json");
  expect(res.status).toBe(200);
  doc = res.body as Doc;
  agent = await signInAs(t.app, "owner@demo.emulant.test");
});

/**
 * A small checker for the JSON Schema subset the generator emits (type, properties, required, items, enum, anyOf,
 * oneOf, const, $ref), written here so the test does not trust the package that produced the document.
 */
function check(schema: Record<string, unknown>, value: unknown, path: string, errors: string[]): void {
  if (schema.$ref) {
    const name = String(schema.$ref).split("/").pop()!;
    return check(doc.components!.schemas![name] as Record<string, unknown>, value, path, errors);
  }
  for (const key of ["anyOf", "oneOf"] as const) {
    const options = schema[key] as Record<string, unknown>[] | undefined;
    if (options) {
      const ok = options.some((o) => {
        const e: string[] = [];
        check(o, value, path, e);
        return e.length === 0;
      });
      if (!ok) errors.push(`${path}: matches none of ${key}`);
    }
  }
  if ("const" in schema && value !== schema.const) errors.push(`${path}: expected ${String(schema.const)}`);
  if (schema.enum && !(schema.enum as unknown[]).includes(value)) errors.push(`${path}: not in enum`);
  const types = schema.type === undefined ? [] : ([] as unknown[]).concat(schema.type);
  const typeOf = (v: unknown) =>
    v === null ? "null" : Array.isArray(v) ? "array" : Number.isInteger(v) ? "integer" : typeof v;
  if (types.length) {
    const actual = typeOf(value);
    if (!types.includes(actual) && !(actual === "integer" && types.includes("number")))
      return void errors.push(`${path}: ${actual} is not ${types.join("|")}`);
  }
  if (typeOf(value) === "object" && schema.properties) {
    const obj = value as Record<string, unknown>;
    for (const key of (schema.required as string[] | undefined) ?? [])
      if (!(key in obj)) errors.push(`${path}.${key}: missing`);
    for (const [key, sub] of Object.entries(schema.properties as Record<string, Record<string, unknown>>))
      if (key in obj) check(sub, obj[key], `${path}.${key}`, errors);
    if (schema.additionalProperties === false)
      for (const key of Object.keys(obj))
        if (!(key in (schema.properties as object))) errors.push(`${path}.${key}: not documented`);
  }
  if (Array.isArray(value) && schema.items)
    value.forEach((v, i) => check(schema.items as Record<string, unknown>, v, `${path}[${i}]`, errors));
}

describe("GET /api/openapi.json", () => {
  it("is an OpenAPI 3.1 document listing every route the Express app serves", () => {
    expect((doc as unknown as { openapi: string }).openapi).toBe("3.1.0");
    const served = expressRoutes((t.app as unknown as { router: { stack: Layer[] } }).router.stack).filter((r) =>
      r.split(" ")[1]!.startsWith("/api"),
    );
    expect(served.length).toBeGreaterThan(50);
    const documented = new Set(
      Object.entries(doc.paths).flatMap(([path, ops]) =>
        Object.keys(ops).map((m) => `${m} ${path.replace(/\{(\w+)\}/g, ":$1")}`),
      ),
    );
    expect(served.filter((r) => !documented.has(r))).toEqual([]);
  });

  it("documents response schemas that real answers of a sample of routes satisfy", async () => {
    const projects = await agent.get("/api/projects");
    const projectId = (projects.body.data as { id: string }[])[0]!.id;
    const models = await agent.get(`/api/projects/${projectId}/models`);
    const modelId = (models.body.data as { id: string }[])[0]!.id;
    const sample = [
      ["/api/health", "/api/health"],
      ["/api/auth/session", "/api/auth/session"],
      ["/api/users/me", "/api/users/me"],
      ["/api/projects", "/api/projects"],
      [`/api/projects/${projectId}`, "/api/projects/{projectId}"],
      [`/api/projects/${projectId}/models`, "/api/projects/{projectId}/models"],
      [`/api/projects/${projectId}/models/${modelId}`, "/api/projects/{projectId}/models/{modelId}"],
      [`/api/projects/${projectId}/runs`, "/api/projects/{projectId}/runs"],
      [`/api/projects/${projectId}/reductions`, "/api/projects/{projectId}/reductions"],
      [`/api/projects/${projectId}/members`, "/api/projects/{projectId}/members"],
    ] as const;
    for (const [url, path] of sample) {
      const res = await agent.get(url);
      expect(res.status, url).toBe(200);
      const schema = doc.paths[path]!.get!.responses["200"]!.content!["application/json"]!.schema;
      const errors: string[] = [];
      check(schema as Record<string, unknown>, res.body, url, errors);
      expect(errors, url).toEqual([]);
    }
  });

  it("a documented schema refuses an answer of the wrong shape, so the check above can fail", () => {
    const schema = doc.paths["/api/projects"]!.get!.responses["200"]!.content!["application/json"]!.schema;
    const errors: string[] = [];
    check(schema as Record<string, unknown>, { data: [{ id: 7 }] }, "wrong", errors);
    expect(errors.length).toBeGreaterThan(0);
  });
});
