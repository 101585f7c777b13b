import { useState } from "react";
import type { Member } from "#core/contracts/members";
import { ROLE_LABELS } from "#core/domain/roles";
import { Button } from "../../../components/ui/button";
import { DataTable, type Column } from "../../../components/ui/data-table";
import { formatDate } from "../../../lib/format";
import { MemberRoleEditor } from "./member-role-editor";
import { RemoveMemberConfirm } from "./remove-member-confirm";
import type { StoreOption } from "./store-picker";

export interface MembersTableProps {
  members: readonly Member[];
  stores: readonly StoreOption[] | undefined;
  canManage: boolean;
  currentUserId: string;
  companyName: string;
}

type Open = { membershipId: string; mode: "edit" | "remove" } | null;

export function MembersTable({ members, stores, canManage, currentUserId, companyName }: MembersTableProps) {
  const [open, setOpen] = useState<Open>(null);
  const storeName = (id: string) => stores?.find((s) => s.id === id)?.name ?? "A store not listed";

  const columns: Column<Member>[] = [
    { header: "Name", cell: (m) => (m.userId === currentUserId ? `${m.name} (you)` : m.name) },
    { header: "E-mail", cell: (m) => m.email },
    { header: "Role", cell: (m) => ROLE_LABELS[m.role] },
    {
      header: "Stores",
      cell: (m) => (m.role === "store-contact" ? m.storeIds.map(storeName).join(", ") || "None" : "All stores"),
    },
    { header: "Joined", cell: (m) => formatDate(m.joinedAt) },
  ];
  if (canManage) {
    columns.push({
      header: "Actions",
      cell: (m) => (
        <div className="flex flex-wrap gap-2">
          <Button
            variant="secondary"
            aria-label={`Change role of ${m.name}`}
            onClick={() => setOpen({ membershipId: m.membershipId, mode: "edit" })}
          >
            Change role
          </Button>
          <Button
            variant="secondary"
            aria-label={`Remove ${m.name}`}
            onClick={() => setOpen({ membershipId: m.membershipId, mode: "remove" })}
          >
            Remove
          </Button>
        </div>
      ),
    });
  }

  return (
    <DataTable
      caption="Members"
      columns={columns}
      rows={members}
      rowKey={(m) => m.membershipId}
      rowDetail={(m) => {
        if (!open || open.membershipId !== m.membershipId) return null;
        const close = () => setOpen(null);
        return open.mode === "edit" ? (
          <MemberRoleEditor member={m} stores={stores} onDone={close} />
        ) : (
          <RemoveMemberConfirm member={m} companyName={companyName} onDone={close} />
        );
      }}
    />
  );
}
