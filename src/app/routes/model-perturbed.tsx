// The model under one perturbation (?revision=&perturbation=A=0,B=1&phenotype=X=1&screen=<run>): attractors lost,
// kept and gained side by side with their basin shares, computed in a Web Worker from the revision's rules, so the
// page (and the server) never wait on a state space that doubles with every node.
import { useEffect, useState } from "react";
import { Link, useParams, useSearchParams } from "react-router-dom";
import { parseAssignment, type Assignment } from "@shared/engine/expectations";
import { Alert } from "@/components/ui/alert";
import { useModel } from "@/features/models/api/get-model";
import { StateCells } from "@/features/models/components/attractor-table";
import { JsonDownload } from "@/features/models/components/json-download";
import { perturbationWords } from "@/features/models/components/screen-heatmap";
import {
  BROWSER_EXACT_MAX_NODES,
  type ComparedAttractor,
  type PerturbedComparison,
} from "@/features/models/lib/perturbed-comparison";

type WorkerAnswer = { ok: true; comparison: PerturbedComparison } | { ok: false; message: string };

/** Attractors listed per column; the JSON download holds them all. */
const LISTED = 200;

const percent = (x: number | null) => (x === null ? "—" : `${(100 * x).toFixed(1)} %`);

function readAssignment(text: string | null, what: string): { value: Assignment; problem: string | null } {
  const parsed = parseAssignment(text ?? "");
  const issue = parsed.issues[0];
  return {
    value: parsed.assignment,
    problem: issue ? `${what} in the address, at character ${issue.offset + 1}: ${issue.message}` : null,
  };
}

/** `request` is the worker's message as JSON (null while there is nothing to compute), so equal requests built on
 * different renders never restart the worker. */
function useComparison(request: string | null): WorkerAnswer | null {
  const [state, setState] = useState<{ request: string; answer: WorkerAnswer } | null>(null);
  useEffect(() => {
    if (request === null) return;
    const worker = new Worker(new URL("../../features/models/lib/perturbed-comparison.worker.ts", import.meta.url), {
      type: "module",
    });
    worker.onmessage = (e: MessageEvent<WorkerAnswer>) => setState({ request, answer: e.data });
    worker.onerror = (e) =>
      setState({ request, answer: { ok: false, message: e.message || "the computation failed" } });
    worker.postMessage(JSON.parse(request));
    return () => worker.terminate();
  }, [request]);
  return state !== null && state.request === request ? state.answer : null;
}

function AttractorItem({
  attractor,
  nodes,
  shareBefore,
}: {
  attractor: ComparedAttractor;
  nodes: readonly string[];
  shareBefore?: number | null;
}) {
  const length = attractor.states.length;
  return (
    <li className="space-y-0.5 rounded border border-slate-100 p-1.5" data-testid="compared-attractor">
      <div className="flex flex-wrap items-center gap-2 text-xs">
        <span className="text-slate-600">{length === 1 ? "fixed point" : `cycle of ${length}`}</span>
        <span className="tabular-nums text-slate-800">
          {shareBefore !== undefined
            ? `${percent(shareBefore)} → ${percent(attractor.share)}`
            : percent(attractor.share)}
        </span>
        {attractor.hasPhenotype && (
          <span className="rounded bg-brand-100 px-1 text-[11px] font-medium text-brand-800">phenotype</span>
        )}
      </div>
      <div className="space-y-px">
        {attractor.states.slice(0, 8).map((s, i) => (
          <div key={i}>
            <StateCells state={s} nodes={nodes} />
          </div>
        ))}
        {length > 8 && <p className="text-[11px] text-slate-500">and {length - 8} more states</p>}
      </div>
    </li>
  );
}

function Column({
  title,
  tone,
  testId,
  children,
  count,
}: {
  title: string;
  tone: string;
  testId: string;
  count: number;
  children: React.ReactNode;
}) {
  return (
    <div data-testid={testId} className="min-w-0 space-y-1">
      <h4 className={`text-xs font-semibold uppercase tracking-wide ${tone}`}>
        {title} ({count})
      </h4>
      {count === 0 ? <p className="text-xs text-slate-500">none</p> : <ul className="space-y-1">{children}</ul>}
      {count > LISTED && <p className="text-xs text-slate-500">The first {LISTED} are listed; the JSON has all.</p>}
    </div>
  );
}

function ComparisonView({ c, fileName }: { c: PerturbedComparison; fileName: string }) {
  const counted = c.method === "exact-synchronous" ? "attractors" : "fixed points";
  const phenotypeText = Object.entries(c.phenotype)
    .map(([n, v]) => `${n}=${v}`)
    .join(", ");
  return (
    <div className="space-y-3" data-testid="perturbed-comparison">
      <p className="text-sm text-slate-700" data-testid="perturbed-summary">
        {c.method === "exact-synchronous"
          ? `Every synchronous attractor with its exact basin (${c.nodes.length} nodes, ${(2 ** c.nodes.length).toLocaleString("en")} states).`
          : `Fixed points found by SAT: the model has more than ${BROWSER_EXACT_MAX_NODES} nodes, too many for exact basins in the browser; cycles are not listed.`}{" "}
        {c.beforeCount} {counted} before, {c.afterCount} after: {c.kept.length} kept, {c.lost.length} lost,{" "}
        {c.gained.length} gained.
        {phenotypeText &&
          c.phenotypeShareBefore !== null &&
          ` Share of states ending with ${phenotypeText}: ${percent(c.phenotypeShareBefore)} → ${percent(c.phenotypeShareAfter)}.`}
        {!c.complete && " The enumeration stopped at its cap: the counts are lower bounds."}
      </p>
      <div className="grid gap-4 md:grid-cols-3">
        <Column title="Lost" tone="text-red-700" testId="attractors-lost" count={c.lost.length}>
          {c.lost.slice(0, LISTED).map((a, i) => (
            <AttractorItem key={i} attractor={a} nodes={c.nodes} />
          ))}
        </Column>
        <Column
          title="Kept (basin before → after)"
          tone="text-slate-700"
          testId="attractors-kept"
          count={c.kept.length}
        >
          {c.kept.slice(0, LISTED).map((k, i) => (
            <AttractorItem key={i} attractor={k.after} nodes={c.nodes} shareBefore={k.before.share} />
          ))}
        </Column>
        <Column title="Gained" tone="text-brand-700" testId="attractors-gained" count={c.gained.length}>
          {c.gained.slice(0, LISTED).map((a, i) => (
            <AttractorItem key={i} attractor={a} nodes={c.nodes} />
          ))}
        </Column>
      </div>
      <JsonDownload data={c} fileName={`${fileName}.json`} />
    </div>
  );
}

export function ModelPerturbedRoute() {
  const { projectId = "", modelId = "" } = useParams();
  const [search] = useSearchParams();
  const asked = Number(search.get("revision"));
  const revision = Number.isInteger(asked) && asked > 0 ? asked : "latest";
  const detail = useModel(projectId, modelId, revision);
  const perturbation = readAssignment(search.get("perturbation"), "perturbation");
  const phenotype = readAssignment(search.get("phenotype"), "phenotype");
  const problem =
    perturbation.problem ??
    phenotype.problem ??
    (Object.keys(perturbation.value).length === 0
      ? "The address names no perturbation (?perturbation=A=0,B=1)."
      : null);
  const ruleText = detail.data?.revision.ruleText;
  const answer = useComparison(
    problem === null && ruleText !== undefined
      ? JSON.stringify({ ruleText, perturbation: perturbation.value, phenotype: phenotype.value })
      : null,
  );
  const screen = search.get("screen");
  const back = new URLSearchParams();
  if (detail.data) back.set("revision", String(detail.data.revision.revision));
  if (screen) back.set("screen", screen);

  if (detail.isPending) return <p className="text-sm text-slate-500">Loading model…</p>;
  if (detail.error) return <Alert>{detail.error.message}</Alert>;
  const { model, revision: rev } = detail.data;
  return (
    <div className="space-y-4">
      <div>
        <Link
          to={`/projects/${projectId}/models/${modelId}?${back.toString()}`}
          className="text-sm text-brand-700 hover:underline"
        >
          ← {model.name}
          {screen ? " and its screen" : ""}
        </Link>
        <h2 className="mt-1 text-xl font-semibold text-slate-900" data-testid="perturbed-title">
          {model.name} r{rev.revision} with {problem ? "a perturbation" : perturbationWords(perturbation.value)}
        </h2>
        <p className="text-sm text-slate-600">
          Knocked-out nodes are held at 0, over-expressed ones at 1, under synchronous update; the stored model is not
          changed. A statement about the model, not about the cell.
        </p>
      </div>
      <section className="space-y-3 rounded-lg border border-slate-200 bg-white p-4 shadow-sm">
        <h3 className="text-base font-semibold text-slate-900">Attractors before and after</h3>
        {problem && <Alert>{problem}</Alert>}
        {!problem && !answer && (
          <p className="text-sm text-slate-500" data-testid="perturbed-computing">
            Computing the attractors with and without the perturbation…
          </p>
        )}
        {answer && !answer.ok && <Alert>{answer.message}</Alert>}
        {answer?.ok && <ComparisonView c={answer.comparison} fileName={`${model.name}-r${rev.revision}-perturbed`} />}
      </section>
    </div>
  );
}
