import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pino from "pino";
import { agentFor, createTestApp, signIn, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import { resetTokenIn, waitForMail } from "../../../tests/helpers/mail-wait";

let t: TestApp;
let acme: Awaited<ReturnType<typeof seedCompany>>;
let rival: Awaited<ReturnType<typeof seedCompany>>;
const logLines: string[] = [];

beforeAll(async () => {
  t = await createTestApp();
  // The server log, as the person running the built-in mail mode reads it.
  t.ctx.logger = pino({ level: "info" }, { write: (line: string) => void logLines.push(line) });
  acme = await seedCompany(t.ctx, "Bramble Foods");
  rival = await seedCompany(t.ctx, "Thistle Market");
});
afterAll(() => t.close());

async function askForReset(email: string) {
  const since = new Date();
  const a = await agentFor(t.app);
  expect((await a.post("/api/auth/password-reset", { email })).status).toBe(202);
  return resetTokenIn((await waitForMail(t.ctx, email, since)).text);
}

describe("reset mail and the Outbox", () => {
  it("never lists a reset link to another company (nor any mail without a company)", async () => {
    const token = await askForReset(acme.people.owner.email);
    for (const who of [rival.people.owner, rival.people.engineer, acme.people.owner, acme.people.engineer]) {
      const res = await (await signIn(t.app, who)).get("/api/outbox");
      expect(res.status).toBe(200);
      expect(JSON.stringify(res.body)).not.toContain(token);
      expect(res.body.messages.some((m: { subject: string }) => /reset/i.test(m.subject))).toBe(false);
    }
  });

  it("puts the reset link in the server log in the built-in mail mode", async () => {
    const token = await askForReset(acme.people["lead-tech"].email);
    const line = logLines.find((l) => l.includes(token));
    expect(line).toBeTruthy();
    expect(JSON.parse(line!).msg).toMatch(/password reset link/i);
  });
});

describe("a completed reset", () => {
  it("ends every other session of that user", async () => {
    const person = acme.people.technician;
    const phone = await signIn(t.app, person);
    const laptop = await signIn(t.app, person);
    const bystander = await signIn(t.app, acme.people.engineer);
    const token = await askForReset(person.email);
    const a = await agentFor(t.app);
    expect(
      (await a.post("/api/auth/password-reset/confirm", { token, password: "a brand new passphrase" })).status,
    ).toBe(204);
    for (const old of [phone, laptop]) {
      expect((await old.get("/api/auth/session")).body.user).toBeNull();
      expect((await old.get("/api/team")).status).toBe(401);
    }
    expect((await bystander.get("/api/team")).status).toBe(200);
  });

  it("leaves only the newest reset link live", async () => {
    const person = acme.people["store-contact"];
    const first = await askForReset(person.email);
    const second = await askForReset(person.email);
    const a = await agentFor(t.app);
    const stale = await a.post("/api/auth/password-reset/confirm", { token: first, password: "an older passphrase" });
    expect(stale.status).toBe(400);
    expect(stale.body.error.fields.token).toBeTruthy();
    expect(
      (await a.post("/api/auth/password-reset/confirm", { token: second, password: "the newest passphrase" })).status,
    ).toBe(204);
    expect((await a.post("/api/auth/sign-in", { email: person.email, password: PASSWORD })).status).toBe(401);
  });
});

describe("asking for a reset", () => {
  it("is answered before any mail goes, the same for known and unknown addresses", async () => {
    // Hold every send until released: an answer that waited for the mail would not arrive at all.
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    const send = t.ctx.mailer.send;
    t.ctx.mailer.send = async (mail) => {
      await gate;
      return send(mail);
    };
    try {
      const since = new Date();
      // Bounded only to fail with a clear message: the mail is held until both answers are in, so an
      // answer that waited for it would never come, however long it is given.
      const within = <T>(p: Promise<T>) =>
        Promise.race([p, new Promise<never>((_, no) => setTimeout(() => no(new Error("the answer waited")), 20_000))]);
      const a = await agentFor(t.app);
      const known = await within(a.post("/api/auth/password-reset", { email: acme.people.owner.email }));
      const unknown = await within(a.post("/api/auth/password-reset", { email: "ghost@nowhere.test" }));
      for (const res of [known, unknown]) {
        expect(res.status).toBe(202);
        expect(res.body).toEqual({ ok: true });
      }
      expect(Object.keys(known.headers).sort()).toEqual(Object.keys(unknown.headers).sort());
      release();
      expect((await waitForMail(t.ctx, acme.people.owner.email, since)).subject).toMatch(/reset/i);
    } finally {
      release();
      t.ctx.mailer.send = send;
    }
  });

  it("is throttled per address and per client, known or not", async () => {
    const limited = await createTestApp({ resetRateLimit: { perAddress: 2, perClient: 5 } });
    try {
      const c = await seedCompany(limited.ctx, "Quill Grocers");
      const a = await agentFor(limited.app);
      const ask = (email: string) => a.post("/api/auth/password-reset", { email });
      for (const email of [c.people.owner.email, "ghost@quillgrocers.test"]) {
        expect((await ask(email)).status).toBe(202);
        expect((await ask(` ${email.toUpperCase()}`)).status).toBe(202);
        const third = await ask(email);
        expect(third.status).toBe(429);
        expect(third.body.error.code).toBe("rate_limited");
        expect(third.headers["retry-after"]).toMatch(/^\d+$/);
      }
      // Six asked so far from this client (two refused); the client's own limit of five is spent.
      expect((await ask("someone-else@quillgrocers.test")).status).toBe(429);
    } finally {
      await limited.close();
    }
  });
});
