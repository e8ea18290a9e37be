// "Reduce by elimination" on the model page: the person removes chosen nodes (only those that do not regulate
// themselves can be chosen; the others say why), every eligible node, or percolates constants with some nodes held,
// as a `node-elimination` run. The result lists what was removed and kept, the reduced rules and what the reduction
// preserves, with the JSON to download and "Save as a new model", which files a proposed reduction to its source.
import { useState } from "react";
import { Link } from "react-router-dom";
import { parseAssignment } from "@shared/engine/expectations";
import type { StructureResult } from "@shared/schemas/models";
import { NodeEliminationResult } from "@shared/schemas/run-tasks";
import type { NodeEliminationParams } from "@shared/schemas/runs";
import { Button } from "@/components/ui/button";
import { RunProgress } from "@/features/runs";
import { ApiError } from "@/lib/api-client";
import { useSaveReducedModel } from "../api/save-reduced-model";
import { useAnalysisRun } from "../lib/use-analysis-run";
import { JsonDownload } from "./json-download";

type Mode = NodeEliminationParams["mode"];

/** Nodes whose function depends on their own value: an essential self-loop in the structure view. */
export function selfRegulated(structure: StructureResult | undefined): Set<string> {
  return new Set(
    (structure?.edges ?? []).filter((e) => e.source === e.target && e.sign !== "non-essential").map((e) => e.source),
  );
}

function SaveReducedModel({
  projectId,
  runId,
  suggestedName,
}: {
  projectId: string;
  runId: string;
  suggestedName: string;
}) {
  const [name, setName] = useState(suggestedName);
  const save = useSaveReducedModel(projectId);
  if (save.data)
    return (
      <p className="text-sm text-slate-700" data-testid="reduced-model-saved">
        Saved as{" "}
        <Link className="text-brand-700 underline" to={`/projects/${projectId}/models/${save.data.modelId}`}>
          {save.data.reduction.target?.modelName ?? name}
        </Link>
        , with a{" "}
        <Link className="text-brand-700 underline" to={`/projects/${projectId}/reductions/${save.data.reduction.id}`}>
          proposed reduction
        </Link>{" "}
        from this revision; once approved it joins the model hierarchy.
      </p>
    );
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        save.mutate({ runId, name });
      }}
      data-testid="save-reduced-model"
    >
      <label className="flex flex-col gap-1 text-xs text-slate-700">
        Name of the new model
        <input
          value={name}
          onChange={(e) => setName(e.target.value)}
          maxLength={120}
          className="w-72 rounded-md border border-slate-300 px-2 py-1 text-sm"
          data-testid="reduced-model-name"
        />
      </label>
      <Button type="submit" size="sm" disabled={!name.trim() || save.isPending} data-testid="save-reduced-model-button">
        Save as a new model
      </Button>
      {save.error && (
        <p role="alert" className="w-full text-sm text-red-700">
          {save.error instanceof ApiError ? save.error.message : "Saving failed"}
        </p>
      )}
    </form>
  );
}

function EliminationResultView({
  projectId,
  runId,
  result,
  fileBase,
  modelName,
  canSave,
}: {
  projectId: string;
  runId: string;
  result: NodeEliminationResult;
  fileBase: string;
  modelName: string;
  canSave: boolean;
}) {
  const percolation = result.mode === "percolate";
  return (
    <div className="space-y-3" data-testid="elimination-result">
      <p className="text-slate-800" data-testid="elimination-summary">
        {result.nodesBefore} nodes → {result.nodesAfter}: {percolation ? "fixed" : "eliminated"}{" "}
        {result.eliminated.length === 0 ? "none" : result.eliminated.join(", ")}.
      </p>
      {percolation && result.fixed.length > 0 && (
        <p className="text-slate-700" data-testid="elimination-fixed">
          Fixed values: {result.fixed.map((f) => `${f.node} = ${f.value}`).join(", ")}
          {result.held.length > 0 && ` (held: ${result.held.map((h) => h.node).join(", ")})`}.
        </p>
      )}
      {result.notEliminated.length > 0 && (
        <details className="text-slate-700">
          <summary className="cursor-pointer">Kept nodes and why ({result.notEliminated.length})</summary>
          <ul className="mt-1 list-disc pl-5" data-testid="elimination-kept">
            {result.notEliminated.map((k) => (
              <li key={k.node}>
                {k.node}: {k.reason}
              </li>
            ))}
          </ul>
        </details>
      )}
      <p className="rounded-md bg-slate-50 p-2 text-slate-800" data-testid="elimination-preserves">
        <strong>Preserves: </strong>
        {result.preserves}
      </p>
      {result.ruleText && (
        <div>
          <p className="text-xs font-medium uppercase text-slate-500">Reduced rules</p>
          <pre
            className="mt-1 max-h-72 overflow-auto rounded-md border border-slate-200 bg-slate-50 p-2 text-xs"
            data-testid="elimination-rules"
          >
            {result.ruleText}
          </pre>
        </div>
      )}
      <JsonDownload data={result} fileName={`${fileBase}-${percolation ? "percolation" : "elimination"}.json`} />
      {result.certificate ? (
        canSave && (
          <SaveReducedModel
            projectId={projectId}
            runId={runId}
            suggestedName={`${modelName}, ${percolation ? "constants percolated" : `${result.eliminated.length} nodes eliminated`}`.slice(
              0,
              120,
            )}
          />
        )
      ) : (
        <p className="text-slate-600">{result.certificateNote}</p>
      )}
    </div>
  );
}

export function EliminationPanel({
  projectId,
  revisionId,
  modelName,
  nodes,
  structure,
  fileBase,
  canStart,
  canSave,
}: {
  projectId: string;
  revisionId: string;
  modelName: string;
  nodes: readonly string[];
  structure: StructureResult | undefined;
  fileBase: string;
  canStart: boolean;
  canSave: boolean;
}) {
  const analysis = useAnalysisRun(projectId, revisionId, "node-elimination");
  const [mode, setMode] = useState<Mode>("all-eligible");
  const [chosen, setChosen] = useState<string[]>([]);
  const [hold, setHold] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  const selfLoops = selfRegulated(structure);
  const run = analysis.run;
  const parsed = NodeEliminationResult.safeParse(run?.result);

  const start = () => {
    if (mode === "nodes") {
      if (chosen.length === 0) return setProblem("choose at least one node to eliminate");
      setProblem(null);
      return analysis.start({ mode, nodes: chosen });
    }
    if (mode === "percolate") {
      const p = parseAssignment(hold);
      if (p.issues[0]) return setProblem(`held nodes, at character ${p.issues[0].offset + 1}: ${p.issues[0].message}`);
      const unknown = Object.keys(p.assignment).find((name) => !nodes.includes(name));
      if (unknown) return setProblem(`held nodes: there is no node named "${unknown}"`);
      setProblem(null);
      return analysis.start({
        mode,
        hold: Object.entries(p.assignment).map(([node, value]) => ({ node, value })),
      });
    }
    setProblem(null);
    analysis.start({ mode });
  };

  return (
    <div data-testid="elimination-panel" className="space-y-3 text-sm">
      <dl className="grid gap-x-3 gap-y-0.5 text-xs text-slate-600 sm:grid-cols-[auto_1fr]">
        <dt className="font-medium">Limits</dt>
        <dd>
          A node can be eliminated only when its rule does not read its own value; no substitution may give a node more
          than 20 regulators (such nodes are kept).
        </dd>
        <dt className="font-medium">Preserves</dt>
        <dd>
          Elimination: the fixed points, one to one. Percolation of constants: every attractor and fixed point (for the
          model with the held nodes fixed).
        </dd>
        <dt className="font-medium">Does not preserve</dt>
        <dd>
          Elimination: cycles and cyclic attractors, which may appear, vanish or change. A reduction is a statement
          about the model, not about the cell.
        </dd>
      </dl>
      {canStart ? (
        <div className="space-y-2">
          <fieldset className="flex flex-wrap gap-4">
            <legend className="sr-only">What to remove</legend>
            {(
              [
                ["all-eligible", "All eligible nodes"],
                ["nodes", "Chosen nodes, in order"],
                ["percolate", "Percolate constants"],
              ] as const
            ).map(([value, label]) => (
              <label key={value} className="flex items-center gap-1.5">
                <input
                  type="radio"
                  name="elimination-mode"
                  value={value}
                  checked={mode === value}
                  onChange={() => setMode(value)}
                  data-testid={`elimination-mode-${value}`}
                />
                {label}
              </label>
            ))}
          </fieldset>
          {mode === "nodes" && (
            <div
              className="max-h-56 overflow-y-auto rounded-md border border-slate-200 p-2"
              data-testid="elimination-nodes"
            >
              <ul className="grid gap-x-4 gap-y-0.5 sm:grid-cols-3">
                {nodes.map((name) => {
                  const self = selfLoops.has(name);
                  const at = chosen.indexOf(name);
                  return (
                    <li key={name}>
                      <label className={`flex items-center gap-1.5 ${self ? "text-slate-400" : ""}`}>
                        <input
                          type="checkbox"
                          disabled={self}
                          checked={at >= 0}
                          onChange={(e) =>
                            setChosen((c) => (e.target.checked ? [...c, name] : c.filter((x) => x !== name)))
                          }
                          data-testid="elimination-node"
                          data-node={name}
                        />
                        {name}
                        {at >= 0 && <span className="text-xs text-slate-500">#{at + 1}</span>}
                        {self && <span className="text-xs">(regulates itself)</span>}
                      </label>
                    </li>
                  );
                })}
              </ul>
              <p className="mt-1 text-xs text-slate-500">
                Nodes are eliminated in the order you tick them; one that comes to regulate itself after the earlier
                eliminations stops the run with its name.
              </p>
            </div>
          )}
          {mode === "percolate" && (
            <label className="flex flex-col gap-1 text-xs text-slate-700">
              Held nodes (optional), as X=1, Y=0
              <input
                value={hold}
                onChange={(e) => setHold(e.target.value)}
                className="w-72 rounded-md border border-slate-300 px-2 py-1 font-mono text-sm"
                data-testid="elimination-hold"
              />
            </label>
          )}
          <Button
            variant="secondary"
            data-testid="elimination-start"
            disabled={analysis.isStarting || analysis.isLive}
            onClick={start}
          >
            Reduce by elimination
          </Button>
        </div>
      ) : (
        !run && <p className="text-slate-600">Ask a modeler or the project owner to start it.</p>
      )}
      {(problem || analysis.startError) && (
        <p role="alert" className="text-red-700">
          {problem ?? analysis.startError?.message}
        </p>
      )}
      {run && analysis.isLive && (
        <div className="space-y-2">
          <RunProgress run={run} label="Elimination progress" />
          {canStart && (
            <Button variant="secondary" size="sm" disabled={analysis.isCancelling} onClick={analysis.cancel}>
              Cancel
            </Button>
          )}
        </div>
      )}
      {run?.state === "failed" && (
        <p role="alert" className="text-red-700" data-testid="elimination-failed">
          The run failed: {run.error?.message ?? "unknown error"}
        </p>
      )}
      {run?.state === "succeeded" && parsed.success && (
        <EliminationResultView
          projectId={projectId}
          runId={run.id}
          result={parsed.data}
          fileBase={fileBase}
          modelName={modelName}
          canSave={canSave}
        />
      )}
    </div>
  );
}
