import type { Knex } from "knex";
import { evaluateExpectations, parseExpectationsCsv, trapSpaceMethod } from "@shared/engine/expectations";
import { compileDefinition, upgradeDefinition } from "@shared/engine/rules";
import { recordAudit } from "../server/db/repositories/audit-log";
import { insertExpectation, insertResults, type NewResult } from "../server/db/repositories/expectations";
import { bodyHash } from "../server/services/expectations/expectations-table";

// What the invented Tidewater Lab has seen of the invented Glimmerfin alga, as the bloom switch's expectations
// (every observation and notebook page is demo data). Each revision's results are computed here by the same
// engine as the check runs, so the expectation-by-revision matrix is filled when the demo opens: the pigment
// observation is undecided on revision 1 (no Pig node yet), and one observation fails on both revisions, as an
// open question a modeling team would track. Safe to run twice.
const DEMO_PROJECT_ID = "00000000-0000-4000-8000-000000000001";
const BLOOM = "00000000-0000-4000-8000-000000000301";

export const BLOOM_EXPECTATIONS_CSV = `# Glimmerfin bloom switch: what Tidewater Lab has seen (invented demo data)
id,update,knock_out,over_express,inputs,outcome,pattern,from,count,source,note
cyst-in-dark,,,,Light=0,some-attractor,Cyst=1,,,Tidewater notebook 7 p. 12,cysts form in the dark
lum-needs-glfa,,GlfA,,,every-attractor,Lum=0,,,Tidewater notebook 7 p. 30,no glow without the bloom activator
no-cyst-in-light,,,,Light=1,no-attractor,Cyst=1,,,Tidewater notebook 8 p. 3,
bloom-in-light-with-nitrate,,,,Light=1; Nitrate=1,every-attractor,GlfA=1; Lum=1,,,Tidewater notebook 8 p. 9,
dark-cells-reach-cyst,asynchronous,,,Light=0,reachable,Cyst=1,GlfA=1; GlfB=1,,Tidewater notebook 9 p. 4,from blooming cells put in the dark
drmk-ko-stays-out-of-cyst,,DrmK,,,no-attractor,Cyst=1,,,Tidewater notebook 9 p. 9,"open question: knock-out cultures never encysted, the model lets them"
pigment-in-light,,,,Light=1,every-attractor,Pig=1,,,Tidewater notebook 10 p. 1,pigment seen in every lit culture
few-stable-states,,,,,fixed-point-count,,,<=6,Tidewater notebook 10 p. 5,
cyst-with-glfb-over,,,GlfB,Light=0,some-attractor,Cyst=1,,,Tidewater notebook 11 p. 2,seen once
`;

export async function seed(knex: Knex): Promise<void> {
  const model = (await knex("models").where({ id: BLOOM, project_id: DEMO_PROJECT_ID }).first("id")) as
    { id: string } | undefined;
  if (!model) return; // the models seed did not run
  if (await knex("expectations").where({ model_id: BLOOM }).first("id")) return;
  const table = parseExpectationsCsv(BLOOM_EXPECTATIONS_CSV);
  if (table.errors.length > 0) throw new Error(`demo seed: bad expectations table: ${table.errors[0]!.reason}`);
  const modeler = (await knex("users").where({ email: "modeler@demo.emulant.test" }).first("id")) as
    { id: string } | undefined;
  const revisions = (await knex("model_revisions")
    .where({ model_id: BLOOM })
    .orderBy("revision")
    .select("id", "revision", "definition")) as { id: string; revision: number; definition: never }[];
  await knex.transaction(async (trx) => {
    const rows: { rowId: string; bodyHash: string }[] = [];
    for (const e of table.expectations) {
      const write = { expectation: e, bodyHash: bodyHash(e) };
      rows.push({ ...write, rowId: await insertExpectation(trx, BLOOM, modeler?.id ?? null, write) });
    }
    const previous = new Map<string, string>();
    for (const r of revisions) {
      const network = compileDefinition(upgradeDefinition(r.definition));
      const results = evaluateExpectations(network, table.expectations, { methods: [trapSpaceMethod()] });
      const stored: NewResult[] = results.map((result, q) => ({
        expectationId: rows[q]!.rowId,
        revisionId: r.id,
        runId: null,
        bodyHash: rows[q]!.bodyHash,
        status: result.status,
        method: result.method,
        detail: result.detail,
        reason: result.reason,
        broke: result.status === "fail" && previous.get(rows[q]!.rowId) === "pass",
      }));
      for (const s of stored) previous.set(s.expectationId, s.status);
      await insertResults(trx, stored);
    }
    await recordAudit(trx, {
      projectId: DEMO_PROJECT_ID,
      actorId: modeler?.id ?? null,
      action: "expectation.import",
      target: BLOOM,
      details: { mode: "add", added: rows.length, replaced: 0, removed: 0 },
    });
  });
}
