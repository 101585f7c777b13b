import { useState, type FormEvent } from "react";
import {
  APPLIANCE_TYPE_NAMES,
  APPLIANCE_TYPES,
  type ApplianceType,
  type System,
  type SystemInput,
} from "#core/contracts/systems";
import { kgToPounds } from "#core/domain/units/mass";
import type { MassPreference } from "#core/domain/units/format-units";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Checkbox } from "../../../components/ui/checkbox";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from "../../../lib/form-errors";
import { createSystemInput, useCreateSystem } from "../api/create-system";
import { useRefrigerants } from "../api/get-refrigerants";
import { useUpdateSystem } from "../api/update-system";
import { RefrigerantCautions } from "./refrigerant-cautions";
import { RefrigerantPicker } from "./refrigerant-picker";

function chargeText(kg: number, unit: MassPreference): string {
  const v = unit === "lb" ? kgToPounds(kg) : kg;
  return String(Number(v.toFixed(3)));
}

/** Adds a system to a store, or edits one; the charge is typed in kg or lb and kept in kg. */
export function SystemForm({
  storeId,
  system,
  massUnit,
  onDone,
  onCancel,
}: {
  storeId: string;
  system?: System;
  massUnit: MassPreference;
  onDone: () => void;
  onCancel: () => void;
}) {
  const refrigerants = useRefrigerants();
  const [name, setName] = useState(system?.name ?? "");
  const [refrigerantId, setRefrigerantId] = useState(system?.refrigerantId ?? "");
  const [unit, setUnit] = useState<MassPreference>(massUnit);
  const [charge, setCharge] = useState(system ? chargeText(system.fullChargeKg, massUnit) : "");
  const [applianceType, setApplianceType] = useState<ApplianceType>(
    system?.applianceType ?? "commercial-refrigeration",
  );
  const [ald, setAld] = useState(system?.automaticLeakDetection ?? false);
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const create = useCreateSystem();
  const update = useUpdateSystem();
  const mutation = system ? update : create;
  const errors = { ...serverFieldErrors(mutation.error), ...clientErrors };
  const picked = refrigerants.data?.find((r) => r.id === refrigerantId) ?? null;

  function submit(e: FormEvent) {
    e.preventDefault();
    const value = charge.trim() === "" ? Number.NaN : Number(charge);
    const values: SystemInput = {
      name,
      refrigerantId,
      fullCharge: { value, unit },
      applianceType,
      automaticLeakDetection: ald,
    };
    const parsed = createSystemInput.safeParse(values);
    if (!parsed.success) {
      setClientErrors(zodFieldErrors(parsed.error));
      return;
    }
    setClientErrors({});
    if (system) update.mutate({ id: system.id, input: parsed.data }, { onSuccess: () => onDone() });
    else create.mutate({ storeId, input: parsed.data }, { onSuccess: () => onDone() });
  }

  const formError = formErrorMessage(mutation.error);
  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_minmax(0,22rem)]">
      <form onSubmit={submit} noValidate className="space-y-4 rounded-md bg-surface p-4 edge">
        <h3 className="text-lg font-bold">{system ? `Edit ${system.name}` : "New system"}</h3>
        {formError ? <Alert tone="error">{formError}</Alert> : null}
        <TextField
          label="System name"
          hint="As on the rack or unit, e.g. Rack A (medium temperature)"
          value={name}
          onChange={(e) => setName(e.target.value)}
          error={errors.name}
        />
        <RefrigerantPicker
          refrigerants={refrigerants.data ?? []}
          value={refrigerantId}
          onChange={setRefrigerantId}
          error={errors.refrigerantId}
        />
        <div className="flex flex-wrap items-start gap-3">
          <TextField
            label="Full charge"
            inputMode="decimal"
            value={charge}
            onChange={(e) => setCharge(e.target.value)}
            error={errors["fullCharge.value"] ?? errors.fullCharge}
            className="w-48"
          />
          <Select
            label="Charge unit"
            value={unit}
            onChange={(e) => setUnit(e.target.value as MassPreference)}
            options={[
              { value: "kg", label: "kg" },
              { value: "lb", label: "lb" },
            ]}
            error={errors["fullCharge.unit"]}
            className="w-28"
          />
        </div>
        <Select
          label="Appliance type"
          value={applianceType}
          onChange={(e) => setApplianceType(e.target.value as ApplianceType)}
          options={APPLIANCE_TYPES.map((t) => ({ value: t, label: APPLIANCE_TYPE_NAMES[t] }))}
          error={errors.applianceType}
        />
        <Checkbox label="Has automatic leak detection" checked={ald} onChange={(e) => setAld(e.target.checked)} />
        <div className="flex flex-wrap gap-2">
          <Button type="submit" busy={mutation.isPending}>
            {system ? "Save system" : "Add system"}
          </Button>
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        </div>
      </form>
      <RefrigerantCautions refrigerantName={picked?.id ?? null} cautions={picked?.cautions ?? []} />
    </div>
  );
}
