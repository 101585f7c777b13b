import { useState, type FormEvent } from "react";
import { Alert } from "../../../components/ui/alert";
import { NewPasswordFields } from "../../../components/new-password-fields";
import { Button } from "../../../components/ui/button";
import { TextField } from "../../../components/ui/text-field";
import {
  checkForm,
  focusFirstInvalid,
  formErrorMessage,
  serverFieldErrors,
  type FieldErrors,
} from "../../../lib/form-errors";
import { passwordChangeInput, useChangePassword } from "../api/change-password";

/** Change your own password: the current one proves it is you; the new one is typed twice. */
export function PasswordChangeForm() {
  const [current, setCurrent] = useState("");
  const [next, setNext] = useState("");
  const [again, setAgain] = useState("");
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const [done, setDone] = useState(false);
  const change = useChangePassword();
  const errors = { ...serverFieldErrors(change.error), ...clientErrors };
  const formError = formErrorMessage(change.error);

  function submit(event: FormEvent) {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    setDone(false);
    const parsed = checkForm(
      passwordChangeInput,
      { currentPassword: current, newPassword: next },
      form,
      setClientErrors,
    );
    if (!parsed) return;
    if (next !== again) {
      const fields = { confirm: "does not match the new password" };
      setClientErrors(fields);
      focusFirstInvalid(form, fields);
      return;
    }
    change.mutate(parsed, {
      onSuccess: () => {
        setDone(true);
        setCurrent("");
        setNext("");
        setAgain("");
      },
      onError: (e) => focusFirstInvalid(form, serverFieldErrors(e)),
    });
  }

  return (
    <form noValidate onSubmit={submit} aria-label="Change your password" className="max-w-xl space-y-4">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      {done ? (
        <Alert tone="success">Your password is changed. Every other device you were signed in on is signed out.</Alert>
      ) : null}
      <TextField
        label="Current password"
        name="currentPassword"
        type="password"
        autoComplete="current-password"
        value={current}
        onChange={(e) => setCurrent(e.target.value)}
        error={errors.currentPassword}
      />
      <NewPasswordFields
        name="newPassword"
        password={next}
        confirm={again}
        onPassword={setNext}
        onConfirm={setAgain}
        errors={errors}
      />
      <Button type="submit" busy={change.isPending}>
        Change password
      </Button>
    </form>
  );
}
