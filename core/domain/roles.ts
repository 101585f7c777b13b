// The five roles of docs/product.md and what each may do. Pure data shared by the
// server (authorization) and the client (navigation); the server is the one that enforces.
export const ROLES = ["owner", "lead-tech", "technician", "engineer", "store-contact"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  owner: "Owner",
  "lead-tech": "Lead tech",
  technician: "Technician",
  engineer: "Engineer",
  "store-contact": "Store contact",
};

export type Permission =
  | "members.read"
  | "members.manage"
  | "settings.manage"
  | "outbox.read"
  | "stores.read"
  | "stores.edit"
  | "plans.edit"
  | "detectors.read"
  | "detectors.manage"
  /** A sweep's evidence: its readings and their audit, the readings CSV, field maps and trends, report sends. */
  | "sweeps.read"
  | "sweeps.record"
  | "sweeps.review"
  /** Ask for a field map at another delay or time constant than the detector's (a new computation). */
  | "analyses.tune"
  | "findings.record"
  | "findings.close"
  | "compliance.manage"
  | "reports.send"
  | "digest.send"
  /** Download the company's whole record set in one archive (for an auditor, or on leaving the service). */
  | "records.export";

const GRANTS: Record<Role, readonly Permission[]> = {
  owner: [
    "members.read",
    "members.manage",
    "settings.manage",
    "outbox.read",
    "stores.read",
    "stores.edit",
    "plans.edit",
    "detectors.read",
    "detectors.manage",
    "sweeps.read",
    "sweeps.record",
    "sweeps.review",
    "analyses.tune",
    "findings.record",
    "findings.close",
    "compliance.manage",
    "reports.send",
    "digest.send",
    "records.export",
  ],
  "lead-tech": [
    "members.read",
    "stores.read",
    "stores.edit",
    "plans.edit",
    "detectors.read",
    "detectors.manage",
    "sweeps.read",
    "sweeps.record",
    "analyses.tune",
    "findings.record",
  ],
  technician: ["members.read", "stores.read", "detectors.read", "sweeps.read", "sweeps.record", "findings.record"],
  // Engineers read everything (docs/product.md), detectors included: their lag figures explain an analysis.
  engineer: [
    "members.read",
    "outbox.read",
    "stores.read",
    "detectors.read",
    "sweeps.read",
    "sweeps.review",
    "analyses.tune",
    "findings.record",
    "findings.close",
    "compliance.manage",
    "reports.send",
  ],
  // A store manager's view, only for the stores named on the membership (enforced per store): the store,
  // its plan, systems and their records, findings, due dates and the sweep reports. Not the evidence
  // behind a report (readings, their audit, field maps): decision 0072.
  "store-contact": ["stores.read"],
};

export function can(role: Role, permission: Permission): boolean {
  return GRANTS[role].includes(permission);
}

/** Store contacts see only the stores their membership names; every other role sees the company's stores. */
export function isStoreScoped(role: Role): boolean {
  return role === "store-contact";
}
