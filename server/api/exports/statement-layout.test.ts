// The leak-rate statement's layout, read back as a viewer reads it (pdfjs-dist): the company's paper
// (Letter under the US profile, A4 under EU F-gas, or the paper the company chose), no page that holds
// only its footer, no text drawn over other text with long reasons and notes, and the company's mass
// unit first. Pages are rendered to test-results/pdf/ for a person to look at.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, type Agent, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import { overlappingText, pdfLayout, type PdfPage } from "../../../tests/helpers/pdf-text";
import { renderPdfPages } from "../../../tests/helpers/pdf-pages";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { binaryBody } from "../../../tests/helpers/binary-body";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let tech: Agent;
let owner: Agent;
let systemId: string;

const ADDITIONS = 36;
const LONG_REASON =
  "Low suction pressure on the medium-temperature rack after the overnight defrost; topped up while the cases recovered and the receiver level was watched";

async function statement(): Promise<{ bytes: Buffer; pages: PdfPage[] }> {
  const res = await tech.agent.get(`/api/systems/${systemId}/leak-rate-statement.pdf`).buffer(true).parse(binaryBody);
  expect(res.status).toBe(200);
  const bytes = res.body as Buffer;
  return { bytes, pages: await pdfLayout(bytes) };
}

const settings = (over: Record<string, unknown>) => ({
  name: "Quillmoor Provisions",
  lengthUnit: "ft-in",
  massUnit: "lb",
  ruleProfile: "us-federal",
  leakRateMethod: "annualizing",
  detectorCheckIntervalDays: 30,
  ...over,
});

const FOOTER = /page \d+ of \d+/;
// ISO 216 A4 is 210 × 297 mm = 595.28 × 841.89 pt; US Letter is 8.5 × 11 in = 612 × 792 pt.
const SIZE = { a4: [595.28, 841.89], letter: [612, 792] } as const;

function expectClean(pages: PdfPage[], paper: keyof typeof SIZE, what: string) {
  for (const [i, p] of pages.entries()) {
    expect(p.width, `${what} page ${i + 1} width`).toBeCloseTo(SIZE[paper][0], 0);
    expect(p.height, `${what} page ${i + 1} height`).toBeCloseTo(SIZE[paper][1], 0);
    const body = p.boxes.filter((b) => !FOOTER.test(b.str));
    expect(body.length, `${what}: page ${i + 1} holds only its footer`).toBeGreaterThan(0);
    // The footer is one line: its page number is one run, at the same baseline as the rest of it.
    const footer = p.boxes.filter((b) => b.y < 40);
    expect(footer.map((b) => b.str).join(" "), `${what} page ${i + 1} footer`).toMatch(FOOTER);
    expect(new Set(footer.map((b) => Math.round(b.y))).size, `${what} page ${i + 1} footer lines`).toBe(1);
    expect(
      overlappingText(p).map(([a, b]) => `${a.str} / ${b.str}`),
      `${what} page ${i + 1}`,
    ).toEqual([]);
  }
}

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Quillmoor Provisions");
  tech = await agentFor(t.app);
  await tech.post("/api/auth/sign-in", { email: co.people.technician.email, password: PASSWORD });
  owner = await agentFor(t.app);
  await owner.post("/api/auth/sign-in", { email: co.people.owner.email, password: PASSWORD });
  expect((await owner.put("/api/company/settings", settings({}))).status).toBe(200);
  const lead = await agentFor(t.app);
  await lead.post("/api/auth/sign-in", { email: co.people["lead-tech"].email, password: PASSWORD });
  systemId = (
    await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Rack B (LT) with a long name for the dairy and frozen food line",
      refrigerantId: "R-404A",
      fullCharge: { value: 400, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    })
  ).body.id;
  // One addition every ten days over a year: enough rows for the table to cross pages.
  const start = Date.UTC(2025, 0, 6);
  for (let i = 0; i < ADDITIONS; i++) {
    const addedOn = new Date(start + i * 10 * 86_400_000).toISOString().slice(0, 10);
    const res = await tech.post(`/api/systems/${systemId}/charge-additions`, {
      addedOn,
      amount: { value: 2 + (i % 5) * 3.5, unit: "lb" },
      reason: i % 4 === 0 ? LONG_REASON : "Top-up",
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  }
  const f = (
    await tech.post(`/api/stores/${co.store.id}/findings`, {
      systemId,
      status: "confirmed",
      component: "valve",
      foundAt: "2025-03-02T15:00:00Z",
      note: "Service valve cap missing, stem packing weeping; bubbles under the cap with the rack running",
    })
  ).body;
  await tech.post(`/api/findings/${f.id}/events`, {
    action: "repair",
    on: "2025-03-03",
    note: "Packing nut tightened a quarter turn, cap replaced with a new gasketed cap; re-checked with bubbles, no leak",
  });
});
afterAll(() => t.close());

describe("leak-rate statement PDF layout", () => {
  it("prints US Letter under the US profile: every addition in a table that wraps, no text over text, no footer-only page", async () => {
    const { bytes, pages } = await statement();
    renderPdfPages(bytes, "leak-rate-statement-letter");
    expectClean(pages, "letter", "US statement");
    const text = pages.map((p) => p.text).join("\n");
    const flat = text.replace(/\s+/g, " ");
    // Every addition is a row: its day ("6 Jan 2025", as every screen writes days) is in the leak-rate table.
    for (let i = 0; i < ADDITIONS; i++)
      expect(flat).toContain(
        formatCalendarDay(new Date(Date.UTC(2025, 0, 6) + i * 10 * 86_400_000).toISOString().slice(0, 10)),
      );
    // The company weighs in pounds: pounds first, kilograms in brackets (1 lb = 0.45359237 kg, NIST SP 811 B.8).
    expect(flat).toContain("400.0 lb (181.44 kg)");
    expect(flat).not.toMatch(/181\.44 kg \(400\.0 lb\)/);
    // The finding's long note is wrapped in its column, not cut off.
    expect(flat).toContain("cap replaced with a new gasketed cap");
    // 36 rows of one or two lines plus the facts: three pages, four at most.
    expect(pages.length).toBeGreaterThanOrEqual(2);
    expect(pages.length).toBeLessThanOrEqual(4);
    expect(pages.at(-1)!.text).toMatch(new RegExp(`page ${pages.length} of ${pages.length}`));
  });

  it("prints A4 under EU F-gas, with the refrigerant added in a table and kilograms first for a kg company", async () => {
    expect(
      (await owner.put("/api/company/settings", settings({ ruleProfile: "eu-fgas", massUnit: "kg" }))).status,
    ).toBe(200);
    try {
      const { bytes, pages } = await statement();
      renderPdfPages(bytes, "leak-rate-statement-a4");
      expectClean(pages, "a4", "EU statement");
      const flat = pages
        .map((p) => p.text)
        .join("\n")
        .replace(/\s+/g, " ");
      expect(flat).toContain("Refrigerant added");
      expect(flat).toContain("181.44 kg (400.0 lb)");
      expect(flat).not.toMatch(/CFR|EPA/);
    } finally {
      expect((await owner.put("/api/company/settings", settings({}))).status).toBe(200);
    }
  });

  it("follows the company's paper setting over the profile, and keeps it when a save leaves it out", async () => {
    const put = await owner.put("/api/company/settings", settings({ paperSize: "a4" }));
    expect(put.status).toBe(200);
    expect(put.body.paperSize).toBe("a4");
    expectClean((await statement()).pages, "a4", "US statement on A4");
    // An older client that does not know the setting does not reset it.
    const again = await owner.put("/api/company/settings", settings({}));
    expect(again.body.paperSize).toBe("a4");
    const bad = await owner.put("/api/company/settings", settings({ paperSize: "legal" }));
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.paperSize).toBe("must be profile, letter or a4");
    expect((await owner.put("/api/company/settings", settings({ paperSize: "profile" }))).body.paperSize).toBe(
      "profile",
    );
    expectClean((await statement()).pages, "letter", "US statement following the profile");
  });
});
