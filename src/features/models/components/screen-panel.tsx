// Perturbation screen of one revision: the person chooses nodes and a phenotype ("X=1, Y=0"), singles or also pairs,
// and starts a `screen` run; its rows read as a table ranked by the share of the basin that ends in attractors with
// the phenotype (rows without a share last), with a CSV download of the same table, or as a heatmap. The run and
// the view are kept in the address (?screen=<run>&screenView=heatmap), so a screen survives a reload and the way back
// from a perturbation it opened; each row and cell links to the model under its perturbation.
import { useState } from "react";
import { Link, useSearchParams } from "react-router-dom";
import { parseAssignment } from "@shared/engine/expectations";
import { ScreenRunResult, type ScreenRunRow } from "@shared/schemas/screens";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { RunProgress, useCancelRun, useRun, useStartRun } from "@/features/runs";
import { downloadCsv } from "@/lib/download";
import { perturbedViewPath } from "../lib/perturbed-link";
import { perturbationWords, ScreenHeatmapView } from "./screen-heatmap";

const percent = (x: number | null) => (x === null ? "—" : `${(100 * x).toFixed(1)} %`);
const signedPercent = (x: number | null) => (x === null ? "—" : `${x > 0 ? "+" : ""}${(100 * x).toFixed(1)} %`);

function ranked(rows: readonly ScreenRunRow[]): ScreenRunRow[] {
  return [...rows].sort((a, b) => (b.basinShare ?? -1) - (a.basinShare ?? -1) || a.unit - b.unit);
}

type LinkFor = (perturbation: Readonly<Record<string, 0 | 1>>) => string;

function ScreenTable({ result, fileName, linkFor }: { result: ScreenRunResult; fileName: string; linkFor: LinkFor }) {
  const rows = ranked(result.rows);
  const asynchronous = result.update === "asynchronous";
  const csv = () =>
    downloadCsv(
      [
        [
          "perturbation",
          "basin_share",
          "basin_share_change",
          `${result.counted}_before`,
          `${result.counted}_after`,
          "lost",
          "gained",
          ...(asynchronous ? ["trap_spaces_with_phenotype", "trap_spaces"] : []),
        ],
        ...rows.map((r) => [
          Object.entries(r.perturbation)
            .map(([n, v]) => `${n}=${v}`)
            .join(";"),
          r.basinShare,
          r.basinShareChange,
          r.attractorsBefore,
          r.attractorsAfter,
          r.attractorsLost,
          r.attractorsGained,
          ...(asynchronous ? [r.trapSpaces?.withPhenotype ?? null, r.trapSpaces?.total ?? null] : []),
        ]),
      ],
      `${fileName}-screen`,
    );
  return (
    <div className="space-y-2" data-testid="screen-result">
      <div className="overflow-x-auto">
        <table className="min-w-full text-sm">
          <thead>
            <tr className="text-left text-xs text-slate-600">
              <th className="py-1 pr-3 font-medium">Perturbation</th>
              <th className="px-2 text-right font-medium">Basin share</th>
              <th className="px-2 text-right font-medium">Change</th>
              <th className="px-2 text-right font-medium">
                {result.counted === "attractors" ? "Attractors" : "Fixed points"} before → after
              </th>
              <th className="px-2 text-right font-medium">Lost / gained</th>
              {asynchronous && <th className="px-2 text-right font-medium">Trap spaces with phenotype</th>}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.unit} className="border-t border-slate-100" data-testid="screen-row">
                <td className="py-1 pr-3">
                  <Link
                    to={linkFor(r.perturbation)}
                    className="text-brand-700 hover:underline"
                    title="Open the model under this perturbation, attractors before and after"
                  >
                    {perturbationWords(r.perturbation)}
                  </Link>
                </td>
                <td className="px-2 text-right tabular-nums">{percent(r.basinShare)}</td>
                <td className="px-2 text-right tabular-nums">{signedPercent(r.basinShareChange)}</td>
                <td className="px-2 text-right tabular-nums">
                  {r.attractorsBefore} → {r.attractorsAfter}
                </td>
                <td className="px-2 text-right tabular-nums">
                  {r.attractorsLost} / {r.attractorsGained}
                </td>
                {asynchronous && (
                  <td className="px-2 text-right tabular-nums">
                    {r.trapSpaces ? `${r.trapSpaces.withPhenotype} of ${r.trapSpaces.total}` : "—"}
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <Button size="sm" variant="secondary" onClick={csv}>
        Download CSV
      </Button>
    </div>
  );
}

function ScreenResultView({
  result,
  fileName,
  linkFor,
}: {
  result: ScreenRunResult;
  fileName: string;
  linkFor: LinkFor;
}) {
  const [search, setSearch] = useSearchParams();
  const view = search.get("screenView") === "heatmap" ? "heatmap" : "table";
  const show = (v: "table" | "heatmap") =>
    setSearch(
      (s) => {
        const next = new URLSearchParams(s);
        if (v === "heatmap") next.set("screenView", v);
        else next.delete("screenView");
        return next;
      },
      { replace: true },
    );
  const choice = (v: "table" | "heatmap", label: string) => (
    <button
      type="button"
      aria-pressed={view === v}
      onClick={() => show(v)}
      className={`rounded-md border px-2.5 py-1 text-xs font-medium ${view === v ? "border-brand-700 bg-brand-700 text-white" : "border-slate-300 text-slate-700 hover:border-brand-600"}`}
    >
      {label}
    </button>
  );
  return (
    <div className="space-y-2">
      <p className="text-sm text-slate-700" data-testid="screen-baseline">
        Unperturbed: {percent(result.baseline.basinShare)} of the states end in {result.counted} with the phenotype (
        {result.baseline.phenotypeAttractors} of {result.baseline.attractors}). Method: {result.method}.
      </p>
      <div className="flex gap-1" role="group" aria-label="Screen view">
        {choice("table", "Table")}
        {choice("heatmap", "Heatmap")}
      </div>
      {view === "table" ? (
        <ScreenTable result={result} fileName={fileName} linkFor={linkFor} />
      ) : (
        <ScreenHeatmapView result={result} linkFor={linkFor} />
      )}
    </div>
  );
}

export function ScreenPanel({
  projectId,
  modelId,
  revision,
  revisionId,
  nodes,
  fileName,
  canStart,
}: {
  projectId: string;
  modelId: string;
  revision: number;
  revisionId: string;
  nodes: readonly string[];
  fileName: string;
  canStart: boolean;
}) {
  const start = useStartRun();
  const cancel = useCancelRun();
  const [chosen, setChosen] = useState<string[]>([]);
  const [phenotype, setPhenotype] = useState("");
  const [pairs, setPairs] = useState(false);
  const [update, setUpdate] = useState<"synchronous" | "asynchronous">("synchronous");
  const [problem, setProblem] = useState<string | null>(null);
  const [search, setSearch] = useSearchParams();
  const runId = search.get("screen");
  const setRunId = (id: string) =>
    setSearch((s) => {
      const next = new URLSearchParams(s);
      next.set("screen", id);
      next.delete("screenView");
      return next;
    });
  const run = useRun(projectId, runId);
  // The address may name a run of another kind or revision (an edited link, another revision picked): not shown here.
  const ours = run.data?.kind === "screen" && run.data.modelRevisionId === revisionId ? run.data : null;
  const state = ours?.state;
  const parsed = state === "succeeded" ? ScreenRunResult.safeParse(ours?.result) : null;

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const p = parseAssignment(phenotype);
    if (p.issues[0]) return setProblem(`phenotype, at character ${p.issues[0].offset + 1}: ${p.issues[0].message}`);
    if (Object.keys(p.assignment).length === 0) return setProblem("phenotype: name at least one node, as X=1, Y=0");
    if (chosen.length === 0) return setProblem("choose at least one node to perturb");
    setProblem(null);
    start.mutate(
      {
        projectId,
        body: {
          kind: "screen",
          modelRevisionId: revisionId,
          params: { nodes: chosen, pairs, update, phenotype: p.assignment as Record<string, 0 | 1> },
        },
      },
      { onSuccess: (r) => setRunId(r.id) },
    );
  };

  return (
    <div className="space-y-3" data-testid="screen-panel">
      {canStart ? (
        <form onSubmit={submit} className="space-y-2 text-sm">
          <div className="flex flex-wrap items-center gap-1 text-xs">
            <span className="mr-1 text-slate-600">Nodes to perturb:</span>
            {nodes.map((n) => {
              const on = chosen.includes(n);
              return (
                <button
                  key={n}
                  type="button"
                  data-testid={`screen-node-${n}`}
                  aria-pressed={on}
                  onClick={() =>
                    setChosen(on ? chosen.filter((c) => c !== n) : nodes.filter((x) => x === n || chosen.includes(x)))
                  }
                  className={`rounded-full border px-2 py-0.5 font-mono ${on ? "border-brand-700 bg-brand-700 text-white" : "border-slate-300 text-slate-600 hover:border-brand-600"}`}
                >
                  {n}
                </button>
              );
            })}
          </div>
          <div className="flex flex-wrap items-end gap-3">
            <label className="flex flex-col gap-1 text-xs">
              <span className="text-slate-600">Phenotype (X=1, Y=0)</span>
              <input
                aria-label="Phenotype"
                className="rounded-md border border-slate-300 px-2 py-1 font-mono text-sm"
                value={phenotype}
                onChange={(e) => setPhenotype(e.target.value)}
              />
            </label>
            <label className="flex flex-col gap-1 text-xs">
              <span className="text-slate-600">Update</span>
              <select
                className="rounded-md border border-slate-300 px-2 py-1 text-sm"
                value={update}
                onChange={(e) => setUpdate(e.target.value as typeof update)}
              >
                <option value="synchronous">synchronous</option>
                <option value="asynchronous">asynchronous</option>
              </select>
            </label>
            <label className="flex items-center gap-1">
              <input type="checkbox" checked={pairs} onChange={(e) => setPairs(e.target.checked)} /> also every pair
            </label>
            <Button type="submit" size="sm" data-testid="start-screen" disabled={start.isPending}>
              Start screen
            </Button>
          </div>
          {(problem ?? start.error) && <Alert>{problem ?? start.error?.message}</Alert>}
        </form>
      ) : (
        <p className="text-sm text-slate-600">Ask a modeler or the project owner to start a screen.</p>
      )}
      {ours && (state === "queued" || state === "running") && (
        <div className="space-y-2">
          <RunProgress run={ours} label="Screen progress" />
          <Button variant="secondary" size="sm" disabled={cancel.isPending} onClick={() => cancel.mutate(ours)}>
            Cancel
          </Button>
        </div>
      )}
      {ours?.error && <Alert>{ours.error.message}</Alert>}
      {run.error && <Alert>The screen named in the address could not be read: {run.error.message}</Alert>}
      {run.data && !ours && (
        <p className="text-sm text-slate-600">The screen named in the address is not a screen of this revision.</p>
      )}
      {state === "cancelled" && <p className="text-sm text-slate-600">The screen was cancelled.</p>}
      {parsed?.success && (
        <ScreenResultView
          result={parsed.data}
          fileName={fileName}
          linkFor={(p) => perturbedViewPath(projectId, modelId, revision, p, parsed.data.phenotype, runId)}
        />
      )}
      {parsed && !parsed.success && <Alert>The screen's result could not be read.</Alert>}
    </div>
  );
}
