// A run of states as a raster on a canvas: rows are time steps (top to bottom), columns are nodes; on cells are
// filled. Column colours let a caller tint groups of nodes (e.g. the blocks of an encoding); rows can be marked.
import { useEffect, useRef } from "react";

export interface StateRasterProps {
  nodes: readonly string[];
  states: readonly string[];
  /** Fill colour of an on cell, per column; teal when absent. */
  columnColours?: readonly string[];
  /** Row labels in the gutter (defaults to the row index). */
  rowLabels?: readonly string[];
  /** Rows drawn with a red outline (e.g. where two runs disagree). */
  markedRows?: ReadonlySet<number>;
  testId?: string;
}

export function StateRaster({
  nodes,
  states,
  columnColours,
  rowLabels,
  markedRows,
  testId = "trajectory-raster",
}: StateRasterProps) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const cell = Math.max(6, Math.min(22, Math.floor(640 / Math.max(1, nodes.length))));
  const header = 70;
  const gutter = 34;
  const width = gutter + nodes.length * cell;
  const height = header + states.length * cell;

  useEffect(() => {
    const c = canvas.current;
    if (!c) return;
    const ratio = window.devicePixelRatio || 1;
    c.width = width * ratio;
    c.height = height * ratio;
    const ctx = c.getContext("2d");
    if (!ctx) return;
    ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
    ctx.fillStyle = "#ffffff";
    ctx.fillRect(0, 0, width, height);
    ctx.font = '11px "Inter Variable", sans-serif';
    ctx.fillStyle = "#334155";
    nodes.forEach((name, j) => {
      ctx.save();
      ctx.translate(gutter + j * cell + cell / 2 + 4, header - 4);
      ctx.rotate(-Math.PI / 3);
      ctx.fillText(name, 0, 0);
      ctx.restore();
    });
    ctx.textAlign = "right";
    ctx.textBaseline = "middle";
    states.forEach((s, t) => {
      if (t % Math.max(1, Math.round(16 / cell)) === 0 || states.length < 40) {
        ctx.fillStyle = "#64748b";
        ctx.fillText(rowLabels?.[t] ?? String(t), gutter - 4, header + t * cell + cell / 2);
      }
      for (let j = 0; j < nodes.length; j++) {
        ctx.fillStyle = s[j] === "1" ? (columnColours?.[j] ?? "#0d9488") : "#f1f5f9";
        ctx.fillRect(gutter + j * cell, header + t * cell, cell - 1, cell - 1);
      }
      if (markedRows?.has(t)) {
        ctx.strokeStyle = "#dc2626";
        ctx.lineWidth = 2;
        ctx.strokeRect(gutter - 1, header + t * cell - 1, nodes.length * cell + 1, cell + 1);
      }
    });
  }, [nodes, states, cell, width, height, columnColours, rowLabels, markedRows]);

  return (
    <canvas
      ref={canvas}
      data-testid={testId}
      data-steps={states.length}
      role="img"
      aria-label={`${states.length} states, one row per step, of the nodes ${nodes.join(", ")}; filled cells are on. First row ${states[0] ?? "none"}, last row ${states[states.length - 1] ?? "none"}.`}
      style={{ width, height }}
      className="max-w-full rounded border border-slate-200"
    />
  );
}
