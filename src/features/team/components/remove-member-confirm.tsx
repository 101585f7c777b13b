import type { Member } from "#core/contracts/members";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { formErrorMessage } from "../../../lib/form-errors";
import { useRemoveMember } from "../api/remove-member";

export function RemoveMemberConfirm({
  member,
  companyName,
  onDone,
}: {
  member: Member;
  companyName: string;
  onDone: () => void;
}) {
  const remove = useRemoveMember();
  const error = formErrorMessage(remove.error);
  return (
    <div className="space-y-3 rounded-md bg-danger-soft p-3 edge border-danger">
      <p>
        Remove <strong>{member.name}</strong> from {companyName}? They lose access to its stores and records.
      </p>
      {error ? <Alert tone="error">{error}</Alert> : null}
      <div className="flex flex-wrap gap-2">
        <Button
          variant="danger"
          busy={remove.isPending}
          onClick={() => remove.mutate(member.membershipId, { onSuccess: onDone })}
        >
          Yes, remove {member.name}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Keep
        </Button>
      </div>
    </div>
  );
}
