// Prints the one closing line CI reads: "N passed, N failed" over every suite (skips not counted).
import fs from "node:fs";

const file = process.argv[2];
if (!fs.existsSync(file)) {
  console.log("0 passed, 1 failed");
  process.exit(1);
}
const report = JSON.parse(fs.readFileSync(file, "utf8"));
let passed = 0;
let failed = 0;
for (const suite of report.testResults ?? []) {
  const results = suite.assertionResults ?? [];
  for (const t of results) {
    if (t.status === "passed") passed++;
    else if (t.status === "failed") failed++;
  }
  // A file that failed to load has no assertions but must still count as a failure.
  if (suite.status === "failed" && !results.some((t) => t.status === "failed")) failed++;
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
