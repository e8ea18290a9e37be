// A new account: name, e-mail and a password of at least ten characters. The server mails a link that finishes
// it, so the form ends by saying where to look.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { PASSWORD_MIN, SignUpBody } from "@shared/schemas/accounts";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { serverFieldErrors } from "@/lib/utils/server-field-errors";
import { useSignUp } from "../api/sign-up";

export function SignUpForm({ onRequested }: { onRequested: (email: string) => void }) {
  const signUp = useSignUp();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm({
    resolver: zodResolver(SignUpBody),
    defaultValues: { email: "", displayName: "", password: "" },
  });
  const { errors, isSubmitting } = form.formState;
  const submit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      const { email } = await signUp.mutateAsync(values);
      onRequested(email);
    } catch (err) {
      setFormError(serverFieldErrors(err, ["email", "displayName", "password"] as const, form.setError));
    }
  });
  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label="Create an account">
      <TextField
        label="Your name"
        autoComplete="name"
        maxLength={120}
        error={errors.displayName?.message}
        {...form.register("displayName")}
      />
      <TextField
        label="E-mail address"
        type="email"
        autoComplete="email"
        error={errors.email?.message}
        {...form.register("email")}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters.`}
        error={errors.password?.message}
        {...form.register("password")}
      />
      {formError && <Alert>{formError}</Alert>}
      <Button type="submit" disabled={isSubmitting} className="w-full">
        {isSubmitting ? "Sending the link…" : "Create account"}
      </Button>
    </form>
  );
}
