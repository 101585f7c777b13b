import { describe, expect, it } from "vitest";
import { PAPER_POINTS, paperFor, reportPaper } from "./paper";

describe("report paper", () => {
  it("is A4 under EU F-gas and US Letter under US federal rules; a custom profile follows its base", () => {
    expect(paperFor({ kind: "eu-fgas" })).toBe("a4");
    expect(paperFor({ kind: "us-federal" })).toBe("letter");
    expect(paperFor({ kind: "custom", basedOn: "eu-fgas" })).toBe("a4");
    expect(paperFor({ kind: "custom", basedOn: "us-federal" })).toBe("letter");
  });

  it("lets the company's setting override the profile, and follows the profile by default", () => {
    expect(reportPaper("profile", { kind: "eu-fgas" })).toBe("a4");
    expect(reportPaper("letter", { kind: "eu-fgas" })).toBe("letter");
    expect(reportPaper("a4", { kind: "us-federal" })).toBe("a4");
    expect(reportPaper("profile", { kind: "custom", basedOn: "us-federal" })).toBe("letter");
  });

  it("knows the sheet sizes in points", () => {
    // ISO 216: A4 is 210 mm × 297 mm; 1 in = 25.4 mm exactly, 72 pt to the inch
    expect(PAPER_POINTS.a4.width).toBeCloseTo((210 / 25.4) * 72, 1);
    expect(PAPER_POINTS.a4.height).toBeCloseTo((297 / 25.4) * 72, 1);
    // US Letter: 8.5 in × 11 in (ANSI/ASME Y14.1 size A)
    expect(PAPER_POINTS.letter).toEqual({ width: 8.5 * 72, height: 11 * 72 });
  });
});
