// New model: write rule text, upload a file, or generate one. Each way shows the server's parse errors before
// anything is stored and opens the model page once it is saved.
import { useState } from "react";
import { Link, useNavigate, useParams } from "react-router-dom";
import type { ModelDetail } from "@shared/schemas/models";
import { can } from "@shared/types/roles";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { useCreateModel } from "@/features/models/api/create-model";
import { GeneratorForm } from "@/features/models/components/generator-form";
import { issuesOf } from "@/features/models/components/parse-error-list";
import { RuleEditor } from "@/features/models/components/rule-editor";
import { UploadDropZone } from "@/features/models/components/upload-drop-zone";
import { useProjectOutlet } from "./project-layout";

type Mode = "write" | "upload" | "generate";

const starter = `# One rule per line: Target' = expression
# Operators: ! (not), & (and), ^ (xor), | (or); constants 0 and 1
A' = !C
B' = A
C' = B
`;

function WriteForm({ projectId, onCreated }: { projectId: string; onCreated(d: ModelDetail): void }) {
  const create = useCreateModel(projectId);
  const [name, setName] = useState("");
  const [text, setText] = useState(starter);
  const [submittedText, setSubmittedText] = useState<string | null>(null);
  const [savable, setSavable] = useState(false);
  const serverErrors = submittedText === text ? issuesOf(create.error) : [];
  return (
    <form
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        setSubmittedText(text);
        create.mutate({ name: name.trim(), ruleText: text }, { onSuccess: onCreated });
      }}
    >
      <label className="flex max-w-md flex-col gap-1 text-sm">
        <span className="text-slate-700">Name</span>
        <input
          required
          data-testid="model-name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          className="rounded-md border border-slate-300 px-2 py-1"
        />
      </label>
      <RuleEditor
        projectId={projectId}
        value={text}
        onChange={setText}
        serverErrors={serverErrors}
        onSavableChange={setSavable}
      />
      {create.error && serverErrors.length === 0 && submittedText === text && <Alert>{create.error.message}</Alert>}
      <Button type="submit" disabled={create.isPending || !name.trim() || !savable} data-testid="save-model">
        {create.isPending ? "Saving…" : "Save model"}
      </Button>
    </form>
  );
}

export function ModelNewRoute() {
  const { projectId = "" } = useParams();
  const navigate = useNavigate();
  const [mode, setMode] = useState<Mode>("write");
  const open = (d: ModelDetail) => navigate(`/projects/${projectId}/models/${d.model.id}`);
  const { project } = useProjectOutlet();
  // Said before any work: a role that cannot save models sees why, not a form it would fill in for nothing.
  if (!can(project.role, project.siteRole, "model:write"))
    return (
      <section className="space-y-3" data-testid="role-limits">
        <h2 className="text-lg font-semibold text-slate-900">New model</h2>
        <Alert tone="info">
          As a {project.role ?? "non-member"} of this project you can read its models, runs and reductions, but not
          create or edit models. Ask an owner of the project for the modeler role.
        </Alert>
        <Link to={`/projects/${projectId}/models`} className="text-sm text-brand-700 hover:underline">
          ← Back to the models
        </Link>
      </section>
    );
  const modes: [Mode, string][] = [
    ["write", "Write rules"],
    ["upload", "Upload a file"],
    ["generate", "Generate"],
  ];
  return (
    <section className="space-y-4">
      <div>
        <Link to={`/projects/${projectId}/models`} className="text-sm text-brand-700 hover:underline">
          ← Models
        </Link>
        <h2 className="mt-1 text-lg font-semibold text-slate-900">New model</h2>
      </div>
      <div role="tablist" aria-label="How to create the model" className="flex gap-1 border-b border-slate-200">
        {modes.map(([m, label]) => (
          <button
            key={m}
            role="tab"
            type="button"
            aria-selected={mode === m}
            data-testid={`mode-${m}`}
            onClick={() => setMode(m)}
            className={`-mb-px border-b-2 px-4 py-2 text-sm font-medium ${mode === m ? "border-brand-700 text-brand-700" : "border-transparent text-slate-600 hover:text-slate-900"}`}
          >
            {label}
          </button>
        ))}
      </div>
      <div role="tabpanel">
        {mode === "write" && <WriteForm projectId={projectId} onCreated={open} />}
        {mode === "upload" && <UploadDropZone projectId={projectId} onUploaded={open} />}
        {mode === "generate" && <GeneratorForm projectId={projectId} onCreated={open} />}
      </div>
    </section>
  );
}
