// Inviting people by e-mail and the list of invitations still waiting for an answer.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { CreateInvitationBody } from "@shared/schemas/projects";
import { PROJECT_ROLES } from "@shared/types/roles";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { serverFieldErrors } from "@/lib/utils/server-field-errors";
import { useCreateInvitation } from "../api/create-invitation";
import { useInvitations } from "../api/list-invitations";
import { useRevokeInvitation } from "../api/revoke-invitation";

export function InvitationsPanel({ projectId }: { projectId: string }) {
  const invite = useCreateInvitation(projectId);
  const revoke = useRevokeInvitation(projectId);
  const { data: pending } = useInvitations(projectId, true);
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const form = useForm({
    resolver: zodResolver(CreateInvitationBody),
    defaultValues: { email: "", role: "viewer" as const },
  });
  const submit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      const sent = await invite.mutateAsync(values);
      form.reset({ email: "", role: values.role });
      setMessage({ tone: "success", text: `Invitation sent to ${sent.email} as ${sent.role}.` });
    } catch (err) {
      const text = serverFieldErrors(err, ["email", "role"] as const, form.setError);
      if (text) setMessage({ tone: "error", text });
    }
  });
  return (
    <section
      className="space-y-4 rounded-lg border border-slate-200 bg-white p-5"
      aria-labelledby="invite-title"
      data-testid="invite-panel"
    >
      <h2 id="invite-title" className="text-lg font-semibold">
        Invite someone
      </h2>
      <form onSubmit={submit} noValidate className="flex flex-wrap items-start gap-3" aria-label="Invite by e-mail">
        <TextField
          label="E-mail address"
          type="email"
          className="min-w-64 flex-1"
          error={form.formState.errors.email?.message}
          {...form.register("email")}
        />
        <div className="space-y-1">
          <label htmlFor="invite-role" className="block text-sm font-medium text-slate-700">
            Role
          </label>
          <select
            id="invite-role"
            className="rounded-md border border-slate-300 bg-white px-3 py-2 text-sm"
            {...form.register("role")}
          >
            {PROJECT_ROLES.map((r) => (
              <option key={r} value={r}>
                {r}
              </option>
            ))}
          </select>
        </div>
        <Button type="submit" className="mt-6" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? "Sending…" : "Send invitation"}
        </Button>
      </form>
      {message && <Alert tone={message.tone}>{message.text}</Alert>}
      {pending && pending.length > 0 && (
        <div>
          <h3 className="mb-2 text-sm font-semibold text-slate-700">Waiting for an answer</h3>
          <ul
            className="divide-y divide-slate-100 rounded-md border border-slate-200 text-sm"
            data-testid="pending-invitations"
          >
            {pending.map((i) => (
              <li key={i.id} className="flex flex-wrap items-center gap-3 px-3 py-2">
                <span className="font-medium">{i.email}</span>
                <span className="capitalize text-slate-600">{i.role}</span>
                <span className="text-xs text-slate-500">expires {new Date(i.expiresAt).toLocaleDateString()}</span>
                <Button variant="ghost" size="sm" className="ml-auto" onClick={() => revoke.mutate(i.id)}>
                  Withdraw
                </Button>
              </li>
            ))}
          </ul>
        </div>
      )}
    </section>
  );
}
