import { useState, type FormEvent } from "react";
import {
  APPLIANCE_TYPE_NAMES,
  APPLIANCE_TYPES,
  revisionInput,
  type ApplianceType,
  type System,
  type SystemInput,
} from "#core/contracts/systems";
import type { NumberFormat } from "#core/domain/numbers/number-format";
import type { MassPreference } from "#core/domain/units/format-units";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Checkbox } from "../../../components/ui/checkbox";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from "../../../lib/form-errors";
import { useAddRevision } from "../api/add-revision";
import { createSystemInput, useCreateSystem } from "../api/create-system";
import { useRefrigerants } from "../api/get-refrigerants";
import { useUpdateSystem } from "../api/update-system";
import { changedFacts, draftOf, readCharge, type SystemDraft } from "../model/system-draft";
import { RefrigerantCautions } from "./refrigerant-cautions";
import { RefrigerantPicker } from "./refrigerant-picker";
import { RevisionFields, type RevisionDraft } from "./revision-fields";

const FACT_NAMES: Record<string, string> = {
  refrigerantId: "the refrigerant",
  fullCharge: "the full charge",
  applianceType: "the appliance type",
  automaticLeakDetection: "automatic leak detection",
  inServiceOn: "the in-service date",
};

const localToday = () => new Date().toLocaleDateString("sv-SE");

/**
 * Adds a system to a store, or edits one. The charge is typed in kg or lb in the company's number
 * format and echoed as read. An edit of a dated fact by someone who may revise (engineers, owners)
 * becomes a dated revision with its day and reason; the name alone is a plain edit.
 */
export function SystemForm({
  storeId,
  system,
  massUnit,
  numberFormat = "1,234.5",
  canRevise = false,
  rules = "us",
  onDone,
  onCancel,
}: {
  storeId: string;
  system?: System;
  massUnit: MassPreference;
  numberFormat?: NumberFormat;
  canRevise?: boolean;
  /** Whose rules the company works under: the EU profile asks whether the unit is hermetically sealed. */
  rules?: "us" | "eu";
  onDone: () => void;
  onCancel: () => void;
}) {
  const refrigerants = useRefrigerants();
  const [initial] = useState<SystemDraft>(() =>
    system
      ? draftOf(system, massUnit, numberFormat)
      : {
          name: "",
          refrigerantId: "",
          charge: "",
          unit: massUnit,
          applianceType: "commercial-refrigeration",
          automaticLeakDetection: false,
          hermeticallySealed: false,
          inServiceOn: "",
        },
  );
  const [draft, setDraft] = useState<SystemDraft>(initial);
  const [revision, setRevision] = useState<Omit<RevisionDraft, "kind"> & { kind: RevisionDraft["kind"] | null }>({
    effectiveFrom: localToday(),
    kind: null,
    reason: "",
  });
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const create = useCreateSystem();
  const update = useUpdateSystem();
  const revise = useAddRevision();
  const facts = system ? changedFacts(initial, draft, numberFormat) : {};
  const factKeys = Object.keys(facts);
  const asRevision = Boolean(system) && canRevise && factKeys.length > 0;
  const kind = revision.kind ?? (facts.refrigerantId ? "retrofit" : "change");
  const mutations = [create, update, revise];
  const errors = {
    ...Object.assign({}, ...mutations.map((m) => serverFieldErrors(m.error))),
    ...clientErrors,
  } as FieldErrors;
  const read = readCharge(draft, numberFormat);
  const picked = refrigerants.data?.find((r) => r.id === draft.refrigerantId) ?? null;
  const set = <K extends keyof SystemDraft>(k: K, v: SystemDraft[K]) => setDraft((d) => ({ ...d, [k]: v }));

  function submit(e: FormEvent) {
    e.preventDefault();
    const values: SystemInput = {
      name: draft.name,
      refrigerantId: draft.refrigerantId,
      fullCharge: read.charge,
      applianceType: draft.applianceType,
      automaticLeakDetection: draft.automaticLeakDetection,
      hermeticallySealed: draft.hermeticallySealed,
      ...(draft.inServiceOn ? { inServiceOn: draft.inServiceOn } : {}),
    };
    const parsed = createSystemInput.safeParse(values);
    const found: FieldErrors = parsed.success ? {} : zodFieldErrors(parsed.error);
    if (read.problem) found["fullCharge.value"] = read.problem;
    const rev = asRevision ? revisionInput.safeParse({ ...revision, kind, ...facts }) : null;
    if (rev && !rev.success) Object.assign(found, zodFieldErrors(rev.error));
    setClientErrors(found);
    if (Object.keys(found).length > 0 || !parsed.success) return;
    const done = { onSuccess: () => onDone() };
    if (!system) return create.mutate({ storeId, input: parsed.data }, done);
    // The name and the hermetic mark are plain properties, edited as such (decision 0122).
    const plain = {
      ...(draft.name !== system.name ? { name: parsed.data.name } : {}),
      ...(draft.hermeticallySealed !== system.hermeticallySealed
        ? { hermeticallySealed: draft.hermeticallySealed }
        : {}),
    };
    if (rev?.success) {
      const reviseNow = () => revise.mutate({ id: system.id, input: rev.data }, done);
      if (Object.keys(plain).length > 0) update.mutate({ id: system.id, input: plain }, { onSuccess: reviseNow });
      else reviseNow();
      return;
    }
    // Without the right to revise (or with only plain properties changed), a plain edit: the server
    // refuses a dated fact once records exist, naming the field.
    const input = { ...plain, ...facts };
    if (Object.keys(input).length === 0) return onDone();
    update.mutate({ id: system.id, input }, done);
  }

  const formError = mutations.map((m) => formErrorMessage(m.error)).find(Boolean) ?? null;
  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_minmax(0,22rem)]">
      <form onSubmit={submit} noValidate className="space-y-4 rounded-md bg-surface p-4 edge">
        <h3 className="text-lg font-bold">{system ? `Edit ${system.name}` : "New system"}</h3>
        {formError ? <Alert tone="error">{formError}</Alert> : null}
        <TextField
          label="System name"
          hint="As on the rack or unit, e.g. Rack A (medium temperature)"
          value={draft.name}
          onChange={(e) => set("name", e.target.value)}
          error={errors.name}
        />
        <RefrigerantPicker
          refrigerants={refrigerants.data ?? []}
          value={draft.refrigerantId}
          onChange={(v) => set("refrigerantId", v)}
          error={errors.refrigerantId}
        />
        <div className="flex flex-wrap items-start gap-3">
          <TextField
            label="Full charge"
            inputMode="decimal"
            hint={read.echo ? `Read as ${read.echo}` : `Written as ${numberFormat}`}
            value={draft.charge}
            onChange={(e) => set("charge", e.target.value)}
            error={errors["fullCharge.value"] ?? errors.fullCharge}
            className="w-56"
          />
          <Select
            label="Charge unit"
            value={draft.unit}
            onChange={(e) => set("unit", e.target.value as MassPreference)}
            options={
              massUnit === "lb"
                ? [
                    { value: "lb", label: "lb" },
                    { value: "kg", label: "kg" },
                  ]
                : [
                    { value: "kg", label: "kg" },
                    { value: "lb", label: "lb" },
                  ]
            }
            error={errors["fullCharge.unit"]}
            className="w-28"
          />
        </div>
        <Select
          label="Appliance type"
          value={draft.applianceType}
          onChange={(e) => set("applianceType", e.target.value as ApplianceType)}
          options={APPLIANCE_TYPES.map((t) => ({ value: t, label: APPLIANCE_TYPE_NAMES[t] }))}
          error={errors.applianceType}
        />
        <Checkbox
          label="Has automatic leak detection"
          checked={draft.automaticLeakDetection}
          onChange={(e) => set("automaticLeakDetection", e.target.checked)}
        />
        {rules === "eu" || draft.hermeticallySealed ? (
          <div>
            <Checkbox
              label="Hermetically sealed (factory-sealed, labelled as such)"
              aria-describedby="hermetic-hint"
              checked={draft.hermeticallySealed}
              onChange={(e) => set("hermeticallySealed", e.target.checked)}
            />
            <p id="hermetic-hint" className="text-sm text-muted">
              Only a unit whose refrigerant circuit was sealed at the factory (joined for good, e.g. welded or brazed)
              and that carries a label saying it is hermetically sealed. Below 10 t CO2e such a unit needs no periodic
              leak check.
            </p>
          </div>
        ) : null}
        <TextField
          label="In service since"
          type="date"
          hint={system ? undefined : "Leave empty for today"}
          value={draft.inServiceOn}
          onChange={(e) => set("inServiceOn", e.target.value)}
          error={errors.inServiceOn}
          className="w-56"
        />
        {asRevision ? (
          <RevisionFields
            value={{ ...revision, kind }}
            onChange={setRevision}
            changed={factKeys.map((k) => FACT_NAMES[k] ?? k)}
            errors={errors}
          />
        ) : null}
        <div className="flex flex-wrap gap-2">
          <Button type="submit" busy={mutations.some((m) => m.isPending)}>
            {system ? (asRevision ? "Save revision" : "Save system") : "Add system"}
          </Button>
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        </div>
      </form>
      <RefrigerantCautions refrigerantName={picked?.designation ?? null} cautions={picked?.cautions ?? []} />
    </div>
  );
}
