// A new project: a name (at most 120 characters) and an optional description. The creator becomes its owner.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { CreateProjectBody } from "@shared/schemas/projects";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { serverFieldErrors } from "@/lib/utils/server-field-errors";
import { useCreateProject } from "../api/create-project";

export function CreateProjectForm({ onCreated }: { onCreated: (projectId: string) => void }) {
  const create = useCreateProject();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm({ resolver: zodResolver(CreateProjectBody), defaultValues: { name: "", description: "" } });
  const submit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      const project = await create.mutateAsync(values);
      onCreated(project.id);
    } catch (err) {
      setFormError(serverFieldErrors(err, ["name", "description"] as const, form.setError));
    }
  });
  return (
    <form onSubmit={submit} noValidate className="flex flex-wrap items-start gap-3" aria-label="New project">
      <TextField
        label="New project name"
        className="min-w-64 flex-1"
        maxLength={120}
        error={form.formState.errors.name?.message}
        {...form.register("name")}
      />
      <TextField
        label="Description (optional)"
        className="min-w-64 flex-[2]"
        maxLength={2000}
        {...form.register("description")}
      />
      <Button type="submit" className="mt-6" disabled={form.formState.isSubmitting}>
        Create project
      </Button>
      {formError && (
        <div className="w-full">
          <Alert>{formError}</Alert>
        </div>
      )}
    </form>
  );
}
