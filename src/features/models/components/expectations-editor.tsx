// The model's expectations as a table people edit: add or edit one in a form (assignments written as "A=1; B=0",
// node lists as "A, B"), remove one, import a CSV table (every error with its line and column, nothing stored until
// the whole file reads) and download the table in the documented CSV format (docs/expectations-csv.md).
import { useState } from "react";
import {
  formatAssignment,
  OUTCOME_KINDS,
  parseAssignment,
  parseNodeList,
  type OutcomeKind,
} from "@shared/engine/expectations";
import type { ExpectationInput, StoredExpectation } from "@shared/schemas/expectations";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import {
  expectationsExportUrl,
  useDeleteExpectation,
  useExpectations,
  useImportExpectations,
  useSaveExpectation,
} from "../api/expectations";
import { issuesOf, ParseErrorList } from "./parse-error-list";

interface Draft {
  rowId: string | null;
  id: string;
  update: "synchronous" | "asynchronous";
  knockOut: string;
  overExpress: string;
  inputs: string;
  kind: OutcomeKind;
  pattern: string;
  from: string;
  count: string;
  source: string;
  note: string;
}

const EMPTY: Draft = {
  rowId: null,
  id: "",
  update: "synchronous",
  knockOut: "",
  overExpress: "",
  inputs: "",
  kind: "some-attractor",
  pattern: "",
  from: "",
  count: "",
  source: "",
  note: "",
};

const COMPARISON = { exactly: "", "at-least": ">=", "at-most": "<=" } as const;

function draftOf(s: StoredExpectation): Draft {
  const e = s.expectation;
  const o = e.outcome;
  return {
    rowId: s.id,
    id: e.id,
    update: e.update,
    knockOut: e.condition.knockOut.join(", "),
    overExpress: e.condition.overExpress.join(", "),
    inputs: formatAssignment(e.condition.inputs),
    kind: o.kind,
    pattern: "pattern" in o ? formatAssignment(o.pattern) : "",
    from: o.kind === "reachable" ? formatAssignment(o.from) : "",
    count: "count" in o ? `${COMPARISON[o.comparison]}${o.count}` : "",
    source: e.source,
    note: e.note,
  };
}

/** The draft as the API's body, or the first problem with the field it is in. */
function bodyOf(d: Draft): ExpectationInput | string {
  const list = (field: string, text: string) => {
    const r = parseNodeList(text);
    if (r.issues[0]) throw `${field}: ${r.issues[0].message}`;
    return r.nodes;
  };
  const assign = (field: string, text: string) => {
    const r = parseAssignment(text);
    if (r.issues[0]) throw `${field}: ${r.issues[0].message}`;
    return r.assignment as Record<string, 0 | 1>;
  };
  try {
    const condition = {
      knockOut: list("knock-outs", d.knockOut),
      overExpress: list("over-expressions", d.overExpress),
      inputs: assign("inputs", d.inputs),
    };
    let outcome: ExpectationInput["outcome"];
    if (d.kind === "fixed-point-count" || d.kind === "attractor-count") {
      const m = /^\s*(>=|<=|=)?\s*(\d{1,6})\s*$/.exec(d.count);
      if (!m) return "count: write 2, >=2 or <=2";
      const comparison = m[1] === ">=" ? "at-least" : m[1] === "<=" ? "at-most" : "exactly";
      outcome = { kind: d.kind, comparison, count: Number(m[2]) };
    } else if (d.kind === "reachable")
      outcome = { kind: d.kind, pattern: assign("pattern", d.pattern), from: assign("from", d.from) };
    else outcome = { kind: d.kind, pattern: assign("pattern", d.pattern) };
    return { id: d.id.trim(), update: d.update, condition, outcome, source: d.source, note: d.note };
  } catch (problem) {
    return String(problem);
  }
}

function describe(s: StoredExpectation): string {
  const e = s.expectation;
  const o = e.outcome;
  const c = e.condition;
  const parts = [
    c.knockOut.length ? `${c.knockOut.join(", ")} knocked out` : "",
    c.overExpress.length ? `${c.overExpress.join(", ")} over-expressed` : "",
    Object.keys(c.inputs).length ? `inputs ${formatAssignment(c.inputs)}` : "",
  ].filter(Boolean);
  const what =
    o.kind === "fixed-point-count" || o.kind === "attractor-count"
      ? `${o.kind === "fixed-point-count" ? "fixed points" : "attractors"} ${o.comparison.replace("-", " ")} ${o.count}`
      : o.kind === "reachable"
        ? `from ${formatAssignment(o.from)} an attractor with ${formatAssignment(o.pattern)} is reached`
        : `${o.kind.replace("-attractor", "")} attractor has ${formatAssignment(o.pattern)}`;
  return `${parts.length ? `${parts.join("; ")}: ` : ""}${what}${e.update === "asynchronous" ? " (asynchronous)" : ""}`;
}

function Field({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <label className="flex flex-col gap-1 text-xs">
      <span className="text-slate-600">{label}</span>
      {children}
    </label>
  );
}

const input = "rounded-md border border-slate-300 px-2 py-1 text-sm";

export function ExpectationsEditor({
  projectId,
  modelId,
  canWrite,
}: {
  projectId: string;
  modelId: string;
  canWrite: boolean;
}) {
  const list = useExpectations(projectId, modelId);
  const save = useSaveExpectation(projectId, modelId);
  const remove = useDeleteExpectation(projectId, modelId);
  const importer = useImportExpectations(projectId, modelId);
  const [draft, setDraft] = useState<Draft | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [csv, setCsv] = useState("");
  const [mode, setMode] = useState<"add" | "replace">("add");
  const set = (patch: Partial<Draft>) => setDraft((d) => ({ ...(d ?? EMPTY), ...patch }));
  const usesPattern = draft && draft.kind !== "fixed-point-count" && draft.kind !== "attractor-count";

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    if (!draft) return;
    const body = bodyOf(draft);
    if (typeof body === "string") return setProblem(body);
    setProblem(null);
    save.mutate({ rowId: draft.rowId, body }, { onSuccess: () => setDraft(null) });
  };

  return (
    <div className="space-y-3" data-testid="expectations-editor">
      {list.error && <Alert>{list.error.message}</Alert>}
      <ul className="divide-y divide-slate-100 text-sm">
        {list.data?.map((s) => (
          <li key={s.id} className="flex flex-wrap items-center gap-2 py-1.5" data-testid="expectation-row">
            <span className="font-mono font-medium">{s.expectation.id}</span>
            <span className="text-slate-700">{describe(s)}</span>
            <span className="text-xs italic text-slate-500">— {s.expectation.source}</span>
            {s.expectation.note && <span className="text-xs text-slate-500">({s.expectation.note})</span>}
            {canWrite && (
              <span className="ml-auto flex gap-1">
                <Button size="sm" variant="secondary" onClick={() => setDraft(draftOf(s))}>
                  Edit
                </Button>
                <Button size="sm" variant="danger" disabled={remove.isPending} onClick={() => remove.mutate(s.id)}>
                  Remove
                </Button>
              </span>
            )}
          </li>
        ))}
      </ul>
      <div className="flex flex-wrap gap-2">
        {canWrite && !draft && (
          <Button size="sm" data-testid="add-expectation" onClick={() => setDraft(EMPTY)}>
            Add an expectation
          </Button>
        )}
        <a
          className="rounded-md border border-slate-300 bg-white px-3 py-1 text-sm text-slate-700 hover:bg-slate-50"
          href={expectationsExportUrl(projectId, modelId)}
          download
        >
          Download CSV
        </a>
      </div>
      {draft && (
        <form onSubmit={submit} className="grid gap-2 rounded-md border border-slate-200 p-3 sm:grid-cols-3">
          <Field label="Id (letters, digits, _ - .)">
            <input className={input} value={draft.id} onChange={(e) => set({ id: e.target.value })} aria-label="Id" />
          </Field>
          <Field label="Update">
            <select
              className={input}
              value={draft.update}
              onChange={(e) => set({ update: e.target.value as Draft["update"] })}
            >
              <option value="synchronous">synchronous</option>
              <option value="asynchronous">asynchronous</option>
            </select>
          </Field>
          <Field label="Outcome">
            <select
              className={input}
              value={draft.kind}
              aria-label="Outcome"
              onChange={(e) => set({ kind: e.target.value as OutcomeKind })}
            >
              {OUTCOME_KINDS.map((k) => (
                <option key={k}>{k}</option>
              ))}
            </select>
          </Field>
          <Field label="Knock-outs (A, B)">
            <input className={input} value={draft.knockOut} onChange={(e) => set({ knockOut: e.target.value })} />
          </Field>
          <Field label="Over-expressions">
            <input className={input} value={draft.overExpress} onChange={(e) => set({ overExpress: e.target.value })} />
          </Field>
          <Field label="Inputs held (Light=1)">
            <input className={input} value={draft.inputs} onChange={(e) => set({ inputs: e.target.value })} />
          </Field>
          {usesPattern ? (
            <Field label="Pattern (A=1; B=0)">
              <input
                className={input}
                value={draft.pattern}
                aria-label="Pattern"
                onChange={(e) => set({ pattern: e.target.value })}
              />
            </Field>
          ) : (
            <Field label="Count (2, >=2, <=2)">
              <input
                className={input}
                value={draft.count}
                aria-label="Count"
                onChange={(e) => set({ count: e.target.value })}
              />
            </Field>
          )}
          {draft.kind === "reachable" && (
            <Field label="From state (named nodes; others 0)">
              <input className={input} value={draft.from} onChange={(e) => set({ from: e.target.value })} />
            </Field>
          )}
          <Field label="Source (citation or notebook reference)">
            <input
              className={input}
              value={draft.source}
              aria-label="Source"
              onChange={(e) => set({ source: e.target.value })}
            />
          </Field>
          <Field label="Note">
            <input className={input} value={draft.note} onChange={(e) => set({ note: e.target.value })} />
          </Field>
          <div className="flex items-end gap-2 sm:col-span-3">
            <Button type="submit" size="sm" data-testid="save-expectation" disabled={save.isPending}>
              {draft.rowId ? "Save changes" : "Add"}
            </Button>
            <Button size="sm" variant="secondary" onClick={() => setDraft(null)}>
              Cancel
            </Button>
          </div>
          {(problem ?? save.error) && (
            <div className="sm:col-span-3">
              <Alert>{problem ?? save.error?.message}</Alert>
            </div>
          )}
        </form>
      )}
      {canWrite && (
        <form
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            importer.mutate({ csv, mode }, { onSuccess: () => setCsv("") });
          }}
        >
          <p className="text-xs text-slate-600">
            Import a CSV table (columns id, update, knock_out, over_express, inputs, outcome, pattern, from, count,
            source, note): paste it or pick a file.
          </p>
          <input
            type="file"
            accept=".csv,text/csv"
            className="text-xs"
            onChange={(e) => void e.target.files?.[0]?.text().then(setCsv)}
          />
          <textarea
            className={`${input} w-full font-mono`}
            rows={4}
            value={csv}
            aria-label="Expectations CSV"
            onChange={(e) => setCsv(e.target.value)}
          />
          <div className="flex items-center gap-3 text-sm">
            <label className="flex items-center gap-1">
              <input type="radio" checked={mode === "add"} onChange={() => setMode("add")} /> add and replace same ids
            </label>
            <label className="flex items-center gap-1">
              <input type="radio" checked={mode === "replace"} onChange={() => setMode("replace")} /> make the table
              exactly this file
            </label>
            <Button type="submit" size="sm" disabled={!csv.trim() || importer.isPending}>
              Import
            </Button>
          </div>
          <ParseErrorList errors={issuesOf(importer.error)} title="The table could not be read; nothing was imported" />
          {importer.error && issuesOf(importer.error).length === 0 && <Alert>{importer.error.message}</Alert>}
          {importer.data && (
            <p className="text-sm text-slate-700">
              Imported: {importer.data.added} added, {importer.data.replaced} replaced, {importer.data.removed} removed.
              The latest revision is being checked.
            </p>
          )}
        </form>
      )}
    </div>
  );
}
