import { asc, eq, inArray } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { FindingDetail } from "#core/contracts/finding-actions";
import { findingEvents, findingPhotos, findings, fixtures, systems, users } from "../../db/schema/index";
import { dueStatus } from "#core/domain/compliance/deadlines";
import { nextActions, type LifecycleEvent } from "#core/domain/findings/lifecycle";
import { lookupFor } from "../refrigerants/company-refrigerant-lookup";
import { cautionsFor, type CautionPlace } from "#core/domain/safety/cautions";
import { companyRules, retiredOnOf, type StoreRow, type SystemWithStatus } from "../compliance/system-records";
import { profileWording } from "#core/domain/compliance/company-profile";
import { repairVerification } from "./repair-verification";

export type FindingRow = typeof findings.$inferSelect;

/**
 * Builds the finding screen's view of rows: events signed with names, photos with their
 * authorized URLs, the deadlines that apply to it and the cautions for its refrigerant.
 */
export async function toFindingDetails(
  ctx: AppContext,
  rows: FindingRow[],
  storesById: Map<string, StoreRow>,
  statuses: Map<string, SystemWithStatus>,
  now = new Date(),
): Promise<FindingDetail[]> {
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const lookup = await lookupFor(ctx, rows[0].companyId);
  // The cautions name the certification and codes of the company's rules (an EU company reads no US rule).
  const rules = profileWording((await companyRules(ctx, rows[0].companyId)).profile);
  const [events, photos, sys] = await Promise.all([
    ctx.db
      .select({ e: findingEvents, by: users.name })
      .from(findingEvents)
      .innerJoin(users, eq(users.id, findingEvents.byId))
      .where(inArray(findingEvents.findingId, ids))
      .orderBy(asc(findingEvents.at), asc(findingEvents.id)),
    ctx.db
      .select({ p: findingPhotos, by: users.name })
      .from(findingPhotos)
      .innerJoin(users, eq(users.id, findingPhotos.byId))
      .where(inArray(findingPhotos.findingId, ids))
      .orderBy(asc(findingPhotos.takenAt)),
    ctx.db
      .select({
        id: systems.id,
        name: systems.name,
        refrigerantId: systems.refrigerantId,
        retiredAt: systems.retiredAt,
        retiredOn: systems.retiredOn,
      })
      .from(systems)
      .where(
        inArray(
          systems.id,
          rows
            .map((r) => r.systemId)
            .filter((x): x is string => !!x)
            .concat(["00000000-0000-0000-0000-000000000000"]),
        ),
      ),
  ]);
  const foundBy = await ctx.db
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(inArray(users.id, [...new Set(rows.map((r) => r.foundById))]));
  const fixtureIds = rows.map((r) => r.fixtureId).filter((x): x is string => !!x);
  const fixtureKinds = fixtureIds.length
    ? await ctx.db
        .select({ planId: fixtures.planId, id: fixtures.id, kind: fixtures.kind, label: fixtures.label })
        .from(fixtures)
        .where(inArray(fixtures.id, fixtureIds))
    : [];
  const names = new Map(foundBy.map((u) => [u.id, u.name]));
  const verification = await repairVerification(
    ctx,
    rules,
    rows.map((r) => r.systemId),
  );
  return rows.map((row) => {
    const store = storesById.get(row.storeId)!;
    const mine = events.filter((x) => x.e.findingId === row.id);
    const lifecycle: LifecycleEvent[] = mine.map((x) => ({
      kind: x.e.kind,
      status: x.e.status,
      on: x.e.on,
      result: x.e.result,
    }));
    const system = sys.find((s) => s.id === row.systemId) ?? null;
    const systemRetiredOn = system ? retiredOnOf(system, store.timeZone) : null;
    const st = row.systemId ? statuses.get(row.systemId) : undefined;
    const deadlines: FindingDetail["deadlines"] = [];
    if (st) {
      const relevant = st.status.due.filter((d) =>
        d.findingId
          ? d.findingId === row.id
          : d.kind === "repair" && (row.status === "suspected" || row.status === "confirmed"),
      );
      for (const d of relevant)
        deadlines.push({ what: d.what, dueOn: d.dueOn, source: d.source, ...dueStatus(d.dueOn, now, store.timeZone) });
    }
    const refrigerant = system ? lookup(system.refrigerantId) : undefined;
    // Cautions sit where the risk is: a finding in a walk-in or machine room gets the room's wording.
    const fixture = fixtureKinds.find((f) => f.id === row.fixtureId && (!row.planId || f.planId === row.planId));
    const kind = fixture?.kind;
    const place: CautionPlace | undefined =
      kind === "walk-in-cooler" || kind === "walk-in-freezer"
        ? "walk-in"
        : kind === "machine-room"
          ? "machine-room"
          : undefined;
    return {
      id: row.id,
      storeId: row.storeId,
      systemId: row.systemId,
      planId: row.planId,
      sweepId: row.sweepId,
      fixtureId: row.fixtureId,
      x: row.x,
      y: row.y,
      component: row.component as FindingDetail["component"],
      source: row.source,
      status: row.status,
      note: row.note,
      foundAt: row.foundAt.toISOString(),
      foundBy: names.get(row.foundById) ?? "",
      events: mine.map((x) => ({
        id: x.e.id,
        kind: x.e.kind,
        status: x.e.status,
        on: x.e.on,
        at: x.e.at.toISOString(),
        by: x.by,
        byId: x.e.byId,
        note: x.e.note,
        result: x.e.result,
      })),
      photos: photos
        .filter((p) => p.p.findingId === row.id)
        .map((p) => ({
          id: p.p.id,
          url: `/api/findings/${row.id}/photos/${p.p.id}`,
          thumbUrl: `/api/findings/${row.id}/photos/${p.p.id}?variant=thumb`,
          takenAt: p.p.takenAt.toISOString(),
          by: p.by,
        })),
      storeName: store.name,
      timeZone: store.timeZone,
      systemName: system?.name ?? null,
      fixtureLabel: fixture?.label || null,
      refrigerantId: system?.refrigerantId ?? null,
      dismissReason: row.dismissReason,
      nextActions: nextActions(lifecycle, verification(row.systemId), systemRetiredOn),
      systemRetiredOn,
      deadlines,
      cautions: cautionsFor({ refrigerant, place, rules }).map((c) => ({
        id: c.id,
        level: c.level,
        text: c.text,
        source: c.source,
      })),
    };
  });
}
