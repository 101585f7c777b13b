import { useId, type InputHTMLAttributes } from "react";

export interface CheckboxProps extends Omit<InputHTMLAttributes<HTMLInputElement>, "id" | "type"> {
  label: string;
}

/** The whole row is the target, not only the small box. */
export function Checkbox({ label, className = "", ...rest }: CheckboxProps) {
  const id = useId();
  return (
    <div className={`flex min-h-11 items-center gap-3 ${className}`}>
      <input id={id} type="checkbox" className="size-6 accent-accent" {...rest} />
      <label htmlFor={id} className="cursor-pointer py-2">
        {label}
      </label>
    </div>
  );
}
