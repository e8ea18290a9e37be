// PNG and SVG downloads of a graph, both written from the drawing of its scene.
import { useState } from "react";
import { downloadBlob, svgBlob, svgToPng } from "./image-export";

export interface ExportButtonsProps {
  /** Builds the SVG document when a button is pressed (the drawing can depend on the current state). */
  svg: () => string;
  /** File name without extension. */
  fileName: string;
  testIdPrefix?: string;
}

const buttonClass =
  "rounded-md border border-slate-300 bg-white px-2 py-1 text-xs font-medium text-slate-700 hover:bg-slate-50 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-amber-600";

export function ExportButtons({ svg, fileName, testIdPrefix = "download" }: ExportButtonsProps) {
  const [error, setError] = useState<string | null>(null);
  return (
    <div className="flex items-center gap-2">
      <button
        type="button"
        className={buttonClass}
        data-testid={`${testIdPrefix}-png`}
        onClick={() => {
          setError(null);
          svgToPng(svg())
            .then((blob) => downloadBlob(blob, `${fileName}.png`))
            .catch((e: unknown) => setError(e instanceof Error ? e.message : String(e)));
        }}
      >
        PNG
      </button>
      <button
        type="button"
        className={buttonClass}
        data-testid={`${testIdPrefix}-svg`}
        onClick={() => downloadBlob(svgBlob(svg()), `${fileName}.svg`)}
      >
        SVG
      </button>
      {error && (
        <span role="alert" className="text-xs text-red-700">
          {error}
        </span>
      )}
    </div>
  );
}
