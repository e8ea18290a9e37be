// Owners' controls: rename, archive or restore, and delete after typing the project's name.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { ProjectName, type ProjectDetail } from "@shared/schemas/projects";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { TextField } from "@/components/ui/text-field";
import { serverFieldErrors } from "@/lib/utils/server-field-errors";
import { useDeleteProject } from "../api/delete-project";
import { useUpdateProject } from "../api/update-project";

const RenameForm = z.object({ name: ProjectName });

export function ProjectSettings({ project, onDeleted }: { project: ProjectDetail; onDeleted: () => void }) {
  const update = useUpdateProject(project.id);
  const remove = useDeleteProject(project.id);
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const [isDeleteOpen, setDeleteOpen] = useState(false);
  const [typedName, setTypedName] = useState("");
  const [deleteError, setDeleteError] = useState<string | null>(null);
  const form = useForm({ resolver: zodResolver(RenameForm), values: { name: project.name } });

  const rename = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      await update.mutateAsync({ name: values.name });
      setMessage({ tone: "success", text: "The project was renamed." });
    } catch (err) {
      const text = serverFieldErrors(err, ["name"] as const, form.setError);
      if (text) setMessage({ tone: "error", text });
    }
  });

  const toggleArchive = async () => {
    setMessage(null);
    try {
      await update.mutateAsync({ archived: !project.archived });
      setMessage({
        tone: "success",
        text: project.archived
          ? "The project was restored."
          : "The project was archived; its content is now read-only.",
      });
    } catch (err) {
      setMessage({ tone: "error", text: (err as Error).message });
    }
  };

  const confirmDelete = async () => {
    setDeleteError(null);
    try {
      await remove.mutateAsync(typedName);
      setDeleteOpen(false);
      onDeleted();
    } catch (err) {
      setDeleteError((err as Error).message);
    }
  };

  return (
    <section
      className="space-y-6 rounded-lg border border-slate-200 bg-white p-5"
      aria-labelledby="settings-title"
      data-testid="project-settings"
    >
      <h2 id="settings-title" className="text-lg font-semibold">
        Project settings
      </h2>
      <form onSubmit={rename} noValidate className="flex flex-wrap items-start gap-3" aria-label="Rename project">
        <TextField
          label="Project name"
          className="min-w-64 flex-1"
          maxLength={120}
          error={form.formState.errors.name?.message}
          {...form.register("name")}
        />
        <Button type="submit" variant="secondary" className="mt-6" disabled={form.formState.isSubmitting}>
          Rename
        </Button>
      </form>
      {message && <Alert tone={message.tone}>{message.text}</Alert>}
      <div className="flex flex-wrap gap-3 border-t border-slate-100 pt-4">
        <Button variant="secondary" onClick={toggleArchive} disabled={update.isPending}>
          {project.archived ? "Restore project" : "Archive project"}
        </Button>
        <Button
          variant="danger"
          onClick={() => {
            setTypedName("");
            setDeleteError(null);
            setDeleteOpen(true);
          }}
        >
          Delete project…
        </Button>
      </div>
      <Dialog open={isDeleteOpen} title="Delete this project?" onClose={() => setDeleteOpen(false)}>
        <p className="text-sm text-slate-700">
          This removes <strong>{project.name}</strong> with all its models, runs, reductions, members and history. It
          cannot be undone.
        </p>
        <TextField
          label={`Type the project's name to confirm`}
          value={typedName}
          onChange={(e) => setTypedName(e.target.value)}
          autoFocus
        />
        {deleteError && <Alert>{deleteError}</Alert>}
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={() => setDeleteOpen(false)}>
            Cancel
          </Button>
          <Button variant="danger" onClick={confirmDelete} disabled={typedName !== project.name || remove.isPending}>
            Delete for good
          </Button>
        </div>
      </Dialog>
    </section>
  );
}
