import { NUMBER_FORMAT_NAMES, NUMBER_FORMATS } from "#core/domain/numbers/number-format";
import { useState, type FormEvent } from "react";
import { Link } from "react-router";
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
import { signUpInput, useSignUp } from "../api/sign-up";

const RULES = [
  { value: "us-federal", label: "US federal (EPA 40 CFR Parts 82 and 84)" },
  { value: "eu-fgas", label: "EU F-gas (Regulation (EU) 2024/573)" },
];

/** A new customer opens its company: the company, its first owner and the first settings. */
export function SignUpForm() {
  const [values, setValues] = useState({
    companyName: "",
    name: "",
    email: "",
    password: "",
    passwordAgain: "",
    ruleProfile: "us-federal",
    lengthUnit: "ft-in",
    massUnit: "lb",
    numberFormat: "1,234.5",
  });
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const [sentTo, setSentTo] = useState<string | null>(null);
  const signUp = useSignUp();
  const errors = { ...serverFieldErrors(signUp.error), ...clientErrors };
  const set = (k: keyof typeof values) => (e: { target: { value: string } }) =>
    setValues((v) => ({ ...v, [k]: e.target.value }));
  // Units follow the rules chosen unless the person picks others.
  const setRules = (e: { target: { value: string } }) =>
    setValues((v) => ({
      ...v,
      ruleProfile: e.target.value,
      lengthUnit: e.target.value === "eu-fgas" ? "m" : "ft-in",
      massUnit: e.target.value === "eu-fgas" ? "kg" : "lb",
    }));

  function submit(event: FormEvent) {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    const { passwordAgain, ...input } = values;
    const parsed = checkForm(signUpInput, input, form, setClientErrors);
    if (!parsed) return;
    if (passwordAgain !== values.password) {
      setClientErrors({ passwordAgain: "does not match the first one" });
      return;
    }
    signUp.mutate(parsed, {
      onSuccess: () => setSentTo(parsed.email),
      onError: (e) => focusFirstInvalid(form, serverFieldErrors(e)),
    });
  }

  if (sentTo)
    return (
      <Alert tone="success" title="Check your e-mail">
        <p>We sent a link to {sentTo}. Open it within 24 hours to open your company; nothing is created before that.</p>
      </Alert>
    );
  const formError = formErrorMessage(signUp.error);
  return (
    <form noValidate onSubmit={submit} className="space-y-4" aria-label="Create your company's account">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <TextField
        label="Company name"
        name="companyName"
        hint="Your service company, or your chain's refrigeration team."
        value={values.companyName}
        onChange={set("companyName")}
        error={errors.companyName}
      />
      <TextField
        label="Your name"
        name="name"
        autoComplete="name"
        value={values.name}
        onChange={set("name")}
        error={errors.name}
      />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="username"
        inputMode="email"
        value={values.email}
        onChange={set("email")}
        error={errors.email}
      />
      <TextField
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters."
        value={values.password}
        onChange={set("password")}
        error={errors.password}
      />
      <TextField
        label="New password again"
        name="passwordAgain"
        type="password"
        autoComplete="new-password"
        value={values.passwordAgain}
        onChange={set("passwordAgain")}
        error={errors.passwordAgain}
      />
      <Select
        label="Rules you work under"
        name="ruleProfile"
        hint="Leak rates, deadlines and inspection intervals follow them; you can change this later in Company settings."
        options={RULES}
        value={values.ruleProfile}
        onChange={setRules}
        error={errors.ruleProfile}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <Select
          label="Lengths in"
          name="lengthUnit"
          options={[
            { value: "ft-in", label: "feet and inches" },
            { value: "m", label: "metres" },
          ]}
          value={values.lengthUnit}
          onChange={set("lengthUnit")}
          error={errors.lengthUnit}
        />
        <Select
          label="Refrigerant mass in"
          name="massUnit"
          options={[
            { value: "lb", label: "pounds (lb)" },
            { value: "kg", label: "kilograms (kg)" },
          ]}
          value={values.massUnit}
          onChange={set("massUnit")}
          error={errors.massUnit}
        />
        <Select
          label="Numbers written as"
          name="numberFormat"
          options={NUMBER_FORMATS.map((f) => ({ value: f, label: NUMBER_FORMAT_NAMES[f] }))}
          value={values.numberFormat}
          onChange={set("numberFormat")}
          error={errors.numberFormat}
        />
      </div>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <Button type="submit" busy={signUp.isPending}>
          {signUp.isPending ? "Sending…" : "Create account"}
        </Button>
        <Link to="/sign-in" className="inline-flex min-h-11 items-center">
          I have an account
        </Link>
      </div>
    </form>
  );
}
