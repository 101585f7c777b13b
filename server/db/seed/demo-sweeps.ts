/**
 * The demo's months of sweeps (all dates counted back from the seeding day): a leak appears at a
 * brazed joint behind Dairy 3, grows over two months, is pinpointed on a fans-stopped re-sweep, turned
 * into a finding and repaired, and is gone from the following months' maps. The latest sweep shows a
 * small new suspect on the meat line for the engineer to act on.
 */
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type { DbOrTx } from "../../api/plans/plan-access";
import { detectors, findingEvents, findings, fixtures, plans, readings, sweeps, systems } from "../schema/index";
import { DEMO_LEAK_STORY } from "./demo-story";
import { mulberry32, simulateDemoWalk } from "./demo-walk";

const DAY_MS = 86_400_000;

export interface DemoSweepIds {
  companyId: string;
  storeId: string;
  technicianId: string;
  engineerId: string;
  /** The seeding moment; every date is relative to it. */
  now: Date;
}

function isoDay(d: Date, timeZone: string): string {
  return new Intl.DateTimeFormat("sv-SE", { timeZone }).format(d);
}

export async function seedDemoSweeps(tx: DbOrTx, ids: DemoSweepIds, timeZone: string): Promise<void> {
  const [plan] = await tx.select().from(plans).where(eq(plans.storeId, ids.storeId));
  const planFixtures = await tx.select().from(fixtures).where(eq(fixtures.planId, plan.id));
  const byLabel = new Map(planFixtures.map((f) => [f.label, f]));
  const rackA = (await tx.select().from(systems).where(and(eq(systems.storeId, ids.storeId), eq(systems.refrigerantId, "R-448A"))))[0];

  const day = (offset: number) => new Date(Date.UTC(ids.now.getUTCFullYear(), ids.now.getUTCMonth(), ids.now.getUTCDate()) + offset * DAY_MS);
  const [diode, infrared] = await tx
    .insert(detectors)
    .values([
      { companyId: ids.companyId, name: "Heated-diode sniffer #2", principle: "heated-diode", transportDelayS: 5, timeConstantS: 1.5, alarmPpm: 2, lastCheckedOn: isoDay(day(-20), timeZone) },
      { companyId: ids.companyId, name: "Infrared leak detector", principle: "infrared", transportDelayS: 3.5, timeConstantS: 1, alarmPpm: 2, lastCheckedOn: isoDay(day(-170), timeZone) },
    ])
    .returning();

  const rand = mulberry32(20261);
  for (const month of DEMO_LEAK_STORY) {
    const det = month.detector === "infrared" ? infrared : diode;
    // 07:10 on the store's clock (Central time is UTC−6 in winter): before the store opens
    const startedAt = new Date(day(month.dayOffset).getTime() + (13 * 60 + 10) * 60_000);
    const taps = simulateDemoWalk({ leaks: month.leaks, fansRunning: month.fans === "running" }, { transportDelayS: det.transportDelayS, timeConstantS: det.timeConstantS, ceilingPpm: 500 }, rand, month.rechecks);
    const sweepId = randomUUID();
    const end = new Date(startedAt.getTime() + (taps[taps.length - 1].t + 60) * 1000);
    await tx.insert(sweeps).values({
      id: sweepId,
      companyId: ids.companyId,
      storeId: ids.storeId,
      planId: plan.id,
      detectorId: det.id,
      technicianId: ids.technicianId,
      systemIds: rackA ? [rackA.id] : [],
      fans: month.fans,
      defrost: month.fans === "stopped",
      status: month.reviewed ? "reviewed" : "submitted",
      transportDelayS: det.transportDelayS,
      timeConstantS: det.timeConstantS,
      alarmPpm: det.alarmPpm,
      warnings: [],
      startedAt,
      submittedAt: end,
      reviewedAt: month.reviewed ? new Date(end.getTime() + 2 * DAY_MS) : null,
      reviewedById: month.reviewed ? ids.engineerId : null,
      readingsRevision: 1,
    });
    await tx.insert(readings).values(
      taps.map((tap) => ({
        id: randomUUID(),
        sweepId,
        x: Math.min(plan.widthM! - 0.05, Math.max(0.05, tap.x)),
        y: Math.min(plan.heightM! - 0.05, Math.max(0.05, tap.y)),
        takenAt: new Date(startedAt.getTime() + Math.round(tap.t * 1000)),
        ppm: tap.ppm,
        atLeast: tap.atLeast,
        samplePoint: "grille" as const,
        note: "",
        recordedById: ids.technicianId,
        receivedAt: end,
        updatedAt: end,
      })),
    );

    if (month.finding) {
      const f = month.finding;
      const fixture = byLabel.get(f.fixtureLabel);
      const foundAt = new Date(end.getTime() + 10 * 60_000);
      const [row] = await tx
        .insert(findings)
        .values({ companyId: ids.companyId, storeId: ids.storeId, systemId: rackA?.id ?? null, planId: plan.id, sweepId, fixtureId: fixture?.id ?? null, x: f.x, y: f.y, component: f.component, source: "suspect-spot", status: "repaired", note: f.note, foundAt, foundById: ids.technicianId })
        .returning();
      const on = (offset: number) => isoDay(new Date(foundAt.getTime() + offset * DAY_MS), timeZone);
      await tx.insert(findingEvents).values([
        { findingId: row.id, kind: "found", status: "suspected", on: on(0), at: foundAt, byId: ids.technicianId, note: "Made from suspect spot 1 of the fans-stopped re-sweep." },
        { findingId: row.id, kind: "confirmed", status: "confirmed", on: on(0), at: new Date(foundAt.getTime() + 3_600_000), byId: ids.technicianId, note: f.confirmNote },
        { findingId: row.id, kind: "repaired", status: "repaired", on: on(1), at: new Date(foundAt.getTime() + DAY_MS), byId: ids.technicianId, note: f.repairNote },
      ]);
    }
  }
}
