import { useState, type FormEvent } from "react";
import type { Role } from "#core/domain/roles";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import {
  checkForm,
  focusFirstInvalid,
  formErrorMessage,
  serverFieldErrors,
  type FieldErrors,
} from "../../../lib/form-errors";
import { inviteInput, useInviteMember } from "../api/invite-member";
import { ROLE_OPTIONS } from "./role-options";
import { StorePicker, type StoreOption } from "./store-picker";

export interface InviteFormProps {
  stores: readonly StoreOption[] | undefined;
  storesLoading?: boolean;
  /** Shown after sending, when invitations can be read in the local Outbox. */
  outboxHint?: boolean;
}

export function InviteForm({ stores, storesLoading = false, outboxHint = false }: InviteFormProps) {
  const [email, setEmail] = useState("");
  const [role, setRole] = useState<Role>("technician");
  const [storeIds, setStoreIds] = useState<string[]>([]);
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const [sentTo, setSentTo] = useState<string | null>(null);
  const invite = useInviteMember();
  const errors = { ...serverFieldErrors(invite.error), ...clientErrors };
  const formError = formErrorMessage(invite.error);
  const isStoreContact = role === "store-contact";

  function submit(event: FormEvent) {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    setSentTo(null);
    // Only a store contact is scoped to stores; other roles see every store of the company.
    const parsed = checkForm(
      inviteInput,
      { email, role, storeIds: isStoreContact ? storeIds : [] },
      form,
      setClientErrors,
    );
    if (!parsed) return;
    invite.mutate(parsed, {
      onError: (e) => focusFirstInvalid(form, serverFieldErrors(e)),
      onSuccess: (sent) => {
        setSentTo(sent.email);
        setEmail("");
        setStoreIds([]);
      },
    });
  }

  return (
    <form
      noValidate
      onSubmit={submit}
      className="space-y-4 rounded-md bg-surface p-4 edge"
      aria-label="Invite a member"
    >
      <h2 className="text-xl font-bold">Invite a member</h2>
      {sentTo ? (
        <Alert tone="success" title={`Invitation sent to ${sentTo}`}>
          {outboxHint
            ? "This installation keeps its mail in the Outbox, where the invitation can be read."
            : "The link in it works for a limited time."}
        </Alert>
      ) : null}
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="E-mail"
          name="email"
          type="email"
          inputMode="email"
          value={email}
          onChange={(e) => setEmail(e.target.value)}
          error={errors.email}
        />
        <Select
          label="Role"
          name="role"
          options={ROLE_OPTIONS}
          value={role}
          onChange={(e) => setRole(e.target.value as Role)}
          error={errors.role}
        />
      </div>
      {isStoreContact ? (
        <StorePicker
          stores={stores}
          loading={storesLoading}
          selected={storeIds}
          onChange={setStoreIds}
          error={errors.storeIds}
        />
      ) : null}
      <Button type="submit" busy={invite.isPending}>
        Send invitation
      </Button>
    </form>
  );
}
