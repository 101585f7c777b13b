// The compiled command line's entry (dist/scripts/locate.js, built by scripts/build.mjs): it runs the
// command's body (locate-body.cjs) with V8's code cache, so a run does not parse and compile again the
// half megabyte of the bundle and the functions the last run compiled (docs/decisions/0160). Node 22
// does the same with module.enableCompileCache(); Node 20 has only node:vm's cachedData. The cache is
// written after the first successful run (and again whenever V8 rejects it: another Node, other flags).
// Its name carries the body's content hash, because V8 checks only the source's length, not its text.
// __LOCATE_BODY__ and __LOCATE_CACHE__ are file names the build defines.
// CommonJS (dist/scripts/package.json says so): Node starts a CommonJS entry without its ES module loader.
const { readFileSync, renameSync, writeFileSync } = require("node:fs");
const { createRequire } = require("node:module");
const path = require("node:path");
const { Script } = require("node:vm");

const dir = __dirname;
const bodyFile = path.join(dir, __LOCATE_BODY__);
const cacheFile = path.join(dir, __LOCATE_CACHE__);
let cachedData;
try {
  cachedData = readFileSync(cacheFile);
} catch {
  cachedData = undefined; // first run after a build: compiled as usual, cached at exit
}
const source = readFileSync(bodyFile, "utf8");
const head = "(function (exports, require, module, __filename, __dirname) {";
// the column offset keeps stack traces and the source map's columns on the body's first line right
const script = new Script(`${head}${source}\n})`, { filename: bodyFile, columnOffset: -head.length, cachedData });
if (cachedData === undefined || script.cachedDataRejected) {
  process.on("exit", (code) => {
    if (code !== 0) return;
    try {
      const tmp = `${cacheFile}.${process.pid}.tmp`;
      writeFileSync(tmp, script.createCachedData());
      renameSync(tmp, cacheFile); // atomic: a run started meanwhile reads the old file or the new one
    } catch {
      // a read-only dist/ only loses the speed-up
    }
  });
}
const body = { exports: {} };
script.runInThisContext()(body.exports, createRequire(bodyFile), body, bodyFile, dir);
