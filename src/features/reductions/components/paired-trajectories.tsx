// The reduction at work: G's run beside F's run started from the encoded state and sampled every t steps. Each row
// says whether F's sample is exactly the encoding of G's state; a valid certificate agrees on every row.
import { useMemo, useState } from "react";
import type { Certificate } from "@shared/schemas/reductions";
import { StateRaster } from "@/components/raster/state-raster";
import { BLOCK_COLOURS, pairedRuns, sourceNodeRoles } from "../lib/certificate-view";

function allStates(m: number): string[] {
  return Array.from({ length: 2 ** Math.min(m, 8) }, (_, x) =>
    Array.from({ length: m }, (_, i) => ((x >> i) & 1 ? "1" : "0")).join(""),
  );
}

export function PairedTrajectories({ certificate }: { certificate: Certificate }) {
  const targetNames = certificate.target.nodes.map((n) => n.name);
  const sourceNames = certificate.source.nodes.map((n) => n.name);
  const isCoarse = certificate.notion === "coarse-graining";
  const choices = isCoarse ? [sourceNames.map(() => "0").join("")] : allStates(targetNames.length);
  const [start, setStart] = useState(choices[choices.length > 1 ? 1 : 0]!);
  const [steps, setSteps] = useState(8);
  const runs = useMemo(() => pairedRuns(certificate, start, steps), [certificate, start, steps]);
  const roles = sourceNodeRoles(certificate);
  const sourceColours = sourceNames.map((n) => roles.get(n)!.colour);
  const targetColours = targetNames.map((_, j) => BLOCK_COLOURS[j % BLOCK_COLOURS.length]!);
  const disagreeing = new Set(runs.filter((r) => !r.agrees).map((r) => r.step));
  const isAgreeing = disagreeing.size === 0;

  return (
    <div className="space-y-3" data-testid="paired-trajectories" data-agrees={isAgreeing}>
      <div className="flex flex-wrap items-end gap-4 text-sm">
        <label className="flex flex-col gap-1">
          <span className="font-medium text-slate-700">{isCoarse ? "Source start state" : "Target start state"}</span>
          {isCoarse ? (
            <input
              value={start}
              onChange={(e) =>
                /^[01]*$/.test(e.target.value) &&
                e.target.value.length === sourceNames.length &&
                setStart(e.target.value)
              }
              className="rounded-md border border-slate-300 px-2 py-1 font-mono"
            />
          ) : (
            <select
              value={start}
              onChange={(e) => setStart(e.target.value)}
              className="rounded-md border border-slate-300 px-2 py-1 font-mono"
              data-testid="start-state"
            >
              {choices.map((s) => (
                <option key={s} value={s}>
                  {s}
                </option>
              ))}
            </select>
          )}
        </label>
        <label className="flex flex-col gap-1">
          <span className="font-medium text-slate-700">Steps of G</span>
          <input
            type="number"
            min={1}
            max={64}
            value={steps}
            onChange={(e) => setSteps(Math.max(1, Math.min(64, Number(e.target.value) || 1)))}
            className="w-24 rounded-md border border-slate-300 px-2 py-1"
          />
        </label>
        <p
          className={`rounded-md px-3 py-1.5 font-medium ${isAgreeing ? "bg-emerald-50 text-emerald-800" : "bg-red-50 text-red-800"}`}
          data-testid="agreement"
        >
          {isAgreeing
            ? `F sampled every ${certificate.time} step${certificate.time > 1 ? "s" : ""} matches G on all ${runs.length} rows`
            : `Disagreement at step${disagreeing.size > 1 ? "s" : ""} ${[...disagreeing].join(", ")}`}
        </p>
      </div>
      <div className="flex flex-wrap gap-6">
        <figure>
          <figcaption className="mb-1 text-sm font-medium text-slate-700">G, one step per row</figcaption>
          <StateRaster
            nodes={targetNames}
            states={runs.map((r) => r.target)}
            columnColours={targetColours}
            testId="target-raster"
          />
        </figure>
        <figure>
          <figcaption className="mb-1 text-sm font-medium text-slate-700">
            F, every {certificate.time} step{certificate.time > 1 ? "s" : ""} (rows are F steps 0, {certificate.time},{" "}
            {2 * certificate.time}, …)
          </figcaption>
          <StateRaster
            nodes={sourceNames}
            states={runs.map((r) => r.source)}
            columnColours={sourceColours}
            rowLabels={runs.map((r) => String(r.step * certificate.time))}
            markedRows={disagreeing}
            testId="source-raster"
          />
        </figure>
      </div>
    </div>
  );
}
