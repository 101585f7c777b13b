import { useState, type FormEvent } from "react";
import {
  companyRefrigerantInput,
  GWP_BASIS_VALUES,
  SAFETY_CLASS_VALUES,
  SUBSTANCE_CLASS_VALUES,
} from "#core/contracts/company-refrigerants";
import { formatQuantity, type NumberFormat } from "#core/domain/numbers/number-format";
import { CLASS_WORDS, COMPOSITION_TOLERANCE_PERCENT } from "#core/domain/refrigerants/company-refrigerant";
import { PURE_REFRIGERANTS } from "#core/domain/refrigerants/pure-substances";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from "../../../lib/form-errors";
import { useCreateCompanyRefrigerant } from "../api/company-refrigerants";
import {
  EMPTY_DRAFT,
  readCompanyRefrigerant,
  type CompanyRefrigerantDraft,
  type KnownBy,
} from "../model/company-refrigerant-draft";

const SAFETY_HINT = "ASHRAE 34 safety group: A lower / B higher toxicity; 1 no flame spread, 2L, 2, 3 flammable";
const KNOWN_BY: { value: KnownBy; label: string }[] = [
  { value: "composition", label: "By its composition (GWP worked out on the company's basis)" },
  { value: "gwp", label: "By a published GWP" },
];

/**
 * Enters a refrigerant the catalogue lacks: its composition from catalogue components, or a stated
 * GWP with its basis and source plus the class facts the rules read (docs/decisions/0073). Every
 * field shows its own error, from this form or from the server; nothing typed is lost on a refusal.
 */
export function CompanyRefrigerantForm({
  numberFormat = "1,234.5",
  onDone,
  onCancel,
}: {
  numberFormat?: NumberFormat;
  onDone: (designation: string) => void;
  onCancel: () => void;
}) {
  const [draft, setDraft] = useState<CompanyRefrigerantDraft>(EMPTY_DRAFT);
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const create = useCreateCompanyRefrigerant();
  const errors: FieldErrors = { ...serverFieldErrors(create.error), ...clientErrors };
  const read = readCompanyRefrigerant(draft, numberFormat);
  const set = <K extends keyof CompanyRefrigerantDraft>(k: K, v: CompanyRefrigerantDraft[K]) =>
    setDraft((d) => ({ ...d, [k]: v }));
  const setComponent = (i: number, patch: Partial<CompanyRefrigerantDraft["components"][number]>) =>
    set(
      "components",
      draft.components.map((c, j) => (j === i ? { ...c, ...patch } : c)),
    );

  function submit(e: FormEvent) {
    e.preventDefault();
    create.reset();
    const parsed = companyRefrigerantInput.safeParse(read.input);
    const found: FieldErrors = { ...(parsed.success ? {} : zodFieldErrors(parsed.error)), ...read.problems };
    setClientErrors(found);
    if (!parsed.success || Object.keys(found).length > 0) return;
    create.mutate(parsed.data, { onSuccess: (saved) => onDone(saved.summary.designation) });
  }

  const formError = formErrorMessage(create.error);
  return (
    <form onSubmit={submit} noValidate className="space-y-4 rounded-md bg-surface p-4 edge">
      <h3 className="text-lg font-bold">Enter a refrigerant not in the catalogue</h3>
      <p className="max-w-prose text-sm text-muted">
        Only this company sees it. Once entered it does not change, so past figures never move: a wrong entry is deleted
        while no system uses it, or retired.
      </p>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <TextField
        label="Name"
        name="name"
        hint="As on the cylinder or data sheet; not an R-number the catalogue already has"
        value={draft.name}
        onChange={(e) => set("name", e.target.value)}
        error={errors.name}
      />
      <Select
        label="Safety group"
        name="safetyClass"
        hint={SAFETY_HINT}
        value={draft.safetyClass}
        onChange={(e) => set("safetyClass", e.target.value)}
        options={SAFETY_CLASS_VALUES.map((c) => ({ value: c, label: c }))}
        error={errors.safetyClass}
        className="max-w-xs"
      />
      <fieldset className="space-y-2">
        <legend className="font-bold">How it is known</legend>
        {KNOWN_BY.map((k) => (
          <label key={k.value} className="flex min-h-11 items-center gap-2">
            <input
              type="radio"
              name="knownBy"
              value={k.value}
              checked={draft.knownBy === k.value}
              onChange={() => set("knownBy", k.value)}
            />
            {k.label}
          </label>
        ))}
      </fieldset>
      {draft.knownBy === "composition" ? (
        <CompositionFields
          draft={draft}
          errors={errors}
          total={read.total ?? 0}
          numberFormat={numberFormat}
          setComponent={setComponent}
          setComponents={(c) => set("components", c)}
        />
      ) : (
        <StatedGwpFields draft={draft} errors={errors} set={set} />
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={create.isPending}>
          Save refrigerant
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

function CompositionFields({
  draft,
  errors,
  total,
  numberFormat,
  setComponent,
  setComponents,
}: {
  draft: CompanyRefrigerantDraft;
  errors: FieldErrors;
  total: number;
  numberFormat: NumberFormat;
  setComponent: (i: number, patch: Partial<CompanyRefrigerantDraft["components"][number]>) => void;
  setComponents: (c: CompanyRefrigerantDraft["components"]) => void;
}) {
  const options = [
    { value: "", label: "Choose…" },
    ...PURE_REFRIGERANTS.map((r) => ({ value: r.id, label: `${r.id} (${r.name})` })),
  ];
  return (
    <fieldset className="space-y-3">
      <legend className="font-bold">Composition, mass %</legend>
      {errors.composition ? (
        <p className="text-sm font-bold text-danger" role="alert">
          Composition {errors.composition}
        </p>
      ) : null}
      {draft.components.map((c, i) => (
        <div key={i} className="flex flex-wrap items-start gap-3">
          <Select
            label={`Component ${i + 1}`}
            name={`composition.${i}.refrigerantId`}
            value={c.refrigerantId}
            onChange={(e) => setComponent(i, { refrigerantId: e.target.value })}
            options={options}
            error={errors[`composition.${i}.refrigerantId`]}
            className="min-w-48 flex-1"
          />
          <TextField
            label={`Component ${i + 1} mass %`}
            name={`composition.${i}.massPercent`}
            inputMode="decimal"
            value={c.percent}
            onChange={(e) => setComponent(i, { percent: e.target.value })}
            error={errors[`composition.${i}.massPercent`]}
            className="w-36"
          />
          {draft.components.length > 2 ? (
            <Button
              variant="quiet"
              className="mt-7"
              onClick={() => setComponents(draft.components.filter((_, j) => j !== i))}
              aria-label={`Remove component ${i + 1}`}
            >
              Remove
            </Button>
          ) : null}
        </div>
      ))}
      <div className="flex flex-wrap items-center gap-3">
        {draft.components.length < 8 ? (
          <Button
            variant="secondary"
            onClick={() => setComponents([...draft.components, { refrigerantId: "", percent: "" }])}
          >
            Add a component
          </Button>
        ) : null}
        <p className="text-sm text-muted" aria-live="polite">
          {`Total ${formatQuantity(total, numberFormat, 2)} % (must be 100 % within ±${formatQuantity(COMPOSITION_TOLERANCE_PERCENT, numberFormat, 2)} percentage points)`}
        </p>
      </div>
    </fieldset>
  );
}

function StatedGwpFields({
  draft,
  errors,
  set,
}: {
  draft: CompanyRefrigerantDraft;
  errors: FieldErrors;
  set: <K extends keyof CompanyRefrigerantDraft>(k: K, v: CompanyRefrigerantDraft[K]) => void;
}) {
  return (
    <fieldset className="space-y-3">
      <legend className="font-bold">Published GWP and class</legend>
      <div className="flex flex-wrap items-start gap-3">
        <TextField
          label="GWP (100-year)"
          name="statedGwp"
          inputMode="decimal"
          value={draft.gwp}
          onChange={(e) => set("gwp", e.target.value)}
          error={errors["statedGwp.value"] ?? errors.statedGwp}
          className="w-40"
        />
        <Select
          label="GWP basis"
          name="gwpBasis"
          hint="The figure counts only where the rule profile reads this basis"
          value={draft.gwpBasis}
          onChange={(e) => set("gwpBasis", e.target.value)}
          options={GWP_BASIS_VALUES.map((b) => ({ value: b, label: b }))}
          error={errors["statedGwp.basis"]}
          className="w-64"
        />
      </div>
      <TextField
        label="Where the GWP comes from"
        name="gwpSource"
        hint="E.g. the maker's safety data sheet, section 12"
        value={draft.gwpSource}
        onChange={(e) => set("gwpSource", e.target.value)}
        error={errors["statedGwp.source"]}
      />
      <Select
        label="What it contains"
        name="substanceClass"
        hint="Decides which leak-repair part (US) and which leak-check rule (EU) apply"
        value={draft.substanceClass}
        onChange={(e) => set("substanceClass", e.target.value)}
        options={[
          { value: "", label: "Choose…" },
          ...SUBSTANCE_CLASS_VALUES.map((c) => ({ value: c, label: CLASS_WORDS[c] })),
        ]}
        error={errors.substanceClass}
      />
      <TextField
        label="Molar mass, g/mol (if known)"
        name="molarMass"
        inputMode="decimal"
        hint="Leave empty when unknown: the locator then weighs leaks as R-404A and says so"
        value={draft.molarMass}
        onChange={(e) => set("molarMass", e.target.value)}
        error={errors.molarMass}
        className="max-w-xs"
      />
    </fieldset>
  );
}
