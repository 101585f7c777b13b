import type { z } from "zod";
import { isApiRequestError } from "./api-client";

/** Dotted field path → message; the same shape the server sends in `error.fields`. */
export type FieldErrors = Record<string, string>;

export function zodFieldErrors(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join(".") || "_form";
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}

/** Field errors from a failed request (the server's zod messages), or none. */
export function serverFieldErrors(error: unknown): FieldErrors {
  return isApiRequestError(error) ? error.fields : {};
}

/**
 * The message to show above a form for a failed request. Refused fields are named with the reason,
 * so a field that is off screen, folded away or not on the form at all is never a silent "marked".
 */
export function formErrorMessage(error: unknown): string | null {
  if (!error) return null;
  if (isApiRequestError(error)) {
    if (error.code === "validation_failed" && Object.keys(error.fields).length > 0)
      return fieldErrorSummary(error.fields);
    return error.message;
  }
  return "Something went wrong. Please try again.";
}

/** "Please correct: E-mail must be at most 254 characters. Time zone is not a time zone." */
export function fieldErrorSummary(fields: FieldErrors): string {
  const lines = Object.entries(fields).map(([key, message]) => fieldMessage(fieldLabel(key), message));
  return `Please correct: ${lines.join(" ")}`;
}

/**
 * A field's name as the person reads it: the label of the form control carrying that name when one is
 * on the page, else the key in words ("levels.2.fromPpm" → "Levels 3 from ppm").
 */
export function fieldLabel(key: string): string {
  const [name] = key.split(".");
  const control = typeof document === "undefined" ? null : document.getElementsByName(name)[0];
  const label = control && "labels" in control ? (control as HTMLInputElement).labels?.[0]?.textContent : null;
  if (label?.trim()) return label.trim();
  return key
    .split(".")
    .map((part) => (/^\d+$/.test(part) ? String(Number(part) + 1) : part))
    .join(" ")
    .replace(/([a-z])([A-Z])/g, "$1 $2")
    .toLowerCase()
    .replace(/^./, (c) => c.toUpperCase());
}

// Schema messages are fragments ("is required", "must be at least 10 characters") so that the
// server and the form can both put the field's name in front of them.
const FRAGMENT = /^(is|are|must|should|cannot|can't|has|was|does)\b/;

export function fieldMessage(label: string, message: string): string {
  const text = FRAGMENT.test(message) ? `${label} ${message}` : message;
  const sentence = text.charAt(0).toUpperCase() + text.slice(1);
  return /[.!?]$/.test(sentence) ? sentence : `${sentence}.`;
}

/**
 * Moves focus to the first control (in form order) that has an error, so keyboard and
 * screen-reader users land where the fix is needed. Controls are found by their name.
 */
export function focusFirstInvalid(form: HTMLFormElement | null, fields: FieldErrors): void {
  if (!form) return;
  const names = new Set(Object.keys(fields).map((key) => key.split(".")[0]));
  for (const element of Array.from(form.elements)) {
    const name = element.getAttribute("name");
    if (name && names.has(name) && element instanceof HTMLElement) {
      element.focus();
      return;
    }
  }
}

/**
 * Checks a form's values with the shared schema: on failure shows the field errors and moves focus
 * to the first one (returns null); on success clears them and returns the parsed values.
 */
export function checkForm<S extends z.ZodType>(
  schema: S,
  values: unknown,
  form: HTMLFormElement,
  setErrors: (fields: FieldErrors) => void,
): z.infer<S> | null {
  const parsed = schema.safeParse(values);
  if (!parsed.success) {
    const fields = zodFieldErrors(parsed.error);
    setErrors(fields);
    focusFirstInvalid(form, fields);
    return null;
  }
  setErrors({});
  return parsed.data;
}
