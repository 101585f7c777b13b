/**
 * The demo's months of sweeps (all dates counted back from the seeding day; the story is in
 * demo-story.ts). Runs after the leak records are seeded: it uses their detectors when present and
 * links each finding of the story to the sweep it was made on, making the finding when absent.
 */
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type { DbOrTx } from "../tx";
import { detectors, findingEvents, findings, fixtures, plans, readings, sweeps, systems } from "../schema/index";
import { DEMO_LEAK_STORY, type DemoMonth } from "./demo-story";
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
  const rackA = (
    await tx
      .select()
      .from(systems)
      .where(and(eq(systems.storeId, ids.storeId), eq(systems.refrigerantId, "R-448A")))
  )[0];

  const day = (offset: number) =>
    new Date(Date.UTC(ids.now.getUTCFullYear(), ids.now.getUTCMonth(), ids.now.getUTCDate()) + offset * DAY_MS);
  let dets = await tx.select().from(detectors).where(eq(detectors.companyId, ids.companyId));
  if (dets.length === 0) {
    dets = await tx
      .insert(detectors)
      .values([
        {
          companyId: ids.companyId,
          name: "Heated-diode sniffer",
          principle: "heated-diode",
          transportDelayS: 5,
          timeConstantS: 1.5,
          alarmPpm: 2,
          lastCheckedOn: isoDay(day(-20), timeZone),
        },
        {
          companyId: ids.companyId,
          name: "Infrared detector",
          principle: "infrared",
          transportDelayS: 3.5,
          timeConstantS: 1,
          alarmPpm: 2,
          lastCheckedOn: isoDay(day(-26), timeZone),
        },
      ])
      .returning();
  }
  const detectorFor = (principle: string) => dets.find((d) => d.principle === principle) ?? dets[0];

  const rand = mulberry32(20261);
  for (const month of DEMO_LEAK_STORY) {
    const det = detectorFor(month.detector);
    // 07:10 on the store's clock (Central time is UTC−6 in winter): before the store opens
    const startedAt = new Date(day(month.dayOffset).getTime() + (13 * 60 + 10) * 60_000);
    const taps = simulateDemoWalk(
      { leaks: month.leaks, fansRunning: month.fans === "running" },
      { transportDelayS: det.transportDelayS, timeConstantS: det.timeConstantS, ceilingPpm: 500 },
      rand,
      month.rechecks,
    );
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

    if (month.finding)
      await linkOrMakeFinding(
        tx,
        ids,
        {
          planId: plan.id,
          sweepId,
          end,
          systemId: rackA?.id ?? null,
          fixtureId: byLabel.get(month.finding.fixtureLabel)?.id ?? null,
          timeZone,
        },
        month.finding,
      );
  }
}

/** The records' finding on this fixture found within a few days of the sweep gets the sweep's id; else one is made. */
async function linkOrMakeFinding(
  tx: DbOrTx,
  ids: DemoSweepIds,
  at: {
    planId: string;
    sweepId: string;
    end: Date;
    systemId: string | null;
    fixtureId: string | null;
    timeZone: string;
  },
  f: NonNullable<DemoMonth["finding"]>,
): Promise<void> {
  const onFixture = at.fixtureId
    ? await tx
        .select()
        .from(findings)
        .where(and(eq(findings.storeId, ids.storeId), eq(findings.fixtureId, at.fixtureId)))
    : [];
  const near = onFixture.find((r) => Math.abs(r.foundAt.getTime() - at.end.getTime()) < 4 * DAY_MS);
  if (near) {
    await tx
      .update(findings)
      .set({ sweepId: at.sweepId, source: "suspect-spot", x: f.x, y: f.y })
      .where(eq(findings.id, near.id));
    return;
  }
  const foundAt = new Date(at.end.getTime() + 10 * 60_000);
  const [row] = await tx
    .insert(findings)
    .values({
      companyId: ids.companyId,
      storeId: ids.storeId,
      systemId: at.systemId,
      planId: at.planId,
      sweepId: at.sweepId,
      fixtureId: at.fixtureId,
      x: f.x,
      y: f.y,
      component: f.component,
      source: "suspect-spot",
      status: f.status,
      note: f.note,
      foundAt,
      foundById: ids.technicianId,
    })
    .returning();
  const on = (offset: number) => isoDay(new Date(foundAt.getTime() + offset * DAY_MS), at.timeZone);
  const events: (typeof findingEvents.$inferInsert)[] = [
    {
      findingId: row.id,
      kind: "found",
      status: "suspected",
      on: on(0),
      at: foundAt,
      byId: ids.technicianId,
      note: "Made from suspect spot 1.",
    },
  ];
  if (f.status === "repaired") {
    events.push(
      {
        findingId: row.id,
        kind: "confirmed",
        status: "confirmed",
        on: on(0),
        at: new Date(foundAt.getTime() + 3_600_000),
        byId: ids.technicianId,
        note: "Bubble solution foamed at the joint.",
      },
      {
        findingId: row.id,
        kind: "repaired",
        status: "repaired",
        on: on(1),
        at: new Date(foundAt.getTime() + DAY_MS),
        byId: ids.technicianId,
        note: "Re-made and pressure tested with nitrogen.",
      },
    );
  }
  await tx.insert(findingEvents).values(events);
}
