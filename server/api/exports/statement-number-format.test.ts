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
  const co = await seedCompany(t.ctx, "Larchfield Markets");
  await t.ctx.db.update(companies).set({ numberFormat: "1.234,5" }).where(eq(companies.id, co.company.id));
  const lead = await signIn(t.app, co.people["lead-tech"]);
  tech = await signIn(t.app, co.people.technician);
  systemId = (
    await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Deli condensing unit",
      refrigerantId: "R-448A",
      fullCharge: { value: 10, unit: "kg" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    })
  ).body.id;
  const added = await tech.post(`/api/systems/${systemId}/charge-additions`, {
    amount: { value: 150, unit: "kg" },
    reason: "Refilled after the line set was cut",
  });
  expect(added.status, JSON.stringify(added.body)).toBe(201);
});
afterAll(() => t.close());

describe("the statement's percentages follow the company's number format", () => {
  it("writes the year's share of the full charge and the chronic rule with a decimal comma", async () => {
    const pdf = await tech.agent.get(`/api/systems/${systemId}/leak-rate-statement.pdf`).buffer(true).parse(binaryBody);
    const text = (await pdfText(pdf.body as Buffer)).join(" ").replace(/\s+/g, " ");
    // 150 kg added to a 10 kg full charge in one calendar year: 150 / 10 × 100 = 1,500 % (arithmetic),
    // grouped and with a decimal comma in the "1.234,5" format.
    expect(text).toMatch(/Added per calendar year .*?\b\d{4} 150,00 kg \(330,7 lb\) 1\.500,0 % yes/);
    expect(text).not.toMatch(/1500\.0 %/);
  });
});
