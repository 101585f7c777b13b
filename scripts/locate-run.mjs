// `npm run -s locate`: runs the compiled command line (dist/scripts/locate.js), building it first
// when it is missing or older than its sources, so a fresh clone needs only `npm ci`. Plain
// JavaScript: no TypeScript loader at run time. The build messages go to stderr; stdout stays one
// JSON object (docs/locator/command-line.md).
import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";

const root = path.resolve(import.meta.dirname, "..");
const out = path.join(root, "dist/scripts/locate.js");

function newestSource() {
  // the build script too: a change to how the command is built must rebuild it
  let newest = Math.max(
    statSync(path.join(root, "scripts/locate.ts")).mtimeMs,
    statSync(path.join(root, "scripts/build.mjs")).mtimeMs,
    statSync(path.join(root, "scripts/locate-start.cjs")).mtimeMs,
  );
  for (const f of readdirSync(path.join(root, "core"), { recursive: true })) {
    if (!String(f).endsWith(".ts")) continue;
    newest = Math.max(newest, statSync(path.join(root, "core", String(f))).mtimeMs);
  }
  return newest;
}

if (!existsSync(out) || statSync(out).mtimeMs < newestSource()) {
  const { buildLocate } = await import("./build.mjs");
  await buildLocate();
}
await import(pathToFileURL(out).href);
