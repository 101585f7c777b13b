import { TextField } from "../../../components/ui/text-field";

export interface NewPasswordFieldsProps {
  password: string;
  confirm: string;
  onPassword: (value: string) => void;
  onConfirm: (value: string) => void;
  errors: Record<string, string>;
}

/** A new password typed twice: a typo here would lock the person out. */
export function NewPasswordFields({ password, confirm, onPassword, onConfirm, errors }: NewPasswordFieldsProps) {
  return (
    <>
      <TextField
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters."
        value={password}
        onChange={(e) => onPassword(e.target.value)}
        error={errors.password}
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
