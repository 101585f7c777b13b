import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { createTestApp, signIn, type TestApp } from "../helpers/test-app";
import { seedCompany } from "../helpers/fixtures";

// Headers on every kind of answer (OWASP Secure Headers Project; CSP Level 3, W3C).

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let systemId: string;

beforeAll(async () => {
  t = await createTestApp({ serveClient: true });
  co = await seedCompany(t.ctx, "Hollyhock Foods");
  const lead = await signIn(t.app, co.people["lead-tech"]);
  systemId = (
    await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Rack A",
      refrigerantId: "R-448A",
      fullCharge: { value: 100, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    })
  ).body.id;
});
afterAll(() => t.close());

function expectHeaders(res: request.Response, what: string) {
  const csp = String(res.headers["content-security-policy"] ?? "");
  for (const d of [
    "default-src 'self'",
    "script-src 'self'",
    "img-src 'self' blob: data:",
    "worker-src 'self'",
    "object-src 'none'",
    "frame-ancestors 'none'",
  ])
    expect(csp, what).toContain(d);
  expect(csp, what).not.toContain("unsafe-inline");
  expect(csp, what).not.toContain("upgrade-insecure-requests");
  expect(res.headers["x-frame-options"], what).toBe("DENY");
  expect(res.headers["x-content-type-options"], what).toBe("nosniff");
  expect(res.headers["referrer-policy"], what).toBe("same-origin");
}

describe("security headers", () => {
  it("are on pages, API answers, errors, CSVs and PDFs", async () => {
    const tech = await signIn(t.app, co.people.technician);
    expectHeaders(await request(t.app).get("/api/health"), "health");
    expectHeaders(await request(t.app).get("/api/nowhere"), "API 404");
    expectHeaders(await tech.get("/api/auth/session"), "session JSON");
    const csv = await tech.get(`/api/systems/${systemId}/records.csv`);
    expect(csv.status).toBe(200);
    expectHeaders(csv, "CSV");
    const pdf = await tech.agent.get(`/api/systems/${systemId}/leak-rate-statement.pdf`);
    expect(pdf.status).toBe(200);
    expectHeaders(pdf, "PDF");
    const page = await request(t.app).get("/stores");
    if (page.status === 200) expectHeaders(page, "app shell");
  });

  it("add HSTS and upgrade-insecure-requests only over https", async () => {
    const secure = await createTestApp({ secureCookies: true });
    try {
      const res = await request(secure.app).get("/api/health");
      expect(res.headers["strict-transport-security"]).toMatch(/max-age=31536000/);
      expect(res.headers["content-security-policy"]).toContain("upgrade-insecure-requests");
      expect((await request(t.app).get("/api/health")).headers["strict-transport-security"]).toBeUndefined();
    } finally {
      await secure.close();
    }
  });
});
