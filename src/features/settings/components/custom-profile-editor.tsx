import { useState, type FormEvent, type ReactNode } from "react";
import { RULE_PROFILE_FIELDS as F, type RuleProfileInput } from "#core/contracts/rule-profile";
import { APPLIANCE_TYPES } from "#core/contracts/systems";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { TextField } from "../../../components/ui/text-field";
import {
  fieldErrorSummary,
  formErrorMessage,
  serverFieldErrors,
  zodFieldErrors,
  type FieldErrors,
} from "../../../lib/form-errors";
import { ruleProfileSchema, useSaveCustomProfile } from "../api/custom-profile";
import {
  addTopBand,
  getAt,
  numberFromText,
  pathKey,
  removeTopBand,
  setAt,
  type DraftPath,
} from "../model/profile-draft";

type Draft = RuleProfileInput;
type Set = (path: DraftPath, value: unknown) => void;

/** Focus the first control whose name is a field with an error, in form order. */
function focusFirstError(form: HTMLFormElement, fields: FieldErrors) {
  const keys = Object.keys(fields);
  for (const el of Array.from(form.elements)) {
    const name = el.getAttribute("name");
    if (name && keys.some((k) => k === name || k.startsWith(`${name}.`)) && el instanceof HTMLElement)
      return el.focus();
  }
}

/** A number box that keeps what is typed ("1." stays "1.") and hands the draft a number when it is one. */
function NumberBox({
  label,
  name,
  value,
  onValue,
  error,
  hint,
  disabled,
  emptyIsNull = false,
}: {
  label: string;
  name: string;
  value: unknown;
  onValue: (v: unknown) => void;
  error?: string;
  hint?: string;
  disabled?: boolean;
  emptyIsNull?: boolean;
}) {
  const [text, setText] = useState(value === null || value === undefined ? "" : String(value));
  return (
    <TextField
      label={label}
      name={name}
      inputMode="decimal"
      value={text}
      error={error}
      hint={hint}
      disabled={disabled}
      onChange={(e) => {
        setText(e.target.value);
        onValue(emptyIsNull && e.target.value.trim() === "" ? null : numberFromText(e.target.value));
      }}
    />
  );
}

/** One rule value and its source, side by side. */
function SourcedNumber({
  label,
  path,
  draft,
  set,
  errors,
  hint,
  disabled,
}: {
  label: string;
  path: DraftPath;
  draft: Draft;
  set: Set;
  errors: FieldErrors;
  hint?: string;
  disabled: boolean;
}) {
  const v = [...path, "value"];
  const s = [...path, "source"];
  return (
    <div className="grid gap-2 sm:grid-cols-[12rem_1fr]">
      <NumberBox
        label={label}
        name={pathKey(v)}
        value={getAt(draft, v)}
        onValue={(x) => set(v, x)}
        error={errors[pathKey(v)]}
        hint={hint}
        disabled={disabled}
      />
      <SourceBox label={`Source for “${label}”`} path={s} draft={draft} set={set} errors={errors} disabled={disabled} />
    </div>
  );
}

function SourceBox({
  label,
  path,
  draft,
  set,
  errors,
  disabled,
}: {
  label: string;
  path: DraftPath;
  draft: Draft;
  set: Set;
  errors: FieldErrors;
  disabled: boolean;
}) {
  return (
    <TextField
      label={label}
      name={pathKey(path)}
      value={String(getAt(draft, path) ?? "")}
      error={errors[pathKey(path)]}
      disabled={disabled}
      onChange={(e) => set(path, e.target.value)}
    />
  );
}

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="space-y-4 rounded-md p-4 edge">
      <legend className="px-1 text-lg font-bold">{title}</legend>
      {children}
    </fieldset>
  );
}

/**
 * The editor of a company's custom rule profile: thresholds by appliance type, repair and
 * verification deadlines, inspection and leak-check intervals and CO2e bands, each with its source.
 * The shared schema checks the draft before it is sent; the server checks it again.
 */
export function CustomProfileEditor({ profile, editable }: { profile: Draft; editable: boolean }) {
  const [draft, setDraft] = useState<Draft>(profile);
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const [saved, setSaved] = useState(false);
  const save = useSaveCustomProfile();
  const errors = { ...serverFieldErrors(save.error), ...clientErrors };
  const formError = formErrorMessage(save.error);
  const disabled = !editable;
  const set: Set = (path, value) => {
    setSaved(false);
    setDraft((d) => setAt(d, path, value));
  };
  const common = { draft, set, errors, disabled };

  function submit(event: FormEvent) {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    const parsed = ruleProfileSchema.safeParse(draft);
    if (!parsed.success) {
      const fields = zodFieldErrors(parsed.error);
      setClientErrors(fields);
      focusFirstError(form, fields);
      return;
    }
    setClientErrors({});
    save.mutate(parsed.data, {
      onSuccess: () => setSaved(true),
      onError: (e) => focusFirstError(form, serverFieldErrors(e)),
    });
  }

  const bands = draft.leakChecks?.co2eBands.value ?? [];
  const bandPath = (i: number, k: string): DraftPath => ["leakChecks", "co2eBands", "value", i, k];
  const invalid = Object.keys(errors).length > 0 && !saved;

  return (
    <form noValidate onSubmit={submit} aria-label="Custom rule profile" className="space-y-6">
      {formError ? (
        <Alert tone="error">{formError}</Alert>
      ) : invalid && Object.keys(clientErrors).length ? (
        <Alert tone="error">{fieldErrorSummary(clientErrors)}</Alert>
      ) : null}
      {saved ? (
        <Alert tone="success">
          Custom profile saved. Every deadline and figure now follows it where the company uses it.
        </Alert>
      ) : null}
      <p className="max-w-prose text-sm text-muted">
        Every value needs its source: a citation, or who set the value and why (e.g. “company policy, 2026 audit”).
      </p>
      <TextField
        label="Profile name"
        name="name"
        value={draft.name}
        onChange={(e) => set(["name"], e.target.value)}
        error={errors.name}
        disabled={disabled}
      />

      <SourcedNumber {...F.recordRetentionYears} path={["recordRetentionYears"]} {...common} />

      {draft.leakRateParts.map((part, i) => {
        const p = (...rest: (string | number)[]): DraftPath => ["leakRateParts", i, ...rest];
        return (
          <Group key={part.id} title={part.title}>
            <h3 className="font-bold">Leak-rate thresholds (% per year) by appliance type</h3>
            {APPLIANCE_TYPES.map((a) => (
              <SourcedNumber key={a} {...F[`thresholds.${a}`]} path={p("thresholds", a)} {...common} />
            ))}
            <h3 className="font-bold">Deadlines</h3>
            <SourcedNumber {...F.repairDays} path={p("repairDays")} {...common} />
            <SourcedNumber {...F.initialVerificationDays} path={p("initialVerificationDays")} {...common} />
            <SourcedNumber {...F.followUpVerificationDays} path={p("followUpVerificationDays")} {...common} />
            {part.inspectionsAfterBreach ? (
              <>
                <h3 className="font-bold">Leak inspections after a breach</h3>
                <div className="grid gap-2 sm:grid-cols-2">
                  {(["largeEveryMonths", "otherEveryMonths"] as const).map((k) => (
                    <NumberBox
                      key={k}
                      label={F[`inspectionsAfterBreach.value.${k}`].label}
                      name={pathKey(p("inspectionsAfterBreach", "value", k))}
                      value={part.inspectionsAfterBreach!.value[k]}
                      onValue={(x) => set(p("inspectionsAfterBreach", "value", k), x)}
                      error={errors[pathKey(p("inspectionsAfterBreach", "value", k))]}
                      disabled={disabled}
                    />
                  ))}
                </div>
                <SourceBox
                  label={F["inspectionsAfterBreach.source"].label}
                  path={p("inspectionsAfterBreach", "source")}
                  {...common}
                />
              </>
            ) : null}
            <h3 className="font-bold">Chronic leaker</h3>
            <SourcedNumber
              {...F["chronicLeaker.percentOfFullCharge"]}
              path={p("chronicLeaker", "percentOfFullCharge")}
              {...common}
            />
            <div className="grid gap-2 sm:grid-cols-[9rem_9rem_1fr]">
              {(["month", "day"] as const).map((k) => (
                <NumberBox
                  key={k}
                  label={F[`chronicLeaker.reportBy.value.${k}`].label}
                  name={pathKey(p("chronicLeaker", "reportBy", "value", k))}
                  value={part.chronicLeaker.reportBy.value[k]}
                  onValue={(x) => set(p("chronicLeaker", "reportBy", "value", k), x)}
                  error={errors[pathKey(p("chronicLeaker", "reportBy", "value", k))]}
                  disabled={disabled}
                />
              ))}
              <SourceBox
                label={F["chronicLeaker.reportBy.source"].label}
                path={p("chronicLeaker", "reportBy", "source")}
                {...common}
              />
            </div>
          </Group>
        );
      })}

      {draft.leakChecks ? (
        <Group title="Leak checks by CO2-equivalent">
          <p className="text-sm text-muted">
            Bands in tonnes CO2e, lowest first; each band starts where the one below ends. Leave the top band’s upper
            edge empty.
          </p>
          {bands.map((b, i) => (
            // Keyed by the band count too: adding or removing a band rewrites the edges of the rows below.
            <div
              key={`${i}-${bands.length}`}
              className="grid gap-2 sm:grid-cols-4"
              role="group"
              aria-label={`Band ${i + 1}`}
            >
              <NumberBox
                label={`Band ${i + 1}: from (t)`}
                name={pathKey(bandPath(i, "from"))}
                value={b.from}
                onValue={(x) => set(bandPath(i, "from"), x)}
                error={errors[pathKey(bandPath(i, "from"))]}
                disabled={disabled}
              />
              <NumberBox
                label={`Band ${i + 1}: below (t)`}
                name={pathKey(bandPath(i, "to"))}
                value={b.to}
                emptyIsNull
                onValue={(x) => set(bandPath(i, "to"), x)}
                error={errors[pathKey(bandPath(i, "to"))]}
                disabled={disabled}
              />
              <NumberBox
                label={`Band ${i + 1}: months, no detection system`}
                name={pathKey(bandPath(i, "monthsWithoutLds"))}
                value={b.monthsWithoutLds}
                onValue={(x) => set(bandPath(i, "monthsWithoutLds"), x)}
                error={errors[pathKey(bandPath(i, "monthsWithoutLds"))]}
                disabled={disabled}
              />
              <NumberBox
                label={`Band ${i + 1}: months, with detection system`}
                name={pathKey(bandPath(i, "monthsWithLds"))}
                value={b.monthsWithLds}
                onValue={(x) => set(bandPath(i, "monthsWithLds"), x)}
                error={errors[pathKey(bandPath(i, "monthsWithLds"))]}
                disabled={disabled}
              />
            </div>
          ))}
          {errors["leakChecks.co2eBands.value"] ? (
            <p className="font-bold text-danger">Bands {errors["leakChecks.co2eBands.value"]}.</p>
          ) : null}
          {editable ? (
            <div className="flex flex-wrap gap-2">
              <Button variant="secondary" onClick={() => set(["leakChecks", "co2eBands", "value"], addTopBand(bands))}>
                Add a band on top
              </Button>
              <Button
                variant="secondary"
                disabled={bands.length < 2}
                onClick={() => set(["leakChecks", "co2eBands", "value"], removeTopBand(bands))}
              >
                Remove the top band
              </Button>
            </div>
          ) : null}
          <SourceBox
            label={F["leakChecks.co2eBands.source"].label}
            path={["leakChecks", "co2eBands", "source"]}
            {...common}
          />
          <SourcedNumber
            {...F["leakChecks.recheckAfterRepairMonths"]}
            path={["leakChecks", "recheckAfterRepairMonths"]}
            {...common}
          />
          {/* Profiles copied before the field existed read it as 12 months and have none to edit (decision 0123). */}
          {getAt(draft, ["leakChecks", "ldsCheckMonths"]) !== undefined ? (
            <SourcedNumber {...F["leakChecks.ldsCheckMonths"]} path={["leakChecks", "ldsCheckMonths"]} {...common} />
          ) : null}
        </Group>
      ) : null}

      {editable ? (
        <Button type="submit" busy={save.isPending}>
          Save custom profile
        </Button>
      ) : null}
    </form>
  );
}
