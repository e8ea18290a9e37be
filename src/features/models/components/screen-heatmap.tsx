// The screen as a heatmap (see lib/screen-heatmap.ts for the layout): colour is the chosen measure, a legend reads
// it back, the focused or hovered cell is spelled out below the grid, arrow keys move between cells (one tab stop
// for the whole grid) and Enter opens the model under that cell's perturbation. Undecided cells are hatched in
// amber with a "?", the same tone the expectation matrix uses for undecided.
import { useRef, useState } from "react";
import { Link } from "react-router-dom";
import type { ScreenRunResult } from "@shared/schemas/screens";
import {
  cellColour,
  legendGradient,
  screenHeatmap,
  type HeatmapCell,
  type HeatmapMeasure,
  type ScreenHeatmap,
} from "../lib/screen-heatmap";

const MEASURES: { id: HeatmapMeasure; label: string }[] = [
  { id: "share", label: "Basin share with the phenotype" },
  { id: "change", label: "Change vs. unperturbed" },
  { id: "phenotype-attractors", label: "Change in attractors with the phenotype" },
];

const UNDECIDED_BACKGROUND = "repeating-linear-gradient(45deg, #fef3c7 0 4px, #fde68a 4px 8px)";

export function formatMeasure(value: number, measure: HeatmapMeasure): string {
  if (measure === "share") return `${(100 * value).toFixed(1)} %`;
  const sign = value > 0 ? "+" : value < 0 ? "−" : "±";
  return measure === "change" ? `${sign}${Math.abs(100 * value).toFixed(1)} %` : `${sign}${Math.abs(value)}`;
}

export function perturbationWords(p: Readonly<Record<string, 0 | 1>>): string {
  return Object.entries(p)
    .map(([n, v]) => `${n} ${v === 0 ? "knocked out" : "over-expressed"}`)
    .join(", ");
}

function cellWords(cell: HeatmapCell, map: ScreenHeatmap, counted: string): string {
  if (!cell.perturbation) return "The same node knocked out and over-expressed: no perturbation.";
  const what = perturbationWords(cell.perturbation);
  const r = cell.row;
  if (!r) return `${what}: not in this screen.`;
  const measure = MEASURES.find((m) => m.id === map.measure)!.label.toLowerCase();
  const value =
    cell.value === null
      ? "undecided (no basins for fixed points found by SAT)"
      : formatMeasure(cell.value, map.measure);
  return (
    `${what}: ${measure} ${value}; ${counted} ${r.attractorsBefore} → ${r.attractorsAfter}, ` +
    `with the phenotype ${r.phenotypeAttractorsBefore} → ${r.phenotypeAttractorsAfter}, ` +
    `${r.attractorsLost} lost, ${r.attractorsGained} gained${r.complete ? "" : " (enumeration capped: lower bounds)"}.`
  );
}

function Legend({ map }: { map: ScreenHeatmap }) {
  const [lo, hi] = map.domain;
  const statuses = new Set(map.cells.flat().map((c) => c.status));
  return (
    <div className="flex flex-wrap items-center gap-4 text-xs text-slate-700" data-testid="heatmap-legend">
      <div className="flex items-center gap-2">
        <span className="tabular-nums">{formatMeasure(lo, map.measure)}</span>
        <span
          className="inline-block h-3 w-40 rounded-sm border border-slate-200"
          style={{ background: legendGradient(map.domain) }}
        />
        <span className="tabular-nums">{formatMeasure(hi, map.measure)}</span>
      </div>
      {statuses.has("undecided") && (
        <span className="flex items-center gap-1">
          <span
            className="inline-flex h-3 w-5 items-center justify-center rounded-sm text-[9px] font-bold text-amber-800"
            style={{ background: UNDECIDED_BACKGROUND }}
          >
            ?
          </span>
          undecided
        </span>
      )}
      {statuses.has("missing") && (
        <span className="flex items-center gap-1">
          <span className="inline-block h-3 w-5 rounded-sm border border-dashed border-slate-400 bg-white" /> not
          screened
        </span>
      )}
      {statuses.has("impossible") && (
        <span className="flex items-center gap-1">
          <span className="inline-block h-3 w-5 rounded-sm bg-slate-200" /> no perturbation (one node, both ways)
        </span>
      )}
    </div>
  );
}

export function ScreenHeatmapView({
  result,
  linkFor,
}: {
  result: ScreenRunResult;
  linkFor: (perturbation: Readonly<Record<string, 0 | 1>>) => string;
}) {
  const [measure, setMeasure] = useState<HeatmapMeasure>(
    result.method === "exact-synchronous" ? "share" : "phenotype-attractors",
  );
  const map = screenHeatmap(result, measure);
  const [active, setActive] = useState<[number, number]>([0, 0]);
  const [shown, setShown] = useState<[number, number] | null>(null);
  const grid = useRef<HTMLTableElement>(null);
  const counted = result.counted === "attractors" ? "attractors" : "fixed points";
  const small = map.columns.length <= 16;
  const [ar, ac] = [Math.min(active[0], map.rows.length - 1), Math.min(active[1], map.columns.length - 1)];

  const move = (e: React.KeyboardEvent) => {
    const steps: Record<string, [number, number]> = {
      ArrowUp: [-1, 0],
      ArrowDown: [1, 0],
      ArrowLeft: [0, -1],
      ArrowRight: [0, 1],
    };
    let next: [number, number] | null = null;
    if (steps[e.key]) next = [ar + steps[e.key]![0], ac + steps[e.key]![1]];
    else if (e.key === "Home") next = [ar, 0];
    else if (e.key === "End") next = [ar, map.columns.length - 1];
    if (!next) return;
    e.preventDefault();
    const r = Math.max(0, Math.min(map.rows.length - 1, next[0]));
    const c = Math.max(0, Math.min(map.columns.length - 1, next[1]));
    setActive([r, c]);
    grid.current?.querySelector<HTMLElement>(`[data-cell="${r}-${c}"]`)?.focus();
  };

  const detail = shown ? cellWords(map.cells[shown[0]]![shown[1]]!, map, counted) : null;

  return (
    <div className="space-y-2" data-testid="screen-heatmap">
      <div className="flex flex-wrap items-center gap-3 text-xs">
        <label className="flex items-center gap-1">
          <span className="text-slate-600">Colour:</span>
          <select
            aria-label="Heatmap colour"
            className="rounded-md border border-slate-300 px-2 py-1 text-xs"
            value={measure}
            onChange={(e) => setMeasure(e.target.value as HeatmapMeasure)}
          >
            {MEASURES.map((m) => (
              <option key={m.id} value={m.id}>
                {m.label}
              </option>
            ))}
          </select>
        </label>
        <Legend map={map} />
      </div>
      <div className="overflow-x-auto">
        <table
          ref={grid}
          role="grid"
          aria-label={`Screen heatmap: ${MEASURES.find((m) => m.id === measure)!.label.toLowerCase()}`}
          className="border-separate border-spacing-0.5 text-xs"
          onKeyDown={move}
          onMouseLeave={() => setShown(null)}
        >
          <thead>
            <tr>
              <th className="p-0" />
              {map.columns.map((col) => (
                <th
                  key={col.label}
                  scope="col"
                  className={`px-0.5 font-medium text-slate-600 ${small ? "" : "h-16 align-bottom [writing-mode:vertical-rl]"}`}
                >
                  {col.label}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {map.rows.map((row, r) => (
              <tr key={row.label}>
                <th scope="row" className="whitespace-nowrap pr-2 text-left font-mono font-medium text-slate-700">
                  {row.label}
                </th>
                {map.cells[r]!.map((cell, c) => {
                  const tabIndex = r === ar && c === ac ? 0 : -1;
                  const size = map.layout === "singles" ? "h-8 w-28" : small ? "h-8 w-14" : "h-5 w-5";
                  const words = cellWords(cell, map, counted);
                  const look = cell.status === "value" ? cellColour(cell.value!, map.domain) : null;
                  const common = {
                    "data-cell": `${r}-${c}`,
                    "data-status": cell.status,
                    "aria-label": words,
                    title: words,
                    tabIndex,
                    onFocus: () => {
                      setActive([r, c]);
                      setShown([r, c]);
                    },
                    onMouseEnter: () => setShown([r, c]),
                    className: `flex ${size} items-center justify-center rounded-sm tabular-nums focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-slate-900 ${
                      cell.status === "value" ? (look!.dark ? "text-white" : "text-slate-900") : ""
                    } ${cell.status === "undecided" ? "font-bold text-amber-800" : ""} ${
                      cell.status === "missing" ? "border border-dashed border-slate-400 bg-white text-slate-400" : ""
                    } ${cell.status === "impossible" ? "bg-slate-200" : ""}`,
                    style:
                      cell.status === "value"
                        ? { background: look!.background }
                        : cell.status === "undecided"
                          ? { background: UNDECIDED_BACKGROUND }
                          : undefined,
                  };
                  const text =
                    cell.status === "undecided"
                      ? "?"
                      : small && cell.value !== null
                        ? formatMeasure(cell.value, measure)
                        : "";
                  return (
                    <td key={c} role="gridcell" className="p-0">
                      {cell.row ? (
                        <Link to={linkFor(cell.perturbation!)} data-testid="heatmap-cell" {...common}>
                          {text}
                        </Link>
                      ) : (
                        <span {...common}>{text}</span>
                      )}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="min-h-5 text-xs text-slate-700" aria-live="polite" data-testid="heatmap-detail">
        {detail ?? "Point at a cell or move to it with the arrow keys; Enter opens the model under that perturbation."}
      </p>
    </div>
  );
}
