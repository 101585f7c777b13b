import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { gzipSync } from "node:zlib";
import { createTestApp, signIn, type Agent, type TestApp } from "../helpers/test-app";
import { seedCompany } from "../helpers/fixtures";

// Malformed requests are the client's fault and must be answered as such: a specific 4xx in the one
// JSON error shape, never a 500 (RFC 9110 §15.5: 4xx "the client seems to have erred").

let t: TestApp;
let owner: Agent;
let co: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Kestrel Foods");
  owner = await signIn(t.app, co.people.owner);
});
afterAll(() => t.close());

function expectClientError(
  res: { status: number; body: { error?: { code?: string; message?: string } } },
  status: number,
) {
  expect(res.status).toBe(status);
  expect(res.body.error?.code).toMatch(/^[a-z_]+$/);
  expect(res.body.error?.code).not.toBe("internal");
  expect(res.body.error?.message).toBeTruthy();
}

const post = (url: string) => owner.agent.post(url).set("X-CSRF-Token", owner.csrf);

describe("bodies that are not what they claim", () => {
  it("a gzip body that is not gzip is a 400", async () => {
    const res = await post("/api/stores")
      .set("Content-Type", "application/json")
      .set("Content-Encoding", "gzip")
      .send('{"name":"x"}');
    expectClientError(res, 400);
    expect(res.body.error.code).toBe("bad_encoding");
  });

  it("a real gzip body is read", async () => {
    const res = await post("/api/stores")
      .set("Content-Type", "application/json")
      .set("Content-Encoding", "gzip")
      .serialize((b) => b as string)
      .send(gzipSync(JSON.stringify({ name: "Gzip Grocers", address: "1 Mill Lane", timeZone: "Europe/London" })));
    expect(res.status).toBe(201);
  });

  it("an encoding the server does not speak is a 415", async () => {
    for (const enc of ["compress", "br-x", "identity, compress"]) {
      const res = await post("/api/stores")
        .set("Content-Type", "application/json")
        .set("Content-Encoding", enc)
        .send("{}");
      expectClientError(res, 415);
      expect(res.body.error.code).toBe("unsupported_encoding");
    }
  });

  it("a charset the server does not speak is a 415", async () => {
    const res = await post("/api/stores").set("Content-Type", "application/json; charset=iso-8859-1").send("{}");
    expectClientError(res, 415);
    expect(res.body.error.code).toBe("unsupported_charset");
  });

  it("JSON nested ten thousand deep is refused, not a crash", async () => {
    const deep = `${"[".repeat(10_000)}${"]".repeat(10_000)}`;
    for (const url of ["/api/stores", `/api/sweeps/${crypto.randomUUID()}/readings`, "/api/company/custom-profile"]) {
      const req = url.endsWith("profile") ? owner.agent.put(url).set("X-CSRF-Token", owner.csrf) : post(url);
      const res = await req.set("Content-Type", "application/json").send(`{"readings":${deep},"name":${deep}}`);
      expect(res.status, url).toBeGreaterThanOrEqual(400);
      expect(res.status, url).toBeLessThan(500);
    }
  });
});

describe("paths", () => {
  it("a broken percent-escape is a 400", async () => {
    for (const path of ["/api/stores/%E0%A4%A", "/api/sweeps/%/readings", "/api/findings/%C0%AF"]) {
      const res = await owner.get(path);
      expectClientError(res, 400);
      expect(res.body.error.code).toBe("bad_path");
    }
  });
});

describe("multipart uploads", () => {
  const url = () => `/api/stores/${co.store.id}/plans`;
  it("an empty multipart body is a 400 naming the file field", async () => {
    const res = await post(url()).set("Content-Type", "multipart/form-data; boundary=xyz").send("");
    expectClientError(res, 400);
  });
  it("a multipart body without a boundary is a 400", async () => {
    const res = await post(url()).set("Content-Type", "multipart/form-data").send("--xyz\r\n");
    expectClientError(res, 400);
  });
  it("a multipart body cut off half way is a 400", async () => {
    const body =
      '--xyz\r\nContent-Disposition: form-data; name="image"; filename="plan.png"\r\nContent-Type: image/png\r\n\r\n\x89PNG\r\n';
    const res = await post(url()).set("Content-Type", "multipart/form-data; boundary=xyz").send(body);
    expectClientError(res, 400);
  });
});
