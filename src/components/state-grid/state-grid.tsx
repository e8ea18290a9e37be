// States as a grid people can read: one column per node with its name as a rotated header, one row per state. The
// user groups the columns (phenotype markers first, then inputs, then the rest) and orders them; oscillating nodes
// are marked under their header; rows can carry a note and a highlight. The same drawing downloads as SVG and PNG,
// and the table as CSV in the order shown.
import { useId, useRef, useState } from "react";
import { ExportButtons } from "@/components/graph/export-buttons";
import { downloadCsv } from "@/lib/download";
import { gridColumns, gridCsvRows, type ColumnGrouping, type ColumnOrder } from "./grid-layout";

export interface StateGridRow {
  label: string;
  state: string;
  note?: string;
  /** "entry": the row where an attractor is entered; "cycle": a row on the attractor. */
  tone?: "entry" | "cycle";
}

export interface StateGridProps {
  nodes: readonly string[];
  rows: readonly StateGridRow[];
  markers?: readonly string[];
  inputs?: readonly string[];
  /** Per node (model order): does it oscillate on the cycle shown? */
  oscillating?: readonly boolean[];
  fileName: string;
  /** A text alternative for the drawing. */
  caption: string;
  testId?: string;
}

const FONT = "Inter Variable, Inter, system-ui, sans-serif";
const GROUP_GAP = 8;
const GUTTER = 64;
const selectClass = "rounded-md border border-slate-300 bg-white px-1.5 py-0.5 text-xs";

export function StateGrid({
  nodes,
  rows,
  markers = [],
  inputs = [],
  oscillating,
  fileName,
  caption,
  testId = "state-grid",
}: StateGridProps) {
  const hasGroups = markers.length > 0 || inputs.length > 0;
  const [grouping, setGrouping] = useState<ColumnGrouping>(hasGroups ? "grouped" : "model");
  const [order, setOrder] = useState<ColumnOrder>("model");
  const svgRef = useRef<SVGSVGElement>(null);
  const titleId = useId();
  const groups = gridColumns(nodes, { grouping, order, markers, inputs });
  const cell = Math.max(11, Math.min(18, Math.floor(720 / Math.max(1, nodes.length))));
  const longest = Math.max(1, ...nodes.map((n) => n.length));
  const groupRow = grouping === "grouped" ? 14 : 0;
  const header = groupRow + Math.min(140, 10 + longest * 6.2);
  const oscRow = oscillating?.some(Boolean) ? 12 : 0;
  const notes = rows.some((r) => r.note);
  const noteWidth = notes ? Math.min(360, 16 + Math.max(...rows.map((r) => (r.note ?? "").length)) * 6.4) : 0;
  const xs: { node: number; x: number }[] = [];
  const groupSpans: { label: string; x: number; width: number }[] = [];
  let x = GUTTER;
  groups.forEach((g, gi) => {
    if (gi > 0) x += GROUP_GAP;
    groupSpans.push({ label: g.label, x, width: g.columns.length * cell });
    for (const node of g.columns) {
      xs.push({ node, x });
      x += cell;
    }
  });
  const gridRight = x;
  const width = gridRight + (notes ? 8 + noteWidth : 4);
  const top = header + oscRow;
  const height = top + rows.length * cell + 4;
  const svgText = () => {
    const svg = svgRef.current;
    if (!svg) return "";
    const copy = svg.cloneNode(true) as SVGSVGElement;
    copy.setAttribute("xmlns", "http://www.w3.org/2000/svg");
    return copy.outerHTML;
  };

  return (
    <figure className="space-y-2" data-testid={testId}>
      <div className="flex flex-wrap items-center gap-3 text-xs text-slate-600">
        <label className="flex items-center gap-1">
          Columns
          <select
            className={selectClass}
            value={grouping}
            onChange={(e) => setGrouping(e.target.value as ColumnGrouping)}
            data-testid={`${testId}-grouping`}
          >
            <option value="grouped">markers, inputs, other nodes</option>
            <option value="model">one group</option>
          </select>
        </label>
        <label className="flex items-center gap-1">
          Order
          <select
            className={selectClass}
            value={order}
            onChange={(e) => setOrder(e.target.value as ColumnOrder)}
            data-testid={`${testId}-order`}
          >
            <option value="model">model order</option>
            <option value="name">by name</option>
          </select>
        </label>
        <div className="ml-auto flex items-center gap-2">
          <button
            type="button"
            className="rounded-md border border-slate-300 bg-white px-2 py-1 text-xs font-medium text-slate-700 hover:bg-slate-50 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-amber-600"
            data-testid={`${testId}-csv`}
            onClick={() => downloadCsv(gridCsvRows(nodes, groups, rows), fileName)}
          >
            CSV
          </button>
          <ExportButtons svg={svgText} fileName={fileName} testIdPrefix={`${testId}-image`} />
        </div>
      </div>
      <div className="overflow-x-auto">
        <svg
          ref={svgRef}
          width={width}
          height={height}
          viewBox={`0 0 ${width} ${height}`}
          role="img"
          aria-labelledby={titleId}
          fontFamily={FONT}
        >
          <title id={titleId}>{caption}</title>
          <rect x={0} y={0} width={width} height={height} fill="#ffffff" />
          {grouping === "grouped" &&
            groupSpans.map((g) => (
              <g key={g.label}>
                <line x1={g.x} x2={g.x + g.width} y1={12} y2={12} stroke="#94a3b8" />
                <text x={g.x} y={9} fontSize={9} fill="#475569">
                  {g.label}
                </text>
              </g>
            ))}
          {xs.map(({ node, x: cx }) => (
            <text
              key={node}
              data-testid={`${testId}-header`}
              transform={`translate(${cx + cell / 2 + 3.5}, ${header - 4}) rotate(-90)`}
              fontSize={10}
              fill={markers.includes(nodes[node]!) ? "#0f766e" : "#1e293b"}
              fontWeight={markers.includes(nodes[node]!) ? 600 : 400}
            >
              {nodes[node]}
            </text>
          ))}
          {oscRow > 0 &&
            xs.map(({ node, x: cx }) =>
              oscillating?.[node] ? (
                <text
                  key={node}
                  x={cx + cell / 2}
                  y={header + 9}
                  fontSize={10}
                  textAnchor="middle"
                  fill="#b45309"
                  data-testid={`${testId}-oscillating`}
                  data-node={nodes[node]}
                >
                  ~
                </text>
              ) : null,
            )}
          {rows.map((r, ri) => {
            const y = top + ri * cell;
            return (
              <g key={ri} data-testid={`${testId}-row`} data-tone={r.tone ?? ""}>
                {r.tone && (
                  <rect x={0} y={y} width={width} height={cell} fill={r.tone === "entry" ? "#fef3c7" : "#f0fdfa"} />
                )}
                <text x={GUTTER - 6} y={y + cell - 3.5} fontSize={10} textAnchor="end" fill="#475569">
                  {r.label}
                </text>
                {xs.map(({ node, x: cx }) => (
                  <rect
                    key={node}
                    x={cx + 0.5}
                    y={y + 0.5}
                    width={cell - 1}
                    height={cell - 1}
                    rx={2}
                    fill={r.state[node] === "1" ? "#0f766e" : "#e2e8f0"}
                  />
                ))}
                {r.note && (
                  <text x={gridRight + 8} y={y + cell - 3.5} fontSize={10} fill="#92400e">
                    {r.note}
                  </text>
                )}
              </g>
            );
          })}
        </svg>
      </div>
      <figcaption className="text-xs text-slate-500">
        {caption} Filled cells are on (1), light cells off (0)
        {oscRow > 0 ? "; ~ marks a node that oscillates on the cycle" : ""}.
      </figcaption>
    </figure>
  );
}
