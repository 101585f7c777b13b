import type { z } from "zod";

/** zod issues → { "dotted.path": "message" }, first message per field, "" for the root. */
export function zodFields(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join(".");
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}

export function describeFields(fields: Record<string, string>): string {
  const parts = Object.entries(fields).map(([k, m]) => (k ? `${k} ${m}` : m));
  return parts.length
    ? `Please check: ${parts.slice(0, 3).join("; ")}${parts.length > 3 ? "; …" : ""}.`
    : "The request is not valid.";
}
