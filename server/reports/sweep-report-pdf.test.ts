// The sweep report's layout, read back as a viewer reads it (pdfjs-dist): page size by the rule
// profile's paper, no page that holds only its footer, and no text drawn over other text, even
// with long notes and names. The pages are also rendered to test-results/pdf/ for a person to see.
import { describe, expect, it } from "vitest";
import { Jimp, JimpMime } from "jimp";
import type { SweepReportModel } from "#core/domain/reports/sweep-report-model";
import { overlappingText, pdfLayout } from "../../tests/helpers/pdf-text";
import { renderPdfPages } from "../../tests/helpers/pdf-pages";
import { buildSweepReportPdf } from "./sweep-report-pdf";

async function mapPng(): Promise<Buffer> {
  const img = new Jimp({ width: 400, height: 240, color: 0xe8eef0ff });
  return img.getBuffer(JimpMime.png);
}

function model(png: Buffer, readings: number, paper: SweepReportModel["paper"]): SweepReportModel {
  return {
    title: "Sweep report — Hollin Road Market",
    company: "Larchmont Refrigeration Services",
    paper,
    store: { name: "Hollin Road Market", address: "22 Hollin Road, Fairbrook", timeZone: "America/Chicago" },
    sweep: {
      started: "4 Nov 2026, 07:12",
      submitted: "4 Nov 2026, 08:03",
      status: "Submitted",
      technician: "Priya Natarajan",
      conditions: "Fans running, no defrost",
    },
    detector: {
      name: "Heated-diode sniffer no. 2",
      principle: "heated diode",
      calibration: "bump-checked 1 Nov 2026",
      settings: "transport delay 5 s, response 1.5 s, alarm 2 ppm",
    },
    background: "about 0.4 ppm",
    delayCheck:
      "Readings fit a 6.5 s delay better than the detector's 5 s. Passes over the same spots agree better with 6.5 s, so the spots are placed with it.",
    noSpot: "No credible leak: nothing stands out from the background on this sweep.",
    assumptions: [
      "Strength per year assumes the store air is well mixed over 9 ft 10 in height with 2 air changes per hour; treat it as an order of magnitude.",
    ],
    suspects: Array.from({ length: 4 }, (_, i) => ({
      rank: i + 1,
      position: `${12 + i} ft 3 in, 40 ft ${i} in`,
      radius: "3 ft 3 in",
      score: (0.9 - i * 0.2).toFixed(2),
      strength: "about 2.4 lb/yr",
      fixture: `Frozen food reach-in ${i + 3} with a rather long descriptive name from the layout`,
      riskPoint: "line-set drop at the end of the frozen food line",
      reason:
        "The readings at this case front stand well above the background and fall off on both sides along the walk, as gas from one source would.",
      nextCheck: "Stop the case fans, wait five minutes and probe the coil and the brazed joints at the line-set drop.",
      x: 4 + i * 3,
      y: 6,
      radiusM: 1,
    })),
    diagnostics: ["The fans spread the gas along the line: stop the fans or defrost and re-check."],
    findings: [
      { status: "confirmed", found: "4 Nov 2026", where: "Frozen food reach-in 4, coil", note: "bubbles at a U-bend" },
    ],
    readings: Array.from({ length: readings }, (_, i) => ({
      n: i + 1,
      time: `07:${String(12 + Math.floor(i / 6)).padStart(2, "0")}:${String((i * 10) % 60).padStart(2, "0")}`,
      // the longest positions a store gives in feet and inches
      raw: `${100 + (i % 90)} ft ${i % 12} in, 140 ft 11 in`,
      corrected: `${96 + (i % 90)} ft ${(i + 5) % 12} in, 140 ft 11 in`,
      ppm: i % 17 === 0 ? "≥ 100" : String((i * 7) % 31),
      point: i % 5 === 0 ? "supply air" : "case front / grille",
      note:
        i % 9 === 0 ? "door gasket on the left side looks torn near the hinge; re-check after the defrost cycle" : "",
    })),
    cautions: [
      {
        text: "Walk-in coolers and freezers: a large leak fills the room from the floor up. Keep the door open.",
        source: "",
      },
    ],
    map: { png, widthM: 20, heightM: 12, legend: "ppm above background; hatched: not sampled" },
    generated: "generated 4 Nov 2026, 09:00",
  };
}

const FOOTER = /page \d+ of \d+/;

describe("sweep report PDF layout", () => {
  it("prints US Letter or A4 as the profile's paper, with no footer-only page and no text over text", async () => {
    const png = await mapPng();
    for (const paper of ["letter", "a4"] as const) {
      const bytes = await buildSweepReportPdf(model(png, 140, paper));
      const pages = await pdfLayout(bytes);
      renderPdfPages(bytes, `sweep-report-${paper}`);
      // ISO 216 A4 is 595.28 × 841.89 pt; US Letter 8.5 × 11 in = 612 × 792 pt
      const [w, h] = paper === "a4" ? [595.28, 841.89] : [612, 792];
      for (const p of pages) {
        expect(p.width).toBeCloseTo(w, 0);
        expect(p.height).toBeCloseTo(h, 0);
        const body = p.boxes.filter((b) => !FOOTER.test(b.str));
        expect(body.length, `page with only a footer (${paper})`).toBeGreaterThan(0);
        expect(overlappingText(p).map(([a, b]) => `${a.str} / ${b.str}`)).toEqual([]);
      }
      // every reading is listed once, long notes included (wrapped, not cut)
      const text = pages.map((p) => p.text).join("\n");
      expect(text).toContain("Readings (140)");
      expect(text.replace(/\s+/g, " ")).toContain("door gasket on the left side looks torn near the hinge");
      // two pages of facts, map and suspects, then about 45 rows a page (a tenth of them three lines)
      expect(pages.length).toBeLessThanOrEqual(6);
    }
  });

  it("lists the findings before the suspect spots, confirmed first, each with the spot it answers", async () => {
    const m = model(await mapPng(), 5, "letter");
    // Recorded in this order: a suspicion at spot 1, a dismissed check, then the leak confirmed at spot 2.
    m.findings = [
      { status: "suspected", found: "4 Nov 2026, 07:40", where: "Frozen food reach-in 3", note: "", x: 4, y: 6 },
      { status: "dismissed", found: "4 Nov 2026, 07:45", where: "Dairy wall", note: "nothing at the coil" },
      { status: "confirmed", found: "4 Nov 2026, 07:58", where: "Frozen food reach-in 4, coil", note: "", x: 7, y: 6 },
    ];
    const text = (await pdfLayout(await buildSweepReportPdf(m))).map((p) => p.text).join("\n");
    const flat = text.replace(/\s+/g, " ");
    const at = (s: string) => {
      const i = flat.indexOf(s);
      expect(i, s).toBeGreaterThanOrEqual(0);
      return i;
    };
    const confirmed = at("Confirmed leak — Frozen food reach-in 4, coil (suspect spot 2)");
    const suspected = at("Suspected, not yet confirmed — Frozen food reach-in 3 (suspect spot 1)");
    const dismissed = at("Checked, no leak — Dairy wall");
    const spots = at("Suspect spots");
    expect(at("Findings")).toBeLessThan(confirmed);
    expect([confirmed, suspected, dismissed, spots]).toEqual(
      [...[confirmed, suspected, dismissed, spots]].sort((a, b) => a - b),
    );
  });
});
