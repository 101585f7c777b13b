import { useState, type FormEvent } from "react";
import type { SessionInfo } from "#core/contracts/auth";
import type { CompanySettings } from "#core/contracts/company";
import type { LengthUnit, MassUnit } from "#core/contracts/units";
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
import { profileUpdateInput, useUpdateProfile } from "../api/update-profile";
import { LENGTH_LABELS, MASS_LABELS } from "./unit-labels";

type User = NonNullable<SessionInfo["user"]>;
const COMPANY_DEFAULT = "company-default";

export interface ProfileFormProps {
  user: User;
  /** The company's defaults, to name what "company default" means now (absent while loading). */
  companyDefaults?: Pick<CompanySettings, "lengthUnit" | "massUnit">;
  onSaved: (info: SessionInfo) => void;
}

function defaultLabel(unit: string | undefined) {
  return unit ? `Company default (${unit})` : "Company default";
}

export function ProfileForm({ user, companyDefaults, onSaved }: ProfileFormProps) {
  const [name, setName] = useState(user.name);
  const [lengthUnit, setLengthUnit] = useState<string>(user.lengthUnit ?? COMPANY_DEFAULT);
  const [massUnit, setMassUnit] = useState<string>(user.massUnit ?? COMPANY_DEFAULT);
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const [saved, setSaved] = useState(false);
  const update = useUpdateProfile({ onSaved });
  const errors = { ...serverFieldErrors(update.error), ...clientErrors };
  const formError = formErrorMessage(update.error);

  function submit(event: FormEvent) {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    setSaved(false);
    const parsed = checkForm(
      profileUpdateInput,
      {
        name,
        lengthUnit: lengthUnit === COMPANY_DEFAULT ? null : (lengthUnit as LengthUnit),
        massUnit: massUnit === COMPANY_DEFAULT ? null : (massUnit as MassUnit),
      },
      form,
      setClientErrors,
    );
    if (!parsed) return;
    update.mutate(parsed, {
      onSuccess: () => setSaved(true),
      onError: (e) => focusFirstInvalid(form, serverFieldErrors(e)),
    });
  }

  const lengthOptions = [
    {
      value: COMPANY_DEFAULT,
      label: defaultLabel(companyDefaults && LENGTH_LABELS[companyDefaults.lengthUnit].toLowerCase()),
    },
    { value: "m", label: LENGTH_LABELS.m },
    { value: "ft-in", label: LENGTH_LABELS["ft-in"] },
  ];
  const massOptions = [
    { value: COMPANY_DEFAULT, label: defaultLabel(companyDefaults?.massUnit) },
    { value: "kg", label: MASS_LABELS.kg },
    { value: "lb", label: MASS_LABELS.lb },
  ];

  return (
    <form noValidate onSubmit={submit} aria-label="Profile" className="max-w-xl space-y-4">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      {saved ? <Alert tone="success">Profile saved.</Alert> : null}
      <TextField
        label="Name"
        name="name"
        autoComplete="name"
        value={name}
        onChange={(e) => setName(e.target.value)}
        error={errors.name}
      />
      <p>
        <span className="font-bold">E-mail:</span> <span className="break-all">{user.email}</span>
      </p>
      <Select
        label="Length unit"
        name="lengthUnit"
        options={lengthOptions}
        value={lengthUnit}
        onChange={(e) => setLengthUnit(e.target.value)}
        error={errors.lengthUnit}
      />
      <Select
        label="Mass unit"
        name="massUnit"
        options={massOptions}
        value={massUnit}
        onChange={(e) => setMassUnit(e.target.value)}
        error={errors.massUnit}
      />
      <Button type="submit" busy={update.isPending}>
        Save profile
      </Button>
    </form>
  );
}
