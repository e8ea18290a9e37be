// Minimal or maximal trap spaces by SAT (run kind "trap-spaces"): each trap space in words (how many nodes it fixes,
// whether it is a fixed point) and as a table of the value it fixes per node.
import { useState } from "react";
import { TrapSpacesResult } from "@shared/schemas/run-tasks";
import { useAnalysisRun } from "../lib/use-analysis-run";
import { AnalysisRunFrame } from "./analysis-run-frame";
import { JsonDownload } from "./json-download";
import { fixedInWords, NodeValueMatrix } from "./node-value-matrix";
import type { AnalysisViewProps } from "./sat-cycles-view";

function TrapSpacesResultView({ result, fileBase }: { result: TrapSpacesResult; fileBase: string }) {
  const n = result.nodes.length;
  const fixedPoints = result.trapSpaces.filter((t) => !t.pattern.includes("-")).length;
  return (
    <div className="space-y-3" data-testid="trap-spaces-result">
      <p data-testid="trap-spaces-summary" className="text-slate-800">
        {result.trapSpaces.length} {result.kind} trap space{result.trapSpaces.length === 1 ? "" : "s"}
        {result.kind === "minimal" && `, ${fixedPoints} of them fixed point${fixedPoints === 1 ? "" : "s"}`}.{" "}
        <strong>
          {result.complete
            ? `The list is complete: there are no other ${result.kind} trap spaces.`
            : `The list was cut at the limit: more ${result.kind} trap spaces exist.`}
        </strong>
        {result.kind === "minimal" &&
          result.percolatedNodes > 0 &&
          ` ${result.percolatedNodes} nodes are fixed in every attractor by percolation of constants.`}
      </p>
      <ol className="list-decimal space-y-1 pl-5 text-slate-700">
        {result.trapSpaces.slice(0, 12).map((t) => {
          const free = [...t.pattern].filter((c) => c === "-").length;
          return (
            <li key={t.pattern} data-testid="trap-space-row">
              {free === 0
                ? "A fixed point (every node fixed)."
                : `Fixes ${n - free} of ${n} nodes, leaves ${free} free: ${fixedInWords(result.nodes, t.pattern)}.`}
            </li>
          );
        })}
      </ol>
      <NodeValueMatrix
        testId="trap-space-table"
        nodes={result.nodes}
        columns={result.trapSpaces.map((t, i) => ({ label: `TS ${i + 1}`, pattern: t.pattern }))}
        caption="The value each trap space fixes per node; “free” nodes may change inside it."
      />
      <JsonDownload data={result} fileName={`${fileBase}-${result.kind}-trap-spaces.json`} />
    </div>
  );
}

export function TrapSpacesView({ projectId, revisionId, fileBase, recommended, canStart }: AnalysisViewProps) {
  const analysis = useAnalysisRun(projectId, revisionId, "trap-spaces");
  const [kind, setKind] = useState<"minimal" | "maximal">("minimal");
  const parsed = TrapSpacesResult.safeParse(analysis.run?.result);
  return (
    <AnalysisRunFrame
      method="trap-spaces"
      testId="trap-spaces"
      recommended={recommended}
      canStart={canStart}
      startLabel="Find trap spaces"
      analysis={analysis}
      onStart={() => analysis.start({ kind, limit: 1000 })}
      parameters={
        <label className="flex flex-col gap-1 text-xs text-slate-700">
          Which
          <select
            data-testid="trap-space-kind"
            value={kind}
            onChange={(e) => setKind(e.target.value === "maximal" ? "maximal" : "minimal")}
            className="rounded-md border border-slate-300 px-2 py-1 text-sm"
          >
            <option value="minimal">minimal (approximate the attractors)</option>
            <option value="maximal">maximal (the largest proper ones)</option>
          </select>
        </label>
      }
    >
      {parsed.success && <TrapSpacesResultView result={parsed.data} fileBase={fileBase} />}
    </AnalysisRunFrame>
  );
}
