import { useState, type FormEvent } from "react";
import { Link } from "react-router";
import type { z } from "zod";
import type { SessionInfo } from "#core/contracts/auth";
import type { invitationPreview } from "#core/contracts/members";
import { ROLE_LABELS } from "#core/domain/roles";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { TextField } from "../../../components/ui/text-field";
import {
  focusFirstInvalid,
  formErrorMessage,
  serverFieldErrors,
  zodFieldErrors,
  type FieldErrors,
} from "../../../lib/form-errors";
import { acceptInvitationInput, newAccountPassword, useAcceptInvitation } from "../api/accept-invitation";
import { NewPasswordFields } from "../../../components/new-password-fields";

type Preview = z.infer<typeof invitationPreview>;

export interface AcceptInvitationFormProps {
  token: string;
  preview: Preview;
  onAccepted: (info: SessionInfo) => void;
}

export function AcceptInvitationForm({ token, preview, onAccepted }: AcceptInvitationFormProps) {
  const [name, setName] = useState("");
  const [password, setPassword] = useState("");
  const [confirm, setConfirm] = useState("");
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const accept = useAcceptInvitation();
  const errors = { ...serverFieldErrors(accept.error), ...clientErrors };
  const formError = formErrorMessage(accept.error);

  function validate(): { input: z.infer<typeof acceptInvitationInput> | null; fields: FieldErrors } {
    if (preview.hasAccount) {
      const parsed = acceptInvitationInput.safeParse({ password });
      return parsed.success
        ? { input: parsed.data, fields: {} }
        : { input: null, fields: zodFieldErrors(parsed.error) };
    }
    // A new account needs a name and a password the server will accept (at least 10 characters).
    const parsed = acceptInvitationInput.safeParse({ name, password });
    const fields = parsed.success ? {} : zodFieldErrors(parsed.error);
    if (!parsed.success || !parsed.data.name) fields.name ??= "is required";
    const strong = newAccountPassword.safeParse(password);
    if (!strong.success) fields.password ??= strong.error.issues[0]?.message ?? "is not accepted";
    if (password !== confirm) fields.confirm = "does not match the first one";
    return { input: parsed.success && Object.keys(fields).length === 0 ? parsed.data : null, fields };
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    const { input, fields } = validate();
    setClientErrors(fields);
    if (!input) {
      focusFirstInvalid(form, fields);
      return;
    }
    accept.mutate(
      { token, input },
      { onSuccess: onAccepted, onError: (e) => focusFirstInvalid(form, serverFieldErrors(e)) },
    );
  }

  return (
    <form noValidate onSubmit={submit} className="space-y-4" aria-label="Accept the invitation">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 rounded-md bg-surface p-4 edge">
        <dt className="font-bold">Company</dt>
        <dd>{preview.companyName}</dd>
        <dt className="font-bold">Role</dt>
        <dd>{ROLE_LABELS[preview.role]}</dd>
        <dt className="font-bold">E-mail</dt>
        <dd className="break-all">{preview.email}</dd>
      </dl>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      {preview.hasAccount ? (
        <>
          <p>You already have a Plumeline account. Enter its password to join {preview.companyName}.</p>
          <TextField
            label="Password"
            name="password"
            type="password"
            autoComplete="current-password"
            value={password}
            onChange={(e) => setPassword(e.target.value)}
            error={errors.password}
          />
          <p>
            <Link to="/forgot-password">Forgot password?</Link>
          </p>
        </>
      ) : (
        <>
          <TextField
            label="Your name"
            name="name"
            autoComplete="name"
            value={name}
            onChange={(e) => setName(e.target.value)}
            error={errors.name}
          />
          <NewPasswordFields
            password={password}
            confirm={confirm}
            onPassword={setPassword}
            onConfirm={setConfirm}
            errors={errors}
          />
        </>
      )}
      <Button type="submit" busy={accept.isPending}>
        Join {preview.companyName}
      </Button>
    </form>
  );
}
