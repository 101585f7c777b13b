import { Checkbox } from "../../../components/ui/checkbox";
import { fieldMessage } from "../../../lib/form-errors";

/** A store as the picker needs it; the route hands these in from the stores feature. */
export interface StoreOption {
  id: string;
  name: string;
}

export interface StorePickerProps {
  stores: readonly StoreOption[] | undefined;
  selected: readonly string[];
  onChange: (storeIds: string[]) => void;
  error?: string;
  loading?: boolean;
}

/** Which stores a store contact may read; their membership is scoped to exactly these. */
export function StorePicker({ stores, selected, onChange, error, loading = false }: StorePickerProps) {
  function toggle(id: string, on: boolean) {
    onChange(on ? [...selected, id] : selected.filter((s) => s !== id));
  }
  return (
    <fieldset className="rounded-md p-3 edge" aria-describedby={error ? "store-picker-error" : undefined}>
      <legend className="px-1 font-bold">Stores this contact may see</legend>
      {loading ? <p className="text-muted">Loading stores…</p> : null}
      {!loading && (stores?.length ?? 0) === 0 ? (
        <p className="text-muted">This company has no stores yet, so a store contact cannot be given one.</p>
      ) : null}
      {stores?.map((store) => (
        <Checkbox
          key={store.id}
          name="storeIds"
          value={store.id}
          label={store.name}
          checked={selected.includes(store.id)}
          onChange={(e) => toggle(store.id, e.target.checked)}
        />
      ))}
      {error ? (
        <p id="store-picker-error" className="mt-1 font-bold text-danger">
          {fieldMessage("Stores", error)}
        </p>
      ) : null}
    </fieldset>
  );
}
