import type { SecurityEvent } from "#core/contracts/security-log";
import { ROLE_LABELS, type Role } from "#core/domain/roles";

const roleName = (v: unknown) => (typeof v === "string" && v in ROLE_LABELS ? ROLE_LABELS[v as Role] : String(v));

const EXPORT_NAMES: Record<string, string> = {
  "records.csv": "a system's records (CSV)",
  "leak-rate-statement.pdf": "a leak-rate statement (PDF)",
  "report.pdf": "a sweep report (PDF)",
  "readings.csv": "a sweep's readings (CSV)",
};

/** One line of the security log in words: who did what ("Ann Lee changed Bo Chan's role from …"). */
export function securityEventText(e: SecurityEvent): string {
  const who = e.who ?? "A former member";
  const by = e.by ?? who;
  switch (e.kind) {
    case "sign-in":
      return `${who} signed in.`;
    case "sign-in-failed":
      return `Someone tried to sign in as ${who} with a wrong password.`;
    case "password-changed":
      return `${who} changed their password.`;
    case "password-reset":
      return `${who} set a new password from a reset link.`;
    case "role-changed":
      return `${by} changed ${who}'s role from ${roleName(e.detail.from)} to ${roleName(e.detail.to)}.`;
    case "member-removed":
      return `${by} removed ${who} (${roleName(e.detail.role)}) from the company.`;
    case "export": {
      const what = typeof e.detail.what === "string" ? (EXPORT_NAMES[e.detail.what] ?? e.detail.what) : "records";
      return `${who} downloaded ${what}.`;
    }
  }
}
