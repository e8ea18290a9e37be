// A discovered target has no model of its own; saving it makes one, so the reduction can join the model hierarchy.
import { useState } from "react";
import { ApiError } from "@/lib/api-client";
import { useSaveTarget } from "../api/save-target";

export function SaveTargetForm({
  projectId,
  reductionId,
  suggestedName,
}: {
  projectId: string;
  reductionId: string;
  suggestedName: string;
}) {
  const [name, setName] = useState(suggestedName);
  const save = useSaveTarget(projectId, reductionId);
  return (
    <form
      className="flex flex-wrap items-end gap-2 rounded-lg border border-dashed border-slate-300 bg-white p-3"
      onSubmit={(e) => {
        e.preventDefault();
        save.mutate(name);
      }}
      data-testid="save-target"
    >
      <label className="flex flex-col gap-1 text-sm">
        <span className="font-medium text-slate-700">Save the target as a model of this project</span>
        <input
          value={name}
          onChange={(e) => setName(e.target.value)}
          maxLength={120}
          className="w-72 rounded-md border border-slate-300 px-2 py-1 text-sm"
          data-testid="save-target-name"
        />
      </label>
      <button
        type="submit"
        disabled={!name.trim() || save.isPending}
        className="rounded-md bg-brand-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-brand-800 disabled:opacity-50"
      >
        Save as model
      </button>
      {save.error && (
        <p role="alert" className="w-full text-sm text-red-700">
          {save.error instanceof ApiError ? save.error.message : "Saving failed"}
        </p>
      )}
    </form>
  );
}
