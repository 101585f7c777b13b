import type { ReportFinding, ReportSuspect } from "./sweep-report-model";

/**
 * The report e-mail's summary of what the sweep found, worst news first and in the field map's terms:
 * findings confirmed from the sweep (then repaired, verified, closed) before anything still suspected,
 * then the suspect spots no finding answers yet. A suspect spot answers to a finding placed inside its
 * search radius, the same test the field map uses to show "Finding recorded".
 */
const ORDER = ["confirmed", "repaired", "verified", "closed", "closed-left-service", "suspected", "dismissed"];
const HEADINGS: Record<string, string> = {
  confirmed: "Confirmed leak",
  repaired: "Repaired leak",
  verified: "Repaired and verified",
  closed: "Closed",
  // docs/decisions/0166
  "closed-left-service": "Closed: the system left service",
  suspected: "Suspected, not yet confirmed",
  dismissed: "Checked, no leak",
};

/** A finding's status as the report names it ("Confirmed leak"). */
export function findingHeading(status: string): string {
  return HEADINGS[status] ?? status;
}

/** Confirmed first, then repaired, verified, closed, still suspected, dismissed; in found order within each. */
export function findingsWorstFirst<F extends { status: string }>(findings: readonly F[]): F[] {
  const rank = (status: string) => {
    const i = ORDER.indexOf(status);
    return i === -1 ? ORDER.length : i;
  };
  return [...findings].sort((a, b) => rank(a.status) - rank(b.status));
}

/** The suspect spots whose search radius holds the finding (the spots it answers). */
export function spotsAnswered(f: ReportFinding, suspects: readonly ReportSuspect[]): number[] {
  return suspects.filter((s) => answers(s, f)).map((s) => s.rank);
}

function answers(s: ReportSuspect, f: ReportFinding): boolean {
  return f.x != null && f.y != null && Math.hypot(f.x - s.x, f.y - s.y) <= s.radiusM;
}

export function reportMailFindings(
  findings: ReportFinding[],
  suspects: ReportSuspect[],
  /** Said when there is nothing to name (the report model's wording for "no spot listed"). */
  nothing = "No credible leak was found on this sweep.",
): string[] {
  const lines = findingsWorstFirst(findings).map((f) => {
    const spots = spotsAnswered(f, suspects);
    const spot = spots.length ? ` (suspect spot ${spots.join(", ")})` : "";
    // A note that ends its own sentence does not get a second full stop.
    const note = f.note.replace(/[.\s]+$/, "");
    return `${findingHeading(f.status)}: ${f.where}${spot}, found ${f.found}${note ? ` — ${note}` : ""}.`;
  });
  // A spot with any finding inside its radius has been looked at (even one dismissed): not "still to check".
  const open = suspects.filter((s) => !findings.some((f) => answers(s, f)));
  const answered = suspects.length - open.length;
  if (open.length)
    lines.push(
      [
        answered || findings.length ? "Suspect spots still to check:" : "Suspect spots to check:",
        ...open.map((s) => `${s.rank}. ${s.fixture} at ${s.position} — ${s.reason}`),
      ].join("\n"),
    );
  if (lines.length === 0) lines.push(nothing);
  return lines;
}
