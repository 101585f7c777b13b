// What the report e-mail says first. The order (confirmed before suspected) and the radius test are the
// product's own rules (docs/product.md, field map and findings); no published source governs them.
import { describe, expect, it } from "vitest";
import { reportMailFindings } from "./report-mail-text";
import type { ReportFinding, ReportSuspect } from "./sweep-report-model";

const spot = (rank: number, x: number, fixture: string): ReportSuspect => ({
  rank,
  position: `${x} m, 6 m`,
  radius: "1 m",
  score: (1 - rank / 10).toFixed(2),
  strength: "0.9 of the strongest",
  fixture,
  riskPoint: "none near",
  reason: `readings rise toward ${fixture}`,
  nextCheck: "probe the coil",
  x,
  y: 6,
  radiusM: 1,
});

describe("report e-mail summary", () => {
  it("names the confirmed leak first even when it is not the top suspect spot", () => {
    const suspects = [spot(1, 4, "Dairy 2"), spot(2, 12, "Frozen reach-in 4"), spot(3, 20, "Produce 1")];
    const findings: ReportFinding[] = [
      { status: "suspected", found: "4 Nov 2026, 07:30 GMT-6", where: "Dairy 2", note: "", x: 4.2, y: 6 },
      {
        status: "confirmed",
        found: "4 Nov 2026, 07:41 GMT-6",
        where: "Frozen reach-in 4, coil",
        note: "bubbles at a U-bend",
        x: 12.3,
        y: 6.1,
      },
    ];
    const lines = reportMailFindings(findings, suspects);
    expect(lines[0]).toBe(
      "Confirmed leak: Frozen reach-in 4, coil (suspect spot 2), found 4 Nov 2026, 07:41 GMT-6 — bubbles at a U-bend.",
    );
    expect(lines[1]).toMatch(/^Suspected, not yet confirmed: Dairy 2 \(suspect spot 1\)/);
    // Only the spot no finding answers is left to check.
    expect(lines[2]).toBe("Suspect spots still to check:\n3. Produce 1 at 20 m, 6 m — readings rise toward Produce 1");
    expect(lines).toHaveLength(3);
  });

  it("lists the suspect spots in rank order when nothing was found yet, and says so when there is nothing", () => {
    const lines = reportMailFindings([], [spot(1, 4, "Dairy 2"), spot(2, 12, "Frozen reach-in 4")]);
    expect(lines).toEqual([
      "Suspect spots to check:\n1. Dairy 2 at 4 m, 6 m — readings rise toward Dairy 2\n2. Frozen reach-in 4 at 12 m, 6 m — readings rise toward Frozen reach-in 4",
    ]);
    expect(reportMailFindings([], [])).toEqual(["No credible leak was found on this sweep."]);
  });

  it("puts repaired before suspected, a finding off the plan answers no spot, and a dismissed one comes last", () => {
    const findings: ReportFinding[] = [
      { status: "dismissed", found: "1 Nov", where: "Produce 1", note: "", x: 20, y: 6 },
      { status: "suspected", found: "2 Nov", where: "on the plan", note: "", x: null, y: null },
      { status: "repaired", found: "3 Nov", where: "Dairy 2, flare", note: "", x: 4, y: 6.5 },
    ];
    const lines = reportMailFindings(findings, [spot(1, 4, "Dairy 2"), spot(2, 20, "Produce 1")]);
    expect(lines.map((l) => l.split(":")[0])).toEqual([
      "Repaired leak",
      "Suspected, not yet confirmed",
      "Checked, no leak",
    ]);
  });

  it("ends a finding's sentence once when its note already ends with a full stop", () => {
    const findings: ReportFinding[] = [
      { status: "confirmed", found: "3 Nov", where: "Dairy 2", note: "Traced to a brazed joint. ", x: 4, y: 6 },
    ];
    expect(reportMailFindings(findings, [])).toEqual([
      "Confirmed leak: Dairy 2, found 3 Nov — Traced to a brazed joint.",
    ]);
  });

  it("says a leak closed because its system left service so, after the other closed ones (docs/decisions/0166)", () => {
    const findings: ReportFinding[] = [
      { status: "closed-left-service", found: "4 Nov 2026, 07:30 GMT-6", where: "Dairy 2", note: "" },
      { status: "suspected", found: "4 Nov 2026, 07:35 GMT-6", where: "Produce 1", note: "" },
      { status: "closed", found: "4 Nov 2026, 07:41 GMT-6", where: "Frozen reach-in 4", note: "" },
    ];
    expect(reportMailFindings(findings, []).map((l) => l.split(":")[0])).toEqual([
      "Closed",
      "Closed",
      "Suspected, not yet confirmed",
    ]);
    expect(reportMailFindings(findings, [])[1]).toMatch(/^Closed: the system left service: Dairy 2, found/);
  });
});
