import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { agentFor, createTestApp, signIn, type Agent, type TestApp } from "../helpers/test-app";
import { seedCompany } from "../helpers/fixtures";
import { bodyArbitrary } from "../helpers/schema-arbitrary";
import { detectors, systems } from "../../server/db/schema/index";
import { routeTable, type RouteEntry } from "../../server/lib/route-table";

// Every write route the routers declare (server/lib/route-table.ts reads them from the app), sent
// bodies made from its own zod contract: valid-looking ones, ones with one hostile field, and
// arbitrary JSON. No answer may be a 500, and a validation error must name its field.
// FUZZ_RUNS (default 40) bodies per route; FUZZ_SEED replays a run.

const RUNS = Number(process.env.FUZZ_RUNS ?? 40);
const SEED = Number(process.env.FUZZ_SEED ?? 20261205);

let t: TestApp;
let owner: Agent;
let anonymous: Agent;
let co: Awaited<ReturnType<typeof seedCompany>>;
const ids: Record<string, string> = {};

beforeAll(async () => {
  t = await createTestApp({ resetRateLimit: { perAddress: 1e6, perClient: 1e6 } });
  co = await seedCompany(t.ctx, "Kestrel Foods");
  owner = await signIn(t.app, co.people.owner);
  anonymous = await agentFor(t.app);
  ids.store = co.store.id;
  ids.plan = (await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 40, depth: 25, unit: "m" })).body.id;
  const [d] = await t.ctx.db
    .insert(detectors)
    .values({ companyId: co.company.id, name: "Diode sniffer", principle: "heated-diode", lastCheckedOn: "2026-11-01" })
    .returning();
  ids.detector = d.id;
  const [s] = await t.ctx.db
    .insert(systems)
    .values({
      companyId: co.company.id,
      storeId: co.store.id,
      name: "Rack A",
      refrigerantId: "R-448A",
      fullChargeKg: 300,
      applianceType: "commercial-refrigeration",
    })
    .returning();
  ids.system = s.id;
  const sweep = await owner.post(`/api/stores/${co.store.id}/sweeps`, {
    planId: ids.plan,
    detectorId: ids.detector,
    fans: "running",
    defrost: false,
  });
  ids.sweep = sweep.body.id;
  ids.reading = crypto.randomUUID();
  await owner.post(`/api/sweeps/${ids.sweep}/readings`, {
    readings: [{ id: ids.reading, x: 2, y: 2, takenAt: new Date().toISOString(), ppm: 5, samplePoint: "grille" }],
  });
  ids.member = co.people.technician.membershipId;
  for (const [k, v] of Object.entries(ids)) if (!v) throw new Error(`fixture ${k} was not made`);
});
afterAll(() => t.close());

/** The real id a path parameter should carry, so requests reach the service and not just a 404. */
function fillPath(path: string): string {
  const first = path.split("/")[2];
  const byResource: Record<string, string> = {
    stores: ids.store,
    plans: ids.plan,
    detectors: ids.detector,
    systems: ids.system,
    sweeps: ids.sweep,
    team: ids.member,
  };
  return path
    .replace(":storeId", ids.store)
    .replace(":readingId", ids.reading)
    .replace(":token", "a".repeat(43))
    .replace(":id", byResource[first] ?? crypto.randomUUID());
}

const writes = () =>
  routeTable(t.app)
    .filter((r) => r.method !== "get")
    // Deletes last: the other routes still find what they delete.
    .sort((a, b) => Number(a.method === "delete") - Number(b.method === "delete"));

function agentFor_(r: RouteEntry): Agent {
  return r.requires.user ? owner : anonymous;
}

describe("fuzzing every write route from its contract", () => {
  it("never answers 500, and names the field of every validation error", { timeout: 600_000 }, async () => {
    const routes = writes();
    expect(routes.length).toBeGreaterThan(40);
    let requests = 0;
    const failures: string[] = [];
    for (const [n, route] of routes.entries()) {
      const bodies = fc.sample(bodyArbitrary(route.body), { numRuns: RUNS, seed: SEED + n });
      for (const body of bodies) {
        const a = agentFor_(route);
        const url = fillPath(route.path);
        const res = await a.agent[route.method](url)
          .set("X-CSRF-Token", a.csrf)
          .set("Content-Type", "application/json")
          .send(JSON.stringify(body));
        requests++;
        const err = res.body?.error;
        const named = err?.fields && Object.keys(err.fields).length > 0;
        if (res.status >= 500 || (res.status === 400 && err?.code === "validation_failed" && !named))
          failures.push(
            `${route.method.toUpperCase()} ${route.path} → ${res.status} ${JSON.stringify(err)} for ${JSON.stringify(body).slice(0, 200)}`,
          );
      }
    }
    console.log(
      `write-route fuzz: ${routes.length} routes, ${requests} requests, ${failures.length} failures (seed ${SEED})`,
    );
    if (failures.length) console.log(failures.join("\n"));
    expect(failures.slice(0, 20)).toEqual([]);
  });
});
