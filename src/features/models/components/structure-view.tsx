// The model's structure read from its rules: feedback circuits with their signs, average sensitivity per node,
// canalizing inputs and regulators that do not matter. Computed in a Web Worker so a dense wiring never blocks the
// page; every table downloads as CSV.
import { useEffect, useState } from "react";
import { downloadCsv } from "@/lib/download";
import { MAX_CIRCUIT_LENGTH, MAX_CIRCUITS, type StructureSummary } from "../lib/structure-summary";

type WorkerAnswer = { ok: true; summary: StructureSummary } | { ok: false; message: string };

function useStructureSummary(ruleText: string): { summary: StructureSummary | null; error: string | null } {
  const [state, setState] = useState<{ text: string; answer: WorkerAnswer } | null>(null);
  useEffect(() => {
    const worker = new Worker(new URL("../lib/structure.worker.ts", import.meta.url), { type: "module" });
    worker.onmessage = (e: MessageEvent<WorkerAnswer>) => setState({ text: ruleText, answer: e.data });
    worker.postMessage(ruleText);
    return () => worker.terminate();
  }, [ruleText]);
  if (!state || state.text !== ruleText) return { summary: null, error: null };
  return state.answer.ok
    ? { summary: state.answer.summary, error: null }
    : { summary: null, error: state.answer.message };
}

const csvButton = "text-xs font-medium text-brand-700 hover:underline";
const signClass = { positive: "text-emerald-700", negative: "text-red-700", dual: "text-violet-700" } as const;

export function StructureView({ ruleText, fileName }: { ruleText: string; fileName: string }) {
  const { summary: s, error } = useStructureSummary(ruleText);
  if (error) return <p className="text-sm text-red-700">{error}</p>;
  if (!s) return <p className="text-sm text-slate-500">Reading the structure…</p>;
  const positive = s.circuits.filter((c) => c.sign === "positive").length;
  const negative = s.circuits.filter((c) => c.sign === "negative").length;
  return (
    <div className="grid gap-4 lg:grid-cols-2" data-testid="structure-view">
      <div className="space-y-1">
        <div className="flex items-baseline justify-between">
          <h4 className="text-sm font-semibold text-slate-800">Feedback circuits</h4>
          <button
            type="button"
            className={csvButton}
            onClick={() =>
              downloadCsv(
                [
                  ["length", "sign", "circuit"],
                  ...s.circuits.map((c) => [c.nodes.length, c.sign, c.nodes.join(" → ")]),
                ],
                `${fileName}-circuits`,
              )
            }
          >
            CSV
          </button>
        </div>
        <p className="text-xs text-slate-600" data-testid="circuit-summary">
          {s.circuits.length} circuit{s.circuits.length === 1 ? "" : "s"} of length ≤ {MAX_CIRCUIT_LENGTH}: {positive}{" "}
          positive (can support several stable states), {negative} negative (can support oscillation)
          {s.circuitsComplete ? "." : `; the list stops at ${MAX_CIRCUITS}.`}
        </p>
        <ul className="max-h-64 space-y-0.5 overflow-auto text-sm" data-testid="circuit-list">
          {s.circuits.map((c, i) => (
            <li key={i} className="font-mono text-xs">
              <span className={`mr-2 font-sans font-medium ${signClass[c.sign]}`}>{c.sign}</span>
              {[...c.nodes, c.nodes[0]].join(" → ")}
            </li>
          ))}
        </ul>
      </div>
      <div className="space-y-1">
        <div className="flex items-baseline justify-between">
          <h4 className="text-sm font-semibold text-slate-800">Average sensitivity</h4>
          <button
            type="button"
            className={csvButton}
            onClick={() =>
              downloadCsv(
                [["node", "average sensitivity"], ...s.sensitivity.map((n) => [n.node, n.value.toFixed(4)])],
                `${fileName}-sensitivity`,
              )
            }
          >
            CSV
          </button>
        </div>
        <p className="text-xs text-slate-600" data-testid="average-sensitivity">
          Network average {s.averageSensitivity.toFixed(3)}: the expected number of a node&apos;s inputs whose flip
          changes its next value (1 is the border between ordered and chaotic ensembles).
        </p>
        <ul className="max-h-64 space-y-0.5 overflow-auto text-xs">
          {s.sensitivity.map((n) => (
            <li key={n.node} className="flex items-center gap-2">
              <span className="w-28 truncate font-mono" title={n.node}>
                {n.node}
              </span>
              <span
                className="h-2 rounded bg-brand-600"
                style={{
                  width: `${Math.min(100, (n.value / Math.max(1, ...s.sensitivity.map((x) => x.value))) * 100)}%`,
                }}
              />
              <span className="tabular-nums text-slate-600">{n.value.toFixed(2)}</span>
            </li>
          ))}
        </ul>
      </div>
      <div className="space-y-1">
        <h4 className="text-sm font-semibold text-slate-800">Canalizing inputs</h4>
        <ul className="max-h-48 overflow-auto text-xs" data-testid="canalizing-list">
          {s.canalizing.length === 0 && <li className="text-slate-500">No rule has a canalizing input.</li>}
          {s.canalizing.map((c, i) => (
            <li key={i}>
              <span className="font-mono">{c.regulator}</span> = {c.inputValue} fixes{" "}
              <span className="font-mono">{c.node}</span> to {c.output}
            </li>
          ))}
        </ul>
      </div>
      <div className="space-y-1">
        <h4 className="text-sm font-semibold text-slate-800">Non-essential inputs</h4>
        <ul className="text-xs" data-testid="non-essential-list">
          {s.nonEssential.length === 0 && <li className="text-slate-500">Every listed regulator matters.</li>}
          {s.nonEssential.map((c, i) => (
            <li key={i}>
              <span className="font-mono">{c.regulator}</span> appears in the rule of{" "}
              <span className="font-mono">{c.node}</span> but never changes its value
            </li>
          ))}
        </ul>
      </div>
    </div>
  );
}
