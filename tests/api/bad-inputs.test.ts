// The bad-input corpus and hostile JSON bodies through the real HTTP API. Every model file of the corpus
// (tests/fixtures/bad-inputs) is uploaded: each gets the answer its manifest records, with line and column, and a
// refused file stores nothing. Then every route that takes a JSON body, read from the route registry so that a new
// route is covered without editing this file, gets bodies of the wrong shape: each must be answered with a 4xx in
// the one error shape, never with a 500.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { API_ERROR_CODES } from "@shared/schemas/api-error";
import { MODEL_UPLOAD_LIMIT_BYTES } from "@shared/schemas/models";
import { routeRegistry } from "../../server/http/route-registry";
import { loadBadInputs } from "../fixtures/bad-inputs/corpus";
import { signInAs, type Agent } from "../support/sessions";
import { buildTestApp } from "../support/test-app";

const t = buildTestApp({
  // Nothing here should reach the run queue; a job sent anyway is only recorded.
  runQueue: { send: async () => randomUUID(), stop: async () => {} },
});
afterAll(() => t.close());

let admin: Agent;
let projectId: string;

beforeAll(async () => {
  admin = await signInAs(t.app, "admin@demo.emulant.test");
  const res = await admin.post("/api/projects").send({ name: `Bad inputs ${randomUUID().slice(0, 8)}` });
  projectId = res.body.data.id;
});

const modelCount = async () =>
  Number((await t.db("models").where({ project_id: projectId }).count<{ count: string }[]>("* as count"))[0]!.count);

describe("the bad-input corpus, uploaded", () => {
  const cases = loadBadInputs();
  it.each(cases.map((c) => [c.id, c.description, c] as const))(
    "POST /models/upload answers %s (%s) as the manifest says",
    async (_id, _description, c) => {
      const before = await modelCount();
      const res = await admin
        .post(`/api/projects/${projectId}/models/upload`)
        .attach("file", c.bytes, { filename: c.fileName, contentType: "application/octet-stream" });
      if (c.bytes.length > MODEL_UPLOAD_LIMIT_BYTES) {
        expect(res.status).toBe(413);
        expect(res.body.error.code).toBe("TOO_LARGE");
      } else if (c.expect.accepted) {
        expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(201);
        expect(await modelCount()).toBe(before + 1);
        return;
      } else {
        expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(400);
        expect(res.body.error.code).toBe("PARSE_ERROR");
        const first = (res.body.error.details as { line: number; column: number; message: string }[])[0]!;
        expect([first.line, first.column]).toEqual([c.expect.line, c.expect.column]);
        expect(first.message).toContain(c.expect.message);
        expect(res.body.error.details.length).toBeLessThanOrEqual(100);
        expect(JSON.stringify(res.body).length).toBeLessThan(200_000);
      }
      expect(await modelCount()).toBe(before);
    },
  );
});

/** Bodies no route's schema accepts as they are. */
const hostileBodies: [string, unknown][] = [
  ["an array", [1, 2, 3]],
  ["a bare string", "text"],
  ["a number", 42],
  ["null", null],
  ["every field a deep object", "deep"],
  ["every field a 100,000-character string", "long"],
  ["an object keyed __proto__ and constructor", JSON.parse('{"__proto__":{"admin":true},"constructor":{"x":1}}')],
];

function nested(depth: number): unknown {
  let v: unknown = 0;
  for (let i = 0; i < depth; i++) v = { a: v };
  return v;
}

/** Path parameters filled so that access passes and the body is what is judged. */
function fill(path: string): string {
  return path.replace(/:(\w+)/g, (_m, key: string) => {
    if (key === "projectId") return projectId;
    if (key === "revision") return "1";
    if (key === "token") return "x".repeat(43);
    if (key === "rule") return "110";
    return randomUUID();
  });
}

describe("hostile JSON bodies on every route that takes one", () => {
  const routes = routeRegistry(t.app).routes.filter((r) => r.body && !r.files);

  it("the registry lists dozens of such routes", () => {
    expect(routes.length).toBeGreaterThan(15);
  });

  for (const route of routes) {
    it(`${route.method.toUpperCase()} ${route.fullPath} answers every hostile body without a 500, refusals in the error shape`, async () => {
      const keys = Object.keys((route.body as { shape?: object }).shape ?? { x: 0 });
      for (const [label, template] of hostileBodies) {
        let body = template;
        if (template === "deep") body = Object.fromEntries(keys.map((k) => [k, nested(200)]));
        if (template === "long") body = Object.fromEntries(keys.map((k) => [k, "A".repeat(100_000)]));
        const res = await admin[route.method](fill(route.fullPath))
          .set("Content-Type", "application/json")
          .send(JSON.stringify(body));
        const what = `${label}: ${JSON.stringify(res.body).slice(0, 300)}`;
        expect(res.status, what).toBeLessThan(500);
        // A long string can be a fine value (rule text is checked, not refused); anything not an object never is.
        if (typeof body !== "object" || body === null || Array.isArray(body))
          expect(res.status, what).toBeGreaterThanOrEqual(400);
        if (res.status >= 400) {
          expect(API_ERROR_CODES).toContain(res.body.error.code);
          expect(typeof res.body.error.message).toBe("string");
        }
      }
    });
  }
});
