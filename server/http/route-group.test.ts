import express from "express";
import type { Knex } from "knex";
import { pino } from "pino";
import request from "supertest";
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { errorHandler } from "./errors";
import { anyone, project, reply, routeGroup } from "./route-group";
import { RouteRegistry } from "./route-registry";

// Project routes would look the project up in the database; these tests declare only public routes, so the
// database is never touched.
const db = {} as Knex;

function appWith(build: (routes: ReturnType<typeof routeGroup>) => void) {
  const routes = routeGroup({ mountPath: "/things/:thingId", tag: "things", db });
  build(routes);
  const registry = new RouteRegistry("/api");
  const api = express.Router();
  api.use(express.json());
  registry.mount(api, routes);
  const app = express();
  app.use("/api", api);
  app.use(errorHandler(pino({ level: "silent" })));
  return { app, registry };
}

const ThingParams = z.object({ thingId: z.coerce.number().int().min(1) });

describe("routeGroup", () => {
  it("routeGroup hands the handler parsed params, query and body and answers { data } with the declared status", async () => {
    const { app } = appWith((routes) =>
      routes.post("/parts", {
        summary: "echo",
        access: anyone,
        params: ThingParams,
        query: z.object({ limit: z.coerce.number().default(5) }),
        body: z.object({ name: z.string().trim() }),
        response: z.object({ thingId: z.number(), limit: z.number(), name: z.string() }),
        status: 201,
        handler: ({ params, query, body }) => ({ thingId: params.thingId, limit: query.limit, name: body.name }),
      }),
    );
    const res = await request(app).post("/api/things/7/parts").send({ name: "  gear " });
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ data: { thingId: 7, limit: 5, name: "gear" } });
  });

  it("routeGroup answers 400 INVALID_INPUT naming every failing field and does not call the handler", async () => {
    let called = false;
    const { app } = appWith((routes) =>
      routes.post("/parts", {
        summary: "checked",
        access: anyone,
        params: ThingParams,
        body: z.object({ name: z.string(), count: z.number() }),
        status: 204,
        handler: () => {
          called = true;
        },
      }),
    );
    const res = await request(app).post("/api/things/0/parts").send({ name: 3 });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("INVALID_INPUT");
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toEqual(["params.thingId"]);
    const body = await request(app).post("/api/things/1/parts").send({ name: 3 });
    expect(body.body.error.details.map((d: { field: string }) => d.field)).toEqual(["body.name", "body.count"]);
    expect(called).toBe(false);
  });

  it("routeGroup lets a handler pick one of its declared statuses with reply() and refuses an undeclared one", async () => {
    const { app } = appWith((routes) =>
      routes.get("/", {
        summary: "either",
        access: anyone,
        params: ThingParams,
        response: z.object({ isNew: z.boolean() }),
        status: [201, 200],
        handler: ({ params }) =>
          params.thingId === 1
            ? reply(200, { isNew: false })
            : reply(params.thingId === 2 ? 201 : 204, { isNew: true }),
      }),
    );
    expect((await request(app).get("/api/things/1")).status).toBe(200);
    expect((await request(app).get("/api/things/2")).status).toBe(201);
    expect((await request(app).get("/api/things/3")).status).toBe(500);
  });

  it("routeGroup refuses, when a route is declared, a params schema that does not name exactly the path's parameters", () => {
    const routes = routeGroup({ mountPath: "/things/:thingId", tag: "things", db });
    const spec = { summary: "x", access: anyone, status: 204 as const, handler: () => {} };
    expect(() => routes.get("/:partId", spec)).toThrow(/declare a params schema for thingId, partId/);
    expect(() => routes.get("/:partId", { ...spec, params: ThingParams })).toThrow(/params schema has thingId/);
    expect(() => routes.get("/", { ...spec, params: ThingParams })).not.toThrow();
  });

  it("RouteRegistry lists each route with its full path in Express and OpenAPI syntax, method, tag, access and schemas", () => {
    const Part = z.object({ id: z.string() });
    const { registry } = appWith((routes) => {
      routes.get("/", {
        summary: "the thing",
        access: anyone,
        params: ThingParams,
        response: Part,
        handler: () => ({ id: "t" }),
      });
      routes.delete("/parts/:partId", {
        summary: "remove a part",
        access: project("model:write"),
        params: ThingParams.extend({ partId: z.string() }),
        status: 204,
        handler: () => {},
      });
    });
    expect(
      registry.routes.map((r) => [
        r.method,
        r.fullPath,
        r.openApiPath,
        r.tag,
        r.access,
        r.statuses,
        r.response === Part,
      ]),
    ).toEqual([
      ["get", "/api/things/:thingId", "/api/things/{thingId}", "things", { kind: "public" }, [200], true],
      [
        "delete",
        "/api/things/:thingId/parts/:partId",
        "/api/things/{thingId}/parts/{partId}",
        "things",
        { kind: "project", capability: "model:write" },
        [204],
        false,
      ],
    ]);
  });
});
