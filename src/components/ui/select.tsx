import { useId, type SelectHTMLAttributes } from "react";
import { FieldError } from "./field-error";

export interface SelectOption {
  value: string;
  label: string;
}

export interface SelectProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, "id"> {
  label: string;
  options: readonly SelectOption[];
  error?: string;
  hint?: string;
  /** Hide the label visually (still read by screen readers), for selects inside table rows. */
  hideLabel?: boolean;
}

export function Select({ label, options, error, hint, hideLabel = false, className = "", ...rest }: SelectProps) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className={hideLabel ? "sr-only" : "block font-bold"}>
        {label}
      </label>
      {hint ? (
        <p id={hintId} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
      <select
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`mt-1 block min-h-11 w-full rounded-md bg-surface px-3 py-2 text-ink edge disabled:bg-paper disabled:text-muted ${error ? "border-danger" : ""}`}
        {...rest}
      >
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
      <FieldError id={errorId} label={label} message={error} />
    </div>
  );
}
