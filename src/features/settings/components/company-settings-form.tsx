import { useState, type FormEvent } from "react";
import type { CompanySettings } from "#core/contracts/company";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import {
  checkForm,
  focusFirstInvalid,
  formErrorMessage,
  serverFieldErrors,
  type FieldErrors,
} from "../../../lib/form-errors";
import { companySettings, useUpdateCompanySettings } from "../api/update-company-settings";
import {
  LEAK_RATE_METHOD_LABELS,
  LENGTH_LABELS,
  MASS_LABELS,
  NUMBER_FORMAT_LABELS,
  PAPER_LABELS,
  RULE_PROFILE_LABELS,
  optionsOf,
} from "./unit-labels";

export interface CompanySettingsFormProps {
  settings: CompanySettings;
  editable: boolean;
  onSaved?: (saved: CompanySettings) => void;
}

type Draft = Omit<CompanySettings, "detectorCheckIntervalDays" | "paperSize"> & {
  detectorCheckIntervalDays: string;
  paperSize: NonNullable<CompanySettings["paperSize"]>;
};

export function CompanySettingsForm({ settings, editable, onSaved }: CompanySettingsFormProps) {
  const [draft, setDraft] = useState<Draft>({
    ...settings,
    detectorCheckIntervalDays: String(settings.detectorCheckIntervalDays),
    paperSize: settings.paperSize ?? "profile",
  });
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const [saved, setSaved] = useState(false);
  const update = useUpdateCompanySettings({ onSaved });
  const errors = { ...serverFieldErrors(update.error), ...clientErrors };
  const formError = formErrorMessage(update.error);

  function set<K extends keyof Draft>(key: K, value: Draft[K]) {
    setSaved(false);
    setDraft((d) => ({ ...d, [key]: value }));
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    const days = draft.detectorCheckIntervalDays.trim();
    const parsed = checkForm(
      companySettings,
      { ...draft, detectorCheckIntervalDays: days === "" ? Number.NaN : Number(days) },
      form,
      setClientErrors,
    );
    if (!parsed) return;
    update.mutate(parsed, {
      onSuccess: () => setSaved(true),
      onError: (e) => focusFirstInvalid(form, serverFieldErrors(e)),
    });
  }

  return (
    <form noValidate onSubmit={submit} aria-label="Company settings" className="space-y-6">
      {!editable ? (
        <Alert tone="note">
          Only an owner can change these settings. They are shown here so you know what the company works under.
        </Alert>
      ) : null}
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      {saved ? <Alert tone="success">Settings saved.</Alert> : null}
      <fieldset disabled={!editable} className="space-y-6">
        <TextField
          label="Company name"
          name="name"
          value={draft.name}
          onChange={(e) => set("name", e.target.value)}
          error={errors.name}
        />
        <section className="grid gap-4 sm:grid-cols-2" aria-labelledby="units-heading">
          <h2 id="units-heading" className="text-xl font-bold sm:col-span-2">
            Default units
          </h2>
          <p className="text-muted sm:col-span-2">
            Everything is stored in metres and kilograms; these set how figures are shown. Each person may choose their
            own on their profile.
          </p>
          <Select
            label="Length"
            name="lengthUnit"
            options={optionsOf(LENGTH_LABELS)}
            value={draft.lengthUnit}
            onChange={(e) => set("lengthUnit", e.target.value as Draft["lengthUnit"])}
            error={errors.lengthUnit}
          />
          <Select
            label="Mass"
            name="massUnit"
            options={optionsOf(MASS_LABELS)}
            value={draft.massUnit}
            onChange={(e) => set("massUnit", e.target.value as Draft["massUnit"])}
            error={errors.massUnit}
          />
          <Select
            label="Number format"
            name="numberFormat"
            hint="How numbers are shown and typed: with a decimal comma, 1,200 is one point two."
            options={optionsOf(NUMBER_FORMAT_LABELS)}
            value={draft.numberFormat}
            onChange={(e) => set("numberFormat", e.target.value as Draft["numberFormat"])}
            error={errors.numberFormat}
          />
        </section>
        <section className="grid gap-4 sm:grid-cols-2" aria-labelledby="rules-heading">
          <h2 id="rules-heading" className="text-xl font-bold sm:col-span-2">
            Records and rules
          </h2>
          <p className="text-muted sm:col-span-2">
            The rule profile decides leak-rate thresholds, repair deadlines and inspection intervals. Local codes and
            certified practice still apply.
          </p>
          <Select
            label="Rule profile"
            name="ruleProfile"
            options={optionsOf(RULE_PROFILE_LABELS)}
            value={draft.ruleProfile}
            onChange={(e) => set("ruleProfile", e.target.value as Draft["ruleProfile"])}
            error={errors.ruleProfile}
          />
          <Select
            label="Leak-rate method"
            name="leakRateMethod"
            options={optionsOf(LEAK_RATE_METHOD_LABELS)}
            value={draft.leakRateMethod}
            onChange={(e) => set("leakRateMethod", e.target.value as Draft["leakRateMethod"])}
            error={errors.leakRateMethod}
          />
          <TextField
            label="Detector check interval (days)"
            name="detectorCheckIntervalDays"
            inputMode="numeric"
            hint="A sweep with a detector whose last calibration or bump check is older than this shows a warning."
            value={draft.detectorCheckIntervalDays}
            onChange={(e) => set("detectorCheckIntervalDays", e.target.value)}
            error={errors.detectorCheckIntervalDays}
          />
          <Select
            label="Paper size of PDFs"
            name="paperSize"
            hint="Sweep reports and leak-rate statements print on this paper."
            options={optionsOf(PAPER_LABELS)}
            value={draft.paperSize}
            onChange={(e) => set("paperSize", e.target.value as Draft["paperSize"])}
            error={errors.paperSize}
          />
        </section>
      </fieldset>
      {editable ? (
        <Button type="submit" busy={update.isPending}>
          Save settings
        </Button>
      ) : null}
    </form>
  );
}
