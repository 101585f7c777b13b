import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, type TestApp, signIn } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { pdfText } from "../../../tests/helpers/pdf-text";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Fernhollow Market");
});
afterAll(() => t.close());

const binary = (
  res: { on(e: string, f: (c?: Buffer) => void): void },
  cb: (err: Error | null, body: Buffer) => void,
) => {
  const chunks: Buffer[] = [];
  res.on("data", (c) => chunks.push(c!));
  res.on("end", () => cb(null, Buffer.concat(chunks)));
};

describe("research notes never reach a customer (docs/decisions/0044-readings-and-research-notes.md)", () => {
  it("lists the profile's readings once and prints only citations and the 'reading' marker", async () => {
    const tech = await signIn(t.app, co.people.technician);
    const r = await tech.get("/api/compliance/readings");
    expect(r.status).toBe(200);
    expect(r.body.profileName).toMatch(/US federal/);
    const texts = r.body.readings.map((x: { text: string }) => x.text);
    // Follow-up verification within 10 days is [M] in docs/reference/standards.md §1: a reading.
    expect(texts.some((x: string) => /follow-up verification within 10 days/.test(x))).toBe(true);
    expect(new Set(texts).size).toBe(texts.length);

    const lead = await signIn(t.app, co.people["lead-tech"]);
    const sys = await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Rack K",
      refrigerantId: "R-404A",
      fullCharge: { value: 100, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    });
    await tech.post(`/api/systems/${sys.body.id}/charge-additions`, {
      addedOn: "2026-03-01",
      amount: { value: 30, unit: "lb" },
      reason: "Top-up",
    });
    const rec = (await tech.get(`/api/systems/${sys.body.id}/records`)).body;
    const pdf = await tech.agent.get(`/api/systems/${sys.body.id}/leak-rate-statement.pdf`).buffer(true).parse(binary);
    const text = (await pdfText(pdf.body as Buffer)).join(" ").replace(/\s+/g, " ");
    for (const out of [text, JSON.stringify(rec.due)])
      expect(out).not.toMatch(/from memory|study guide|ACHR|magazine|Legal Register|not yet confirmed/i);
    expect(text).toContain("“reading”: how the product applies a rule whose text it has not confirmed");
  });
});
