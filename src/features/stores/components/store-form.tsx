import { useId, useState, type FormEvent } from "react";
import type { Store } from "#core/contracts/stores";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { FieldError } from "../../../components/ui/field-error";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from "../../../lib/form-errors";
import { createStoreInput, useCreateStore } from "../api/create-store";
import { updateStoreInput, useUpdateStore } from "../api/update-store";
import { browserTimeZone, TimeZoneField } from "./time-zone-field";

/** Creates a store, or edits one when `store` is given. */
export function StoreForm({
  store,
  onDone,
  onCancel,
}: {
  store?: Store;
  onDone: (saved: Store) => void;
  onCancel?: () => void;
}) {
  const [name, setName] = useState(store?.name ?? "");
  const [address, setAddress] = useState(store?.address ?? "");
  const [timeZone, setTimeZone] = useState(store?.timeZone ?? browserTimeZone());
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const create = useCreateStore();
  const update = useUpdateStore();
  const mutation = store ? update : create;
  const addressId = useId();
  const errors = { ...serverFieldErrors(mutation.error), ...clientErrors };

  function submit(e: FormEvent) {
    e.preventDefault();
    const values = { name, address, timeZone };
    const parsed = (store ? updateStoreInput : createStoreInput).safeParse(values);
    if (!parsed.success) {
      setClientErrors(zodFieldErrors(parsed.error));
      return;
    }
    setClientErrors({});
    if (store) update.mutate({ id: store.id, input: values }, { onSuccess: (saved) => onDone(saved) });
    else create.mutate(createStoreInput.parse(values), { onSuccess: (saved) => onDone(saved) });
  }

  const formError = formErrorMessage(mutation.error);
  return (
    <form onSubmit={submit} noValidate className="space-y-4 rounded-md bg-surface p-4 edge">
      <h2 className="text-xl font-bold">{store ? `Edit ${store.name}` : "New store"}</h2>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <TextField
        label="Store name"
        value={name}
        onChange={(e) => setName(e.target.value)}
        error={errors.name}
        autoComplete="off"
      />
      <div>
        <label htmlFor={addressId} className="block font-bold">
          Address
        </label>
        <textarea
          id={addressId}
          value={address}
          rows={3}
          onChange={(e) => setAddress(e.target.value)}
          className="mt-1 block w-full rounded-md bg-surface px-3 py-2 text-ink edge"
        />
        <FieldError id={`${addressId}-error`} label="Address" message={errors.address} />
      </div>
      <TimeZoneField value={timeZone} onChange={setTimeZone} error={errors.timeZone} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={mutation.isPending}>
          {store ? "Save store" : "Create store"}
        </Button>
        {onCancel ? (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}
