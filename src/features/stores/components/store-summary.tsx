import { useState } from "react";
import type { Store } from "#core/contracts/stores";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { formErrorMessage } from "../../../lib/form-errors";
import { useSetStoreArchived } from "../api/archive-store";
import { formatDateTimeInZone } from "../model/store-time";
import { StoreForm } from "./store-form";

/** The store page's first section: address and zone, with edit and archive for those who may. */
export function StoreSummary({ store, canEdit }: { store: Store; canEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  const [confirmArchive, setConfirmArchive] = useState(false);
  const archive = useSetStoreArchived();
  if (editing) return <StoreForm store={store} onDone={() => setEditing(false)} onCancel={() => setEditing(false)} />;
  const error = formErrorMessage(archive.error);
  return (
    <section aria-label="Store details" className="space-y-3 rounded-md bg-surface p-4 edge">
      {store.archivedAt ? (
        <Alert tone="note" title="Archived">
          This store is archived: it is hidden from the stores list, and its records are kept.
        </Alert>
      ) : null}
      {error ? <Alert tone="error">{error}</Alert> : null}
      <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[max-content_1fr]">
        <dt className="font-bold">Address</dt>
        <dd className="whitespace-pre-line">{store.address || "—"}</dd>
        <dt className="font-bold">Time zone</dt>
        <dd>{store.timeZone}</dd>
        <dt className="font-bold">Last changed</dt>
        <dd>{formatDateTimeInZone(store.updatedAt, store.timeZone)}</dd>
      </dl>
      {canEdit ? (
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => setEditing(true)}>
            Edit store
          </Button>
          {store.archivedAt ? (
            <Button
              variant="secondary"
              busy={archive.isPending}
              onClick={() => archive.mutate({ id: store.id, archived: false })}
            >
              Restore store
            </Button>
          ) : confirmArchive ? (
            <>
              <Button
                variant="danger"
                busy={archive.isPending}
                onClick={() =>
                  archive.mutate({ id: store.id, archived: true }, { onSuccess: () => setConfirmArchive(false) })
                }
              >
                Yes, archive {store.name}
              </Button>
              <Button variant="secondary" onClick={() => setConfirmArchive(false)}>
                Keep it
              </Button>
            </>
          ) : (
            <Button variant="secondary" onClick={() => setConfirmArchive(true)}>
              Archive store
            </Button>
          )}
        </div>
      ) : null}
    </section>
  );
}
