// Fixed points and synchronous cycles by SAT (run kind "sat-cycles"): the cycle length to search up to, then the fixed
// points as a table of node values and each cycle step by step, with whether the list is complete for that length.
import { useState } from "react";
import { SatCyclesResult } from "@shared/schemas/run-tasks";
import { useAnalysisRun } from "../lib/use-analysis-run";
import { AnalysisRunFrame } from "./analysis-run-frame";
import { JsonDownload } from "./json-download";
import { NodeValueMatrix } from "./node-value-matrix";

export interface AnalysisViewProps {
  projectId: string;
  revisionId: string;
  fileBase: string;
  recommended: boolean;
  canStart: boolean;
}

function SatCyclesResultView({ result, fileBase }: { result: SatCyclesResult; fileBase: string }) {
  const fixed = result.cycles.filter((c) => c.length === 1);
  const cycles = result.cycles.filter((c) => c.length > 1);
  const upTo = result.maxLength === 1 ? "fixed points" : `fixed points and cycles of length up to ${result.maxLength}`;
  return (
    <div className="space-y-3" data-testid="sat-cycles-result">
      <p data-testid="sat-cycles-summary" className="text-slate-800">
        {fixed.length === 1 ? "1 fixed point" : `${fixed.length} fixed points`}
        {result.maxLength > 1 &&
          `, ${cycles.length === 1 ? "1 cycle" : `${cycles.length} cycles`} of length 2 to ${result.maxLength}`}
        .{" "}
        {result.complete ? (
          <strong>The list is complete: there are no other {upTo}.</strong>
        ) : (
          <strong>The list was cut at the solution limit: more {upTo} exist.</strong>
        )}
      </p>
      {fixed.length > 0 && (
        <NodeValueMatrix
          testId="fixed-point-table"
          nodes={result.nodes}
          columns={fixed.map((c, i) => ({ label: `FP ${i + 1}`, pattern: c.states[0]! }))}
          caption="Fixed points: the value of each node (1 on, 0 off)."
        />
      )}
      {cycles.slice(0, 6).map((c, k) => (
        <NodeValueMatrix
          key={k}
          nodes={result.nodes}
          columns={c.states.map((s, step) => ({ label: `t${step}`, pattern: s }))}
          caption={`Cycle ${k + 1}: ${c.length} states under synchronous update, one column per step.`}
        />
      ))}
      {cycles.length > 6 && <p className="text-xs text-slate-600">{cycles.length - 6} more cycles are in the JSON.</p>}
      <JsonDownload data={result} fileName={`${fileBase}-sat-cycles.json`} />
    </div>
  );
}

export function SatCyclesView({ projectId, revisionId, fileBase, recommended, canStart }: AnalysisViewProps) {
  const analysis = useAnalysisRun(projectId, revisionId, "sat-cycles");
  const [maxLength, setMaxLength] = useState(4);
  const parsed = SatCyclesResult.safeParse(analysis.run?.result);
  return (
    <AnalysisRunFrame
      method="sat-cycles"
      testId="sat-cycles"
      recommended={recommended}
      canStart={canStart}
      startLabel="Find fixed points and cycles"
      analysis={analysis}
      onStart={() => analysis.start({ maxLength, maxSolutions: 1000 })}
      parameters={
        <label className="flex flex-col gap-1 text-xs text-slate-700">
          Cycles up to length
          <select
            data-testid="sat-max-length"
            value={maxLength}
            onChange={(e) => setMaxLength(Number(e.target.value))}
            className="rounded-md border border-slate-300 px-2 py-1 text-sm"
          >
            {[1, 2, 3, 4, 5, 6, 7, 8].map((l) => (
              <option key={l} value={l}>
                {l === 1 ? "1 (fixed points only)" : l}
              </option>
            ))}
          </select>
        </label>
      }
    >
      {parsed.success && <SatCyclesResultView result={parsed.data} fileBase={fileBase} />}
    </AnalysisRunFrame>
  );
}
