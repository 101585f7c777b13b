import { TextField } from "./ui/text-field";

export interface NewPasswordFieldsProps {
  password: string;
  confirm: string;
  onPassword: (value: string) => void;
  onConfirm: (value: string) => void;
  errors: Record<string, string>;
  /** The first field's form name, which is also the key of its error (forms' contracts differ). */
  name?: string;
}

/** A new password typed twice: a typo here would lock the person out. Shared by reset, invitation and profile. */
export function NewPasswordFields({
  password,
  confirm,
  onPassword,
  onConfirm,
  errors,
  name = "password",
}: NewPasswordFieldsProps) {
  return (
    <>
      <TextField
        label="New password"
        name={name}
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters."
        value={password}
        onChange={(e) => onPassword(e.target.value)}
        error={errors[name]}
      />
      <TextField
        label="New password again"
        name="confirm"
        type="password"
        autoComplete="new-password"
        value={confirm}
        onChange={(e) => onConfirm(e.target.value)}
        error={errors.confirm}
      />
    </>
  );
}
