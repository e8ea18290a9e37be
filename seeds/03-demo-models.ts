import type { Knex } from "knex";
import type { GeneratorParams } from "@shared/schemas/models";
import { findModel } from "../server/db/repositories/models";
import { createModelFromRules, generateModel } from "../server/services/models/new-model";
import { reviseModel } from "../server/services/models/new-revision";

// Demo models of the invented Glimmerfin alga (organism, genes and story are ours; every model says it is demo
// data), created through the same services as the API, so they are read, checked and audited like any other.
// Fixed ids so the seed can run twice; missing revisions are added as edits (revisions are immutable).
const DEMO_PROJECT_ID = "00000000-0000-4000-8000-000000000001";
const DEMO_NOTE = "Demo data: the Glimmerfin alga and its genes are invented.";

/** Revision 1 from rule text or a generator; later revisions are edits of the rule text. */
type FirstRevision = { ruleText: string } | { generator: GeneratorParams };
interface DemoModel {
  id: string;
  name: string;
  description: string;
  author: string;
  first: FirstRevision;
  edits?: { ruleText: string; message: string }[];
}

const BLOOM_V1 = `# Glimmerfin bloom switch: light and nitrate decide between blooming and the dormant cyst.
Light' = Light
Nitrate' = Nitrate
PhotoR' = Light
GlfA' = PhotoR & !DrmK
GlfB' = GlfA | GlfB & Nitrate
DrmK' = !GlfB & !Light
DrmS' = DrmK | DrmS & !GlfA
Lum' = GlfA & GlfB
NitT' = Nitrate & !DrmS
Cyc' = GlfB & NitT & !DrmS
Cyst' = DrmS & !Cyc
`;

const BLOOM_V2 = `${BLOOM_V1}# Pigment made in light unless the dormancy kinase is active.
Pig' = Light & !DrmK
`;

// The tide clock hides a three-gene repressor ring (Tk1 -| Tk2 -| Tk3 -| Tk1) encoded in blocks of two nodes:
// each gene X is the pair Xa, Xb. On states where every pair agrees (Xa = Xb), Xa' = !(Ya & Yb) and
// Xb' = !(Ya | Yb) both equal !Y, so the pairs keep agreeing and step exactly like the three-gene ring. Moon and
// the reporters only read the clock and never feed back.
const TIDE_CLOCK = `# Glimmerfin tide clock: a repressor ring in two-node blocks, with lunar context and reporters.
Tk1a' = !(Tk3a & Tk3b)
Tk1b' = !(Tk3a | Tk3b)
Tk2a' = !(Tk1a & Tk1b)
Tk2b' = !(Tk1a | Tk1b)
Tk3a' = !(Tk2a & Tk2b)
Tk3b' = !(Tk2a | Tk2b)
Moon' = Moon
Rep1' = Tk1a & Tk1b & Moon
Rep2' = Rep1 | Tk2a & Moon
Shell' = Rep2 & !Tk3b
`;

const DIVISION = `# Glimmerfin division cycle as weighted sums: a start signal (Sun) that decays, and gene groups that switch on
# when their weighted inputs exceed the offset.
Sun' = threshold(; tie zero)
Gc1' = threshold(+1 Sun, -1 Gc4; tie keep)
Inh' = threshold(-1 Gc1, -1 Gc3, +1 Apc; tie keep)
Gc2' = threshold(+1 Gc1; tie zero)
Gc3' = threshold(+1 Gc2, -1 Inh, -1 Apc, +1 Mit; tie keep)
Mit' = threshold(+1 Gc3, +1 Gc4; tie zero)
Gc4' = threshold(+1 Gc3, +1 Mit, -1 Apc; tie keep)
Apc' = threshold(+1 Mit, +2 Gc4, -1 Gc1; offset 1; tie zero)
Sep' = threshold(+1 Apc, +1 Mit, -1 Gc3; tie zero)
Dau' = threshold(+1 Sep, -1 Sun; tie keep)
`;

const STRESS = `# Glimmerfin stress-response atlas: heat, salt and UV pathways converging on growth arrest and the cyst.
Heat' = Heat
Salt' = Salt
UV' = UV
Hsf1' = Heat & !Hsp7
Hsp7' = Hsf1 | Hsp7 & Heat
Hsp9' = Hsf1 & !Sos2
Osm1' = Salt & !Gly3
Osm2' = Osm1 | Osm2 & Salt
Gly3' = Osm2
Sos2' = Osm2 & !Hsp9
Uvr1' = UV & !Rep4
Uvr2' = Uvr1
Rep4' = Uvr2 & !Chk1
Chk1' = Uvr1 | Uvr2 & !Rep4
Arr1' = Chk1 | Sos2 | Hsf1 & !Hsp7
Cyc1' = !Arr1 & Grw1
Grw1' = !Heat & !Salt | Cyc1 & !Arr1
Aox1' = Hsp7 | Gly3 | Rep4
Ros1' = (Heat | UV) & !Aox1
Apo1' = Ros1 & Chk1 & !Hsp9
Cyst1' = Arr1 & Gly3 | Cyst1 & !Grw1
Glow1' = Grw1 & !Ros1
Pig1' = UV | Pig1 & !Grw1
Dorm1' = Cyst1 & !Apo1
`;

const CILIA_RING: GeneratorParams = { kind: "eca", rule: 110, radius: 1, cells: 12 };

export const DEMO_MODELS: DemoModel[] = [
  {
    id: "00000000-0000-4000-8000-000000000301",
    name: "Glimmerfin bloom switch",
    description: `${DEMO_NOTE} Light and nitrate decide between blooming (GlfA/GlfB, luminescence) and the dormant cyst (DrmK/DrmS).`,
    author: "modeler@demo.emulant.test",
    first: { ruleText: BLOOM_V1 },
    edits: [{ ruleText: BLOOM_V2, message: "Add the light pigment Pig" }],
  },
  {
    id: "00000000-0000-4000-8000-000000000302",
    name: "Glimmerfin tide clock",
    description: `${DEMO_NOTE} Contains a three-gene repressor ring encoded in two-node blocks (Tk1a/Tk1b, Tk2a/Tk2b, Tk3a/Tk3b) plus lunar context and reporters: a known smaller circuit for reductions to find.`,
    author: "modeler@demo.emulant.test",
    first: { ruleText: TIDE_CLOCK },
  },
  {
    id: "00000000-0000-4000-8000-000000000303",
    name: "Glimmerfin division cycle (threshold)",
    description: `${DEMO_NOTE} A weighted-sum model of the division cycle, in the style of threshold cell-cycle models.`,
    author: "owner@demo.emulant.test",
    first: { ruleText: DIVISION },
  },
  {
    id: "00000000-0000-4000-8000-000000000304",
    name: "Glimmerfin cilia ring (rule 110, 12 cells)",
    description: `${DEMO_NOTE} The ring of cilia cells around the eyespot, modelled as elementary cellular automaton rule 110 on 12 cells.`,
    author: "modeler@demo.emulant.test",
    first: { generator: CILIA_RING },
  },
  {
    id: "00000000-0000-4000-8000-000000000306",
    name: "Glimmerfin tide ring (3 genes)",
    description: `${DEMO_NOTE} The three-gene repressor ring the tide clock was built around, written on its own.`,
    author: "modeler@demo.emulant.test",
    first: { ruleText: "# Each tide gene represses the next.\nTk1' = !Tk3\nTk2' = !Tk1\nTk3' = !Tk2\n" },
  },
  {
    id: "00000000-0000-4000-8000-000000000307",
    name: "Glimmerfin tide pulse (1 gene)",
    description: `${DEMO_NOTE} A single self-repressing gene: the smallest oscillator, on at every other step.`,
    author: "modeler@demo.emulant.test",
    first: { ruleText: "Pulse' = !Pulse\n" },
  },
  {
    id: "00000000-0000-4000-8000-000000000305",
    name: "Glimmerfin stress-response atlas",
    description: `${DEMO_NOTE} 24 genes; heat, salt and UV pathways converging on growth arrest and encystment. Its exact attractor analysis runs as a background run.`,
    author: "owner@demo.emulant.test",
    first: { ruleText: STRESS },
  },
];

export async function seed(knex: Knex): Promise<void> {
  const project = await knex("projects").where({ id: DEMO_PROJECT_ID }).first("id");
  if (!project) return; // the accounts seed creates the demo project; without it there is nowhere to put models
  for (const m of DEMO_MODELS) {
    const author = (await knex("users").where({ email: m.author }).first("id")) as { id: string } | undefined;
    if (!author) throw new Error(`demo seed: the accounts seed did not create ${m.author}`);
    const by = { projectId: DEMO_PROJECT_ID, userId: author.id };
    const fields = { id: m.id, name: m.name, description: m.description };
    let latest = (await findModel(knex, DEMO_PROJECT_ID, m.id))?.latestRevision;
    if (latest === undefined) {
      if ("generator" in m.first) await generateModel(knex, by, { ...fields, generator: m.first.generator });
      else await createModelFromRules(knex, by, { ...fields, ruleText: m.first.ruleText });
      latest = 1;
    }
    for (const edit of (m.edits ?? []).slice(latest - 1)) await reviseModel(knex, by, m.id, edit);
  }
}
