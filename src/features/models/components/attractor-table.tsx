// Synchronous attractors with basin sizes (share of all states), cycle states and phenotype labels; a row can be
// selected to paint its first state on the wiring diagram.
import type { SynchronousResult } from "@shared/schemas/models";
import { downloadCsv } from "@/lib/download";
import { plural } from "@/lib/plural";

export function StateCells({ state, nodes, testId }: { state: string; nodes: readonly string[]; testId?: string }) {
  return (
    <span
      data-testid={testId}
      className="inline-flex font-mono"
      title={nodes.map((n, i) => `${n}=${state[i]}`).join(" ")}
    >
      {[...state].map((c, i) => (
        <span
          key={i}
          className={`inline-block w-3 text-center text-[11px] leading-4 ${c === "1" ? "bg-brand-600 text-white" : "bg-slate-100 text-slate-500"}`}
        >
          {c}
        </span>
      ))}
    </span>
  );
}

/** One CSV row per attractor state, so a cycle's states stay together under its number. */
export function attractorCsvRows(result: SynchronousResult): (string | number)[][] {
  return [
    ["attractor", "kind", "basin", "share", "phenotype", "step", ...result.nodes],
    ...result.attractors.flatMap((a, i) =>
      a.states.map((s, j) => [
        i + 1,
        a.length === 1 ? "fixed point" : `cycle of ${a.length}`,
        a.basin,
        (a.basin / result.stateCount).toFixed(4),
        a.phenotype ?? "",
        j,
        ...s,
      ]),
    ),
  ];
}

export interface AttractorTableProps {
  fileName?: string;
  result: SynchronousResult;
  selected: number | null;
  onSelect(index: number | null): void;
}

export function AttractorTable({ result, selected, onSelect, fileName = "attractors" }: AttractorTableProps) {
  const hasPhenotypes = result.markers.length > 0;
  return (
    <div className="overflow-x-auto rounded-lg border border-slate-200 bg-white">
      <table
        data-testid="attractor-table"
        data-count={result.attractors.length}
        className="min-w-full divide-y divide-slate-200 text-sm"
      >
        <thead className="bg-slate-50 text-left text-xs font-semibold uppercase tracking-wide text-slate-600">
          <tr>
            <th className="px-3 py-2">#</th>
            <th className="px-3 py-2">Kind</th>
            <th className="px-3 py-2 text-right">Basin</th>
            <th className="px-3 py-2 text-right">Share</th>
            {hasPhenotypes && <th className="px-3 py-2">Phenotype ({result.markers.join(", ")})</th>}
            <th className="px-3 py-2">States ({plural(result.nodes.length, "node")}, in model order)</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-slate-100">
          {result.attractors.map((a, i) => (
            <tr
              key={i}
              data-testid="attractor-row"
              aria-selected={selected === i}
              tabIndex={0}
              onClick={() => onSelect(selected === i ? null : i)}
              onKeyDown={(e) => {
                if (e.key !== "Enter" && e.key !== " ") return;
                e.preventDefault();
                onSelect(selected === i ? null : i);
              }}
              className={`cursor-pointer align-top focus-visible:outline-2 focus-visible:-outline-offset-2 focus-visible:outline-amber-600 ${selected === i ? "bg-brand-50" : "hover:bg-slate-50"}`}
            >
              <td className="px-3 py-2 tabular-nums text-slate-500">{i + 1}</td>
              <td className="px-3 py-2">{a.length === 1 ? "fixed point" : `cycle of ${a.length}`}</td>
              <td className="px-3 py-2 text-right tabular-nums" data-testid="attractor-basin">
                {a.basin}
              </td>
              <td className="px-3 py-2 text-right tabular-nums">{((100 * a.basin) / result.stateCount).toFixed(1)}%</td>
              {hasPhenotypes && (
                <td className="px-3 py-2 font-mono" data-testid="attractor-phenotype">
                  {a.phenotype}
                </td>
              )}
              <td className="space-y-0.5 px-3 py-2">
                {a.states.slice(0, 6).map((s, j) => (
                  <div key={j}>
                    <StateCells state={s} nodes={result.nodes} testId="attractor-state" />
                  </div>
                ))}
                {a.states.length > 6 && <div className="text-xs text-slate-500">… {a.states.length - 6} more</div>}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="border-t border-slate-100 px-3 py-2 text-xs text-slate-500">
        {result.stateCount.toLocaleString()} states; longest transient {result.maxTransient} step
        {result.maxTransient === 1 ? "" : "s"}, mean {result.meanTransient.toFixed(2)}. Phenotype: 1 always on, 0 always
        off, ~ oscillates on the attractor.{" "}
        <button
          type="button"
          className="font-medium text-brand-700 hover:underline"
          data-testid="attractor-csv"
          onClick={() => downloadCsv(attractorCsvRows(result), `${fileName}-attractors`)}
        >
          Download as CSV
        </button>
      </p>
    </div>
  );
}
