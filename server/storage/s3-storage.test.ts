// The S3 adapter against a real S3 protocol server on loopback (s3rver, a general-purpose fake
// of the S3 REST API), not a mock: requests, signatures, path-style URLs and 404s are the real thing.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import type { AddressInfo } from "node:net";
import S3rver from "s3rver";
import { createS3Storage } from "./s3-storage";

let dir: string;
let server: S3rver;
let endpoint: string;

beforeAll(async () => {
  dir = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-s3-"));
  server = new S3rver({
    port: 0,
    address: "127.0.0.1",
    directory: dir,
    silent: true,
    configureBuckets: [{ name: "plumeline-uploads", configs: [] }],
  });
  const address = (await server.run()) as AddressInfo;
  endpoint = `http://127.0.0.1:${address.port}`;
});

afterAll(async () => {
  await server.close();
  await fs.rm(dir, { recursive: true, force: true });
});

const storage = () =>
  createS3Storage({
    bucket: "plumeline-uploads",
    endpoint,
    region: "us-east-1",
    // s3rver's documented local credentials
    accessKeyId: "S3RVER",
    secretAccessKey: "S3RVER",
    forcePathStyle: true,
    prefix: "test-install",
  });

describe("S3 storage", () => {
  it("puts, gets, replaces and deletes by key, byte for byte", async () => {
    const s = storage();
    const bytes = Buffer.from(Array.from({ length: 70_000 }, (_, i) => (i * 31) % 256));
    await s.put("plans/a/original.png", bytes);
    expect((await s.get("plans/a/original.png"))?.equals(bytes)).toBe(true);
    await s.put("plans/a/original.png", Buffer.from("replaced"));
    expect((await s.get("plans/a/original.png"))?.toString()).toBe("replaced");
    await s.delete("plans/a/original.png");
    expect(await s.get("plans/a/original.png")).toBeNull();
    await s.delete("plans/a/original.png"); // a missing key is no error
    s.destroy();
  });

  it("answers null for a key that was never stored", async () => {
    const s = storage();
    expect(await s.get("photos/never/there.jpg")).toBeNull();
    s.destroy();
  });

  it("keeps objects under the installation's prefix", async () => {
    const s = storage();
    await s.put("plans/b/display.jpg", Buffer.from("x"));
    const other = createS3Storage({
      bucket: "plumeline-uploads",
      endpoint,
      region: "us-east-1",
      accessKeyId: "S3RVER",
      secretAccessKey: "S3RVER",
      forcePathStyle: true,
      prefix: "another-install",
    });
    expect(await other.get("plans/b/display.jpg")).toBeNull();
    expect((await s.get("plans/b/display.jpg"))?.toString()).toBe("x");
    s.destroy();
    other.destroy();
  });

  it("refuses keys that could leave the prefix", async () => {
    const s = storage();
    await expect(s.put("../escape.txt", Buffer.from("x"))).rejects.toThrow(/invalid storage key/);
    await expect(s.get("plans/../../etc/passwd")).rejects.toThrow(/invalid storage key/);
    s.destroy();
  });

  it("reports a store that cannot be reached as an error, never as a missing file", async () => {
    const s = createS3Storage({
      bucket: "plumeline-uploads",
      endpoint: "http://127.0.0.1:1",
      region: "us-east-1",
      accessKeyId: "S3RVER",
      secretAccessKey: "S3RVER",
      forcePathStyle: true,
    });
    await expect(s.get("plans/a/original.png")).rejects.toThrow();
    s.destroy();
  });
});
