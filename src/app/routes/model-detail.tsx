// Model page: one revision of a model with its wiring diagram, synchronous attractors (table, basin chart,
// phenotype labels), trajectory raster, perturbation comparison, expectations with their by-revision matrix,
// a perturbation screen, downloads, rule editing and revision history.
import { useState } from "react";
import { Link, useParams, useSearchParams } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { useProjectOutlet } from "./project-layout";
import { Button } from "@/components/ui/button";
import { useCreateRevision } from "@/features/models/api/create-revision";
import { useAttractors } from "@/features/models/api/get-attractors";
import { useModel } from "@/features/models/api/get-model";
import { can } from "@shared/types/roles";
import { useStructure } from "@/features/models/api/get-structure";
import { useRevisionList } from "@/features/models/api/list-revisions";
import { AttractorRunPanel } from "@/features/models/components/attractor-run-panel";
import { AttractorStates } from "@/features/models/components/attractor-states";
import { AnalysisNextStep } from "@/features/models/components/analysis-next-step";
import { EliminationPanel } from "@/features/models/components/elimination-panel";
import { AttractorTable } from "@/features/models/components/attractor-table";
import { BasinChart } from "@/features/models/components/basin-chart";
import { Downloads } from "@/features/models/components/downloads";
import { issuesOf } from "@/features/models/components/parse-error-list";
import { PerturbationPanel } from "@/features/models/components/perturbation-panel";
import { RuleEditor } from "@/features/models/components/rule-editor";
import { ScreenPanel } from "@/features/models/components/screen-panel";
import { StructureView } from "@/features/models/components/structure-view";
import { EnsembleView } from "@/features/models/components/ensemble-view";
import { ExpectationMatrix } from "@/features/models/components/expectation-matrix";
import { ExpectationsEditor } from "@/features/models/components/expectations-editor";
import { TrajectoryPanel } from "@/features/models/components/trajectory-panel";
import { WiringDiagram } from "@/features/models/components/wiring-diagram";
import { plural } from "@/lib/plural";
import { useRuleDraft } from "@/features/models/lib/use-rule-draft";
import { UnsavedChangesGuard } from "@/features/models/components/unsaved-changes-guard";

function Section({ title, children, testId }: { title: string; children: React.ReactNode; testId?: string }) {
  return (
    <section data-testid={testId} className="space-y-3 rounded-lg border border-slate-200 bg-white p-4 shadow-sm">
      <h3 className="text-base font-semibold text-slate-900">{title}</h3>
      {children}
    </section>
  );
}

function Attractors({
  projectId,
  modelId,
  revision,
  revisionId,
  canStartRun,
  nodes,
  markers,
  setMarkers,
  selected,
  setSelected,
  inputs,
  fileName,
}: {
  inputs: readonly string[];
  fileName: string;
  projectId: string;
  modelId: string;
  revision: number;
  revisionId: string;
  canStartRun: boolean;
  nodes: readonly string[];
  markers: string[];
  setMarkers(m: string[]): void;
  selected: number | null;
  setSelected(i: number | null): void;
}) {
  const result = useAttractors(projectId, modelId, revision, markers);
  const error = result.error as { code?: string; message: string } | null;
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-1 text-xs">
        <span className="mr-1 text-slate-600">Phenotype markers:</span>
        {nodes.map((n) => {
          const on = markers.includes(n);
          return (
            <button
              key={n}
              type="button"
              data-testid={`marker-${n}`}
              aria-pressed={on}
              onClick={() =>
                setMarkers(on ? markers.filter((m) => m !== n) : nodes.filter((x) => x === n || markers.includes(x)))
              }
              className={`rounded-full border px-2 py-0.5 font-mono ${on ? "border-brand-700 bg-brand-700 text-white" : "border-slate-300 text-slate-600 hover:border-brand-600"}`}
            >
              {n}
            </button>
          );
        })}
      </div>
      {result.isPending && (
        <p className="text-sm text-slate-500" data-testid="attractors-loading">
          Computing attractors…
        </p>
      )}
      {error?.code === "NEEDS_RUN" && (
        <AttractorRunPanel
          projectId={projectId}
          modelId={modelId}
          revision={revision}
          revisionId={revisionId}
          nodeCount={nodes.length}
          canStart={canStartRun}
        />
      )}
      {error && error.code !== "NEEDS_RUN" && <Alert>{error.message}</Alert>}
      {result.data && (
        <div className="grid gap-4 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <AttractorTable result={result.data} selected={selected} onSelect={setSelected} fileName={fileName} />
          <div>
            <h4 className="mb-1 text-xs font-semibold uppercase tracking-wide text-slate-600">Basin sizes</h4>
            <BasinChart result={result.data} selected={selected} onSelect={setSelected} />
          </div>
        </div>
      )}
      {result.data && result.data.attractors.length > 0 && (
        <AttractorStates result={result.data} index={selected ?? 0} inputs={inputs} fileName={fileName} />
      )}
    </div>
  );
}

function EditRules({
  projectId,
  modelId,
  baseText,
  latest,
}: {
  projectId: string;
  modelId: string;
  baseText: string;
  latest: number;
}) {
  const save = useCreateRevision(projectId, modelId);
  const [, setSearch] = useSearchParams();
  // When the base text changes (another revision is shown), the editor starts again from it: the state is adjusted
  // while rendering, as React recommends, rather than in an effect after a render with the stale text.
  const stored = useRuleDraft(modelId, baseText);
  const [draft, setDraft] = useState({ base: baseText, text: stored.restored ?? baseText });
  if (draft.base !== baseText) setDraft({ base: baseText, text: baseText });
  const text = draft.base === baseText ? draft.text : baseText;
  const setText = (next: string) => {
    setDraft({ base: baseText, text: next });
    stored.keep(next);
  };
  const [savable, setSavable] = useState(false);
  const isDirty = text !== baseText && !save.isPending;
  const [message, setMessage] = useState("");
  const [submitted, setSubmitted] = useState<string | null>(null);
  const serverErrors = submitted === text ? issuesOf(save.error) : [];
  return (
    <form
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        setSubmitted(text);
        save.mutate(
          { ruleText: text, message },
          {
            onSuccess: () => {
              stored.drop();
              setMessage("");
              setSearch({});
            },
          },
        );
      }}
    >
      <UnsavedChangesGuard when={isDirty} what="Your rule edits" />
      {stored.restored !== null && text === stored.restored && (
        <p className="rounded-md bg-amber-50 px-3 py-2 text-sm text-amber-900" data-testid="draft-restored">
          Your unsaved edits from last time are back.{" "}
          <button type="button" className="font-medium underline" onClick={() => setText(baseText)}>
            Discard them
          </button>
        </p>
      )}
      <RuleEditor
        projectId={projectId}
        value={text}
        onChange={setText}
        serverErrors={serverErrors}
        rows={12}
        onSavableChange={setSavable}
      />
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex flex-1 flex-col gap-1 text-sm">
          <span className="text-slate-700">What changed (optional)</span>
          <input
            value={message}
            maxLength={500}
            onChange={(e) => setMessage(e.target.value)}
            className="rounded-md border border-slate-300 px-2 py-1"
          />
        </label>
        <Button
          type="submit"
          data-testid="save-revision"
          disabled={save.isPending || text === baseText || !savable}
          title={savable ? undefined : "Correct the errors in the rules first"}
        >
          {save.isPending ? "Saving…" : `Save as revision ${latest + 1}`}
        </Button>
      </div>
      {save.error && serverErrors.length === 0 && submitted === text && <Alert>{save.error.message}</Alert>}
    </form>
  );
}

export function ModelDetailRoute() {
  const { projectId = "", modelId = "" } = useParams();
  const [search, setSearch] = useSearchParams();
  const asked = Number(search.get("revision"));
  const revisionParam = Number.isInteger(asked) && asked > 0 ? asked : "latest";
  const detail = useModel(projectId, modelId, revisionParam);
  const revisions = useRevisionList(projectId, modelId);
  const { project } = useProjectOutlet();
  const canWrite = can(project.role, project.siteRole, "model:write");
  const revision = detail.data?.revision.revision ?? 0;
  const structure = useStructure(projectId, modelId, revision, revision > 0);
  const [markers, setMarkers] = useState<string[]>([]);
  // Another revision starts with no attractor selected (adjusted while rendering, not in an effect).
  const [selection, setSelection] = useState<{ revision: number; index: number | null }>({ revision, index: null });
  if (selection.revision !== revision) setSelection({ revision, index: null });
  const selected = selection.revision === revision ? selection.index : null;
  const setSelected = (index: number | null) => setSelection({ revision, index });
  const attractorsForState = useAttractors(projectId, modelId, revision, markers, revision > 0);

  if (detail.isPending) return <p className="text-sm text-slate-500">Loading model…</p>;
  if (detail.error) return <Alert>{detail.error.message}</Alert>;
  const { model, revision: rev } = detail.data;
  const nodes = rev.network.nodes;
  const selectedState = selected !== null ? (attractorsForState.data?.attractors[selected]?.states[0] ?? null) : null;
  const suggestedInitial = attractorsForState.data?.attractors[0]?.states[0] ?? "0".repeat(nodes.length);
  const baseName = `${model.name}-r${rev.revision}`;

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <Link to={`/projects/${projectId}/models`} className="text-sm text-brand-700 hover:underline">
            ← Models
          </Link>
          <h2 className="mt-1 text-xl font-semibold text-slate-900" data-testid="model-title">
            {model.name}
          </h2>
          <p className="text-sm text-slate-600">
            <span data-testid="revision-label" data-revision={rev.revision}>
              Revision {rev.revision}
            </span>
            {rev.revision !== model.latestRevision && (
              <span className="ml-1 rounded bg-amber-100 px-1.5 text-amber-800">
                older revision (latest is {model.latestRevision})
              </span>
            )}
            {" · "}
            <span data-testid="node-count">{rev.nodeCount} nodes</span>, {rev.network.edgeCount} edges
            {rev.network.inputs.length > 0 && `, inputs ${rev.network.inputs.join(", ")}`}
            {" · "}by {rev.createdBy?.displayName ?? "—"}, {new Date(rev.createdAt).toLocaleString()}
          </p>
          {model.description && <p className="mt-1 max-w-3xl text-sm text-slate-700">{model.description}</p>}
        </div>
        <Downloads
          projectId={projectId}
          modelId={modelId}
          revision={rev.revision}
          originalName={rev.file?.fileName ?? null}
        />
      </div>

      <Section title="Wiring diagram" testId="wiring-section">
        {structure.data ? (
          <WiringDiagram structure={structure.data} state={selectedState} fileName={baseName} />
        ) : structure.error ? (
          <Alert>{structure.error.message}</Alert>
        ) : (
          <p className="text-sm text-slate-500">Laying out…</p>
        )}
        {selectedState && (
          <p className="text-xs text-slate-600">
            Nodes are painted with the first state of attractor #{(selected ?? 0) + 1}; click the row again to clear.
          </p>
        )}
      </Section>

      <Section title="Attractors under synchronous update" testId="attractors-section">
        <Attractors
          projectId={projectId}
          modelId={modelId}
          revision={rev.revision}
          revisionId={rev.id}
          canStartRun={can(project.role, project.siteRole, "run:start")}
          nodes={nodes}
          markers={markers}
          setMarkers={setMarkers}
          selected={selected}
          setSelected={setSelected}
          inputs={rev.network.inputs}
          fileName={baseName}
        />
      </Section>

      <Section title="Analyses for every size: SAT, trap spaces, asynchronous attractors" testId="analyses-section">
        <AnalysisNextStep
          key={rev.id}
          projectId={projectId}
          revisionId={rev.id}
          nodeCount={rev.nodeCount}
          fileBase={baseName}
          canStart={can(project.role, project.siteRole, "run:start")}
        />
      </Section>

      <Section title="Reduce by elimination: fewer nodes, same fixed points" testId="elimination-section">
        <EliminationPanel
          key={rev.id}
          projectId={projectId}
          revisionId={rev.id}
          modelName={model.name}
          nodes={nodes}
          structure={structure.data}
          fileBase={baseName}
          canStart={can(project.role, project.siteRole, "run:start")}
          canSave={canWrite}
        />
      </Section>

      <div className="grid gap-4 lg:grid-cols-2">
        <Section title="Trajectory" testId="trajectory-section">
          <TrajectoryPanel
            key={`${rev.revision}-${suggestedInitial}`}
            projectId={projectId}
            modelId={modelId}
            revision={rev.revision}
            nodes={nodes}
            suggestedInitial={suggestedInitial}
            attractors={attractorsForState.data ?? null}
            inputs={rev.network.inputs}
            fileName={baseName}
          />
        </Section>
        <Section title="Perturbations" testId="perturbation-section">
          <p className="text-xs text-slate-600">
            Knock-outs fix a node to 0, over-expression to 1, input conditions fix an input; the stored model is not
            changed.
          </p>
          <PerturbationPanel
            key={rev.revision}
            projectId={projectId}
            modelId={modelId}
            revision={rev.revision}
            nodes={nodes}
            inputs={rev.network.inputs}
            markers={markers}
          />
        </Section>
      </div>

      <Section
        title="Expectations: what the model must reproduce, checked on every revision"
        testId="expectations-section"
      >
        <ExpectationMatrix
          projectId={projectId}
          modelId={modelId}
          revision={rev.revision}
          canRun={can(project.role, project.siteRole, "run:start")}
        />
        <ExpectationsEditor projectId={projectId} modelId={modelId} canWrite={canWrite} />
      </Section>

      <Section
        title="Perturbation screen: which knock-outs and over-expressions move a phenotype"
        testId="screen-section"
      >
        <ScreenPanel
          key={rev.id}
          projectId={projectId}
          modelId={modelId}
          revision={rev.revision}
          revisionId={rev.id}
          nodes={nodes}
          fileName={baseName}
          canStart={can(project.role, project.siteRole, "run:start")}
        />
      </Section>

      <Section title="Structure" testId="structure-section">
        <StructureView ruleText={rev.ruleText} fileName={baseName} />
      </Section>
      <Section title="Beside random networks (NK ensemble)" testId="ensemble-section">
        <EnsembleView
          ruleText={rev.ruleText}
          nodeCount={rev.nodeCount}
          meanInDegree={rev.network.edgeCount / Math.max(1, rev.nodeCount)}
          fileName={baseName}
        />
      </Section>
      <Section title={canWrite ? "Edit rules" : "Rules"} testId="rules-section">
        {canWrite ? (
          <EditRules projectId={projectId} modelId={modelId} baseText={rev.ruleText} latest={model.latestRevision} />
        ) : (
          <pre className="overflow-x-auto rounded-md bg-slate-50 p-3 font-mono text-sm">{rev.ruleText}</pre>
        )}
      </Section>

      <Section title="Revisions" testId="revisions-section">
        <ol className="divide-y divide-slate-100 text-sm">
          {revisions.data?.map((r) => (
            <li key={r.id} className="flex flex-wrap items-center gap-3 py-1.5" data-testid="revision-row">
              <button
                type="button"
                onClick={() => setSearch(r.revision === model.latestRevision ? {} : { revision: String(r.revision) })}
                className={`font-medium ${r.revision === rev.revision ? "text-slate-900" : "text-brand-700 hover:underline"}`}
              >
                r{r.revision}
              </button>
              <span className="text-slate-600">{plural(r.nodeCount, "node")}</span>
              <span className="text-slate-600">
                {r.source === "edit" ? "edited" : r.file ? `imported from ${r.file.fileName}` : r.source}
              </span>
              {r.message && <span className="italic text-slate-700">“{r.message}”</span>}
              <span className="ml-auto text-xs text-slate-500">
                {r.createdBy?.displayName ?? "—"}, {new Date(r.createdAt).toLocaleString()}
              </span>
            </li>
          ))}
        </ol>
      </Section>
    </div>
  );
}
