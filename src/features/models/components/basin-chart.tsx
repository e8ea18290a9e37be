// Basin sizes as horizontal bars (plain SVG): one bar per attractor, as a share of the whole state space.
import type { SynchronousResult } from "@shared/schemas/models";

export function BasinChart({
  result,
  selected,
  onSelect,
}: {
  result: SynchronousResult;
  selected: number | null;
  onSelect(i: number | null): void;
}) {
  const rows = result.attractors.slice(0, 24);
  const rowHeight = 22;
  const labelWidth = 120;
  const width = 520;
  const barWidth = width - labelWidth - 60;
  const max = Math.max(1, ...rows.map((a) => a.basin));
  return (
    <svg
      data-testid="basin-chart"
      role="img"
      aria-label={`Basin sizes: ${rows
        .map(
          (a, i) =>
            `#${i + 1} ${a.length === 1 ? "fixed point" : `cycle of ${a.length}`}, ${((100 * a.basin) / result.stateCount).toFixed(1)}% of states`,
        )
        .join("; ")}`}
      viewBox={`0 0 ${width} ${rows.length * rowHeight + 8}`}
      className="w-full max-w-xl"
    >
      {rows.map((a, i) => {
        const w = Math.max(1, (barWidth * a.basin) / max);
        const y = 4 + i * rowHeight;
        const label = `#${i + 1} ${a.length === 1 ? "fixed" : `cycle ${a.length}`}${a.phenotype ? ` ${a.phenotype}` : ""}`;
        return (
          <g key={i} onClick={() => onSelect(selected === i ? null : i)} className="cursor-pointer">
            <text x={labelWidth - 6} y={y + 14} textAnchor="end" className="fill-slate-600 text-[11px]">
              {label}
            </text>
            <rect
              x={labelWidth}
              y={y + 3}
              width={w}
              height={rowHeight - 7}
              rx={2}
              className={selected === i ? "fill-amber-500" : "fill-brand-600"}
            />
            <text x={labelWidth + w + 4} y={y + 14} className="fill-slate-700 text-[11px] tabular-nums">
              {((100 * a.basin) / result.stateCount).toFixed(1)}%
            </text>
          </g>
        );
      })}
    </svg>
  );
}
