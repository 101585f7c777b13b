import { eq } from "drizzle-orm";
import type { DbOrTx } from "../tx";
import { addDays } from "#core/domain/dates/calendar-date";
import { localDateOf } from "#core/domain/dates/time-zone";
import type { Role } from "#core/domain/roles";
import { KG_PER_POUND } from "#core/domain/units/mass";
import {
  chargeAdditions,
  detectors,
  findingEvents,
  findings,
  fixtures,
  plans,
  systemRevisions,
  systems,
} from "../schema/index";

type EventKind = (typeof findingEvents.$inferInsert)["kind"];
type Status = (typeof findingEvents.$inferInsert)["status"];

/**
 * The demo store's records, dated back from the seeding day on the store's calendar so the
 * picture stays true whenever it is seeded (US federal rules, annualizing method):
 * - Rack A (R-448A, 1,150 lb): an earlier breach repaired, verified and closed; a new breach 12 days
 *   ago with a confirmed leak at the Dairy 3 case still open (repair due in 18 days); quarterly
 *   inspections since the first breach, the next one due in a few days.
 * - Walk-in condensing unit (R-404A, 38 lb): a breach four months ago, repaired and verified.
 * - Rack B: a top-up; no leak-rate rule applies to CO2 (GWP 1).
 */
export async function seedDemoCompliance(
  tx: DbOrTx,
  ids: { companyId: string; storeId: string; timeZone: string; people: Record<Role, string> },
  now = new Date(),
): Promise<void> {
  const today = localDateOf(now, ids.timeZone);
  const day = (n: number) => addDays(today, -n);
  // The systems were put on record well before their first addition.
  await tx
    .update(systems)
    .set({ createdAt: new Date(`${day(420)}T17:00:00Z`), inServiceOn: day(420) })
    .where(eq(systems.storeId, ids.storeId));
  const rows = await tx.select().from(systems).where(eq(systems.storeId, ids.storeId));
  // Each system's first revision, as entering a system writes one (docs/decisions/0043-system-revisions.md).
  await tx.insert(systemRevisions).values(
    rows.map((r) => ({
      companyId: ids.companyId,
      systemId: r.id,
      effectiveFrom: day(420),
      kind: "first" as const,
      refrigerantId: r.refrigerantId,
      fullChargeKg: r.fullChargeKg,
      applianceType: r.applianceType,
      automaticLeakDetection: r.automaticLeakDetection,
      inServiceOn: day(420),
      reason: "Entered",
      byId: ids.people["lead-tech"],
      recordedAt: new Date(`${day(420)}T17:00:00Z`),
    })),
  );
  const sys = (refrigerantId: string) => rows.find((r) => r.refrigerantId === refrigerantId)!;
  const rackA = sys("R-448A");
  const rackB = sys("R-744");
  const walkIns = sys("R-404A");
  const [plan] = await tx.select({ id: plans.id }).from(plans).where(eq(plans.storeId, ids.storeId)).limit(1);
  const layout = plan ? await tx.select().from(fixtures).where(eq(fixtures.planId, plan.id)) : [];
  const spot = (label: string, dy = 0) => {
    const f = layout.find((x) => x.label === label);
    if (!f) return { planId: plan?.id ?? null, fixtureId: null, x: null, y: null };
    const pts = f.polygon ?? [[f.pointX ?? 0, f.pointY ?? 0]];
    const x = pts.reduce((s, p) => s + p[0], 0) / pts.length;
    const y = Math.max(...pts.map((p) => p[1])) + dy; // at the case front
    return { planId: plan!.id, fixtureId: f.id, x, y };
  };

  const { people } = ids;
  const add = (
    systemId: string,
    daysAgo: number,
    lb: number,
    by: string,
    reason: string,
    findingId: string | null = null,
  ) =>
    tx.insert(chargeAdditions).values({
      companyId: ids.companyId,
      systemId,
      addedOn: day(daysAgo),
      amountKg: lb * KG_PER_POUND,
      enteredValue: lb,
      enteredUnit: "lb",
      technicianId: by,
      reason,
      findingId,
      recordedById: by,
      recordedAt: new Date(`${day(daysAgo)}T20:00:00Z`),
    });

  let tick = 0;
  async function finding(input: {
    systemId: string;
    where: ReturnType<typeof spot>;
    component: string;
    source: "walk" | "manual";
    note: string;
    steps: [EventKind, Status, number, string, ("passed" | "failed")?, string?][];
  }) {
    const [first] = input.steps;
    const [row] = await tx
      .insert(findings)
      .values({
        companyId: ids.companyId,
        storeId: ids.storeId,
        systemId: input.systemId,
        ...input.where,
        component: input.component,
        source: input.source,
        status: input.steps.at(-1)![1],
        note: input.note,
        foundAt: new Date(`${day(first[2])}T16:00:00Z`),
        foundById: first[3],
      })
      .returning({ id: findings.id });
    for (const [kind, status, daysAgo, by, result, note] of input.steps) {
      tick += 1;
      await tx.insert(findingEvents).values({
        findingId: row.id,
        kind,
        status,
        on: day(daysAgo),
        at: new Date(Date.parse(`${day(daysAgo)}T16:00:00Z`) + tick * 60_000),
        byId: by,
        result: result ?? null,
        note: note ?? "",
      });
    }
    return row.id;
  }

  const tech = people.technician;
  const lead = people["lead-tech"];
  const engineer = people.engineer;

  // Rack A. 150 lb into 1,150 lb after 212 days: 22.5 % > 20 % (40 CFR 84.102 annualizing).
  await add(rackA.id, 300, 40, lead, "Seasonal top-up after the summer service");
  const earlier = await finding({
    systemId: rackA.id,
    where: spot("Meat 2"),
    component: "flare",
    source: "walk",
    note: "Oily flare nut at the liquid-line drop; reading rose to 14 ppm at the case front.",
    steps: [
      ["found", "suspected", 89, tech],
      ["confirmed", "confirmed", 88, tech, undefined, "Bubble test positive at the flare."],
      ["repaired", "repaired", 86, lead, undefined, "Flare re-made with a new nut."],
      ["initial-test", "repaired", 86, lead, "passed", "Standing nitrogen test before recharge, no drop."],
      ["follow-up-test", "verified", 78, tech, "passed", "Electronic check at normal operation, nothing found."],
      ["closed", "closed", 75, engineer, undefined, "Records complete."],
    ],
  });
  await add(rackA.id, 88, 150, tech, "Low receiver level after the Meat 2 leak", earlier);
  // 90 lb after 76 more days: 37.6 % > 20 %, learned 12 days ago; repair due in 18 days.
  const open = await finding({
    systemId: rackA.id,
    where: spot("Dairy 3"),
    component: "brazed-joint",
    source: "walk",
    note: "Steady 9 ppm at the return-air grille of Dairy 3; traced to a brazed joint on the suction line under the case.",
    steps: [
      ["found", "suspected", 13, tech],
      ["confirmed", "confirmed", 12, tech, undefined, "Confirmed with soap solution at the brazed elbow."],
    ],
  });
  await add(rackA.id, 12, 90, tech, "Low-level alarm on the receiver", open);

  // Walk-ins. 5 lb into 38 lb after 30 days: 160 % > 20 %; repaired the next day and verified.
  await add(walkIns.id, 150, 3, tech, "Top-up after defrost heater replacement");
  const coil = await finding({
    systemId: walkIns.id,
    where: spot("Dairy walk-in cooler"),
    component: "coil",
    source: "manual",
    note: "Pinhole in the evaporator coil return bend.",
    steps: [
      ["found", "suspected", 121, tech],
      ["confirmed", "confirmed", 120, tech],
      ["repaired", "repaired", 119, lead, undefined, "Return bend brazed."],
      ["initial-test", "repaired", 119, lead, "passed"],
      ["follow-up-test", "verified", 111, lead, "passed"],
    ],
  });
  await add(walkIns.id, 120, 5, tech, "Recharge after the coil leak", coil);

  // Rack B: CO2 is topped up too, but no leak-rate threshold applies to it (GWP 1, not above 53).
  await add(rackB.id, 40, 10, lead, "Top-up after gas cooler service");

  // The two detectors: one checked recently, one due in a few days (company interval 30 days).
  await tx.insert(detectors).values([
    {
      companyId: ids.companyId,
      name: "Heated-diode sniffer (van 1)",
      principle: "heated-diode",
      lastCheckedOn: day(9),
    },
    { companyId: ids.companyId, name: "Infrared detector (van 2)", principle: "infrared", lastCheckedOn: day(26) },
  ]);
}
