// What an invitation link shows: the project and role on offer, then either "accept" for the signed-in invitee,
// a form to create the account (name and password), or a pointer to sign in as the invited address.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Link } from "react-router-dom";
import { z } from "zod";
import { DisplayName, NewPassword, PASSWORD_MIN } from "@shared/schemas/accounts";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { serverFieldErrors } from "@/lib/utils/server-field-errors";
import { useAcceptInvitation } from "../api/accept-invitation";
import { useInvitationPreview } from "../api/get-invitation";

const NewAccountForm = z.object({ displayName: DisplayName, password: NewPassword });

export function AcceptInvitationPanel({
  token,
  signedInEmail,
  onAccepted,
}: {
  token: string;
  signedInEmail: string | null;
  onAccepted: (projectId: string) => void;
}) {
  const { data: invitation, error, isPending } = useInvitationPreview(token);
  const accept = useAcceptInvitation(token);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm({ resolver: zodResolver(NewAccountForm), defaultValues: { displayName: "", password: "" } });

  if (isPending) return <p className="text-sm text-slate-500">Checking the invitation…</p>;
  if (error) return <Alert>{error.message}</Alert>;

  const acceptWith = async (body: { displayName?: string; password?: string }) => {
    setFormError(null);
    try {
      const result = await accept.mutateAsync(body);
      onAccepted(result.projectId);
    } catch (err) {
      setFormError(serverFieldErrors(err, ["displayName", "password"] as const, form.setError));
    }
  };

  const isForMe = signedInEmail === invitation.email;
  return (
    <div className="space-y-5">
      <p className="text-slate-700">
        <strong>{invitation.invitedByName || "A project owner"}</strong> invited <strong>{invitation.email}</strong> to
        the project <strong>{invitation.projectName}</strong> as{" "}
        <strong data-testid="invited-role">{invitation.role}</strong>.
      </p>
      {signedInEmail && !isForMe ? (
        <Alert tone="info">
          You are signed in as {signedInEmail}. Sign out first, then open this link again to accept as{" "}
          {invitation.email}.
        </Alert>
      ) : isForMe ? (
        <Button onClick={() => acceptWith({})} disabled={accept.isPending}>
          Accept and open the project
        </Button>
      ) : invitation.accountExists ? (
        <Alert tone="info">
          {invitation.email} already has an account.{" "}
          <Link
            className="font-medium underline"
            to={`/sign-in?next=${encodeURIComponent(`/invitations/${token}`)}&email=${encodeURIComponent(invitation.email)}`}
          >
            Sign in
          </Link>{" "}
          to accept.
        </Alert>
      ) : (
        <form
          onSubmit={form.handleSubmit(acceptWith)}
          noValidate
          className="space-y-4"
          aria-label="Create your account"
        >
          <p className="text-sm text-slate-600">Choose your name and a password to create your account.</p>
          <TextField
            label="Your name"
            autoComplete="name"
            maxLength={120}
            error={form.formState.errors.displayName?.message}
            {...form.register("displayName")}
          />
          <TextField
            label="Password"
            type="password"
            autoComplete="new-password"
            hint={`At least ${PASSWORD_MIN} characters.`}
            error={form.formState.errors.password?.message}
            {...form.register("password")}
          />
          <Button type="submit" disabled={form.formState.isSubmitting} className="w-full">
            Create account and join
          </Button>
        </form>
      )}
      {formError && <Alert>{formError}</Alert>}
    </div>
  );
}
