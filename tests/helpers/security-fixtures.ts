import { detectors, systems } from "../../server/db/schema/index";
import type { Role } from "#core/domain/roles";
import { ROLES } from "#core/domain/roles";
import { seedCompany } from "./fixtures";
import { signIn, type Agent, type TestApp } from "./test-app";

/** The ids a route's path may name, for one store of one company. */
export interface StoreIds {
  store: string;
  plan: string;
  sweep: string;
  reading: string;
  system: string;
  finding: string;
}

export interface CompanyFixture {
  co: Awaited<ReturnType<typeof seedCompany>>;
  agents: Record<Role, Agent>;
  detector: string;
  member: string;
  /** The store the store contact is scoped to, and the company's other store. */
  main: StoreIds;
  other: StoreIds;
  /** Every id and name of this company, to look for in another company's answers. */
  secrets: string[];
}

async function storeIds(owner: Agent, t: TestApp, companyId: string, storeId: string, detector: string) {
  const plan = (await owner.post(`/api/stores/${storeId}/plans/blank`, { width: 40, depth: 25, unit: "m" })).body.id;
  const [s] = await t.ctx.db
    .insert(systems)
    .values({
      companyId,
      storeId,
      name: `Rack ${storeId.slice(0, 4)}`,
      refrigerantId: "R-448A",
      fullChargeKg: 300,
      applianceType: "commercial-refrigeration",
    })
    .returning();
  const sweep = (
    await owner.post(`/api/stores/${storeId}/sweeps`, {
      planId: plan,
      detectorId: detector,
      fans: "running",
      defrost: false,
    })
  ).body.id;
  const reading = crypto.randomUUID();
  await owner.post(`/api/sweeps/${sweep}/readings`, {
    readings: [{ id: reading, x: 2, y: 2, takenAt: new Date().toISOString(), ppm: 5, samplePoint: "grille" }],
  });
  const finding = (
    await owner.post(`/api/stores/${storeId}/findings`, { systemId: s.id, status: "suspected", note: "Oil at a flare" })
  ).body.id;
  const ids = { store: storeId, plan, sweep, reading, system: s.id, finding };
  for (const [k, v] of Object.entries(ids)) if (!v) throw new Error(`fixture ${k} was not made`);
  return ids;
}

/** A company with one member of each role signed in, and a plan, sweep, system and finding in each of its two stores. */
export async function companyFixture(t: TestApp, name: string): Promise<CompanyFixture> {
  const co = await seedCompany(t.ctx, name);
  const agents = {} as Record<Role, Agent>;
  for (const role of ROLES) agents[role] = await signIn(t.app, co.people[role]);
  const [d] = await t.ctx.db
    .insert(detectors)
    .values({
      companyId: co.company.id,
      name: `${name} sniffer`,
      principle: "heated-diode",
      lastCheckedOn: "2026-11-01",
    })
    .returning();
  const main = await storeIds(agents.owner, t, co.company.id, co.store.id, d.id);
  const other = await storeIds(agents.owner, t, co.company.id, co.otherStore.id, d.id);
  const secrets = [
    name,
    co.company.id,
    d.id,
    ...Object.values(main),
    ...Object.values(other),
    ...Object.values(co.people).flatMap((p) => [p.email, p.userId, p.membershipId]),
  ];
  return { co, agents, detector: d.id, member: co.people.technician.membershipId, main, other, secrets };
}

/** A route's path with real ids put in: those of `ids` (one store of a company) and its company. */
export function fillPath(path: string, f: CompanyFixture, ids: StoreIds): string {
  const first = path.split("/")[2];
  const byResource: Record<string, string> = {
    stores: ids.store,
    plans: ids.plan,
    detectors: f.detector,
    systems: ids.system,
    sweeps: ids.sweep,
    findings: ids.finding,
    team: f.member,
  };
  return path
    .replace(":storeId", ids.store)
    .replace(":readingId", ids.reading)
    .replace(":photoId", crypto.randomUUID())
    .replace(":passId", crypto.randomUUID())
    .replace(":token", "a".repeat(43))
    .replace(":id", byResource[first] ?? crypto.randomUUID());
}
