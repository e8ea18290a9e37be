// Perturbation comparison: pick knock-outs (fixed to 0), over-expressions (fixed to 1) and input conditions, then
// compare the attractors (and the basin each phenotype gets) before and after.
import { useState } from "react";
import type { PerturbationResult } from "@shared/schemas/models";
import { useComparePerturbation } from "../api/compare-perturbation";
import { StateCells } from "./attractor-table";

type Choice = "none" | "ko" | "oe";

function AttractorList({ title, result }: { title: string; result: PerturbationResult["before"] }) {
  return (
    <div>
      <h4 className="text-xs font-semibold uppercase tracking-wide text-slate-600">{title}</h4>
      <ul className="mt-1 space-y-1 text-xs">
        {result.attractors.map((a, i) => (
          <li key={i} className="flex items-center gap-2">
            <span className="w-20 text-slate-600">{a.length === 1 ? "fixed" : `cycle ${a.length}`}</span>
            <span className="w-14 text-right tabular-nums">{((100 * a.basin) / result.stateCount).toFixed(1)}%</span>
            {a.phenotype !== null && <span className="w-16 font-mono">{a.phenotype}</span>}
            <StateCells state={a.states[0]!} nodes={result.nodes} />
          </li>
        ))}
      </ul>
    </div>
  );
}

export function PerturbationPanel({
  projectId,
  modelId,
  revision,
  nodes,
  inputs,
  markers,
}: {
  projectId: string;
  modelId: string;
  revision: number;
  nodes: readonly string[];
  inputs: readonly string[];
  markers: readonly string[];
}) {
  const compare = useComparePerturbation(projectId, modelId, revision);
  const [choice, setChoice] = useState<Record<string, Choice>>({});
  const chosen = (c: Choice) => nodes.filter((n) => choice[n] === c && !inputs.includes(n));
  const fixed = Object.fromEntries(
    inputs.filter((n) => choice[n] === "ko" || choice[n] === "oe").map((n) => [n, choice[n] === "oe" ? 1 : 0] as const),
  );
  const isEmpty = chosen("ko").length + chosen("oe").length + Object.keys(fixed).length === 0;
  const total = compare.data?.before.stateCount ?? 1;

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-2 text-xs">
        {nodes.map((n) => (
          <label key={n} className="flex items-center gap-1 rounded border border-slate-200 bg-white px-2 py-1">
            <span className={`font-mono ${inputs.includes(n) ? "text-brand-800" : ""}`}>{n}</span>
            <select
              aria-label={`Perturbation of ${n}`}
              data-testid={`perturb-${n}`}
              value={choice[n] ?? "none"}
              onChange={(e) => setChoice({ ...choice, [n]: e.target.value as Choice })}
              className="rounded border-slate-200 bg-transparent text-xs"
            >
              <option value="none">—</option>
              <option value="ko">{inputs.includes(n) ? "input 0" : "knock-out"}</option>
              <option value="oe">{inputs.includes(n) ? "input 1" : "over-express"}</option>
            </select>
          </label>
        ))}
      </div>
      <button
        type="button"
        disabled={isEmpty || compare.isPending}
        data-testid="perturb-run"
        onClick={() =>
          compare.mutate({ knockOut: chosen("ko"), overExpress: chosen("oe"), fixed, markers: [...markers] })
        }
        className="rounded-md bg-brand-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-brand-800 disabled:opacity-50"
      >
        Compare attractors
      </button>
      {compare.error && (
        <p role="alert" className="text-sm text-red-700">
          {compare.error.message}
        </p>
      )}
      {compare.data && (
        <div data-testid="perturbation-result" className="space-y-3">
          {markers.length > 0 && (
            <table className="text-sm">
              <thead className="text-left text-xs uppercase text-slate-600">
                <tr>
                  <th className="pr-6">Phenotype ({markers.join(", ")})</th>
                  <th className="pr-6 text-right">Before</th>
                  <th className="text-right">After</th>
                </tr>
              </thead>
              <tbody>
                {compare.data.phenotypes.map((p) => (
                  <tr key={p.phenotype}>
                    <td className="pr-6 font-mono">{p.phenotype}</td>
                    <td className="pr-6 text-right tabular-nums">{((100 * p.basinBefore) / total).toFixed(1)}%</td>
                    <td
                      className={`text-right tabular-nums ${p.basinAfter !== p.basinBefore ? "font-semibold text-amber-700" : ""}`}
                    >
                      {((100 * p.basinAfter) / total).toFixed(1)}%
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
          <div className="grid gap-4 md:grid-cols-2">
            <AttractorList title="Before" result={compare.data.before} />
            <AttractorList title="After" result={compare.data.after} />
          </div>
        </div>
      )}
    </div>
  );
}
