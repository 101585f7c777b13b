import fs from "node:fs/promises";
import path from "node:path";
import { randomBytes } from "node:crypto";
import { assertValidKey, type BlobStorage } from "./blob-storage";

/**
 * Files under one root folder. A put writes `<name>.<random>.part` and renames it into place:
 * rename is atomic on one file system, so readers see the whole file or none, and a failure
 * removes the part file.
 */
export function createDiskStorage(root: string): BlobStorage {
  const resolved = path.resolve(root);
  const fileOf = (key: string) => {
    assertValidKey(key);
    return path.join(resolved, ...key.split("/"));
  };
  return {
    async put(key, data) {
      const file = fileOf(key);
      await fs.mkdir(path.dirname(file), { recursive: true });
      const part = `${file}.${randomBytes(6).toString("hex")}.part`;
      try {
        await fs.writeFile(part, data, { flag: "wx" });
        await fs.rename(part, file);
      } catch (err) {
        await fs.rm(part, { force: true });
        throw err;
      }
    },
    async get(key) {
      try {
        return await fs.readFile(fileOf(key));
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === "ENOENT") return null;
        throw err;
      }
    },
    async delete(key) {
      await fs.rm(fileOf(key), { force: true });
    },
  };
}
