// E-mail and password; the server's message (wrong password, too many attempts) shows above the button.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { SignInBody } from "@shared/schemas/accounts";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { serverFieldErrors } from "@/lib/utils/server-field-errors";
import { useSignIn } from "../api/sign-in";

export function SignInForm({ onSignedIn, defaultEmail = "" }: { onSignedIn: () => void; defaultEmail?: string }) {
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm({ resolver: zodResolver(SignInBody), defaultValues: { email: defaultEmail, password: "" } });
  const { errors, isSubmitting } = form.formState;
  const submit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await signIn.mutateAsync(values);
      onSignedIn();
    } catch (err) {
      setFormError(serverFieldErrors(err, ["email", "password"] as const, form.setError));
    }
  });
  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label="Sign in">
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
        autoComplete="current-password"
        error={errors.password?.message}
        {...form.register("password")}
      />
      {formError && <Alert>{formError}</Alert>}
      <Button type="submit" disabled={isSubmitting} className="w-full">
        {isSubmitting ? "Signing in…" : "Sign in"}
      </Button>
    </form>
  );
}
