import { useState, type FormEvent } from "react";
import { Link } from "react-router";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import {
  focusFirstInvalid,
  formErrorMessage,
  serverFieldErrors,
  zodFieldErrors,
  type FieldErrors,
} from "../../../lib/form-errors";
import { passwordResetConfirmInput, useConfirmPasswordReset } from "../api/confirm-password-reset";
import { NewPasswordFields } from "../../../components/new-password-fields";

export function PasswordResetForm({ token }: { token: string }) {
  const [password, setPassword] = useState("");
  const [confirm, setConfirm] = useState("");
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const reset = useConfirmPasswordReset();
  const errors = { ...serverFieldErrors(reset.error), ...clientErrors };
  const formError = errors.token ? "This reset link is not valid. Ask for a new one." : formErrorMessage(reset.error);

  function submit(event: FormEvent) {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    const parsed = passwordResetConfirmInput.safeParse({ token, password });
    const fields = parsed.success ? {} : zodFieldErrors(parsed.error);
    if (password !== confirm) fields.confirm = "does not match the first one";
    setClientErrors(fields);
    if (parsed.success && !fields.confirm)
      reset.mutate(parsed.data, { onError: (e) => focusFirstInvalid(form, serverFieldErrors(e)) });
    else focusFirstInvalid(form, fields);
  }

  if (reset.isSuccess) {
    return (
      <Alert tone="success" title="Password changed">
        <Link to="/sign-in">Sign in with your new password</Link>
      </Alert>
    );
  }

  return (
    <form noValidate onSubmit={submit} className="space-y-4" aria-label="Choose a new password">
      {formError ? (
        <Alert tone="error">
          {formError} <Link to="/forgot-password">Request a new link</Link>
        </Alert>
      ) : null}
      <NewPasswordFields
        password={password}
        confirm={confirm}
        onPassword={setPassword}
        onConfirm={setConfirm}
        errors={errors}
      />
      <Button type="submit" busy={reset.isPending}>
        Save new password
      </Button>
    </form>
  );
}
