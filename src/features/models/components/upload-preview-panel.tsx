// What an uploaded file holds, before it is stored: name (editable), nodes, inputs, the first rules and warnings.
// When the project already has a model with identical content, it is offered first: open it, or add this file's
// model as its next revision, instead of storing a second copy under the same name.
import { useState } from "react";
import { Link } from "react-router-dom";
import type { ModelDetail, UploadPreview } from "@shared/schemas/models";
import { Button } from "@/components/ui/button";
import { plural } from "@/lib/plural";
import { useCreateRevision } from "../api/create-revision";

function AddRevision({
  projectId,
  duplicate,
  ruleText,
  onAdded,
}: {
  projectId: string;
  duplicate: UploadPreview["duplicates"][number];
  ruleText: string;
  onAdded(d: ModelDetail): void;
}) {
  const revise = useCreateRevision(projectId, duplicate.modelId);
  return (
    <Button
      variant="secondary"
      size="sm"
      disabled={revise.isPending}
      onClick={() => revise.mutate({ ruleText, message: "Uploaded again" }, { onSuccess: onAdded })}
      data-testid="duplicate-add-revision"
    >
      Add as revision {duplicate.revision + 1} of “{duplicate.name}”
    </Button>
  );
}

export function UploadPreviewPanel({
  projectId,
  preview,
  isStoring,
  onStore,
  onCancel,
  onRevised,
}: {
  projectId: string;
  preview: UploadPreview;
  isStoring: boolean;
  onStore(name: string): void;
  onCancel(): void;
  onRevised(d: ModelDetail): void;
}) {
  const [name, setName] = useState(preview.suggestedName);
  return (
    <section className="space-y-3 rounded-lg border border-slate-200 bg-white p-4" data-testid="upload-preview">
      <h3 className="text-sm font-semibold text-slate-900">
        {preview.fileName}: {plural(preview.nodeCount, "node")}, nothing stored yet
      </h3>
      {preview.duplicates.length > 0 && (
        <div className="space-y-2 rounded-md bg-amber-50 p-3 text-sm text-amber-900" data-testid="duplicate-offer">
          <p>This project already has a model with the same content. Open it, or add this file as its next revision:</p>
          {preview.duplicates.map((d) => (
            <div key={d.modelId} className="flex flex-wrap items-center gap-2">
              <Link
                to={`/projects/${projectId}/models/${d.modelId}`}
                className="font-medium text-brand-700 underline"
                data-testid="duplicate-open"
              >
                Open “{d.name}” (revision {d.revision})
              </Link>
              <AddRevision projectId={projectId} duplicate={d} ruleText={preview.ruleText} onAdded={onRevised} />
            </div>
          ))}
        </div>
      )}
      <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[8rem_1fr]">
        <dt className="text-slate-500">Nodes</dt>
        <dd data-testid="preview-nodes">{preview.nodes.join(", ")}</dd>
        <dt className="text-slate-500">Inputs</dt>
        <dd>{preview.inputs.length ? preview.inputs.join(", ") : "none"}</dd>
        <dt className="text-slate-500">First rules</dt>
        <dd>
          <pre className="overflow-x-auto rounded bg-slate-50 p-2 font-mono text-xs">
            {preview.firstRules.join("\n")}
            {preview.moreRules > 0 ? `\n… and ${plural(preview.moreRules, "more rule")}` : ""}
          </pre>
        </dd>
      </dl>
      {preview.warnings.length > 0 && (
        <ul className="list-disc pl-5 text-sm text-amber-800" data-testid="preview-warnings">
          {preview.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
      <label className="flex max-w-md flex-col gap-1 text-sm">
        <span className="text-slate-700">Name</span>
        <input
          value={name}
          maxLength={120}
          onChange={(e) => setName(e.target.value)}
          className="rounded-md border border-slate-300 px-2 py-1"
          data-testid="preview-name"
        />
      </label>
      <div className="flex gap-2">
        <Button disabled={isStoring || !name.trim()} onClick={() => onStore(name.trim())} data-testid="store-upload">
          {isStoring ? "Storing…" : preview.duplicates.length ? "Store as a new model anyway" : "Store this model"}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Choose another file
        </Button>
      </div>
    </section>
  );
}
