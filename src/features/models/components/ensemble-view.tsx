// The model beside random NK networks of its size: the Derrida damage curve of the ensemble and of the model,
// plotted against the annealed approximation, and the ensemble's attractor counts when its members are small.
// Computed in a Web Worker on request; the plot downloads as PNG and SVG, the points as CSV.
import { useEffect, useRef, useState, type FormEvent } from "react";
import { ExportButtons } from "@/components/graph/export-buttons";
import { Button } from "@/components/ui/button";
import { downloadCsv } from "@/lib/download";
import type { EnsembleRequest, EnsembleSummary } from "../lib/ensemble-summary";

type WorkerAnswer = { ok: true; summary: EnsembleSummary } | { ok: false; message: string };

const W = 420;
const H = 300;
const M = { left: 44, right: 12, top: 12, bottom: 40 };
const SERIES = [
  { key: "annealed", label: "annealed approximation", colour: "#64748b", dash: "4 3" },
  { key: "ensemble", label: "NK ensemble", colour: "#0f766e", dash: "" },
  { key: "model", label: "this model", colour: "#b45309", dash: "" },
] as const;

const inputClass = "w-20 rounded-md border border-slate-300 px-2 py-1 text-sm";

export function EnsembleView({
  ruleText,
  nodeCount,
  meanInDegree,
  fileName,
}: {
  ruleText: string;
  nodeCount: number;
  meanInDegree: number;
  fileName: string;
}) {
  const [form, setForm] = useState({
    n: nodeCount,
    k: Math.max(1, Math.min(6, Math.round(meanInDegree))),
    p: 0.5,
    members: 20,
    seed: 1,
  });
  const [answer, setAnswer] = useState<WorkerAnswer | null>(null);
  const [busy, setBusy] = useState(false);
  const worker = useRef<Worker | null>(null);
  const svgRef = useRef<SVGSVGElement>(null);
  useEffect(() => () => worker.current?.terminate(), []);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    worker.current?.terminate();
    const w = new Worker(new URL("../lib/ensemble.worker.ts", import.meta.url), { type: "module" });
    worker.current = w;
    setBusy(true);
    w.onmessage = (m: MessageEvent<WorkerAnswer>) => {
      setAnswer(m.data);
      setBusy(false);
      w.terminate();
    };
    const req: EnsembleRequest = { ruleText, ...form };
    w.postMessage(req);
  };
  const field = (key: keyof typeof form, label: string, min: number, max: number, step = 1) => (
    <label className="flex flex-col gap-1 text-sm">
      <span className="text-slate-700">{label}</span>
      <input
        type="number"
        min={min}
        max={max}
        step={step}
        value={form[key]}
        onChange={(e) => setForm({ ...form, [key]: Number(e.target.value) })}
        className={inputClass}
        data-testid={`ensemble-${key}`}
      />
    </label>
  );
  const s = answer?.ok ? answer.summary : null;
  const x = (a: number) => M.left + a * (W - M.left - M.right);
  const y = (a: number) => H - M.bottom - a * (H - M.top - M.bottom);
  const svgText = () => {
    const svg = svgRef.current;
    if (!svg) return "";
    const copy = svg.cloneNode(true) as SVGSVGElement;
    copy.setAttribute("xmlns", "http://www.w3.org/2000/svg");
    return copy.outerHTML;
  };

  return (
    <div className="space-y-3" data-testid="ensemble-view">
      <form onSubmit={submit} className="flex flex-wrap items-end gap-3">
        {field("n", "Nodes N", 2, 200)}
        {field("k", "Inputs K", 1, 6)}
        {field("p", "Bias p", 0.05, 0.95, 0.05)}
        {field("members", "Networks", 1, 50)}
        {field("seed", "Seed", 0, 1_000_000)}
        <Button type="submit" disabled={busy} data-testid="ensemble-run">
          {busy ? "Drawing…" : "Draw the ensemble"}
        </Button>
      </form>
      {answer && !answer.ok && (
        <p role="alert" className="text-sm text-red-700">
          {answer.message}
        </p>
      )}
      {s && (
        <div className="grid gap-4 lg:grid-cols-[auto_minmax(0,1fr)]">
          <figure className="space-y-1">
            <svg
              ref={svgRef}
              width={W}
              height={H}
              viewBox={`0 0 ${W} ${H}`}
              role="img"
              aria-label={`Derrida curve: one-step damage against initial distance for ${s.request.members} NK networks (N = ${s.request.n}, K = ${s.request.k}, p = ${s.request.p}), this model, and the annealed approximation.`}
              fontFamily="Inter Variable, Inter, system-ui, sans-serif"
              data-testid="derrida-plot"
            >
              <rect width={W} height={H} fill="#ffffff" />
              <line x1={x(0)} y1={y(0)} x2={x(1)} y2={y(1)} stroke="#e2e8f0" />
              {[0, 0.25, 0.5, 0.75, 1].map((t) => (
                <g key={t} fontSize={10} fill="#475569">
                  <line x1={x(t)} x2={x(t)} y1={y(0)} y2={y(0) + 4} stroke="#94a3b8" />
                  <text x={x(t)} y={y(0) + 15} textAnchor="middle">
                    {t}
                  </text>
                  <line x1={x(0) - 4} x2={x(0)} y1={y(t)} y2={y(t)} stroke="#94a3b8" />
                  <text x={x(0) - 6} y={y(t) + 3} textAnchor="end">
                    {t}
                  </text>
                </g>
              ))}
              <line x1={x(0)} y1={y(0)} x2={x(1)} y2={y(0)} stroke="#94a3b8" />
              <line x1={x(0)} y1={y(0)} x2={x(0)} y2={y(1)} stroke="#94a3b8" />
              <text x={(x(0) + x(1)) / 2} y={H - 6} fontSize={11} textAnchor="middle" fill="#1e293b">
                distance before one step
              </text>
              <text transform={`translate(11, ${(y(0) + y(1)) / 2}) rotate(-90)`} fontSize={11} textAnchor="middle">
                distance after
              </text>
              {SERIES.map((series) => (
                <polyline
                  key={series.key}
                  fill="none"
                  stroke={series.colour}
                  strokeWidth={2}
                  strokeDasharray={series.dash}
                  points={s.curve.map((pt) => `${x(pt.before)},${y(pt[series.key])}`).join(" ")}
                />
              ))}
              {SERIES.map((series, i) => (
                <g key={series.key} fontSize={10}>
                  <line
                    x1={x(0.04)}
                    x2={x(0.1)}
                    y1={M.top + 6 + i * 14}
                    y2={M.top + 6 + i * 14}
                    stroke={series.colour}
                    strokeWidth={2}
                    strokeDasharray={series.dash}
                  />
                  <text x={x(0.12)} y={M.top + 9 + i * 14} fill="#1e293b">
                    {series.label}
                  </text>
                </g>
              ))}
            </svg>
            <div className="flex items-center gap-2">
              <button
                type="button"
                className="rounded-md border border-slate-300 bg-white px-2 py-1 text-xs font-medium text-slate-700 hover:bg-slate-50"
                data-testid="derrida-csv"
                onClick={() =>
                  downloadCsv(
                    [
                      ["distance before", "NK ensemble after", "this model after", "annealed approximation"],
                      ...s.curve.map((pt) => [pt.before, pt.ensemble, pt.model, pt.annealed]),
                    ],
                    `${fileName}-derrida`,
                  )
                }
              >
                CSV
              </button>
              <ExportButtons svg={svgText} fileName={`${fileName}-derrida`} testIdPrefix="derrida-image" />
            </div>
          </figure>
          <div className="space-y-2 text-sm text-slate-700" data-testid="ensemble-summary">
            <p>
              Below the diagonal, small differences shrink (ordered); above it they grow (chaotic). The annealed
              approximation 2p(1−p)[1−(1−a)^K] has slope 2p(1−p)K ={" "}
              {(2 * s.request.p * (1 - s.request.p) * s.request.k).toFixed(2)} at a = 0.
            </p>
            {s.attractors ? (
              <p>
                The {s.request.members} networks have on average {s.attractors.meanCount.toFixed(2)} attractors of mean
                length {s.attractors.meanLength.toFixed(2)} (counts:{" "}
                {s.attractors.countDistribution.map(([c, m]) => `${m}× ${c}`).join(", ")}).
              </p>
            ) : (
              <p>Attractor counts are gathered for ensembles of up to 14 nodes, where every state can be walked.</p>
            )}
          </div>
        </div>
      )}
    </div>
  );
}
