/**
 * Per-fixture peak and mean ppm over the store's sweeps of the last 12 months, fixtures matched by
 * their stable ids across plan versions; the fixtures that got worse from sweep a to sweep b first.
 */
import { and, asc, eq, gte, inArray, ne } from "drizzle-orm";
import type { AppContext } from "../../context";
import { AIR_VOLUME_KINDS } from "#core/contracts/fixture-kinds";
import type { FixtureTrends } from "#core/contracts/fixture-trends";
import { fixtures, sweeps, users } from "../../db/schema/index";
import { fixtureLevel } from "#core/domain/fieldmap/fixture-levels";
import { HttpError, badRequest } from "../../lib/http-error";
import { loadVisibleStore, type Viewer } from "../../access/store-access";
import { ensureAnalysis, rowField } from "./analysis.service";

const YEAR_MS = 365 * 86_400_000;
const AIR = new Set<string>(AIR_VOLUME_KINDS);

export async function fixtureTrends(
  ctx: AppContext,
  viewer: Viewer,
  storeId: string,
  q: { a?: string; b?: string },
  now = new Date(),
): Promise<FixtureTrends> {
  await loadVisibleStore(ctx, viewer, storeId);
  const joined = await ctx.db
    .select({ sweep: sweeps, technicianName: users.name })
    .from(sweeps)
    .leftJoin(users, eq(users.id, sweeps.technicianId))
    .where(
      and(
        eq(sweeps.storeId, storeId),
        eq(sweeps.companyId, viewer.companyId),
        ne(sweeps.status, "in-progress"),
        gte(sweeps.startedAt, new Date(now.getTime() - YEAR_MS)),
      ),
    )
    .orderBy(asc(sweeps.startedAt));
  const rows = joined.map((j) => j.sweep);
  const technician = new Map(joined.map((j) => [j.sweep.id, j.technicianName ?? ""]));
  const ids = rows.map((r) => r.id);
  for (const [k, v] of Object.entries(q))
    if (v && !ids.includes(v))
      throw badRequest(`${k}: that sweep is not one of this store's sweeps of the last 12 months`, {
        [k]: "not a sweep of this store in the last 12 months",
      });
  const b = q.b ?? ids[ids.length - 1] ?? null;
  const a = q.a ?? ids[ids.indexOf(b ?? "") - 1] ?? null;

  const planIds = [...new Set(rows.map((r) => r.planId))];
  const fixtureRows = planIds.length
    ? await ctx.db.select().from(fixtures).where(inArray(fixtures.planId, planIds))
    : [];
  const byPlan = new Map<string, typeof fixtureRows>();
  for (const f of fixtureRows) {
    if (!AIR.has(f.kind) || !f.polygon) continue;
    const list = byPlan.get(f.planId) ?? [];
    list.push(f);
    byPlan.set(f.planId, list);
  }
  // labels and order from the latest plan a fixture appears on
  const meta = new Map<string, { label: string; kind: string }>();
  const levels = new Map<string, FixtureTrends["fixtures"][number]["levels"][number][]>();
  for (const [i, s] of rows.entries()) {
    let field = null;
    try {
      field = rowField(await ensureAnalysis(ctx, s));
    } catch (err) {
      if (!(err instanceof HttpError)) throw err; // an unanalysable sweep (no readings) has no levels
    }
    for (const f of byPlan.get(s.planId) ?? []) {
      meta.set(f.id, { label: f.label || f.kind, kind: f.kind });
      const list = levels.get(f.id) ?? new Array(rows.length).fill(null);
      const level = field ? fixtureLevel(field, f.polygon!) : null;
      list[i] = level ? { sweepId: s.id, peakPpm: level.peakPpm, meanPpm: level.meanPpm } : null;
      levels.set(f.id, list);
    }
  }
  const ia = a ? ids.indexOf(a) : -1;
  const ib = b ? ids.indexOf(b) : -1;
  const out = [...levels.entries()].map(([id, list]) => {
    const la = ia >= 0 ? list[ia] : null;
    const lb = ib >= 0 ? list[ib] : null;
    return { id, ...meta.get(id)!, levels: list, change: la && lb ? lb.peakPpm - la.peakPpm : null };
  });
  out.sort((x, y) => (y.change ?? -Infinity) - (x.change ?? -Infinity) || x.label.localeCompare(y.label));
  return {
    sweeps: rows.map((r) => ({
      id: r.id,
      startedAt: r.startedAt.toISOString(),
      planId: r.planId,
      status: r.status,
      technicianName: technician.get(r.id) ?? "",
    })),
    a,
    b,
    fixtures: out,
  };
}
