// A screen's rows laid out as a heatmap: for single perturbations, one row per perturbed node and one column per
// direction (knock-out, over-expression); when pairs were screened, one square matrix over every (node, direction),
// where a cell holds the pair of its row and column, the diagonal holds the single perturbation, and a node held at
// 0 and 1 at once is no perturbation. The colour scales read a measure (basin share, its change against the
// unperturbed model, or the change in attractors with the phenotype) into the brand's teal and, below zero, red.
import type { ScreenRunResult, ScreenRunRow } from "@shared/schemas/screens";

export type HeatmapMeasure = "share" | "change" | "phenotype-attractors";

export interface HeatmapAxisEntry {
  readonly node: string;
  /** Only in the pair matrix: the direction this row or column holds the node at. */
  readonly value: 0 | 1 | null;
  readonly label: string;
}

export type HeatmapCellStatus =
  /** The measure has a value. */
  | "value"
  /** The row exists but its measure is not known (basins are out of reach for fixed points by SAT). */
  | "undecided"
  /** No row of the screen holds this perturbation. */
  | "missing"
  /** The same node held at 0 and at 1: no perturbation. */
  | "impossible";

export interface HeatmapCell {
  readonly perturbation: Readonly<Record<string, 0 | 1>> | null;
  readonly row: ScreenRunRow | null;
  readonly value: number | null;
  readonly status: HeatmapCellStatus;
}

export interface ScreenHeatmap {
  readonly layout: "singles" | "pairs";
  readonly measure: HeatmapMeasure;
  readonly rows: readonly HeatmapAxisEntry[];
  readonly columns: readonly HeatmapAxisEntry[];
  /** cells[r][c] for rows[r] and columns[c]. */
  readonly cells: readonly (readonly HeatmapCell[])[];
  /** The range the colour scale spans: [0, 1] for shares, symmetric about 0 for changes. */
  readonly domain: readonly [number, number];
}

const DIRECTION = ["knock-out", "over-expression"] as const;

/** The key of a perturbation that does not depend on the order its nodes were written in. */
export function perturbationKey(p: Readonly<Record<string, 0 | 1>>): string {
  return Object.entries(p)
    .map(([n, v]) => `${n}=${v}`)
    .sort()
    .join(";");
}

export function measureOf(row: ScreenRunRow, measure: HeatmapMeasure): number | null {
  if (measure === "share") return row.basinShare;
  if (measure === "change") return row.basinShareChange;
  return row.phenotypeAttractorsAfter - row.phenotypeAttractorsBefore;
}

/** Perturbed nodes in the order the screen listed them (its unit order). */
function screenedNodes(rows: readonly ScreenRunRow[]): string[] {
  const nodes: string[] = [];
  for (const r of [...rows].sort((a, b) => a.unit - b.unit))
    for (const n of Object.keys(r.perturbation)) if (!nodes.includes(n)) nodes.push(n);
  return nodes;
}

export function screenHeatmap(result: Pick<ScreenRunResult, "rows">, measure: HeatmapMeasure): ScreenHeatmap {
  const byKey = new Map(result.rows.map((r) => [perturbationKey(r.perturbation), r]));
  const cellOf = (perturbation: Record<string, 0 | 1> | null): HeatmapCell => {
    if (!perturbation) return { perturbation: null, row: null, value: null, status: "impossible" };
    const row = byKey.get(perturbationKey(perturbation)) ?? null;
    if (!row) return { perturbation, row: null, value: null, status: "missing" };
    const value = measureOf(row, measure);
    return { perturbation, row, value, status: value === null ? "undecided" : "value" };
  };
  const nodes = screenedNodes(result.rows);
  const pairs = result.rows.some((r) => Object.keys(r.perturbation).length > 1);
  let rows: HeatmapAxisEntry[];
  let columns: HeatmapAxisEntry[];
  let cells: HeatmapCell[][];
  if (!pairs) {
    rows = nodes.map((node) => ({ node, value: null, label: node }));
    columns = DIRECTION.map((label, v) => ({ node: "", value: v as 0 | 1, label }));
    cells = nodes.map((node) => [0, 1].map((v) => cellOf({ [node]: v as 0 | 1 })));
  } else {
    const axis = nodes.flatMap((node) =>
      ([0, 1] as const).map((value) => ({ node, value, label: `${node} ${value === 0 ? "KO" : "OE"}` })),
    );
    rows = axis;
    columns = axis;
    cells = axis.map((a) =>
      axis.map((b) => {
        if (a.node !== b.node) return cellOf({ [a.node]: a.value, [b.node]: b.value });
        return cellOf(a.value === b.value ? { [a.node]: a.value } : null);
      }),
    );
  }
  const values = cells.flat().flatMap((c) => (c.value === null ? [] : [Math.abs(c.value)]));
  const reach = Math.max(measure === "phenotype-attractors" ? 1 : 0.01, ...values);
  return {
    layout: pairs ? "pairs" : "singles",
    measure,
    rows,
    columns,
    cells,
    domain: measure === "share" ? [0, 1] : [-reach, reach],
  };
}

type Rgb = readonly [number, number, number];
// slate-50, brand-800 and red-700 of the app's palette (src/index.css and Tailwind's defaults).
const LOW: Rgb = [248, 250, 252];
const HIGH: Rgb = [17, 94, 89];
const NEGATIVE: Rgb = [185, 28, 28];

function mix(a: Rgb, b: Rgb, t: number): Rgb {
  const channel = (i: 0 | 1 | 2) => Math.round(a[i] + (b[i] - a[i]) * t);
  return [channel(0), channel(1), channel(2)];
}

/** Where a value sits on the scale: 0 at the pale end, 1 at the full colour; the sign picks teal or red. */
export function intensity(value: number, domain: readonly [number, number]): { t: number; negative: boolean } {
  const [lo, hi] = domain;
  if (lo >= 0) return { t: Math.min(1, Math.max(0, (value - lo) / (hi - lo))), negative: false };
  return { t: Math.min(1, Math.abs(value) / hi), negative: value < 0 };
}

export function cellColour(value: number, domain: readonly [number, number]): { background: string; dark: boolean } {
  const { t, negative } = intensity(value, domain);
  const [r, g, b] = mix(LOW, negative ? NEGATIVE : HIGH, t);
  return { background: `rgb(${r}, ${g}, ${b})`, dark: t > 0.55 };
}

/** CSS gradient of the scale, low to high, for the legend. */
export function legendGradient(domain: readonly [number, number]): string {
  const stops = Array.from({ length: 9 }, (_, i) => domain[0] + ((domain[1] - domain[0]) * i) / 8);
  return `linear-gradient(to right, ${stops.map((v) => cellColour(v, domain).background).join(", ")})`;
}
