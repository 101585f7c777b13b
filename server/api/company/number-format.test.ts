import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, signIn, type TestApp } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Brackenridge Foods");
});
afterAll(() => t.close());

describe("the company's number format", () => {
  it("is a company setting: 1,234.5 by default, changed by an owner, kept when a save leaves it out", async () => {
    const owner = await signIn(t.app, co.people.owner);
    const before = (await owner.get("/api/company/settings")).body;
    expect(before.numberFormat).toBe("1,234.5");
    const saved = await owner.put("/api/company/settings", { ...before, numberFormat: "1.234,5" });
    expect(saved.status).toBe(200);
    expect(saved.body.numberFormat).toBe("1.234,5");
    const { numberFormat: _left, ...older } = before;
    const again = await owner.put("/api/company/settings", { ...older, name: "Brackenridge Foods Ltd" });
    expect(again.body).toMatchObject({ name: "Brackenridge Foods Ltd", numberFormat: "1.234,5" });
  });

  it("refuses a format it does not know, naming the field", async () => {
    const owner = await signIn(t.app, co.people.owner);
    const current = (await owner.get("/api/company/settings")).body;
    const res = await owner.put("/api/company/settings", { ...current, numberFormat: "1'234.5" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.numberFormat).toBe('must be one of "1,234.5", "1.234,5", "1 234,5"');
    expect((await owner.get("/api/company/settings")).body.numberFormat).toBe(current.numberFormat);
  });

  it("is the owner's to change", async () => {
    const lead = await signIn(t.app, co.people["lead-tech"]);
    const current = (await lead.get("/api/company/settings")).body;
    expect((await lead.put("/api/company/settings", { ...current, numberFormat: "1 234,5" })).status).toBe(403);
  });
});
