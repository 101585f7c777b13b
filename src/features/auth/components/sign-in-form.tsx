import { useState, type FormEvent } from "react";
import { Link } from "react-router";
import type { SessionInfo } from "#core/contracts/auth";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { TextField } from "../../../components/ui/text-field";
import { isApiRequestError } from "../../../lib/api-client";
import {
  checkForm,
  focusFirstInvalid,
  formErrorMessage,
  serverFieldErrors,
  type FieldErrors,
} from "../../../lib/form-errors";
import { signInInput, useSignIn } from "../api/sign-in";

export function SignInForm({ onSignedIn }: { onSignedIn: (info: SessionInfo) => void }) {
  const [email, setEmail] = useState("");
  const [password, setPassword] = useState("");
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const signIn = useSignIn();

  const errors = { ...serverFieldErrors(signIn.error), ...clientErrors };
  // The server's wording is shown as it is: a rate limit says when to try again.
  const formError =
    isApiRequestError(signIn.error) && signIn.error.code === "invalid_credentials"
      ? "That e-mail and password do not match an account. Check both and try again."
      : formErrorMessage(signIn.error);

  function submit(event: FormEvent) {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    const parsed = checkForm(signInInput, { email, password }, form, setClientErrors);
    if (!parsed) return;
    signIn.mutate(parsed, { onSuccess: onSignedIn, onError: (e) => focusFirstInvalid(form, serverFieldErrors(e)) });
  }

  return (
    <form noValidate onSubmit={submit} className="space-y-4" aria-label="Sign in">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="username"
        inputMode="email"
        value={email}
        onChange={(e) => setEmail(e.target.value)}
        error={errors.email}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="current-password"
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        error={errors.password}
      />
      <div className="flex flex-wrap items-center justify-between gap-3">
        <Button type="submit" busy={signIn.isPending}>
          {signIn.isPending ? "Signing in…" : "Sign in"}
        </Button>
        <Link to="/forgot-password" className="inline-flex min-h-11 items-center">
          Forgot password?
        </Link>
      </div>
    </form>
  );
}
