// A plan image uploaded through the API lands in the object store and is served back from it:
// the same app code path as the disk, with S3 chosen by configuration (as bootstrap does).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import type { AddressInfo } from "node:net";
import S3rver from "s3rver";
import { imageSize } from "image-size";
import { createTestApp, signIn, type TestApp } from "../../tests/helpers/test-app";
import { seedCompany } from "../../tests/helpers/fixtures";
import { makePng } from "../../tests/helpers/plan-images";
import { readEnv } from "../env";
import { storageFromEnv } from "./storage-from-env";

let dir: string;
let uploadsDir: string;
let server: S3rver;
let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let storage: ReturnType<typeof storageFromEnv>;

beforeAll(async () => {
  dir = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-s3-"));
  uploadsDir = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-uploads-"));
  server = new S3rver({
    port: 0,
    address: "127.0.0.1",
    directory: dir,
    silent: true,
    configureBuckets: [{ name: "uploads", configs: [] }],
  });
  const { port } = (await server.run()) as AddressInfo;
  const env = readEnv({
    DATABASE_URL: "postgres://unused",
    STORAGE: "s3",
    S3_BUCKET: "uploads",
    S3_ENDPOINT: `http://127.0.0.1:${port}`,
    S3_ACCESS_KEY_ID: "S3RVER",
    S3_SECRET_ACCESS_KEY: "S3RVER",
  });
  storage = storageFromEnv(env);
  t = await createTestApp({ uploadsDir });
  t.ctx.storage = storage.storage;
  co = await seedCompany(t.ctx, "Birchfield Foods");
});

afterAll(async () => {
  await t.close();
  storage.close();
  await server.close();
  await fs.rm(dir, { recursive: true, force: true });
  await fs.rm(uploadsDir, { recursive: true, force: true });
});

describe("uploads in an S3-compatible object store", () => {
  it("keeps a plan's three images in the bucket and none on the local disk", async () => {
    const lead = await signIn(t.app, co.people["lead-tech"]);
    const png = await makePng(600, 300);
    const res = await lead.agent
      .post(`/api/stores/${co.store.id}/plans`)
      .set("X-CSRF-Token", lead.csrf)
      .attach("image", png, "ground-floor.png");
    expect(res.status).toBe(201);

    const original = await lead.agent.get(res.body.image.originalUrl).buffer(true);
    expect(Buffer.compare(original.body, png)).toBe(0);
    const thumb = await lead.agent.get(res.body.image.thumbUrl).buffer(true);
    expect(imageSize(thumb.body).width).toBeGreaterThan(0);

    const inBucket = await fs.readdir(dir, { recursive: true });
    expect(inBucket.filter((f) => String(f).includes(res.body.id)).length).toBeGreaterThanOrEqual(3);
    expect(await fs.readdir(uploadsDir, { recursive: true })).toEqual([]);
  });
});

describe("storage configuration", () => {
  it("asks for the bucket when S3 is chosen without one", () => {
    expect(() => readEnv({ DATABASE_URL: "postgres://x", STORAGE: "s3" })).toThrow(/S3_BUCKET/);
  });

  it("keeps uploads on disk by default", () => {
    const chosen = storageFromEnv(readEnv({ DATABASE_URL: "postgres://x" }));
    expect(chosen.kind).toBe("disk");
    chosen.close();
  });
});
