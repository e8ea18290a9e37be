// The witness made visible: G's run from a configuration x, beside F's run from the encoding of x (each cell of x
// replaced by its codeword) sampled every t steps. Each sampled row of F decodes block by block to G's row.
import { useMemo } from "react";
import seedrandom from "seedrandom";
import { ecaRule, spaceTimeDiagram } from "@shared/engine/automata";
import type { WitnessReport } from "@shared/schemas/automata";
import { SpaceTimeCanvas } from "./space-time-canvas";

const BLOCKS = 20;
const STEPS = 24;
const ROW_HEIGHT = 9;

export function witnessRuns(report: WitnessReport) {
  const { source, target, witness } = report;
  const u = [witness.encoding["0"], witness.encoding["1"]];
  const k = u[0]!.length;
  const t = witness.time;
  const random = seedrandom(`witness-${source}-${target}`);
  const x = new Uint8Array(BLOCKS);
  for (let i = 0; i < BLOCKS; i++) x[i] = random() < 0.5 ? 1 : 0;
  const encoded = new Uint8Array(BLOCKS * k);
  for (let i = 0; i < BLOCKS; i++) for (let j = 0; j < k; j++) encoded[i * k + j] = u[x[i]!]![j] === "1" ? 1 : 0;
  const g = spaceTimeDiagram(ecaRule(target), x, STEPS);
  const f = spaceTimeDiagram(ecaRule(source), encoded, STEPS * t, t);
  let agreeingRows = 0;
  for (let s = 0; s <= STEPS; s++) {
    let agrees = true;
    for (let i = 0; i < BLOCKS && agrees; i++) {
      let block = "";
      for (let j = 0; j < k; j++) block += f.cells[s * BLOCKS * k + i * k + j] ? "1" : "0";
      agrees = block === u[g.cells[s * BLOCKS + i]!];
    }
    if (agrees) agreeingRows++;
  }
  return { g, f, k, t, agreeingRows, rows: STEPS + 1 };
}

export function WitnessDiagram({ report }: { report: WitnessReport }) {
  const runs = useMemo(() => witnessRuns(report), [report]);
  const fCell = Math.max(1.5, Math.min(6, 420 / (BLOCKS * runs.k)));
  const gCell = fCell * runs.k;
  const allAgree = runs.agreeingRows === runs.rows;
  return (
    <div className="space-y-3" data-testid="witness-diagram">
      <div className="flex flex-wrap items-start gap-6">
        <figure className="space-y-1">
          <figcaption className="text-sm font-medium text-slate-700">
            Rule {report.target} (emulated), {STEPS} steps
          </figcaption>
          <SpaceTimeCanvas
            cells={runs.g.cells}
            width={BLOCKS}
            rows={runs.rows}
            cellWidth={gCell}
            cellHeight={ROW_HEIGHT}
            label={`Run of rule ${report.target}`}
            testId="witness-target-run"
          />
        </figure>
        <figure className="space-y-1">
          <figcaption className="text-sm font-medium text-slate-700">
            Rule {report.source} (emulator) from the encoding, one row every {runs.t === 1 ? "step" : `${runs.t} steps`}
          </figcaption>
          <SpaceTimeCanvas
            cells={runs.f.cells}
            width={BLOCKS * runs.k}
            rows={runs.rows}
            cellWidth={fCell}
            cellHeight={ROW_HEIGHT}
            blockEvery={fCell * runs.k >= 8 ? runs.k : undefined}
            label={`Run of rule ${report.source} from the encoded configuration`}
            testId="witness-source-run"
          />
        </figure>
      </div>
      <p className={`text-sm ${allAgree ? "text-brand-700" : "text-red-700"}`} data-testid="witness-agreement">
        {allAgree
          ? `All ${runs.rows} sampled rows of rule ${report.source} decode, block by block, to the rows of rule ${report.target}.`
          : `Only ${runs.agreeingRows} of ${runs.rows} sampled rows decode to rule ${report.target}'s rows.`}
      </p>
    </div>
  );
}
