// The profile page's two forms: the display name, and a password change (which signs out other sessions).
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { ChangePasswordBody, PASSWORD_MIN, UpdateProfileBody, type Profile } from "@shared/schemas/accounts";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { serverFieldErrors } from "@/lib/utils/server-field-errors";
import { useChangePassword } from "../api/change-password";
import { useUpdateProfile } from "../api/update-profile";

export function DisplayNameForm({ profile }: { profile: Profile }) {
  const update = useUpdateProfile();
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const form = useForm({
    resolver: zodResolver(UpdateProfileBody),
    defaultValues: { displayName: profile.displayName },
  });
  const submit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      await update.mutateAsync(values);
      setMessage({ tone: "success", text: "Your name was saved." });
    } catch (err) {
      const text = serverFieldErrors(err, ["displayName"] as const, form.setError);
      if (text) setMessage({ tone: "error", text });
    }
  });
  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label="Your name">
      <TextField
        label="Display name"
        maxLength={120}
        error={form.formState.errors.displayName?.message}
        {...form.register("displayName")}
      />
      {message && <Alert tone={message.tone}>{message.text}</Alert>}
      <Button type="submit" disabled={form.formState.isSubmitting}>
        Save name
      </Button>
    </form>
  );
}

export function PasswordForm() {
  const change = useChangePassword();
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const form = useForm({
    resolver: zodResolver(ChangePasswordBody),
    defaultValues: { currentPassword: "", newPassword: "" },
  });
  const submit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      await change.mutateAsync(values);
      form.reset();
      setMessage({ tone: "success", text: "Password changed. Other devices have been signed out." });
    } catch (err) {
      const text = serverFieldErrors(err, ["currentPassword", "newPassword"] as const, form.setError);
      if (text) setMessage({ tone: "error", text });
    }
  });
  const { errors } = form.formState;
  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label="Change password">
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        error={errors.currentPassword?.message}
        {...form.register("currentPassword")}
      />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters.`}
        error={errors.newPassword?.message}
        {...form.register("newPassword")}
      />
      {message && <Alert tone={message.tone}>{message.text}</Alert>}
      <Button type="submit" disabled={form.formState.isSubmitting}>
        Change password
      </Button>
    </form>
  );
}
