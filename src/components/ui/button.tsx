import type { ButtonHTMLAttributes } from "react";

type Variant = "primary" | "secondary" | "danger" | "quiet";

const VARIANTS: Record<Variant, string> = {
  primary: "bg-accent text-on-accent hover:bg-accent-strong edge border-accent",
  secondary: "bg-surface text-ink hover:bg-accent-soft edge",
  danger: "bg-danger text-on-accent hover:opacity-90 edge border-danger",
  quiet: "bg-transparent text-accent underline underline-offset-2 hover:bg-accent-soft",
};

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  busy?: boolean;
}

/** A button at least 44 px tall: a gloved thumb's target (WCAG 2.5.5 target size). */
export function Button({
  variant = "primary",
  busy = false,
  className = "",
  disabled,
  children,
  type = "button",
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={`inline-flex min-h-11 min-w-11 items-center justify-center gap-2 rounded-md px-4 py-2 font-bold disabled:cursor-not-allowed disabled:opacity-60 ${VARIANTS[variant]} ${className}`}
      {...rest}
    >
      {children}
    </button>
  );
}
