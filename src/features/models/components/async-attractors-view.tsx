// Asynchronous attractors (run kind "async-attractors"): which method ran, whether the list is proved complete or
// found so far, each attractor labelled "proved", and what was decided about each minimal trap space.
import { AsyncAttractorsResult } from "@shared/schemas/run-tasks";
import { useAnalysisRun } from "../lib/use-analysis-run";
import { AnalysisRunFrame } from "./analysis-run-frame";
import { JsonDownload } from "./json-download";
import { fixedInWords, NodeValueMatrix } from "./node-value-matrix";
import type { AnalysisViewProps } from "./sat-cycles-view";

const METHOD_WORDS: Record<AsyncAttractorsResult["method"], string> = {
  exact: "Exact analysis of the whole asynchronous state graph.",
  "exact on the percolated subspace":
    "Exact analysis of the subspace left after percolating constants, which holds every attractor.",
  "minimal trap spaces":
    "Too many nodes for exact analysis: attractors were located through the minimal trap spaces, and each trap space small enough was analysed exactly.",
};

const OUTSIDE_WORDS: Record<AsyncAttractorsResult["outsideMinimalTrapSpaces"], string> = {
  excluded: "No attractor lies outside the minimal trap spaces.",
  found: "Some attractors lie outside every minimal trap space.",
  "not excluded": "Attractors outside every minimal trap space are not excluded.",
};

function AsyncResultView({ result, fileBase }: { result: AsyncAttractorsResult; fileBase: string }) {
  const complete = result.completeness === "proved complete";
  return (
    <div className="space-y-3" data-testid="async-attractors-result">
      <p className="text-slate-800">
        <span
          data-testid="async-completeness"
          className={`mr-2 rounded px-1.5 py-0.5 text-xs font-semibold ${complete ? "bg-emerald-100 text-emerald-800" : "bg-amber-100 text-amber-800"}`}
        >
          {complete ? "proved complete" : "found so far"}
        </span>
        {result.attractors.length} attractor{result.attractors.length === 1 ? "" : "s"}{" "}
        {complete ? "in all: there are no others." : "proved so far; others may exist."}
      </p>
      <p className="text-xs text-slate-600">
        {METHOD_WORDS[result.method]} {OUTSIDE_WORDS[result.outsideMinimalTrapSpaces]}
        {!result.minimalTrapSpacesComplete && " The list of minimal trap spaces was cut at its limit."}
      </p>
      {result.attractors.length > 0 && (
        <ol className="list-decimal space-y-1 pl-5 text-slate-700">
          {result.attractors.slice(0, 12).map((a, i) => (
            <li key={i} data-testid="async-attractor-row">
              <span className="mr-1 rounded bg-emerald-100 px-1 text-xs text-emerald-800">proved</span>
              {a.size === 1 ? "A fixed point." : `A cyclic attractor of ${a.size.toLocaleString()} states;`}{" "}
              {a.size > 1 && `constant nodes: ${fixedInWords(result.nodes, a.pattern)}.`}
            </li>
          ))}
        </ol>
      )}
      {result.attractors.length > 0 && (
        <NodeValueMatrix
          nodes={result.nodes}
          columns={result.attractors.map((a, i) => ({ label: `A ${i + 1}`, pattern: a.pattern }))}
          caption="Node values on each attractor; “free” marks nodes that change within it."
        />
      )}
      {result.minimalTrapSpaces.length > 0 && (
        <div>
          <h5 className="text-xs font-semibold uppercase tracking-wide text-slate-600">Minimal trap spaces</h5>
          <ul className="mt-1 space-y-1 text-slate-700">
            {result.minimalTrapSpaces.slice(0, 12).map((m, i) => (
              <li key={i} data-testid="async-trap-space-row">
                Trap space {i + 1} ({m.freeNodes} free node{m.freeNodes === 1 ? "" : "s"}):{" "}
                {m.verdict === "at least one attractor"
                  ? "holds at least one attractor, none of them a fixed point (too many free nodes to decide more)."
                  : m.verdict === "fixed point"
                    ? "a fixed point."
                    : `${m.attractorCount} attractor${m.attractorCount === 1 ? "" : "s"}, proved by exact analysis.`}
              </li>
            ))}
          </ul>
        </div>
      )}
      <JsonDownload data={result} fileName={`${fileBase}-async-attractors.json`} />
    </div>
  );
}

export function AsyncAttractorsView({ projectId, revisionId, fileBase, recommended, canStart }: AnalysisViewProps) {
  const analysis = useAnalysisRun(projectId, revisionId, "async-attractors");
  const parsed = AsyncAttractorsResult.safeParse(analysis.run?.result);
  return (
    <AnalysisRunFrame
      method="async-attractors"
      testId="async-attractors"
      recommended={recommended}
      canStart={canStart}
      startLabel="Find asynchronous attractors"
      analysis={analysis}
      onStart={() => analysis.start({ trapSpaceLimit: 1000 })}
    >
      {parsed.success && <AsyncResultView result={parsed.data} fileBase={fileBase} />}
    </AnalysisRunFrame>
  );
}
