import { execFileSync, spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { YEAST_RULE_TEXT } from "@shared/engine/rules/yeast-rule-text.test-support";
import { MULTIVALUED_SBML, REPRESSOR_RING_SBML } from "../support/model-fixtures";
import { signInAs } from "../support/sessions";
import { buildTestApp } from "../support/test-app";

const t = buildTestApp();
afterAll(() => t.close());

const PROJECT = "00000000-0000-4000-8000-000000000001";
const base = `/api/projects/${PROJECT}/models`;

type Agent = Awaited<ReturnType<typeof signInAs>>;
let modeler: Agent;
let viewer: Agent;

beforeAll(async () => {
  modeler = await signInAs(t.app, "modeler@demo.emulant.test");
  viewer = await signInAs(t.app, "viewer@demo.emulant.test");
});

// Two mutually repressing genes: under synchronous update both single-on states are fixed points and the
// both-off/both-on pair forms a 2-cycle (common practice: the textbook toggle switch as a Boolean network).
const TOGGLE = "# toggle\nA' = !B\nB' = !A\n";

async function counts() {
  const [m] = await t.db("models").count<{ count: string }[]>("* as count");
  const [f] = await t.db("model_files").count<{ count: string }[]>("* as count");
  const [r] = await t.db("model_revisions").count<{ count: string }[]>("* as count");
  return { models: Number(m!.count), files: Number(f!.count), revisions: Number(r!.count) };
}

async function createRules(name: string, ruleText: string) {
  const res = await modeler.post(base).send({ name, ruleText });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.data as {
    model: { id: string; latestRevision: number; nodeCount: number };
    revision: { revision: number; ruleText: string };
  };
}

describe("POST /models (rule text)", () => {
  it("creates a model with revision 1 and lists it with its node count and author", async () => {
    const { model, revision } = await createRules("Toggle pair", TOGGLE);
    expect(revision.revision).toBe(1);
    expect(model.nodeCount).toBe(2);
    const list = await viewer.get(base);
    expect(list.status).toBe(200);
    const row = list.body.data.find((m: { id: string }) => m.id === model.id);
    expect(row).toMatchObject({
      name: "Toggle pair",
      nodeCount: 2,
      latestRevision: 1,
      source: "rules",
      createdBy: { displayName: expect.any(String) },
    });
  });

  it("answers a faulty rule text with 400 PARSE_ERROR listing line and column of each error, storing nothing", async () => {
    const before = await counts();
    const res = await modeler.post(base).send({ name: "Broken", ruleText: "A' = B &\nB' = A\nC' = (A | \n" });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("PARSE_ERROR");
    const details = res.body.error.details as { line: number; column: number; message: string }[];
    expect(details.map((d) => d.line)).toEqual([1, 3]);
    for (const d of details) {
      expect(d.column).toBeGreaterThan(0);
      expect(d.message.length).toBeGreaterThan(0);
    }
    expect(await counts()).toEqual(before);
  });

  it("reports a node used without a rule at the column where it is used", async () => {
    const res = await modeler.post(base).send({ name: "Undefined", ruleText: "A' = A & Zed\n" });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual([{ line: 1, column: 10, message: expect.stringContaining("Zed") }]);
  });
});

describe("POST /models/validate", () => {
  it("answers the node count of a good text and the positioned errors of a bad one, without storing", async () => {
    const before = await counts();
    const good = await viewer.post(`${base}/validate`).send({ ruleText: TOGGLE });
    expect(good.status).toBe(200);
    expect(good.body.data).toEqual({ ok: true, nodeCount: 2, nodes: ["A", "B"], errors: [] });
    const bad = await viewer.post(`${base}/validate`).send({ ruleText: "A' = !B\nB' = A &&\n" });
    expect(bad.body.data.ok).toBe(false);
    expect(bad.body.data.errors[0].line).toBe(2);
    expect(await counts()).toEqual(before);
  });
});

describe("POST /models/upload", () => {
  it("imports a rule-text file and keeps the original bytes for download", async () => {
    const bytes = Buffer.from("# uploaded\nX' = X\nY' = X & !Y\n", "utf8");
    const res = await modeler
      .post(`${base}/upload`)
      .attach("file", bytes, { filename: "pair.rules", contentType: "text/plain" });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.data.model.name).toBe("pair");
    expect(res.body.data.revision.file).toEqual({
      fileName: "pair.rules",
      mediaType: "text/plain",
      sizeBytes: bytes.length,
    });
    const original = await viewer
      .get(`${base}/${res.body.data.model.id}/revisions/1/original`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on("data", (c: Buffer) => chunks.push(c));
        r.on("end", () => cb(null, Buffer.concat(chunks)));
      });
    expect(original.status).toBe(200);
    expect(Buffer.compare(original.body as Buffer, bytes)).toBe(0);
  });

  it("imports an SBML-qual file: three mutual repressors in a ring give a 6-cycle and a 2-cycle", async () => {
    const res = await modeler
      .post(`${base}/upload`)
      .attach("file", Buffer.from(REPRESSOR_RING_SBML), { filename: "ring.sbml", contentType: "application/xml" });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.data.model).toMatchObject({ name: "Repressor ring", nodeCount: 3, source: "sbml" });
    expect(res.body.data.revision.ruleText).toBe("LacI' = !CI\nTetR' = !LacI\nCI' = !TetR\n");
    // A negative feedback loop of odd length n under synchronous update: every state lies on a cycle, here one
    // of length 2n = 6 and the pair all-off/all-on (common practice; e.g. Remy, Mosse, Thieffry on Boolean
    // circuits, and directly checkable by hand on 8 states).
    const a = await viewer.get(`${base}/${res.body.data.model.id}/revisions/1/attractors`);
    expect(a.body.data.attractors.map((x: { length: number; basin: number }) => [x.length, x.basin])).toEqual([
      [6, 6],
      [2, 2],
    ]);
  });

  it("refuses an SBML-qual file with a multi-valued species, naming the species, and stores nothing", async () => {
    const before = await counts();
    const res = await modeler
      .post(`${base}/upload`)
      .attach("file", Buffer.from(MULTIVALUED_SBML), { filename: "multi.xml" });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("PARSE_ERROR");
    expect(res.body.error.details[0].message).toMatch(/CI has maxLevel 2/);
    expect(await counts()).toEqual(before);
  });

  it("refuses malformed XML with the line of the fault", async () => {
    const res = await modeler
      .post(`${base}/upload`)
      .attach("file", Buffer.from('<?xml version="1.0"?>\n<sbml>\n  <model>\n</sbml>\n'), { filename: "broken.sbml" });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("PARSE_ERROR");
    expect(res.body.error.details[0].line).toBeGreaterThan(1);
  });

  it("refuses a faulty file with its parse errors and stores neither model nor file", async () => {
    const before = await counts();
    const res = await modeler
      .post(`${base}/upload`)
      .attach("file", Buffer.from("P' = Q |\n"), { filename: "bad.rules" });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("PARSE_ERROR");
    expect(res.body.error.details[0]).toMatchObject({ line: 1, column: expect.any(Number) });
    expect(await counts()).toEqual(before);
  });

  it("refuses files above the size limit with 413 and unknown extensions with 415", async () => {
    const big = await modeler
      .post(`${base}/upload`)
      .attach("file", Buffer.alloc(5 * 1024 * 1024 + 1, 0x20), { filename: "big.rules" });
    expect(big.status).toBe(413);
    const odd = await modeler
      .post(`${base}/upload`)
      .attach("file", Buffer.from("A' = A\n"), { filename: "model.docx" });
    expect(odd.status).toBe(415);
  });
});

describe("POST /models/generate", () => {
  it("builds an elementary cellular automaton ring whose rule-90 dynamics match the XOR of neighbours", async () => {
    const res = await modeler
      .post(`${base}/generate`)
      .send({ name: "Rule 90 ring", generator: { kind: "eca", rule: 90, radius: 1, cells: 5 } });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.data.model.nodeCount).toBe(5);
    // Rule 90: each cell becomes the XOR of its two neighbours (Wolfram, Rev. Mod. Phys. 55, 1983; common practice).
    const traj = await viewer
      .post(`${base}/${res.body.data.model.id}/revisions/1/trajectory`)
      .send({ initial: "00100", steps: 2 });
    expect(traj.body.data.states).toEqual(["00100", "01010", "10001"]);
  });

  it("builds the same NK network twice from the same seed", async () => {
    const spec = { kind: "nk", n: 6, k: 2, p: 0.5, seed: 42 };
    const a = await modeler.post(`${base}/generate`).send({ name: "NK a", generator: spec });
    const b = await modeler.post(`${base}/generate`).send({ name: "NK b", generator: spec });
    expect(a.status).toBe(201);
    expect(a.body.data.revision.ruleText).toBe(b.body.data.revision.ruleText);
    expect(a.body.data.revision.generator).toEqual(spec);
  });
});

describe("revisions", () => {
  it("editing the rules creates revision 2 and leaves revision 1 exactly as it was", async () => {
    const { model } = await createRules("Editable", TOGGLE);
    const first = await viewer.get(`${base}/${model.id}/revisions/1`);
    const edit = await modeler
      .post(`${base}/${model.id}/revisions`)
      .send({ ruleText: "A' = !B\nB' = A\n", message: "B follows A" });
    expect(edit.status).toBe(201);
    expect(edit.body.data.revision.revision).toBe(2);
    expect(edit.body.data.model.latestRevision).toBe(2);
    const again = await viewer.get(`${base}/${model.id}/revisions/1`);
    expect(again.body.data.revision).toEqual(first.body.data.revision);
    const list = await viewer.get(`${base}/${model.id}/revisions`);
    expect(list.body.data.map((r: { revision: number }) => r.revision)).toEqual([2, 1]);
    // The attractors of the two revisions differ: a negative loop A -| B -> A oscillates with period 4.
    const a1 = await viewer.get(`${base}/${model.id}/revisions/1/attractors`);
    const a2 = await viewer.get(`${base}/${model.id}/revisions/2/attractors`);
    expect(a1.body.data.attractors.map((a: { length: number }) => a.length).sort()).toEqual([1, 1, 2]);
    expect(a2.body.data.attractors).toEqual([
      { length: 4, basin: 4, states: ["00", "10", "11", "01"], phenotype: null },
    ]);
  });

  it("refuses an UPDATE of a stored revision at the database level", async () => {
    const { model } = await createRules("Frozen", TOGGLE);
    await expect(
      t.db("model_revisions").where({ model_id: model.id }).update({ rule_text: "A' = 1\nB' = 1\n" }),
    ).rejects.toThrow(/immutable/);
  });

  it("does not store a new revision when the edited text has errors", async () => {
    const { model } = await createRules("Kept", TOGGLE);
    const res = await modeler.post(`${base}/${model.id}/revisions`).send({ ruleText: "A' = !B\nB' = !\n" });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].line).toBe(2);
    const list = await viewer.get(`${base}/${model.id}/revisions`);
    expect(list.body.data).toHaveLength(1);
  });
});

async function download(path: string): Promise<{ status: number; text: string; type: string }> {
  const res = await viewer
    .get(path)
    .buffer(true)
    .parse((r, cb) => {
      let body = "";
      r.setEncoding("utf8");
      r.on("data", (c: string) => (body += c));
      r.on("end", () => cb(null, body));
    });
  return { status: res.status, text: res.body as string, type: String(res.headers["content-type"]) };
}

describe("exports", () => {
  for (const [format, fileName] of [
    ["sbml", "back.sbml"],
    ["csv", "back.csv"],
  ] as const) {
    it(`exports ${format} that uploads back to a model with the same attractors`, async () => {
      const { model } = await createRules(`Yeast ${format}`, YEAST_RULE_TEXT);
      const exported = await download(`${base}/${model.id}/revisions/1/export?format=${format}`);
      expect(exported.status).toBe(200);
      const back = await modeler
        .post(`${base}/upload`)
        .attach("file", Buffer.from(exported.text), { filename: fileName });
      expect(back.status, JSON.stringify(back.body)).toBe(201);
      expect(back.body.data.model.nodeCount).toBe(11);
      const a = await viewer.get(`${base}/${model.id}/revisions/1/attractors`);
      const b = await viewer.get(`${base}/${back.body.data.model.id}/revisions/1/attractors`);
      expect(b.body.data.nodes).toEqual(a.body.data.nodes);
      expect(b.body.data.attractors).toEqual(a.body.data.attractors);
    });
  }

  it("exports rule text that imports back to a model with the same attractors", async () => {
    const { model } = await createRules("Yeast cell cycle", YEAST_RULE_TEXT);
    const exported = await viewer.get(`${base}/${model.id}/revisions/1/export?format=rules`);
    expect(exported.status).toBe(200);
    expect(exported.headers["content-disposition"]).toContain(".rules");
    expect(exported.headers["content-type"]).toContain("text/plain");
    const back = await createRules("Yeast again", exported.text);
    const a = await viewer.get(`${base}/${model.id}/revisions/1/attractors`);
    const b = await viewer.get(`${base}/${back.model.id}/revisions/1/attractors`);
    expect(b.body.data.attractors).toEqual(a.body.data.attractors);
  });
});

// libSBML ("LibSBML: an API library for SBML", Bioinformatics 2008), through Debian's python3-sbml5, which
// scripts/test.sh installs; the check script belongs to the SBML-qual format tests.
const hasLibSbml = spawnSync("/usr/bin/python3", ["-c", "import libsbml"]).status === 0;

describe.skipIf(!hasLibSbml)("SBML-qual export checked by libSBML", () => {
  it("exports files with zero consistency errors for a threshold model, a generated ring and an SBML import", async () => {
    const yeast = await createRules("Yeast libsbml", YEAST_RULE_TEXT);
    const ring = await modeler
      .post(`${base}/generate`)
      .send({ name: "Ring libsbml", generator: { kind: "eca", rule: 110, radius: 1, cells: 6 } });
    const imported = await modeler
      .post(`${base}/upload`)
      .attach("file", Buffer.from(REPRESSOR_RING_SBML), { filename: "ring.sbml" });
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "emulant-export-"));
    const files: string[] = [];
    for (const id of [yeast.model.id, ring.body.data.model.id, imported.body.data.model.id]) {
      const exported = await download(`${base}/${id}/revisions/1/export?format=sbml`);
      expect(exported.status).toBe(200);
      const file = path.join(dir, `${id}.sbml`);
      fs.writeFileSync(file, exported.text);
      files.push(file);
    }
    const out = JSON.parse(
      execFileSync("/usr/bin/python3", [path.resolve("tests/fixtures/sbml/check-with-libsbml.py"), ...files], {
        encoding: "utf8",
      }),
    ) as { files: { errors: string[] }[] };
    expect(out.files.map((f) => f.errors)).toEqual([[], [], []]);
    fs.rmSync(dir, { recursive: true, force: true });
  });
});

describe("analyses", () => {
  it("reproduces the seven fixed points and basins of the budding-yeast cell-cycle model, labelled by markers", async () => {
    const { model } = await createRules("Yeast for analysis", YEAST_RULE_TEXT);
    const res = await viewer.get(`${base}/${model.id}/revisions/1/attractors?markers=Cdh1,Sic1,Clb12`);
    expect(res.status).toBe(200);
    const data = res.body.data;
    expect(data.stateCount).toBe(2048);
    // Li, Long, Lu, Ouyang, Tang, "The yeast cell-cycle network is robustly designed", PNAS 2004, Table 1 (value
    // from memory; wiring in shared/engine/rules/yeast-rule-text.test-support.ts).
    expect(data.attractors.map((a: { basin: number }) => a.basin)).toEqual([1764, 151, 109, 9, 7, 7, 1]);
    expect(data.attractors.every((a: { length: number }) => a.length === 1)).toBe(true);
    // G1: Cdh1 and Sic1 on, Clb1,2 off.
    expect(data.attractors[0].phenotype).toBe("110");
    const g1 = data.attractors[0].states[0] as string;
    expect(data.nodes.filter((_: string, i: number) => g1[i] === "1")).toEqual(["Cdh1", "Sic1"]);
    // Stored per revision: asking again answers the same from the one cached row.
    const again = await viewer.get(`${base}/${model.id}/revisions/1/attractors`);
    expect(again.body.data.attractors.map((a: { basin: number }) => a.basin)).toEqual([1764, 151, 109, 9, 7, 7, 1]);
    const [cached] = await t
      .db("model_analyses as a")
      .join("model_revisions as r", "r.id", "a.revision_id")
      .where("r.model_id", model.id)
      .count<{ count: string }[]>("* as count");
    expect(Number(cached!.count)).toBe(1);
  });

  it("labels an oscillating marker with ~ and answers unknown markers with 400", async () => {
    const { model } = await createRules("Toggle markers", TOGGLE);
    const res = await viewer.get(`${base}/${model.id}/revisions/1/attractors?markers=A`);
    const labels = res.body.data.attractors
      .map((a: { length: number; phenotype: string }) => `${a.length}:${a.phenotype}`)
      .sort();
    expect(labels).toEqual(["1:0", "1:1", "2:~"]);
    const bad = await viewer.get(`${base}/${model.id}/revisions/1/attractors?markers=Nope`);
    expect(bad.status).toBe(400);
  });

  it("compares attractors before and after a knock-out: knocking out B leaves A on as the only fixed point", async () => {
    const { model } = await createRules("Toggle perturbed", TOGGLE);
    const res = await viewer
      .post(`${base}/${model.id}/revisions/1/perturbation`)
      .send({ knockOut: ["B"], markers: ["A", "B"] });
    expect(res.status).toBe(200);
    expect(res.body.data.before.attractors).toHaveLength(3);
    expect(res.body.data.after.attractors).toEqual([{ length: 1, basin: 4, states: ["10"], phenotype: "10" }]);
    expect(res.body.data.phenotypes).toContainEqual({ phenotype: "10", basinBefore: 1, basinAfter: 4 });
  });

  it("fixes an input condition: with Light held at 0 only the dark attractors of the bloom switch remain", async () => {
    const { model } = await createRules("Light switch", "Light' = Light\nGene' = Light | Gene & !Light\n");
    const res = await viewer
      .post(`${base}/${model.id}/revisions/1/perturbation`)
      .send({ fixed: { Light: 0 }, markers: ["Gene"] });
    expect(res.status).toBe(200);
    expect(res.body.data.after.attractors.every((a: { states: string[] }) => a.states.every((s) => s[0] === "0"))).toBe(
      true,
    );
  });

  it("refuses contradictory perturbations", async () => {
    const { model } = await createRules("Toggle contradict", TOGGLE);
    const res = await viewer
      .post(`${base}/${model.id}/revisions/1/perturbation`)
      .send({ knockOut: ["A"], overExpress: ["A"] });
    expect(res.status).toBe(400);
  });

  it("gives a reproducible random-order asynchronous trajectory for a seed", async () => {
    const { model } = await createRules("Toggle async", TOGGLE);
    const body = { initial: "00", scheme: "random-order", steps: 5, seed: 7 };
    const a = await viewer.post(`${base}/${model.id}/revisions/1/trajectory`).send(body);
    const b = await viewer.post(`${base}/${model.id}/revisions/1/trajectory`).send(body);
    expect(a.status).toBe(200);
    expect(a.body.data.states).toEqual(b.body.data.states);
    expect(a.body.data.states).toHaveLength(6);
    // Random-order updating of the toggle leaves 00 for a single-on state and stays there.
    expect(["10", "01"]).toContain(a.body.data.states[5]);
    const wrong = await viewer.post(`${base}/${model.id}/revisions/1/trajectory`).send({ initial: "000" });
    expect(wrong.status).toBe(400);
  });

  it("reports edge signs and degrees: positive, negative and dual edges read off the functions", async () => {
    const { model } = await createRules("Signs", "A' = A\nB' = A & !C\nC' = A ^ B\n");
    const res = await viewer.get(`${base}/${model.id}/revisions/1/structure`);
    expect(res.status).toBe(200);
    const sign = (s: string, tgt: string) =>
      res.body.data.edges.find((e: { source: string; target: string }) => e.source === s && e.target === tgt)?.sign;
    expect(sign("A", "B")).toBe("positive");
    expect(sign("C", "B")).toBe("negative");
    expect(sign("A", "C")).toBe("dual");
    const a = res.body.data.nodes.find((n: { name: string }) => n.name === "A");
    expect(a).toMatchObject({ isInput: true, inDegree: 1, outDegree: 3 });
  });
});

describe("large models", () => {
  it("answers 409 NEEDS_RUN above 16 nodes, then serves and caches the result of a succeeded attractors run", async () => {
    const names = Array.from({ length: 17 }, (_, i) => `G${i}`);
    // A ring of 17 copies: each node takes its left neighbour's value, so the state rotates.
    const ring = names.map((n, i) => `${n}' = ${names[(i + 16) % 17]}`).join("\n") + "\n";
    const { model } = await createRules("Ring of 17", ring);
    const refused = await viewer.get(`${base}/${model.id}/revisions/1/attractors`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("NEEDS_RUN");
    const revisionId = refused.body.error.details.revisionId as string;
    // What the runs worker stores for kind "attractors" (server/workers/tasks/attractors.ts), written directly here:
    // this test is about reuse, the analysis itself is tested in the engine.
    const result = {
      nodeNames: names,
      stateCount: 2 ** 17,
      maxTransient: 0,
      meanTransient: 0,
      attractors: [
        { length: 1, basin: 1, states: ["0".repeat(17)] },
        { length: 1, basin: 1, states: ["1".repeat(17)] },
      ],
    };
    await t.db("runs").insert({
      project_id: PROJECT,
      model_revision_id: revisionId,
      kind: "attractors",
      params: "{}",
      params_hash: "test",
      time_limit_seconds: 60,
      state: "succeeded",
      result: JSON.stringify(result),
      finished_at: t.db.fn.now(),
      shard_count: 0,
    });
    const served = await viewer.get(`${base}/${model.id}/revisions/1/attractors?markers=G0`);
    expect(served.status).toBe(200);
    expect(served.body.data.attractors.map((a: { phenotype: string }) => a.phenotype)).toEqual(["0", "1"]);
    const [cached] = await t
      .db("model_analyses")
      .where({ revision_id: revisionId })
      .count<{ count: string }[]>("* as count");
    expect(Number(cached!.count)).toBe(1);
  });
});

describe("audit", () => {
  it("records who created, imported, generated and revised models", async () => {
    const { model } = await createRules("Audited", TOGGLE);
    await modeler.post(`${base}/${model.id}/revisions`).send({ ruleText: "A' = B\nB' = A\n" });
    const rows = await t
      .db("audit_log")
      .where({ project_id: PROJECT, target: model.id })
      .orderBy("id")
      .select("action", "details");
    expect(rows.map((r: { action: string }) => r.action)).toEqual(["model.create", "model.revise"]);
    expect(rows[1].details).toMatchObject({ revision: 2, nodeCount: 2 });
  });
});

describe("permissions", () => {
  it("lets a viewer read but not write, and hides the models of a project from non-members", async () => {
    const denied = await viewer.post(base).send({ name: "Nope", ruleText: TOGGLE });
    expect(denied.status).toBe(403);
    const anonymous = await request(t.app).get(base);
    expect(anonymous.status).toBe(401);
    const reviewer = await signInAs(t.app, "reviewer@demo.emulant.test");
    expect((await reviewer.post(base).send({ name: "Nope", ruleText: TOGGLE })).status).toBe(403);
  });

  it("answers 404 for a model id of another project or one that does not exist", async () => {
    const res = await viewer.get(`${base}/00000000-0000-4000-8000-00000000ffff`);
    expect(res.status).toBe(404);
  });
});
