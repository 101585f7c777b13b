/**
 * npm run bench:fieldmap — the field map's speed targets (docs/benchmarks.md), measured (not a test):
 *  1. drawing a 96,000-cell field over the plan in Chromium (playwright-core), target < 200 ms;
 *  2. a sweep report PDF for a 500-reading sweep (field map drawn with jimp + pdfkit), target < 3 s.
 * The field is the locator's own output for the 100 m × 60 m benchmark store at 0.25 m cells.
 */
import { commandLineOutput } from "#core/domain/locator-words/command-line-output";
import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { performance } from "node:perf_hooks";
import { build } from "vite";
import { chromium } from "playwright-core";
import { Jimp, JimpMime } from "jimp";
import { locate } from "#core/analysis/locate";
import { parseLocatorInput } from "#core/contracts/locator-input";
import { CONCENTRATION_LUT, createConcentrationScale } from "#core/domain/fieldmap/concentration-ramp";
import { encodeField } from "#core/domain/fieldmap/field-codec";
import type { SweepReportModel } from "#core/domain/reports/sweep-report-model";
import { renderFieldMapPng } from "../../server/reports/field-map-png";
import { buildSweepReportPdf } from "../../server/reports/sweep-report-pdf";
import { cautionsFor } from "#core/domain/safety/cautions";
import { syntheticStore } from "./synthetic-store";

async function bundlePage(): Promise<string> {
  const out = mkdtempSync(join(tmpdir(), "plumeline-bench-fieldmap-"));
  await build({
    configFile: false,
    logLevel: "error",
    build: {
      outDir: out,
      emptyOutDir: true,
      minify: true,
      lib: {
        entry: join(import.meta.dirname, "fieldmap-page.ts"),
        formats: ["iife"],
        name: "benchFieldmap",
        fileName: () => "page.js",
      },
    },
  });
  return readFileSync(join(out, "page.js"), "utf8");
}

async function chromiumDraw(encoded: ReturnType<typeof encodeField>, widthM: number, heightM: number) {
  const script = await bundlePage();
  const browser = await chromium.launch({
    executablePath: "/usr/bin/chromium",
    args: ["--no-sandbox", "--disable-gpu", "--no-first-run", "--disable-background-networking"],
  });
  try {
    const page = await browser.newPage();
    await page.setContent("<!doctype html><html><body></body></html>");
    await page.addScriptTag({ content: script });
    return await page.evaluate(
      ({ encoded, widthM, heightM }) =>
        (window as unknown as { benchDraw: Function }).benchDraw(encoded, widthM, heightM, 20),
      { encoded, widthM, heightM },
    );
  } finally {
    await browser.close();
  }
}

async function reportPdf(result: ReturnType<typeof locate>, input: ReturnType<typeof parseLocatorInput>) {
  // a plan display copy of 1600 × 960 px (a 100 m × 60 m drawing)
  const planPng = await new Jimp({ width: 1600, height: 960, color: 0xffffffff }).getBuffer(JimpMime.png);
  const scale = createConcentrationScale({ maxPpm: 100, log: true });
  const times: number[] = [];
  let bytes = 0;
  for (let run = 0; run < 5; run++) {
    const t0 = performance.now();
    const png = await renderFieldMapPng({
      planImage: planPng,
      widthM: input.plan.width,
      heightM: input.plan.height,
      field: result.field,
      lut: CONCENTRATION_LUT,
      index: scale.index,
      outlines: input.plan.obstacles.map((o) => o.polygon),
      spots: result.candidates.map((c) => ({ x: c.x, y: c.y, radiusM: c.radius })),
      widthPx: 1400,
    });
    const words = commandLineOutput(input, result);
    const model: SweepReportModel = {
      title: "Sweep report — Benchmark Foods – Riverside",
      paper: "a4",
      company: "Benchmark Foods",
      store: { name: "Benchmark Foods – Riverside", address: "1 Test Way", timeZone: "Europe/Warsaw" },
      sweep: {
        started: "Tue 1 Dec 2026, 07:10",
        submitted: "Tue 1 Dec 2026, 08:02",
        status: "submitted",
        technician: "Łucja Żak",
        conditions: "fans running",
      },
      detector: {
        name: "Diode #1",
        principle: "heated diode",
        calibration: "last checked 2026-11-20",
        settings: "transport delay 5 s, time constant 1.5 s, alarm at 2 ppm",
      },
      background: `${result.background.ppm.toFixed(1)} ppm`,
      delayCheck: "—",
      noSpot: "No credible leak: nothing stands out from the background on this sweep.",
      assumptions: words.assumptions,
      suspects: words.candidates.map((c) => ({
        rank: c.rank,
        position: `${c.x.toFixed(1)} m, ${c.y.toFixed(1)} m`,
        radius: `${c.radius.toFixed(1)} m`,
        score: c.score.toFixed(2),
        strength: c.strength.toFixed(2),
        fixture: c.fixtureId ?? "open floor",
        riskPoint: c.riskPointId ?? "none near",
        reason: c.reason,
        nextCheck: c.nextCheck,
        x: c.x,
        y: c.y,
        radiusM: c.radius,
      })),
      diagnostics: words.diagnostics.map((d) => d.message),
      findings: [],
      readings: result.readings.map((r, i) => ({
        n: i + 1,
        time: `07:${String(10 + Math.floor(r.t / 60)).padStart(2, "0")}`,
        raw: `${r.raw.x.toFixed(1)} m, ${r.raw.y.toFixed(1)} m`,
        corrected: `${r.corrected.x.toFixed(1)} m, ${r.corrected.y.toFixed(1)} m`,
        ppm: String(r.ppm),
        point: "Case front / grille",
        note: "",
      })),
      cautions: cautionsFor().map((c) => ({ text: c.text, source: c.source })),
      map: { png, widthM: input.plan.width, heightM: input.plan.height, legend: "legend" },
      generated: "made now",
    };
    const pdf = await buildSweepReportPdf(model);
    times.push(performance.now() - t0);
    bytes = pdf.length;
  }
  return { times, bytes };
}

const input = parseLocatorInput(syntheticStore(500));
const t0 = performance.now();
const result = locate(input);
const locateMs = performance.now() - t0;
const cells = result.field.width * result.field.height;
console.log(
  `store ${input.plan.width} m × ${input.plan.height} m, ${input.readings.length} readings, field ${result.field.width} × ${result.field.height} = ${cells} cells (locate ${locateMs.toFixed(0)} ms, not part of either figure)`,
);

const draw = await chromiumDraw(encodeField(result.field), input.plan.width, input.plan.height);
console.log(
  `Chromium: decode ${draw.decodeMs.toFixed(1)} ms; draw the ${draw.cells}-cell field over the plan: first ${draw.firstMs.toFixed(1)} ms, median of 20 ${draw.medianMs.toFixed(1)} ms, max ${draw.maxMs.toFixed(1)} ms (target < 200 ms) ${draw.medianMs < 200 ? "OK" : "OVER"}`,
);

const pdf = await reportPdf(result, input);
const sorted = [...pdf.times].sort((a, b) => a - b);
const med = sorted[Math.floor(sorted.length / 2)];
console.log(
  `Report PDF, ${input.readings.length} readings (jimp field map + pdfkit, ${(pdf.bytes / 1024).toFixed(0)} KB): first ${pdf.times[0].toFixed(0)} ms, median of 5 ${med.toFixed(0)} ms (target < 3000 ms) ${med < 3000 ? "OK" : "OVER"}`,
);
