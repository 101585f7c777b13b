// The production build of the server side: esbuild bundles the server, every worker module
// (server/**/*.worker.ts) and the command-line tools into dist/, each output one plain ES module
// with core/ (the #core/* imports) inside it and npm packages left to node_modules (the locate command
// carries its packages inside). Node runs them without a TypeScript loader (docs/decisions/0086).
// Plain JavaScript so it needs no loader.
//   node scripts/build.mjs            server, workers and tools
//   node scripts/build.mjs locate     only dist/scripts/locate.js (the locate command builds on demand)
import { build } from "esbuild";
import { createHash } from "node:crypto";
import { readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";

const root = path.resolve(import.meta.dirname, "..");

function workerEntries(dir) {
  return readdirSync(path.join(root, dir), { recursive: true })
    .filter((f) => String(f).endsWith(".worker.ts"))
    .map((f) => path.join(dir, String(f)));
}

const common = {
  absWorkingDir: root,
  bundle: true,
  platform: "node",
  format: "esm",
  target: "node20",
  // npm packages stay external (node_modules is there at run time); our own code is bundled.
  packages: "external",
  logLevel: "warning",
  legalComments: "none",
  // A bundle that pulls in a CommonJS package's `require` gets one that works in an ES module.
  banner: {
    js: "import { createRequire as __plumelineRequire } from 'node:module'; const require = __plumelineRequire(import.meta.url);",
  },
};

// The command line is started afresh for every file, so its start-up counts: one minified file with its
// npm packages (zod, simple-statistics) inside, which Node reads and compiles without resolving and
// loading a hundred modules of node_modules (about 90 ms of CPU of a 3-reading run; docs/benchmarks.md).
// That body is CommonJS so that scripts/locate-start.cjs can run it through node:vm with V8's code
// cache, named by the body's hash (docs/decisions/0160); caches of earlier bodies are deleted.
export async function buildLocate() {
  const outDir = path.join(root, "dist/scripts");
  await build({
    ...common,
    banner: undefined,
    packages: undefined,
    format: "cjs",
    minify: true,
    sourcemap: "linked",
    entryPoints: ["scripts/locate.ts"],
    outfile: "dist/scripts/locate-body.cjs",
  });
  const hash = createHash("sha256")
    .update(readFileSync(path.join(outDir, "locate-body.cjs")))
    .digest("hex")
    .slice(0, 16);
  const cacheName = `locate-body.${hash}.v8cache`;
  for (const f of readdirSync(outDir)) if (f.endsWith(".v8cache") && f !== cacheName) rmSync(path.join(outDir, f));
  await build({
    ...common,
    banner: undefined,
    format: "cjs",
    entryPoints: ["scripts/locate-start.cjs"],
    outfile: "dist/scripts/locate.js",
    define: { __LOCATE_BODY__: JSON.stringify("locate-body.cjs"), __LOCATE_CACHE__: JSON.stringify(cacheName) },
  });
  // locate.js is CommonJS although the repository's package.json says "module"
  writeFileSync(path.join(outDir, "package.json"), `${JSON.stringify({ type: "commonjs" })}\n`);
}

export async function buildServer() {
  // outbase keeps server/jobs/x.worker.ts at dist/server/jobs/x.worker.js, where server/paths.ts looks.
  await build({
    ...common,
    entryPoints: ["server/index.ts", ...workerEntries("server")],
    outbase: "server",
    outdir: "dist/server",
    sourcemap: "linked",
  });
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(import.meta.filename)) {
  const only = process.argv[2];
  const started = performance.now();
  if (only === "locate") await buildLocate();
  else await Promise.all([buildServer(), buildLocate()]);
  console.error(
    `[plumeline] built ${only ?? "server, workers and tools"} into dist/ in ${Math.round(performance.now() - started)} ms`,
  );
}
