import { useState } from "react";
import type { Member } from "#core/contracts/members";
import type { Role } from "#core/domain/roles";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Select } from "../../../components/ui/select";
import { formErrorMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from "../../../lib/form-errors";
import { memberUpdateInput, useUpdateMember } from "../api/update-member";
import { ROLE_OPTIONS } from "./role-options";
import { StorePicker, type StoreOption } from "./store-picker";

export interface MemberRoleEditorProps {
  member: Member;
  stores: readonly StoreOption[] | undefined;
  onDone: () => void;
}

/** Role and store scope of one member, edited in place under the member's row. */
export function MemberRoleEditor({ member, stores, onDone }: MemberRoleEditorProps) {
  const [role, setRole] = useState<Role>(member.role);
  const [storeIds, setStoreIds] = useState<string[]>(member.storeIds);
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const update = useUpdateMember();
  const errors = { ...serverFieldErrors(update.error), ...clientErrors };
  const formError = formErrorMessage(update.error);

  function save() {
    const parsed = memberUpdateInput.safeParse({ role, storeIds: role === "store-contact" ? storeIds : [] });
    if (!parsed.success) {
      setClientErrors(zodFieldErrors(parsed.error));
      return;
    }
    setClientErrors({});
    update.mutate({ membershipId: member.membershipId, input: parsed.data }, { onSuccess: onDone });
  }

  return (
    <div className="space-y-3 rounded-md bg-accent-soft p-3 edge">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <Select
        label={`Role of ${member.name}`}
        options={ROLE_OPTIONS}
        value={role}
        onChange={(e) => setRole(e.target.value as Role)}
        error={errors.role}
      />
      {role === "store-contact" ? (
        <StorePicker stores={stores} selected={storeIds} onChange={setStoreIds} error={errors.storeIds} />
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button onClick={save} busy={update.isPending}>
          Save role
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </div>
  );
}
