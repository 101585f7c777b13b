/**
 * Gathers a sweep's report: the fresh analysis at the sweep's own settings, the store, detector,
 * technician, plan and fixtures, the findings made from the sweep and the readings, all worded in the
 * reader's length unit and the store's time zone.
 */
import { and, asc, eq, inArray } from "drizzle-orm";
import type { AppContext } from "../../context";
import {
  companies,
  detectors,
  findingEvents,
  findings,
  fixtures,
  plans,
  readings,
  stores,
  sweepPasses,
  systems,
  users,
} from "../../db/schema/index";
import { SAMPLE_POINT_LABELS } from "#core/contracts/sweeps";
import { COMPONENT_LABELS } from "#core/contracts/findings";
import { createConcentrationScale, niceMaxPpm } from "#core/domain/fieldmap/concentration-ramp";
import type { FieldGridLike } from "#core/domain/fieldmap/field-grid";
import type { CsvReading } from "#core/domain/reports/readings-csv";
import type { SweepReportModel } from "#core/domain/reports/sweep-report-model";
import { lookupFor } from "../refrigerants/company-refrigerant-lookup";
import { cautionsFor, type Caution } from "#core/domain/safety/cautions";
import { formatLength } from "#core/domain/units/format-units";
import { formatGrouped, formatQuantity, type NumberFormat } from "#core/domain/numbers/number-format";
import { presentAnalysis } from "#core/domain/locator-words/present-analysis";
import { gramsPerYear } from "#core/domain/locator-words/spot-words";
import { massPerYearWords } from "#core/domain/locator-words/mass-words";
import type { ReaderUnits } from "./reader-units";
import { withRefrigerants } from "../analysis/spot-refrigerants";
import { HttpError } from "../../lib/http-error";
import type { Viewer } from "../../access/store-access";
import { loadVisibleSweep, type SweepRow } from "../../access/sweep-access";
import { ensureAnalysis, rowField, type AnalysisRow } from "../analysis/analysis.service";
import { companyRules } from "../compliance/system-records";
import { companyPaper } from "../../reports/company-paper";
import { formatInZone } from "#core/domain/dates/format-in-zone";
import { passNumberOf, sweepConditionsWords } from "#core/domain/sweeps/pass-words";

export interface ReportFacts {
  sweep: SweepRow;
  storeName: string;
  timeZone: string;
  model: SweepReportModel;
  csv: CsvReading[];
  field: FieldGridLike | null;
  maxPpm: number;
  planImage: { displayKey: string | null; widthM: number; heightM: number };
  outlines: [number, number][][];
  /** The company's number format, for what is worded outside the model (the map's legend). */
  numbers: NumberFormat;
}

export function zonedDateTime(d: Date, timeZone: string): string {
  return formatInZone(d, timeZone, "dateTime");
}

function zonedTime(d: Date, timeZone: string): string {
  return formatInZone(d, timeZone, "time");
}

const PRINCIPLES: Record<string, string> = {
  "heated-diode": "heated diode",
  infrared: "infrared",
  other: "other principle",
};

export async function loadReportFacts(
  ctx: AppContext,
  viewer: Viewer,
  sweepId: string,
  units: ReaderUnits,
): Promise<ReportFacts> {
  const unit = units.length;
  const sweep = await loadVisibleSweep(ctx, viewer, sweepId);
  let analysis: AnalysisRow | null = null;
  let analysisProblem: string | null = null;
  try {
    analysis = await ensureAnalysis(ctx, sweep);
  } catch (err) {
    if (!(err instanceof HttpError)) throw err;
    analysisProblem = err.message;
  }
  const [[store], [company], [det], [tech], [plan], rules] = await Promise.all([
    ctx.db.select().from(stores).where(eq(stores.id, sweep.storeId)),
    ctx.db.select({ name: companies.name }).from(companies).where(eq(companies.id, sweep.companyId)),
    ctx.db.select().from(detectors).where(eq(detectors.id, sweep.detectorId)),
    ctx.db.select({ name: users.name }).from(users).where(eq(users.id, sweep.technicianId)),
    ctx.db.select().from(plans).where(eq(plans.id, sweep.planId)),
    companyRules(ctx, sweep.companyId),
  ]);
  const tz = store.timeZone;
  const paper = await companyPaper(ctx, sweep.companyId, rules.profile);
  const [fixtureRows, readingRows, findingRows, systemRows, passRows] = await Promise.all([
    ctx.db.select().from(fixtures).where(eq(fixtures.planId, sweep.planId)).orderBy(asc(fixtures.position)),
    ctx.db
      .select()
      .from(readings)
      .where(eq(readings.sweepId, sweep.id))
      .orderBy(asc(readings.takenAt), asc(readings.id)),
    ctx.db
      .select()
      .from(findings)
      .where(and(eq(findings.sweepId, sweep.id), eq(findings.companyId, sweep.companyId)))
      .orderBy(asc(findings.foundAt)),
    sweep.systemIds.length
      ? ctx.db.select().from(systems).where(inArray(systems.id, sweep.systemIds))
      : Promise.resolve([]),
    ctx.db
      .select()
      .from(sweepPasses)
      .where(eq(sweepPasses.sweepId, sweep.id))
      .orderBy(asc(sweepPasses.startedAt), asc(sweepPasses.id)),
  ]);
  // A finding closed because its system left service reads so in the report (docs/decisions/0166).
  const leftService = findingRows.length
    ? new Set(
        (
          await ctx.db
            .select({ id: findingEvents.findingId })
            .from(findingEvents)
            .where(
              and(
                inArray(
                  findingEvents.findingId,
                  findingRows.map((f) => f.id),
                ),
                eq(findingEvents.kind, "closed-left-service"),
              ),
            )
        ).map((r) => r.id),
      )
    : new Set<string>();
  const passOf = passNumberOf(passRows);
  const label = new Map(fixtureRows.map((f) => [f.id, f.label || f.kind]));
  const fmt = units.number;
  // Metres to one decimal in the company's number format; feet and inches to the half inch.
  const len = (m: number) => (unit === "m" ? `${formatGrouped(m, fmt, 1)} m` : formatLength(m, unit));
  const qty = (v: number) => formatQuantity(v, fmt);
  const pos = (x: number, y: number) => `${len(x)}, ${len(y)}`;
  const summary = analysis?.result ?? null;
  const spots = summary ? await withRefrigerants(ctx, sweep.planId, summary.candidates) : [];
  // The report goes to people with no unit preference (store contacts): a strength reads in the
  // reader's mass unit first and the other in brackets, as the leak-rate statement does (decision 0103).
  const otherMass = units.mass === "lb" ? "kg" : "lb";
  const bothMasses = (strength: string, i: number) => {
    const s = spots[i];
    if (!s || !Number.isFinite(s.molPerYear)) return strength;
    const grams = gramsPerYear(s, s.refrigerant);
    const first = massPerYearWords(grams, units.mass, fmt);
    return strength.replace(first, `${first} (${massPerYearWords(grams, otherMass, fmt)})`);
  };
  const words = summary
    ? presentAnalysis(
        {
          ...summary,
          candidates: spots,
          params: analysis!.params,
        },
        {
          length: units.length,
          mass: units.mass,
          numbers: units.number,
          names: new Map(fixtureRows.map((f) => [f.id, f.label])),
          delaySetByHand: false,
        },
      )
    : null;
  const corrected = new Map(summary?.readings.map((r) => [r.readingId, r]) ?? []);
  const maxPpm = niceMaxPpm(Math.max(0, ...readingRows.map((r) => r.ppm)), sweep.alarmPpm);
  const scale = createConcentrationScale({ maxPpm, log: true });
  const t0 = Math.min(sweep.startedAt.getTime(), readingRows[0]?.takenAt.getTime() ?? Infinity);

  const cautions = new Map<string, Caution>();
  const lookup = await lookupFor(ctx, sweep.companyId);
  for (const s of systemRows) {
    const r = lookup(s.refrigerantId);
    for (const c of cautionsFor(r ? { refrigerant: r } : {})) cautions.set(c.id, c);
  }
  if (cautions.size === 0) for (const c of cautionsFor()) cautions.set(c.id, c);

  const model: SweepReportModel = {
    title: `Sweep report — ${store.name}`,
    company: company?.name ?? "",
    paper,
    store: { name: store.name, address: store.address, timeZone: tz },
    sweep: {
      started: zonedDateTime(sweep.startedAt, tz),
      submitted: sweep.submittedAt ? zonedDateTime(sweep.submittedAt, tz) : "not yet submitted",
      status:
        sweep.status === "reviewed" && sweep.reviewedAt
          ? `reviewed ${zonedDateTime(sweep.reviewedAt, tz)}`
          : sweep.status.replace("-", " "),
      technician: tech?.name ?? "",
      conditions: sweepConditionsWords(
        sweep,
        passRows,
        (id) => label.get(id) ?? "a fixture",
        (d) => zonedTime(d, tz),
      ),
    },
    detector: {
      name: det?.name ?? "",
      principle: PRINCIPLES[det?.principle ?? "other"] ?? "other principle",
      calibration: det?.lastCheckedOn ? `last checked ${det.lastCheckedOn}` : "no calibration / bump check on record",
      settings: `transport delay ${qty(sweep.transportDelayS)} s, response time constant ${qty(sweep.timeConstantS)} s, alarm at ${qty(sweep.alarmPpm)} ppm (as at the sweep)`,
    },
    background: summary ? `${formatGrouped(summary.background.ppm, fmt, 1)} ppm (estimated from the readings)` : "—",
    delayCheck: words ? `${words.delay.headline} ${words.delay.detail}` : "—",
    suspects: (summary?.candidates ?? []).map((c, i) => ({
      rank: c.rank,
      position: pos(c.x, c.y),
      radius: len(c.radius),
      score: formatGrouped(c.score, fmt, 2),
      strength: bothMasses(words!.spots[i].strength, i),
      fixture: words!.spots[i].place,
      riskPoint: words!.spots[i].riskPoint,
      reason: words!.spots[i].reason,
      nextCheck: words!.spots[i].nextCheck,
      x: c.x,
      y: c.y,
      radiusM: c.radius,
    })),
    noSpot: words?.noSpot ?? "The sweep could not be analysed, so nothing can be said about leaks from it.",
    assumptions: words?.assumptions ?? [],
    diagnostics: [...(analysisProblem ? [analysisProblem] : []), ...(words?.diagnostics.map((d) => d.text) ?? [])],
    findings: findingRows.map((f) => ({
      status: leftService.has(f.id) ? "closed-left-service" : f.status,
      found: zonedDateTime(f.foundAt, tz),
      where:
        [
          f.fixtureId ? label.get(f.fixtureId) : null,
          f.component ? COMPONENT_LABELS[f.component as keyof typeof COMPONENT_LABELS] : null,
          f.x !== null && f.y !== null ? pos(f.x, f.y) : null,
        ]
          .filter(Boolean)
          .join(", ") || "on the plan",
      note: f.note,
      x: f.x,
      y: f.y,
    })),
    readings: readingRows.map((r, i) => {
      const c = corrected.get(r.id);
      return {
        n: i + 1,
        time: zonedTime(r.takenAt, tz),
        raw: pos(r.x, r.y),
        corrected: c ? pos(c.corrected.x, c.corrected.y) : "—",
        ppm: `${r.atLeast ? "≥ " : ""}${qty(r.ppm)}`,
        // the pass a reading was taken in, when the sweep had more than one
        point: `${SAMPLE_POINT_LABELS[r.samplePoint]}${passRows.length ? `, pass ${passOf(r.passId)}` : ""}`,
        note: r.note,
      };
    }),
    cautions: [...cautions.values()].map((c) => ({ text: c.text, source: c.source })),
    map: null,
    generated: `made ${zonedDateTime(new Date(), tz)}`,
  };
  const csv: CsvReading[] = readingRows.map((r) => {
    const c = corrected.get(r.id);
    return {
      id: r.id,
      takenAt: r.takenAt,
      t: (r.takenAt.getTime() - t0) / 1000,
      raw: { x: r.x, y: r.y },
      corrected: c ? c.corrected : null,
      ppm: r.ppm,
      atLeast: r.atLeast,
      samplePoint: r.samplePoint,
      note: r.note,
      flags: c?.flags ?? [],
    };
  });
  const outlines = fixtureRows.filter((f) => f.polygon).map((f) => f.polygon as [number, number][]);
  return {
    sweep,
    storeName: store.name,
    timeZone: tz,
    model,
    csv,
    field: analysis ? rowField(analysis) : null,
    maxPpm: scale.maxPpm,
    planImage: {
      displayKey: plan.source === "image" ? plan.displayKey : null,
      widthM: plan.widthM ?? 1,
      heightM: plan.heightM ?? 1,
    },
    outlines,
    numbers: fmt,
  };
}
