import type { Invitation } from "#core/contracts/members";
import { ROLE_LABELS } from "#core/domain/roles";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { DataTable } from "../../../components/ui/data-table";
import { EmptyState } from "../../../components/ui/empty-state";
import { formErrorMessage } from "../../../lib/form-errors";
import { formatDate } from "../../../lib/format";
import { useRevokeInvitation } from "../api/revoke-invitation";
import { useResendInvitation } from "../api/resend-invitation";
import { MailDeliveryStatus } from "../../../components/mail-delivery-status";
import type { StoreOption } from "./store-picker";

export interface InvitationsListProps {
  invitations: readonly Invitation[];
  stores: readonly StoreOption[] | undefined;
  canManage: boolean;
  now?: Date;
}

export function InvitationsList({ invitations, stores, canManage, now = new Date() }: InvitationsListProps) {
  const revoke = useRevokeInvitation();
  const resend = useResendInvitation();
  const pending = invitations.filter((i) => i.acceptedAt === null);
  const error = formErrorMessage(revoke.error) ?? formErrorMessage(resend.error);

  if (pending.length === 0) return <EmptyState title="No pending invitations" />;
  return (
    <div className="space-y-3">
      {error ? <Alert tone="error">{error}</Alert> : null}
      <DataTable
        caption="Pending invitations"
        rows={pending}
        rowKey={(i) => i.id}
        columns={[
          { header: "E-mail", cell: (i) => i.email },
          { header: "Role", cell: (i) => ROLE_LABELS[i.role] },
          {
            header: "Stores",
            cell: (i) =>
              i.role === "store-contact"
                ? i.storeIds.map((id) => stores?.find((s) => s.id === id)?.name ?? "A store not listed").join(", ")
                : "All stores",
          },
          { header: "Invited by", cell: (i) => i.invitedBy },
          { header: "E-mail status", cell: (i) => <MailDeliveryStatus delivery={i.delivery} /> },
          {
            header: "Expires",
            cell: (i) =>
              new Date(i.expiresAt) < now ? (
                <strong>Expired {formatDate(i.expiresAt)}</strong>
              ) : (
                formatDate(i.expiresAt)
              ),
          },
          ...(canManage
            ? [
                {
                  header: "Actions",
                  cell: (i: Invitation) => (
                    <div className="flex flex-wrap gap-2">
                      {i.delivery?.state !== "queued" ? (
                        <Button
                          variant="secondary"
                          aria-label={`Send the invitation to ${i.email} again`}
                          busy={resend.isPending && resend.variables === i.id}
                          onClick={() => resend.mutate(i.id)}
                        >
                          Send again
                        </Button>
                      ) : null}
                      <Button
                        variant="secondary"
                        aria-label={`Revoke the invitation to ${i.email}`}
                        busy={revoke.isPending && revoke.variables === i.id}
                        onClick={() => revoke.mutate(i.id)}
                      >
                        Revoke
                      </Button>
                    </div>
                  ),
                },
              ]
            : []),
        ]}
      />
    </div>
  );
}
