import { randomUUID } from "node:crypto";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, type Agent, type TestApp, signInOnce } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { makeJpeg } from "../../../tests/helpers/plan-images";
import type { Role } from "#core/domain/roles";

let t: TestApp;
let uploads: string;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;
let systemId: string;
const signInOnceAs = signInOnce(() => t.app);

beforeAll(async () => {
  uploads = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-findings-"));
  t = await createTestApp({ uploadsDir: uploads });
  co = await seedCompany(t.ctx, "Bramblewood Grocers");
  other = await seedCompany(t.ctx, "Saltmarsh Foods");
  const lead = await signedIn("lead-tech");
  systemId = (
    await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Rack A",
      refrigerantId: "R-448A",
      fullCharge: { value: 400, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    })
  ).body.id;
});
afterAll(async () => {
  await t.close();
  await fs.rm(uploads, { recursive: true, force: true });
});

const signedIn = (role: Role, company = co): Promise<Agent> => signInOnceAs(company.people[role]);

const newFinding = (extra: object = {}) => ({
  systemId,
  component: "flare",
  note: "Bubbles at the flare nut",
  ...extra,
});

describe("findings: create, list, read", () => {
  it("creates a suspected finding signed by the technician, dated on the store's calendar", async () => {
    const tech = await signedIn("technician");
    const res = await tech.post(`/api/stores/${co.store.id}/findings`, newFinding({ foundAt: "2026-03-01T03:30:00Z" }));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      status: "suspected",
      source: "manual",
      systemId,
      foundBy: "technician of Bramblewood Grocers",
      component: "flare",
    });
    // 03:30 UTC on 1 March is still 28 February in New York (UTC−5 in winter; IANA tz database).
    expect(res.body.events).toEqual([
      expect.objectContaining({
        kind: "found",
        status: "suspected",
        on: "2026-02-28",
        by: "technician of Bramblewood Grocers",
      }),
    ]);
    expect(res.body.cautions.at(-1).id).toBe("codes-govern");
    const list = await (await signedIn("store-contact")).get(`/api/stores/${co.store.id}/findings`);
    expect(list.status).toBe(200);
    expect(list.body.findings.map((f: { id: string }) => f.id)).toContain(res.body.id);
  });

  it("stores an offline retry once: the same clientId returns the stored finding with 200", async () => {
    const tech = await signedIn("technician");
    const clientId = randomUUID();
    const first = await tech.post(`/api/stores/${co.store.id}/findings`, newFinding({ clientId, source: "walk" }));
    const again = await tech.post(`/api/stores/${co.store.id}/findings`, newFinding({ clientId, source: "walk" }));
    expect(first.status).toBe(201);
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(first.body.id);
    const both = await Promise.all(
      [1, 2].map(() => tech.post(`/api/stores/${co.store.id}/findings`, newFinding({ clientId: randomUUID() }))),
    );
    expect(new Set(both.map((r) => r.body.id)).size).toBe(2);
  });

  it("refuses bad input with field errors", async () => {
    const tech = await signedIn("technician");
    const bad = await tech.post(`/api/stores/${co.store.id}/findings`, {
      x: 3,
      component: "weld",
      clientId: "nope",
      systemId: randomUUID(),
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toMatchObject({
      clientId: "must be a valid id",
      component: expect.stringMatching(/brazed-joint/),
    });
    const half = await tech.post(`/api/stores/${co.store.id}/findings`, { x: 3 });
    expect(half.body.error.fields).toEqual({ y: "x and y must be given together" });
    const foreign = await tech.post(`/api/stores/${co.store.id}/findings`, { systemId: randomUUID() });
    expect(foreign.status).toBe(400);
    expect(foreign.body.error.fields.systemId).toBe("is not a system of this store");
    const confirmedBare = await tech.post(`/api/stores/${co.store.id}/findings`, { status: "confirmed" });
    expect(confirmedBare.body.error.fields.component).toMatch(/required/);
  });

  it("refuses a finding on a retired system with the reason, and takes the same leak without the system", async () => {
    const lead = await signedIn("lead-tech");
    const old = (
      await lead.post(`/api/stores/${co.store.id}/systems`, {
        name: "Rack Z",
        refrigerantId: "R-404A",
        fullCharge: { value: 120, unit: "lb" },
        applianceType: "commercial-refrigeration",
        automaticLeakDetection: false,
        inServiceOn: "2020-01-01",
      })
    ).body.id;
    const retired = await lead.post(`/api/systems/${old}/retire`, { retiredOn: "2026-03-31", reasonKind: "removed" });
    expect(retired.status, JSON.stringify(retired.body)).toBe(200);
    const tech = await signedIn("technician");
    const clientId = randomUUID();
    const refused = await tech.post(`/api/stores/${co.store.id}/findings`, newFinding({ systemId: old, clientId }));
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.systemId).toBe(
      "Rack Z was retired on 2026-03-31: record the leak without a system, or on the system that replaced it",
    );
    const kept = await tech.post(`/api/stores/${co.store.id}/findings`, newFinding({ systemId: null, clientId }));
    expect(kept.status, JSON.stringify(kept.body)).toBe(201);
    expect(kept.body.systemId).toBeNull();
  });

  it("keeps companies apart: another company's finding and store are 404, store contacts see only their store", async () => {
    const tech = await signedIn("technician");
    const f = (await tech.post(`/api/stores/${co.store.id}/findings`, newFinding())).body;
    const stranger = await signedIn("owner", other);
    expect((await stranger.get(`/api/findings/${f.id}`)).status).toBe(404);
    expect((await stranger.get(`/api/stores/${co.store.id}/findings`)).status).toBe(404);
    expect((await stranger.post(`/api/findings/${f.id}/events`, { action: "dismiss", reason: "other" })).status).toBe(
      404,
    );
    expect((await stranger.post(`/api/stores/${co.store.id}/findings`, {})).status).toBe(404);
    const onOther = (await tech.post(`/api/stores/${co.otherStore.id}/findings`, {})).body;
    const contact = await signedIn("store-contact");
    expect((await contact.get(`/api/findings/${onOther.id}`)).status).toBe(404);
    expect((await contact.get(`/api/findings/${f.id}`)).status).toBe(200);
    expect((await contact.post(`/api/stores/${co.store.id}/findings`, {})).status).toBe(403);
  });
});

describe("findings: lifecycle and its role rules", () => {
  it("runs suspected → confirmed → repaired → tests → verified → closed, each step signed", async () => {
    const tech = await signedIn("technician");
    const lead = await signedIn("lead-tech");
    const engineer = await signedIn("engineer");
    const f = (await tech.post(`/api/stores/${co.store.id}/findings`, newFinding({ component: null }))).body;
    const noComponent = await tech.post(`/api/findings/${f.id}/events`, { action: "confirm" });
    expect(noComponent.status).toBe(400);
    expect(noComponent.body.error.fields.component).toMatch(/required/);
    let r = await tech.post(`/api/findings/${f.id}/events`, { action: "confirm", component: "brazed-joint" });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({
      status: "confirmed",
      component: "brazed-joint",
      nextActions: ["repair", "dismiss"],
    });
    r = await lead.post(`/api/findings/${f.id}/events`, { action: "repair", note: "Re-brazed the joint" });
    expect(r.body.status).toBe("repaired");
    // The follow-up test needs a passed initial test first.
    r = await lead.post(`/api/findings/${f.id}/events`, { action: "follow-up-test", result: "passed" });
    expect(r.status).toBe(409);
    expect(r.body.error.message).toMatch(/initial verification test first/);
    r = await lead.post(`/api/findings/${f.id}/events`, { action: "initial-test", result: "passed" });
    expect(r.body).toMatchObject({ status: "repaired", nextActions: ["follow-up-test"] });
    // Initial test passed: a follow-up verification test is due 10 days later (40 CFR 82 follow-up, docs/reference/standards.md §1 [M]).
    const followUp = r.body.deadlines.find((d: { what: string }) => /Follow-up/.test(d.what));
    const initialOn = r.body.events.at(-1).on;
    const expected = new Date(Date.parse(`${initialOn}T00:00:00Z`) + 10 * 86_400_000).toISOString().slice(0, 10);
    expect(followUp.dueOn).toBe(expected);
    // A technician may not close; an engineer may, once verified.
    r = await tech.post(`/api/findings/${f.id}/events`, { action: "follow-up-test", result: "passed" });
    expect(r.body.status).toBe("verified");
    expect((await tech.post(`/api/findings/${f.id}/events`, { action: "close" })).status).toBe(403);
    r = await engineer.post(`/api/findings/${f.id}/events`, { action: "close", note: "Records complete" });
    expect(r.status).toBe(200);
    expect(r.body.events.map((e: { kind: string; by: string }) => [e.kind, e.by])).toEqual([
      ["found", "technician of Bramblewood Grocers"],
      ["confirmed", "technician of Bramblewood Grocers"],
      ["repaired", "lead-tech of Bramblewood Grocers"],
      ["initial-test", "lead-tech of Bramblewood Grocers"],
      ["follow-up-test", "technician of Bramblewood Grocers"],
      ["closed", "engineer of Bramblewood Grocers"],
    ]);
    expect((await engineer.post(`/api/findings/${f.id}/events`, { action: "repair" })).status).toBe(409);
  });

  it("sends a failed verification test back to confirmed", async () => {
    const tech = await signedIn("technician");
    const f = (await tech.post(`/api/stores/${co.store.id}/findings`, newFinding({ status: "confirmed" }))).body;
    expect(f.status).toBe("confirmed");
    await tech.post(`/api/findings/${f.id}/events`, { action: "repair" });
    const r = await tech.post(`/api/findings/${f.id}/events`, {
      action: "initial-test",
      result: "failed",
      note: "Still bubbling",
    });
    expect(r.body.status).toBe("confirmed");
    const noResult = await tech.post(`/api/findings/${f.id}/events`, { action: "initial-test" });
    expect(noResult.status).toBe(400);
    expect(noResult.body.error.fields.result).toBe("must be passed or failed");
  });

  it("lets only engineers and owners dismiss, with a reason, and refuses illegal moves with 409", async () => {
    const tech = await signedIn("technician");
    const owner = await signedIn("owner");
    const f = (await tech.post(`/api/stores/${co.store.id}/findings`, newFinding())).body;
    expect(
      (await tech.post(`/api/findings/${f.id}/events`, { action: "dismiss", reason: "benign-source" })).status,
    ).toBe(403);
    expect(
      (
        await (
          await signedIn("store-contact")
        ).post(`/api/findings/${f.id}/events`, { action: "confirm", component: "valve" })
      ).status,
    ).toBe(403);
    const noReason = await owner.post(`/api/findings/${f.id}/events`, { action: "dismiss" });
    expect(noReason.body.error.fields.reason).toMatch(/benign-source/);
    const r = await owner.post(`/api/findings/${f.id}/events`, {
      action: "dismiss",
      reason: "benign-source",
      note: "Aerosol release agent in the bakery",
    });
    expect(r.body).toMatchObject({ status: "dismissed", dismissReason: "benign-source", nextActions: [] });
    const again = await tech.post(`/api/findings/${f.id}/events`, { action: "confirm", component: "valve" });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toBe("This finding is dismissed: only a suspected finding can be confirmed.");
    const unknown = await owner.post(`/api/findings/${f.id}/events`, { action: "reopen" });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields.action).toMatch(/confirm, repair/);
  });

  it("refuses a step dated in the store's future or before the previous step", async () => {
    const tech = await signedIn("technician");
    const f = (await tech.post(`/api/stores/${co.store.id}/findings`, newFinding({ foundAt: "2026-01-10T15:00:00Z" })))
      .body;
    const future = await tech.post(`/api/findings/${f.id}/events`, { action: "confirm", on: "2999-01-01" });
    expect(future.status).toBe(400);
    expect(future.body.error.fields.on).toMatch(/must not be after today/);
    const before = await tech.post(`/api/findings/${f.id}/events`, { action: "confirm", on: "2026-01-09" });
    expect(before.body.error.fields.on).toBe("must not be before 10 Jan 2026, the day of the previous step");
    const notADay = await tech.post(`/api/findings/${f.id}/events`, { action: "confirm", on: "2026-02-30" });
    expect(notADay.body.error.fields.on).toMatch(/does not exist/);
    expect(
      (await tech.post(`/api/findings/${f.id}/events`, { action: "confirm", on: "2026-01-12" })).body.events.at(-1).on,
    ).toBe("2026-01-12");
  });
});

describe("finding photos", () => {
  it("stores a JPEG checked by content and serves it only to members who may see the finding", async () => {
    const tech = await signedIn("technician");
    const f = (await tech.post(`/api/stores/${co.store.id}/findings`, newFinding())).body;
    const jpeg = await makeJpeg(64, 48);
    const up = await tech.agent
      .post(`/api/findings/${f.id}/photos`)
      .set("X-CSRF-Token", tech.csrf)
      .attach("photo", jpeg, { filename: "leak.txt", contentType: "text/plain" });
    expect(up.status).toBe(201);
    expect(up.body.photos).toHaveLength(1);
    const photo = await tech.get(up.body.photos[0].url);
    expect(photo.status).toBe(200);
    expect(photo.headers["content-type"]).toBe("image/jpeg");
    expect((await tech.get(up.body.photos[0].thumbUrl)).status).toBe(200);
    expect((await (await signedIn("owner", other)).get(up.body.photos[0].url)).status).toBe(404);
    const fake = await tech.agent
      .post(`/api/findings/${f.id}/photos`)
      .set("X-CSRF-Token", tech.csrf)
      .attach("photo", Buffer.from("GIF89a not a photo"), { filename: "leak.jpg", contentType: "image/jpeg" });
    expect(fake.status).toBe(415);
    expect(fake.body.error.fields.photo).toBe("must be a PNG or JPEG image");
    const none = await tech.agent
      .post(`/api/findings/${f.id}/photos`)
      .set("X-CSRF-Token", tech.csrf)
      .field("note", "x");
    expect(none.status).toBe(400);
    expect(none.body.error.fields.photo).toMatch(/required/);
  });
});
