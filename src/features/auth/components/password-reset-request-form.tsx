import { useState, type FormEvent } from "react";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { TextField } from "../../../components/ui/text-field";
import {
  checkForm,
  focusFirstInvalid,
  formErrorMessage,
  serverFieldErrors,
  type FieldErrors,
} from "../../../lib/form-errors";
import { passwordResetRequestInput, useRequestPasswordReset } from "../api/request-password-reset";

export function PasswordResetRequestForm() {
  const [email, setEmail] = useState("");
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const request = useRequestPasswordReset();
  const errors = { ...serverFieldErrors(request.error), ...clientErrors };
  const formError = formErrorMessage(request.error);

  function submit(event: FormEvent) {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    const parsed = checkForm(passwordResetRequestInput, { email }, form, setClientErrors);
    if (!parsed) return;
    request.mutate(parsed, { onError: (e) => focusFirstInvalid(form, serverFieldErrors(e)) });
  }

  if (request.isSuccess) {
    // The server answers the same whether or not the account exists, and so do we.
    return (
      <Alert tone="success" title="Check your e-mail">
        If an account uses {email.trim()}, a link to choose a new password is on its way. The link works once.
      </Alert>
    );
  }

  return (
    <form noValidate onSubmit={submit} className="space-y-4" aria-label="Request a password reset">
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
      <Button type="submit" busy={request.isPending}>
        Send reset link
      </Button>
    </form>
  );
}
