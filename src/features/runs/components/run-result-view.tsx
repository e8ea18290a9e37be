// Each kind of run's result, made to be read: attractors as a state grid, a reduction search as what it found (or a
// sentence saying it found nothing within its bounds), the automaton hierarchy and the demonstration count as short
// summaries. The JSON stays a download on the run page; these views never show it.
import type { ReactNode } from "react";
import { Link } from "react-router-dom";
import { HierarchyRunResult } from "@shared/schemas/automata";
import { ReductionSearchResult, type CoarsestGrouping } from "@shared/schemas/reductions";
import { AttractorsResult } from "@shared/schemas/run-tasks";
import { SleepCountResult, type Run } from "@shared/schemas/runs";
import { oscillatingNodes } from "@/components/state-grid/grid-layout";
import { StateGrid, type StateGridRow } from "@/components/state-grid/state-grid";
import { Alert } from "@/components/ui/alert";
import { downloadCsv, fileNameOf } from "@/lib/download";
import { plural } from "@/lib/plural";
import { nothingFoundSentence, runTitle, searchBounds } from "../lib/run-title";

export interface RunResultViewProps {
  run: Run;
  /** Offered beside a network the run produced (a coarsest grouping's quotient), when the viewer may save models. */
  saveAsModel?: (ruleText: string, suggestedName: string) => ReactNode;
}

export function RunResultView({ run, saveAsModel }: RunResultViewProps) {
  const fileName = fileNameOf(runTitle(run));
  const unreadable = (
    <Alert tone="info">This result has a shape this page does not know; download it as JSON to read it.</Alert>
  );
  switch (run.kind) {
    case "attractors": {
      const r = AttractorsResult.safeParse(run.result);
      return r.success ? <AttractorsView result={r.data} fileName={fileName} /> : unreadable;
    }
    case "reduction-search": {
      const r = ReductionSearchResult.safeParse(run.result);
      return r.success ? (
        <SearchView run={run} result={r.data} fileName={fileName} saveAsModel={saveAsModel} />
      ) : (
        unreadable
      );
    }
    case "eca-hierarchy": {
      const r = HierarchyRunResult.safeParse(run.result);
      return r.success ? <HierarchyView result={r.data} /> : unreadable;
    }
    case "sleep-count": {
      const r = SleepCountResult.safeParse(run.result);
      return r.success ? (
        <p className="text-sm text-slate-700" data-testid="run-summary">
          Counted {r.data.itemCount.toLocaleString()} items: the sum is {r.data.sum.toLocaleString()}, and{" "}
          {r.data.oddCount.toLocaleString()} of the values were odd.
        </p>
      ) : (
        unreadable
      );
    }
    default:
      return unreadable;
  }
}

function AttractorsView({ result, fileName }: { result: AttractorsResult; fileName: string }) {
  const fixed = result.attractors.filter((a) => a.length === 1).length;
  const cycles = result.attractors.length - fixed;
  const rows: StateGridRow[] = result.attractors.flatMap((a, i) => {
    const osc = oscillatingNodes(a.states);
    const moving = result.nodeNames.filter((_, j) => osc[j]);
    const kind = a.length === 1 ? "fixed point" : `cycle of ${a.length}`;
    const share = ((100 * a.basin) / result.stateCount).toFixed(1);
    return a.states.map((state, j) => ({
      label: a.length === 1 ? `#${i + 1}` : `#${i + 1}.${j}`,
      state,
      ...(j === 0
        ? {
            note: `${kind}, basin ${a.basin} (${share}%)${moving.length ? `; oscillating: ${moving.join(", ")}` : ""}`,
          }
        : {}),
      ...(a.length > 1 ? { tone: "cycle" as const } : {}),
    }));
  });
  return (
    <div className="space-y-3" data-testid="attractors-result">
      <p className="text-sm text-slate-700" data-testid="run-summary">
        {result.attractors.length} attractor{result.attractors.length === 1 ? "" : "s"} ({fixed} fixed point
        {fixed === 1 ? "" : "s"}, {cycles} cycle{cycles === 1 ? "" : "s"}) among {result.stateCount.toLocaleString()}{" "}
        states; the longest transient is {result.maxTransient} step{result.maxTransient === 1 ? "" : "s"}, the mean{" "}
        {result.meanTransient.toFixed(2)}.
      </p>
      <StateGrid
        nodes={result.nodeNames}
        rows={rows}
        fileName={`${fileName}-states`}
        caption="Every attractor's states, one row per state; a cycle's rows are shaded and in cycle order."
        testId="run-attractor-grid"
      />
    </div>
  );
}

function SearchView({
  run,
  result,
  fileName,
  saveAsModel,
}: {
  run: Run;
  result: ReductionSearchResult;
  fileName: string;
  saveAsModel?: RunResultViewProps["saveAsModel"];
}) {
  const bounds = searchBounds(result.bounds);
  return (
    <div className="space-y-4" data-testid="search-result">
      {result.found ? (
        <div className="space-y-2">
          <p className="text-sm font-medium text-slate-900" data-testid="search-found">
            {result.mode === "discover"
              ? `Found ${plural(result.distinctTargets, "smaller network")}. The findings below say which are in review.`
              : "Found one, with its certificate. The findings below say whether it is in review."}
          </p>
        </div>
      ) : (
        <p className="text-base font-medium text-slate-900" data-testid="search-nothing">
          {nothingFoundSentence(result.bounds)}.
        </p>
      )}
      <div>
        <h4 className="mb-1 text-xs font-semibold uppercase tracking-wide text-slate-600">Bounds searched</h4>
        <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-0.5 text-sm" data-testid="search-bounds">
          {bounds.map((b) => (
            <div key={b.label} className="contents">
              <dt className="text-slate-600">{b.label}</dt>
              <dd className="text-slate-900">{b.value}</dd>
            </div>
          ))}
        </dl>
        <p className="mt-1 text-xs text-slate-600" data-testid="search-exhaustive">
          {result.mode === "coarse-grain"
            ? "Exact: every state of the source was tabulated."
            : "Exhaustive within these bounds: every shard of the search space completed, so nothing within them was missed."}
        </p>
      </div>
      {result.coarsest && (
        <CoarsestGroupingView
          grouping={result.coarsest}
          fileName={fileName}
          saveAsModel={saveAsModel}
          sourceName={run.model ? `${run.model.modelName} r${run.model.revision}` : "the source"}
        />
      )}
    </div>
  );
}

function groupLabelText(label: number, observe: readonly string[]): string {
  return observe.map((name, k) => `${name}=${(label >> k) & 1}`).join(" ");
}

function CoarsestGroupingView({
  grouping,
  fileName,
  saveAsModel,
  sourceName,
}: {
  grouping: CoarsestGrouping;
  fileName: string;
  saveAsModel?: RunResultViewProps["saveAsModel"];
  sourceName: string;
}) {
  const bits = Math.max(1, Math.ceil(Math.log2(grouping.groups)));
  const { succ, label } = grouping;
  return (
    <div className="space-y-3 rounded-md border border-amber-200 bg-amber-50/40 p-3" data-testid="coarsest-grouping">
      <h4 className="text-sm font-semibold text-slate-900">The coarsest grouping that does close</h4>
      <p className="text-sm text-slate-700" data-testid="coarsest-size">
        Grouping the source&apos;s states by what {grouping.observe.join(", ")} will show from them on needs{" "}
        {grouping.groups} groups. Those groups step deterministically, so they form a network on ⌈log2 {grouping.groups}
        ⌉ = {bits} node{bits === 1 ? "" : "s"} (group g has the binary code g).
      </p>
      {succ && label ? (
        <div className="overflow-x-auto">
          <table className="text-sm" data-testid="coarsest-dynamics">
            <thead className="text-left text-xs font-semibold uppercase tracking-wide text-slate-600">
              <tr>
                <th className="pr-4">Group</th>
                <th className="pr-4">Observed values</th>
                <th>Next group</th>
              </tr>
            </thead>
            <tbody className="font-mono">
              {succ.map((next, g) => (
                <tr key={g}>
                  <td className="pr-4">{g}</td>
                  <td className="pr-4">{groupLabelText(label[g]!, grouping.observe)}</td>
                  <td>→ {next}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <button
            type="button"
            className="mt-1 text-xs font-medium text-brand-700 hover:underline"
            data-testid="coarsest-csv"
            onClick={() =>
              downloadCsv(
                [
                  ["group", ...grouping.observe, "next group"],
                  ...succ.map((next, g) => [g, ...grouping.observe.map((_, k) => (label[g]! >> k) & 1), next]),
                ],
                `${fileName}-groups`,
              )
            }
          >
            Download the groups as CSV
          </button>
        </div>
      ) : (
        <p className="text-xs text-slate-600">Too many groups to list here.</p>
      )}
      {grouping.ruleText && (
        <div className="space-y-2">
          <pre className="overflow-x-auto rounded-md bg-white p-2 font-mono text-xs" data-testid="coarsest-rules">
            {grouping.ruleText}
          </pre>
          {saveAsModel?.(grouping.ruleText, `Coarsest grouping of ${sourceName} by ${grouping.observe.join(", ")}`)}
        </div>
      )}
    </div>
  );
}

function HierarchyView({ result }: { result: HierarchyRunResult }) {
  return (
    <div className="space-y-2 text-sm text-slate-700" data-testid="run-summary">
      <p>
        Among the 256 elementary rules, {result.pairs.length.toLocaleString()} ordered pairs emulate one another with
        blocks up to {result.maxBlock} ({result.timeMode} time), found in {(result.computeMs / 1000).toFixed(1)} s of
        computing. {result.emulateNothing.length} rules emulate no other rule within these bounds.
      </p>
      <Link to="/automata" className="font-medium text-brand-700 hover:underline">
        Explore the hierarchy
      </Link>
    </div>
  );
}
