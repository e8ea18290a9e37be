import type { Knex } from "knex";
import { blockEmulationCertificate } from "@shared/engine/certificates";
import { searchBlockEmulation } from "@shared/engine/emulation";
import { compileDefinition, upgradeDefinition } from "@shared/engine/rules";
import type { Certificate } from "@shared/schemas/reductions";
import { checkCertificate } from "../server/services/reductions/check-certificate";
import { proposeReduction } from "../server/services/reductions/propose-reduction";
import { decideReduction } from "../server/services/reductions/review";

// Demo reductions between the invented Glimmerfin models, found by the engine itself when the seed runs (nothing
// is hand-written): the tide clock emulates its three-gene ring, the ring emulates the one-gene pulse (all three
// genes in one block), and the clock emulates the pulse directly. The first two are approved, so the model
// hierarchy shows them and their composition; the third waits for the demo reviewer. They are stored and approved
// through the same services as the API (verified when found, re-verified on approval). Safe to run twice.
const DEMO_PROJECT_ID = "00000000-0000-4000-8000-000000000001";
const TIDE_CLOCK = "00000000-0000-4000-8000-000000000302";
const TIDE_RING = "00000000-0000-4000-8000-000000000306";
const TIDE_PULSE = "00000000-0000-4000-8000-000000000307";

const statements = [
  {
    source: TIDE_CLOCK,
    target: TIDE_RING,
    approve: "The paired Tk genes step exactly like the ring; checked the runs side by side.",
  },
  { source: TIDE_RING, target: TIDE_PULSE, approve: "All three genes in step are one oscillator." },
  { source: TIDE_CLOCK, target: TIDE_PULSE, approve: null },
];

async function latestRevision(knex: Knex, modelId: string) {
  return (await knex("model_revisions as r")
    .join("models as m", "m.id", "r.model_id")
    .where("m.id", modelId)
    .andWhereRaw("r.revision = m.latest_revision")
    .first("r.id", "r.definition")) as { id: string; definition: never } | undefined;
}

export async function seed(knex: Knex): Promise<void> {
  const users = new Map(
    (
      (await knex("users")
        .whereIn("email", ["modeler@demo.emulant.test", "reviewer@demo.emulant.test"])
        .select("id", "email", "display_name")) as { id: string; email: string; display_name: string }[]
    ).map((u) => [u.email, { id: u.id, displayName: u.display_name }]),
  );
  const modeler = users.get("modeler@demo.emulant.test") ?? null;
  const reviewer = users.get("reviewer@demo.emulant.test") ?? null;
  for (const s of statements) {
    const source = await latestRevision(knex, s.source);
    const target = await latestRevision(knex, s.target);
    if (!source || !target) continue; // the models seed did not run
    // Rows from before operator chains were stored flat hold binary nodes: read both forms.
    const sourceNet = compileDefinition(upgradeDefinition(source.definition));
    const targetNet = compileDefinition(upgradeDefinition(target.definition));
    const found = searchBlockEmulation(sourceNet, targetNet, { maxTime: 1, maxBlock: 6 });
    if (!found.witness) throw new Error(`demo seed: expected a block emulation for ${s.source} -> ${s.target}`);
    const certificate = blockEmulationCertificate(sourceNet, targetNet, found.witness) as Certificate;
    const stored = await knex.transaction((trx) =>
      proposeReduction(
        trx,
        {
          projectId: DEMO_PROJECT_ID,
          sourceRevisionId: source.id,
          targetRevisionId: target.id,
          certificate,
          flags: [],
          foundBy: modeler?.id ?? null,
          foundInRunId: null,
        },
        () => checkCertificate(certificate, null, " when found"),
      ),
    );
    if (stored.isNew && s.approve && reviewer) {
      await decideReduction(knex, { projectId: DEMO_PROJECT_ID, user: reviewer }, stored.id, {
        decision: "approve",
        comment: s.approve,
      });
    }
  }
}
