import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readdirSync } from "node:fs";
import path from "node:path";
import request from "supertest";
import { APP_ROOT } from "../../paths";
import { agentFor, createTestApp, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";

// Before sign-in a session only carries the CSRF token of the sign-in form: it lives an hour, not 30
// days. Cookies are Secure whenever the app is reached over https, directly or via a trusted proxy.

let t: TestApp;
let acme: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  acme = await seedCompany(t.ctx, "Bramble Foods");
});
afterAll(() => t.close());

const HOUR = 3600_000;
const WITHIN_HOUR = HOUR + 5000; // Expires is written to the second
const cookieExpiry = (res: request.Response) => {
  const line = ([] as string[]).concat(res.headers["set-cookie"] ?? []).find((c) => c.startsWith("plumeline.sid="));
  const m = line?.match(/Expires=([^;]+)/);
  return m ? Date.parse(m[1]) - Date.now() : null;
};
const storedExpiry = async (res: request.Response) => {
  const line = ([] as string[]).concat(res.headers["set-cookie"] ?? []).find((c) => c.startsWith("plumeline.sid="))!;
  const sid = decodeURIComponent(line.split(";")[0].split("=")[1]).slice(2).split(".")[0];
  const { rows } = await t.ctx.pool.query("select expire from session where sid = $1", [sid]);
  return new Date(rows[0].expire).getTime() - Date.now();
};

describe("session lifetime", () => {
  it("an anonymous session (the sign-in form's CSRF token) expires within the hour", async () => {
    const res = await request(t.app).get("/api/auth/session");
    expect(res.body.csrfToken).toBeTruthy();
    expect(cookieExpiry(res)).toBeLessThanOrEqual(WITHIN_HOUR);
    expect(await storedExpiry(res)).toBeLessThanOrEqual(WITHIN_HOUR);
  });

  it("a signed-in session lasts 30 days, and is an hour again after sign-out", async () => {
    const a = await agentFor(t.app);
    const signed = await a.post("/api/auth/sign-in", { email: acme.people.owner.email, password: PASSWORD });
    expect(cookieExpiry(signed)).toBeGreaterThan(29 * 24 * HOUR);
    expect(await storedExpiry(signed)).toBeGreaterThan(29 * 24 * HOUR);
    const out = await a.post("/api/auth/sign-out");
    expect(cookieExpiry(out)).toBeLessThanOrEqual(WITHIN_HOUR);
  });
});

describe("the session cookie outside the API", () => {
  it("an asset or app-shell answer sets no cookie, so one in flight across a sign-in cannot sign the person out again", async () => {
    const served = await createTestApp({ serveClient: true });
    try {
      const c = await seedCompany(served.ctx, "Hollin Foods");
      // The sign-in form's anonymous session, as a first visit has it while its service worker
      // fetches the app shell.
      const anonymous = await request(served.app).get("/api/auth/session");
      const oldCookie = ([] as string[]).concat(anonymous.headers["set-cookie"] ?? [])[0].split(";")[0];
      const a = await agentFor(served.app);
      expect((await a.post("/api/auth/sign-in", { email: c.people.owner.email, password: PASSWORD })).status).toBe(200);
      // Answers to requests that left with the old cookie, landing after the sign-in.
      const assets = readdirSync(path.join(APP_ROOT, "dist/client/assets")).filter((f) => f.endsWith(".js"));
      expect(assets.length).toBeGreaterThan(0);
      for (const url of ["/", "/stores", `/assets/${assets[0]}`, "/sw.js"]) {
        const res = await request(served.app).get(url).set("Cookie", oldCookie);
        expect(res.status, url).toBe(200);
        expect(res.headers["set-cookie"], url).toBeUndefined();
      }
      // The API still renews its own cookie.
      expect(
        (await request(served.app).get("/api/auth/session").set("Cookie", oldCookie)).headers["set-cookie"],
      ).toBeTruthy();
    } finally {
      await served.close();
    }
  });
});

describe("Secure cookies", () => {
  const secureFlag = (res: request.Response) =>
    ([] as string[]).concat(res.headers["set-cookie"] ?? []).some((c) => /;\s*Secure/i.test(c));

  it("over plain http: not Secure, and a forwarded https from an untrusted client is not believed", async () => {
    expect(secureFlag(await request(t.app).get("/api/auth/session"))).toBe(false);
    expect(secureFlag(await request(t.app).get("/api/auth/session").set("X-Forwarded-Proto", "https"))).toBe(false);
  });

  it("behind a trusted TLS-terminating proxy: Secure", async () => {
    const proxied = await createTestApp({ trustProxy: ["loopback"] });
    try {
      const res = await request(proxied.app).get("/api/auth/session").set("X-Forwarded-Proto", "https");
      expect(res.headers["set-cookie"]).toBeTruthy();
      expect(secureFlag(res)).toBe(true);
      expect(secureFlag(await request(proxied.app).get("/api/auth/session"))).toBe(false);
    } finally {
      await proxied.close();
    }
  });
});
