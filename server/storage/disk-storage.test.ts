import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { createDiskStorage } from "./disk-storage";

let root: string;
beforeAll(async () => {
  root = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-storage-"));
});
afterAll(() => fs.rm(root, { recursive: true, force: true }));

async function listAll(dir: string): Promise<string[]> {
  const entries = await fs.readdir(dir, { recursive: true, withFileTypes: true });
  return entries
    .filter((e) => e.isFile())
    .map((e) => path.relative(dir, path.join(e.parentPath, e.name)))
    .sort();
}

describe("disk storage", () => {
  it("puts, gets and deletes by key", async () => {
    const s = createDiskStorage(root);
    await s.put("plans/a/original.png", Buffer.from("hello"));
    expect((await s.get("plans/a/original.png"))?.toString()).toBe("hello");
    await s.put("plans/a/original.png", Buffer.from("replaced"));
    expect((await s.get("plans/a/original.png"))?.toString()).toBe("replaced");
    await s.delete("plans/a/original.png");
    expect(await s.get("plans/a/original.png")).toBeNull();
    await s.delete("plans/a/original.png"); // a missing key is no error
  });

  it("refuses keys that could leave the root", async () => {
    const s = createDiskStorage(root);
    await expect(s.put("../escape.txt", Buffer.from("x"))).rejects.toThrow(/invalid storage key/);
    await expect(s.get("plans/../../etc/passwd")).rejects.toThrow(/invalid storage key/);
    await expect(s.put("", Buffer.from("x"))).rejects.toThrow(/invalid storage key/);
  });

  it("leaves no part file behind when the final rename fails", async () => {
    const dir = path.join(root, "fail");
    const s = createDiskStorage(dir);
    // A directory where the file should go makes rename fail after the part file was written.
    await fs.mkdir(path.join(dir, "plans", "b", "display.png"), { recursive: true });
    await expect(s.put("plans/b/display.png", Buffer.alloc(1024, 7))).rejects.toThrow();
    expect(await listAll(dir)).toEqual([]);
  });
});
