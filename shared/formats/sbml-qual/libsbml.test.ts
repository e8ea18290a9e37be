// Exported files are checked by the standard's reference library, libSBML (Bornstein, Keating, Jouraku, Hucka,
// "LibSBML: an API library for SBML", Bioinformatics 2008), through Debian's python3-sbml5 under /usr/bin/python3.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { afterAll, describe, expect, it } from "vitest";
import { cellularAutomaton, nkNetwork, thresholdNetwork } from "../../engine/generators";
import { compileDefinition, networkToDefinition, readRuleText, type ModelDefinition } from "../../engine/rules";
import { modelArb } from "../../engine/rules/rules-arbitrary.test-support";
import { readSbmlQual } from "./read-sbml-qual";
import { writeSbmlQual } from "./write-sbml-qual";

const PYTHON = "/usr/bin/python3";
const fixtureDir = fileURLToPath(new URL("../../../tests/fixtures/sbml/", import.meta.url));
const probe = spawnSync(PYTHON, ["-c", "import libsbml; print(libsbml.getLibSBMLDottedVersion())"], {
  encoding: "utf8",
});
const hasLibSbml = probe.status === 0;
if (!hasLibSbml) {
  console.warn(
    `SKIPPED libSBML checks: ${PYTHON} cannot import libsbml (install Debian's python3-sbml5). ${probe.stderr ?? ""}`,
  );
}

interface FileReport {
  file: string;
  errors: string[];
  readErrors: number;
  level: number;
  version: number;
  qualRequired: boolean;
  species: number;
  transitions: number;
}

const work = mkdtempSync(join(tmpdir(), "emulant-libsbml-"));
afterAll(() => rmSync(work, { recursive: true, force: true }));

function checkWithLibSbml(models: { name: string; text: string }[]): FileReport[] {
  const paths = models.map((m) => {
    const path = join(work, `${m.name}.sbml`);
    writeFileSync(path, m.text);
    return path;
  });
  const out = execFileSync(PYTHON, [join(fixtureDir, "check-with-libsbml.py"), ...paths], {
    encoding: "utf8",
    maxBuffer: 64 * 1024 * 1024,
  });
  return (JSON.parse(out) as { files: FileReport[] }).files;
}

describe.skipIf(!hasLibSbml)("writeSbmlQual checked by libSBML", () => {
  it("writeSbmlQual files of published, generated and random models pass libSBML's consistency check with zero errors", () => {
    const rules = readFileSync(join(fixtureDir, "faure-2006-cell-cycle.rules"), "utf8");
    const models: { name: string; model: ModelDefinition }[] = [
      { name: "faure-2006", model: readRuleText(rules) },
      { name: "eca-110", model: networkToDefinition(cellularAutomaton({ cells: 9, rule: 110 })) },
      { name: "nk", model: networkToDefinition(nkNetwork({ n: 12, k: 3, p: 0.4, random: seedrandom("4901") })) },
      { name: "threshold", model: thresholdNetwork({ n: 8, k: 3, tie: "zero", random: seedrandom("4902") }) },
      // names that collide with the ids the writer would pick for the model, compartment and transitions
      { name: "clash", model: readRuleText("model' = cell\ncell' = !tr_cell\ntr_cell' = 1\n") },
    ];
    fc.sample(modelArb(7), { seed: 4903, numRuns: 40 }).forEach((model, i) =>
      models.push({ name: `random-${i}`, model }),
    );
    const reports = checkWithLibSbml(
      models.map((m) => ({ name: m.name, text: writeSbmlQual(m.model, { modelId: m.name }) })),
    );
    reports.forEach((r, i) => {
      const model = models[i]!.model;
      expect(r.errors, r.file).toEqual([]);
      expect(r.readErrors, r.file).toBe(0);
      expect([r.level, r.version, r.qualRequired]).toEqual([3, 1, true]);
      expect(r.species).toBe(model.nodes.length);
      expect(r.transitions).toBe(model.nodes.filter((n) => !(n.rule.kind === "var" && n.rule.name === n.name)).length);
    });
  });

  it("readSbmlQual reads the files libSBML writes today, with the same dynamics as the committed fixtures", () => {
    const outDir = mkdtempSync(join(work, "fixtures-"));
    execFileSync(PYTHON, [join(fixtureDir, "build-libsbml-fixtures.py"), outDir], { encoding: "utf8" });
    const fresh = readSbmlQual(readFileSync(join(outDir, "faure-2006-cell-cycle.libsbml.sbml"), "utf8"));
    const committed = readSbmlQual(readFileSync(join(fixtureDir, "faure-2006-cell-cycle.libsbml.sbml"), "utf8"));
    expect(compileDefinition(fresh.definition)).toEqual(compileDefinition(committed.definition));
    expect(() => readSbmlQual(readFileSync(join(outDir, "multivalued.libsbml.sbml"), "utf8"))).toThrow(
      /species Kinase has maxLevel 2/,
    );
  });
});
