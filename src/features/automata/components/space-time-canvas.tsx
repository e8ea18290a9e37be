// Draws a space-time diagram (row s = configuration after s steps, time running down) on a canvas, one filled
// rectangle per live cell; optional thin vertical rules mark block boundaries.
import { useEffect, useRef } from "react";

export interface SpaceTimeCanvasProps {
  cells: Uint8Array;
  width: number;
  rows: number;
  cellWidth: number;
  cellHeight: number;
  /** Draw a boundary every `blockEvery` cells (the codeword length of an encoded configuration). */
  blockEvery?: number;
  label: string;
  testId?: string;
}

export function SpaceTimeCanvas({
  cells,
  width,
  rows,
  cellWidth,
  cellHeight,
  blockEvery,
  label,
  testId,
}: SpaceTimeCanvasProps) {
  const ref = useRef<HTMLCanvasElement>(null);
  const pixelWidth = Math.ceil(width * cellWidth);
  const pixelHeight = rows * cellHeight;
  useEffect(() => {
    const canvas = ref.current;
    const ctx = canvas?.getContext("2d");
    if (!canvas || !ctx) return;
    const ratio = window.devicePixelRatio || 1;
    canvas.width = pixelWidth * ratio;
    canvas.height = pixelHeight * ratio;
    ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
    ctx.fillStyle = "#ffffff";
    ctx.fillRect(0, 0, pixelWidth, pixelHeight);
    ctx.fillStyle = "#0f172a";
    for (let s = 0; s < rows; s++) {
      for (let i = 0; i < width; i++)
        if (cells[s * width + i]) ctx.fillRect(i * cellWidth, s * cellHeight, cellWidth, cellHeight);
    }
    if (blockEvery && blockEvery > 1) {
      ctx.strokeStyle = "rgba(13, 148, 136, 0.45)";
      ctx.lineWidth = 1;
      ctx.beginPath();
      for (let i = 0; i <= width; i += blockEvery) {
        const x = Math.min(pixelWidth - 0.5, Math.round(i * cellWidth) + 0.5);
        ctx.moveTo(x, 0);
        ctx.lineTo(x, pixelHeight);
      }
      ctx.stroke();
    }
  }, [cells, width, rows, cellWidth, cellHeight, blockEvery, pixelWidth, pixelHeight]);
  return (
    <canvas
      ref={ref}
      role="img"
      aria-label={label}
      data-testid={testId}
      style={{ width: pixelWidth, height: pixelHeight }}
      className="block border border-slate-300"
    />
  );
}
