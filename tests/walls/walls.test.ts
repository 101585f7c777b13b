// The import walls (.dependency-cruiser.cjs, docs/decisions/0002-import-walls.md) are only worth
// something if they fire. Each case below builds a tiny tree with one deliberate violation and
// checks that the named rule, and only a wall rule, reports it.
import { mkdtempSync, mkdirSync, rmSync, symlinkSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { tmpdir } from "node:os";
import path from "node:path";
import { cruise, type ICruiseResult, type IConfiguration } from "dependency-cruiser";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");
const config = createRequire(import.meta.url)(path.join(root, ".dependency-cruiser.cjs")) as IConfiguration;

/** Files of a small tree: path → source. Every tree also gets the innocent files it imports. */
const BASE: Record<string, string> = {
  "src/features/a/a.ts": "export const a = 1;\n",
  "src/features/b/b.ts": "export const b = 2;\n",
  "src/lib/format.ts": "export const f = 3;\n",
  "core/analysis/locate.ts": "export const locate = 4;\n",
  "server/api/things/things.router.ts": "export const router = 5;\n",
  "server/api/things/things.service.ts": "export const service = 6;\n",
  "server/db/schema.ts": "export const schema = 7;\n",
  "tests/helpers/helper.ts": "export const helper = 8;\n",
};

const VIOLATIONS: { rule: string; file: string; source: string }[] = [
  {
    rule: "features-are-independent",
    file: "src/features/a/uses-b.ts",
    source: 'import { b } from "../b/b";\nexport const x = b;\n',
  },
  {
    rule: "shared-client-code-imports-no-feature",
    file: "src/lib/uses-feature.ts",
    source: 'import { a } from "../features/a/a";\nexport const x = a;\n',
  },
  {
    rule: "client-imports-only-core",
    file: "src/features/a/uses-server.ts",
    source: 'import { service } from "../../../server/api/things/things.service";\nexport const x = service;\n',
  },
  {
    rule: "client-code-imports-no-test-helpers",
    file: "src/lib/uses-helper.ts",
    source: 'import { helper } from "../../tests/helpers/helper";\nexport const x = helper;\n',
  },
  {
    rule: "client-imports-no-node",
    file: "src/lib/uses-fs.ts",
    source: 'import { readFileSync } from "node:fs";\nexport const x = readFileSync;\n',
  },
  {
    rule: "core-stays-in-core",
    file: "core/domain/uses-server.ts",
    source: 'import { schema } from "../../server/db/schema";\nexport const x = schema;\n',
  },
  {
    rule: "core-imports-no-node",
    file: "core/domain/uses-path.ts",
    source: 'import path from "node:path";\nexport const x = path;\n',
  },
  {
    rule: "core-uses-only-pure-packages",
    file: "core/domain/uses-express.ts",
    source: 'import express from "express";\nexport const x = express;\n',
  },
  {
    rule: "server-imports-no-client",
    file: "server/api/things/uses-client.ts",
    source: 'import { f } from "../../../src/lib/format";\nexport const x = f;\n',
  },
  {
    rule: "db-imports-no-route-or-service",
    file: "server/db/seed-via-service.ts",
    source: 'import { service } from "../api/things/things.service";\nexport const x = service;\n',
  },
  {
    rule: "jobs-import-no-route",
    file: "server/jobs/uses-router.ts",
    source: 'import { router } from "../api/things/things.router";\nexport const x = router;\n',
  },
  {
    rule: "simulator-never-sees-the-locator",
    file: "scripts/bench/simulate/peek.ts",
    source: 'import { locate } from "../../../core/analysis/locate";\nexport const x = locate;\n',
  },
  {
    rule: "no-cycles",
    file: "core/domain/ping.ts",
    source: 'import { pong } from "./pong";\nexport const ping = () => pong;\n',
  },
  {
    rule: "no-unresolvable-imports",
    file: "core/domain/missing.ts",
    source: 'import { gone } from "./not-there";\nexport const x = gone;\n',
  },
];

let dir: string;

beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), "plumeline-walls-"));
  const files: Record<string, string> = {
    ...BASE,
    "core/domain/pong.ts": 'import { ping } from "./ping";\nexport const pong = () => ping;\n',
  };
  for (const v of VIOLATIONS) files[v.file] = v.source;
  for (const [file, source] of Object.entries(files)) {
    mkdirSync(path.dirname(path.join(dir, file)), { recursive: true });
    writeFileSync(path.join(dir, file), source);
  }
  writeFileSync(
    path.join(dir, "package.json"),
    JSON.stringify({ name: "walls-case", type: "module", dependencies: { express: "*" } }),
  );
  writeFileSync(
    path.join(dir, "tsconfig.json"),
    JSON.stringify({ compilerOptions: { moduleResolution: "bundler", module: "ESNext", strict: true } }),
  );
  symlinkSync(path.join(root, "node_modules"), path.join(dir, "node_modules"), "dir");
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function violationsIn(): Promise<{ rule: string; from: string }[]> {
  const cwd = process.cwd();
  process.chdir(dir); // dependency-cruiser matches rule paths against paths relative to the working folder
  try {
    const result = await cruise(["core", "server", "src", "scripts", "tests"], {
      ruleSet: config,
      validate: true,
      ...config.options,
      tsConfig: { fileName: "tsconfig.json" },
    } as never);
    return (result.output as ICruiseResult).summary.violations.map((v) => ({ rule: v.rule.name, from: v.from }));
  } finally {
    process.chdir(cwd);
  }
}

describe("the import walls", () => {
  it("report every deliberate violation under its own rule, and nothing in the innocent files", async () => {
    const found = await violationsIn();
    for (const v of VIOLATIONS) {
      expect(found, `${v.rule} should fire on ${v.file}`).toContainEqual({ rule: v.rule, from: v.file });
    }
    const innocent = found.filter((f) => f.from in BASE);
    expect(innocent).toEqual([]);
  });
});
