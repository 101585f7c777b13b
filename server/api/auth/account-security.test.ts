import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, signIn, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";

let t: TestApp;
let acme: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  acme = await seedCompany(t.ctx, "Bramble Foods");
});
afterAll(() => t.close());

describe("changing one's password", () => {
  it("needs the current password, keeps this session and ends the others", async () => {
    const person = acme.people.technician;
    const here = await signIn(t.app, person);
    const there = await signIn(t.app, person);
    const wrong = await here.post("/api/profile/password", {
      currentPassword: "not it",
      newPassword: "a new passphrase",
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.currentPassword).toMatch(/does not match/);
    const short = await here.post("/api/profile/password", { currentPassword: PASSWORD, newPassword: "short" });
    expect(short.body.error.fields.newPassword).toMatch(/at least 10/);
    const ok = await here.post("/api/profile/password", { currentPassword: PASSWORD, newPassword: "a new passphrase" });
    expect(ok.status).toBe(204);
    expect((await here.get("/api/team")).status).toBe(200);
    expect((await there.get("/api/team")).status).toBe(401);
    const fresh = await agentFor(t.app);
    expect((await fresh.post("/api/auth/sign-in", { email: person.email, password: PASSWORD })).status).toBe(401);
    expect((await fresh.post("/api/auth/sign-in", { email: person.email, password: "a new passphrase" })).status).toBe(
      200,
    );
  });

  it("is for the signed-in only", async () => {
    const a = await agentFor(t.app);
    expect(
      (await a.post("/api/profile/password", { currentPassword: PASSWORD, newPassword: "x".repeat(12) })).status,
    ).toBe(401);
  });
});

describe("one's sessions", () => {
  it("are listed (this one marked), can be ended one by one, or everywhere else at once", async () => {
    const person = acme.people.engineer;
    const phone = await signIn(t.app, person);
    const laptop = await signIn(t.app, person);
    const desk = await signIn(t.app, person);
    const bystander = await signIn(t.app, acme.people.owner);
    const list = await desk.get("/api/profile/sessions");
    expect(list.status).toBe(200);
    expect(list.body.sessions).toHaveLength(3);
    expect(list.body.sessions.filter((s: { current: boolean }) => s.current)).toHaveLength(1);
    for (const s of list.body.sessions) {
      expect(s.id).toMatch(/^[A-Za-z0-9_-]{16,}$/);
      expect(s.signedInAt).toBeTruthy();
    }
    // The raw session ids (the cookies' secret) are never shown.
    const { rows } = await t.ctx.pool.query("select sid from session");
    for (const r of rows) expect(JSON.stringify(list.body)).not.toContain(r.sid);

    const phoneId = (await phone.get("/api/profile/sessions")).body.sessions.find(
      (s: { current: boolean }) => s.current,
    ).id;
    expect((await desk.delete(`/api/profile/sessions/${phoneId}`)).status).toBe(204);
    expect((await phone.get("/api/team")).status).toBe(401);
    expect((await laptop.get("/api/team")).status).toBe(200);

    expect((await desk.post("/api/profile/sessions/end-others")).status).toBe(204);
    expect((await laptop.get("/api/team")).status).toBe(401);
    expect((await desk.get("/api/team")).status).toBe(200);
    expect((await desk.get("/api/profile/sessions")).body.sessions).toHaveLength(1);
    expect((await bystander.get("/api/team")).status).toBe(200);
  });

  it("cannot end another person's session", async () => {
    const mine = await signIn(t.app, acme.people["lead-tech"]);
    const theirs = await signIn(t.app, acme.people.owner);
    const id = (await theirs.get("/api/profile/sessions")).body.sessions[0].id;
    expect((await mine.delete(`/api/profile/sessions/${id}`)).status).toBe(404);
    expect((await theirs.get("/api/team")).status).toBe(200);
  });
});
