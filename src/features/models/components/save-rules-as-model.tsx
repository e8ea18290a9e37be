// Saves a network a result produced (given as rule text) as a new model of the project.
import { useState } from "react";
import { Link } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { useCreateModel } from "../api/create-model";

export function SaveRulesAsModel({
  projectId,
  ruleText,
  suggestedName,
  description,
}: {
  projectId: string;
  ruleText: string;
  suggestedName: string;
  description: string;
}) {
  const create = useCreateModel(projectId);
  const [name, setName] = useState(suggestedName.slice(0, 120));
  if (create.data)
    return (
      <p className="text-sm text-slate-700" data-testid="saved-model">
        Saved as{" "}
        <Link
          to={`/projects/${projectId}/models/${create.data.model.id}`}
          className="font-medium text-brand-700 hover:underline"
        >
          {create.data.model.name}
        </Link>
        .
      </p>
    );
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        create.mutate({ name, description, ruleText });
      }}
    >
      <label className="flex min-w-64 flex-1 flex-col gap-1 text-sm">
        <span className="text-slate-700">Model name</span>
        <input
          value={name}
          maxLength={120}
          onChange={(e) => setName(e.target.value)}
          className="rounded-md border border-slate-300 px-2 py-1"
          data-testid="save-model-name"
        />
      </label>
      <Button type="submit" disabled={create.isPending || name.trim() === ""} data-testid="save-model">
        {create.isPending ? "Saving…" : "Save as a model"}
      </Button>
      {create.error && <Alert>{create.error.message}</Alert>}
    </form>
  );
}
