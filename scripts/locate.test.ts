import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

// The command-line contract (docs/locator/command-line.md): one JSON object on stdout, errors on stderr, non-zero exit.
const dir = mkdtempSync(join(tmpdir(), "locate-cli-"));
function run(content: unknown, ...flags: string[]) {
  const file = join(dir, `in-${Math.random().toString(36).slice(2)}.json`);
  writeFileSync(file, typeof content === "string" ? content : JSON.stringify(content));
  return spawnSync(process.execPath, ["scripts/locate-run.mjs", file, ...flags], { encoding: "utf8" });
}

const input = {
  plan: {
    width: 12,
    height: 6,
    obstacles: [
      {
        id: "w1",
        polygon: [
          [0, 0],
          [12, 0],
          [12, 0.2],
          [0, 0.2],
        ],
      },
    ],
  },
  instrument: { transportDelayS: 2, timeConstantS: 1, alarmPpm: 2 },
  readings: Array.from({ length: 10 }, (_, k) => ({ x: 1 + k, y: 3, t: k, ppm: k === 6 ? 1 : 0 })),
};

describe("npm run locate", () => {
  it("prints exactly one JSON object with the contract's keys", () => {
    const r = run(input);
    expect(r.status).toBe(0);
    expect(r.stderr).toBe("");
    const lines = r.stdout.trim().split("\n");
    expect(lines).toHaveLength(1);
    const out = JSON.parse(lines[0]);
    expect(Object.keys(out)).toEqual(["candidates", "background", "diagnostics", "assumptions"]);
    expect(out.candidates).toEqual([]);
    expect(typeof out.background.ppm).toBe("number");
  });

  it("adds the field grid only when asked, with unknown cells as null", () => {
    const out = JSON.parse(run(input, "--field").stdout);
    expect(out.field.width * out.field.height).toBe(out.field.values.length);
    expect(out.field.values).toContain(null);
  });

  it("exits non-zero with the field named on stderr for bad input", () => {
    const bad = structuredClone(input);
    bad.readings[4].ppm = -2;
    const r = run(bad);
    expect(r.status).not.toBe(0);
    expect(r.stdout).toBe("");
    expect(r.stderr).toMatch(/readings\[4\]\.ppm: ppm must not be negative/);
    const broken = run("{ not json");
    expect(broken.status).not.toBe(0);
    expect(broken.stderr).toMatch(/not valid JSON/);
  });
});
