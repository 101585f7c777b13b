/**
 * Files the server finds by location, the same from source (tsx) and from the production build
 * (dist/server, bundled by scripts/build.mjs). The one place that knows both layouts: the app's
 * root is the nearest folder above this code with package.json, and a compiled bundle (a .js file)
 * loads its worker modules from dist/server instead of server/ (docs/decisions/0086).
 */
import { existsSync } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";

function findRoot(from: string): string {
  for (let dir = from; ; dir = path.dirname(dir)) {
    if (existsSync(path.join(dir, "package.json"))) return dir;
    if (path.dirname(dir) === dir) throw new Error(`no package.json above ${from}`);
  }
}

/** The checkout (or install) folder: package.json, drizzle/, dist/ and node_modules/ live here. */
export const APP_ROOT = findRoot(import.meta.dirname);

/** True when running the esbuild bundle (no TypeScript loader in the process). */
export const COMPILED = import.meta.url.endsWith(".js");

/** `server/<rel>.ts` from source, `dist/server/<rel>.js` when compiled: `rel` is e.g. "jobs/analysis.worker". */
export function serverModule(rel: string): URL {
  const file = COMPILED ? path.join(APP_ROOT, "dist/server", `${rel}.js`) : path.join(APP_ROOT, "server", `${rel}.ts`);
  return pathToFileURL(file);
}
