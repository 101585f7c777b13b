import Papa from "papaparse";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, signIn, type Agent, type TestApp } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { pdfText } from "../../../tests/helpers/pdf-text";
import { companies } from "../../db/schema/index";
import { binaryBody } from "../../../tests/helpers/binary-body";

let t: TestApp;
let tech: Agent;
let systemId: string;

beforeAll(async () => {
  t = await createTestApp();
  const co = await seedCompany(t.ctx, "Ashgrove Provisions");
  await t.ctx.db.update(companies).set({ massUnit: "lb" }).where(eq(companies.id, co.company.id));
  const lead = await signIn(t.app, co.people["lead-tech"]);
  tech = await signIn(t.app, co.people.technician);
  systemId = (
    await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Rack L",
      refrigerantId: "R-448A",
      fullCharge: { value: 1500, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: true,
    })
  ).body.id;
  await tech.post(`/api/systems/${systemId}/charge-additions`, { amount: { value: 10, unit: "lb" }, reason: "Top-up" });
});
afterAll(() => t.close());

describe("an lb company reads lb first, grouped", () => {
  it("prints lb first on the statement, with thousands grouped", async () => {
    const pdf = await tech.agent.get(`/api/systems/${systemId}/leak-rate-statement.pdf`).buffer(true).parse(binaryBody);
    const text = (await pdfText(pdf.body as Buffer)).join(" ").replace(/\s+/g, " ");
    // 1,500 lb × 0.45359237 kg/lb = 680.39 kg; 10 lb = 4.54 kg (NIST SP 811, appendix B.8).
    expect(text).toContain("full charge 1,500.0 lb (680.39 kg)");
    // The year's row of the "Added per calendar year" table: the year, then what was added.
    expect(text).toMatch(/Added per calendar year .*?\b\d{4} 10\.0 lb \(4\.54 kg\)/);
  });

  it("puts amount_lb before amount_kg in the records CSV", async () => {
    const res = await tech.get(`/api/systems/${systemId}/records.csv`);
    const [header] = Papa.parse<string[]>(res.text).data;
    expect(header.indexOf("amount_lb")).toBeLessThan(header.indexOf("amount_kg"));
    expect(header.indexOf("amount_lb")).toBeGreaterThan(-1);
  });
});
