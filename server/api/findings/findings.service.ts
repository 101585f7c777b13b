import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import type { z } from "zod";
import type { AppContext } from "../../context";
import type { FindingActionInput, FindingDetail } from "#core/contracts/finding-actions";
import type { createFindingInput } from "#core/contracts/findings";
import {
  complianceAudit,
  findingEvents,
  findings,
  fixtures,
  plans,
  stores,
  sweeps,
  systems,
} from "../../db/schema/index";
import { compareDates, parseIsoDate } from "#core/domain/dates/calendar-date";
import { localDateOf } from "#core/domain/dates/time-zone";
import { DomainInputError } from "#core/domain/input-error";
import { ACTION_PERMISSION, transition, type LifecycleEvent } from "#core/domain/findings/lifecycle";
import { can } from "#core/domain/roles";
import { badRequest, conflict, forbidden, notFound, HttpError } from "../../lib/http-error";
import {
  companyRules,
  retiredOnOf,
  statusesOf,
  type StoreRow,
  type SystemWithStatus,
} from "../compliance/system-records";
import { leftServiceDayError } from "#core/domain/findings/left-service";
import { COMPONENT_LABELS } from "#core/contracts/findings";
import { loadVisibleStore, type Viewer } from "../../access/store-access";
import { toFindingDetails, type FindingRow } from "./finding-view";
import { repairVerification } from "./repair-verification";
import { profileWording } from "#core/domain/compliance/company-profile";

type CreateInput = z.output<typeof createFindingInput>;

/** Statuses of the systems the findings name, for their deadlines. */
async function detailsOf(ctx: AppContext, viewer: Viewer, rows: FindingRow[]): Promise<FindingDetail[]> {
  if (rows.length === 0) return [];
  const rules = await companyRules(ctx, viewer.companyId);
  const storeRows = await ctx.db
    .select()
    .from(stores)
    .where(inArray(stores.id, [...new Set(rows.map((r) => r.storeId))]));
  const storesById = new Map(storeRows.map((s) => [s.id, s]));
  const systemIds = [...new Set(rows.map((r) => r.systemId).filter((x): x is string => !!x))];
  const sysRows = systemIds.length ? await ctx.db.select().from(systems).where(inArray(systems.id, systemIds)) : [];
  const statuses = await statusesOf(
    ctx,
    rules,
    sysRows.map((s) => ({ system: s, store: storesById.get(s.storeId)! })),
  );
  return toFindingDetails(
    ctx,
    rows,
    storesById,
    new Map<string, SystemWithStatus>(statuses.map((s) => [s.system.id, s])),
  );
}

/** A day on the store's calendar for an event: given, or today; never after today. */
export function eventDay(given: string | undefined, store: StoreRow, field = "on", now = new Date()): string {
  const today = localDateOf(now, store.timeZone);
  if (given === undefined) return today;
  try {
    parseIsoDate(given, field);
  } catch (err) {
    if (err instanceof DomainInputError)
      throw badRequest(`Please check: ${field} ${err.message}.`, { [field]: err.message });
    throw err;
  }
  if (compareDates(given, today) > 0) {
    throw badRequest(`Please check: ${field} ${given} is after today (${today}) in the store's time zone.`, {
      [field]: `must not be after today (${today}, ${store.timeZone})`,
    });
  }
  return given;
}

async function checkReferences(ctx: AppContext, viewer: Viewer, storeId: string, input: CreateInput): Promise<void> {
  if (input.systemId) {
    const [s] = await ctx.db
      .select({ name: systems.name, retiredAt: systems.retiredAt, retiredOn: systems.retiredOn })
      .from(systems)
      .where(
        and(eq(systems.id, input.systemId), eq(systems.storeId, storeId), eq(systems.companyId, viewer.companyId)),
      );
    if (!s)
      throw badRequest("Please check: systemId is not a system of this store.", {
        systemId: "is not a system of this store",
      });
    // A retired system's records are kept as they are (docs/decisions/0124): a new leak on it would
    // start a repair clock on equipment no longer in service.
    if (s.retiredAt) {
      const why = `${s.name} was retired on ${s.retiredOn ?? s.retiredAt.toISOString().slice(0, 10)}: record the leak without a system, or on the system that replaced it`;
      throw badRequest(`Please check: systemId ${why}.`, { systemId: why });
    }
  }
  if (input.planId) {
    const [p] = await ctx.db
      .select({ id: plans.id })
      .from(plans)
      .where(and(eq(plans.id, input.planId), eq(plans.storeId, storeId), eq(plans.companyId, viewer.companyId)));
    if (!p)
      throw badRequest("Please check: planId is not a plan of this store.", { planId: "is not a plan of this store" });
  }
  if (input.fixtureId) {
    const where = input.planId
      ? and(eq(fixtures.id, input.fixtureId), eq(fixtures.planId, input.planId))
      : and(eq(fixtures.id, input.fixtureId), eq(plans.storeId, storeId));
    const [f] = await ctx.db
      .select({ id: fixtures.id })
      .from(fixtures)
      .innerJoin(plans, eq(plans.id, fixtures.planId))
      .where(where)
      .limit(1);
    if (!f)
      throw badRequest("Please check: fixtureId is not a fixture on this store's plan.", {
        fixtureId: "is not a fixture on this store's plan",
      });
  }
  if (input.sweepId) {
    const [w] = await ctx.db
      .select({ id: sweeps.id })
      .from(sweeps)
      .where(and(eq(sweeps.id, input.sweepId), eq(sweeps.storeId, storeId), eq(sweeps.companyId, viewer.companyId)));
    if (!w)
      throw badRequest("Please check: sweepId is not a sweep of this store.", {
        sweepId: "is not a sweep of this store",
      });
  }
}

/**
 * Creates a finding with its first event ("found", or "confirmed" when created confirmed). With a
 * clientId already seen in this company, returns the stored finding instead (created: false).
 */
export async function createFinding(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  storeId: string,
  input: CreateInput,
): Promise<{ finding: FindingDetail; created: boolean }> {
  const store = await loadVisibleStore(ctx, viewer, storeId);
  if (input.clientId) {
    const seen = await byClientId(ctx, viewer, input.clientId);
    if (seen) return { finding: seen, created: false };
  }
  await checkReferences(ctx, viewer, storeId, input);
  if (input.status === "confirmed" && !input.component) {
    throw badRequest("Please check: component is required to create a confirmed finding.", {
      component: "is required when the leak is confirmed",
    });
  }
  const foundAt = input.foundAt ? new Date(input.foundAt) : new Date();
  if (foundAt.getTime() > Date.now() + 5 * 60_000)
    throw badRequest("Please check: foundAt is in the future.", { foundAt: "must not be in the future" });
  const on = localDateOf(foundAt, store.timeZone);
  const id = await ctx.db.transaction(async (tx) => {
    const [row] = await tx
      .insert(findings)
      .values({
        companyId: viewer.companyId,
        storeId,
        systemId: input.systemId,
        planId: input.planId,
        sweepId: input.sweepId,
        fixtureId: input.fixtureId,
        x: input.x,
        y: input.y,
        component: input.component,
        source: input.source,
        status: input.status,
        note: input.note,
        foundAt,
        foundById: userId,
        clientId: input.clientId ?? null,
      })
      .onConflictDoNothing({ target: [findings.companyId, findings.clientId] })
      .returning({ id: findings.id });
    if (!row) return null; // a concurrent retry with the same clientId won
    await tx.insert(findingEvents).values({
      findingId: row.id,
      kind: "found",
      status: "suspected",
      on,
      at: foundAt,
      byId: userId,
      note: input.note,
    });
    if (input.status === "confirmed")
      await tx.insert(findingEvents).values({
        findingId: row.id,
        kind: "confirmed",
        status: "confirmed",
        on,
        at: new Date(foundAt.getTime() + 1),
        byId: userId,
        note: "",
      });
    return row.id;
  });
  if (!id) return { finding: (await byClientId(ctx, viewer, input.clientId!))!, created: false };
  return { finding: await getFinding(ctx, viewer, id), created: true };
}

async function byClientId(ctx: AppContext, viewer: Viewer, clientId: string): Promise<FindingDetail | null> {
  const [row] = await ctx.db
    .select({ id: findings.id })
    .from(findings)
    .where(and(eq(findings.companyId, viewer.companyId), eq(findings.clientId, clientId)));
  return row ? getFinding(ctx, viewer, row.id) : null;
}

export async function listFindings(
  ctx: AppContext,
  viewer: Viewer,
  storeId: string,
  filter: { systemId?: string; open?: boolean } = {},
): Promise<FindingDetail[]> {
  await loadVisibleStore(ctx, viewer, storeId);
  const rows = await ctx.db
    .select()
    .from(findings)
    .where(
      and(
        eq(findings.storeId, storeId),
        eq(findings.companyId, viewer.companyId),
        filter.systemId ? eq(findings.systemId, filter.systemId) : undefined,
      ),
    )
    .orderBy(desc(findings.foundAt), asc(findings.id));
  const list = await detailsOf(ctx, viewer, rows);
  return filter.open ? list.filter((f) => f.status !== "closed" && f.status !== "dismissed") : list;
}

async function loadFindingRow(
  ctx: AppContext,
  viewer: Viewer,
  id: string,
): Promise<{ row: FindingRow; store: StoreRow }> {
  const [row] = await ctx.db
    .select()
    .from(findings)
    .where(and(eq(findings.id, id), eq(findings.companyId, viewer.companyId)));
  if (!row) throw notFound("That finding");
  try {
    return { row, store: await loadVisibleStore(ctx, viewer, row.storeId) };
  } catch (err) {
    // Only "not your store" becomes "not found"; a database outage stays a 503.
    if (err instanceof HttpError) throw notFound("That finding");
    throw err;
  }
}

export async function getFinding(ctx: AppContext, viewer: Viewer, id: string): Promise<FindingDetail> {
  const { row } = await loadFindingRow(ctx, viewer, id);
  return (await detailsOf(ctx, viewer, [row]))[0];
}

export { loadFindingRow };

/** One lifecycle step: checked against the role, the current status and the calendar, then appended. */
export async function addFindingEvent(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  id: string,
  input: FindingActionInput,
): Promise<FindingDetail> {
  const { row, store } = await loadFindingRow(ctx, viewer, id);
  if (!can(viewer.role, ACTION_PERMISSION[input.action])) {
    throw forbidden(
      ACTION_PERMISSION[input.action] === "findings.close"
        ? "Only engineers and owners close or dismiss findings."
        : "Your role does not allow recording findings.",
    );
  }
  const on = eventDay(input.on, store);
  const system = await findingSystem(ctx, row.systemId, store);
  const verification = (
    await repairVerification(ctx, profileWording((await companyRules(ctx, viewer.companyId)).profile), [row.systemId])
  )(row.systemId);
  await ctx.db.transaction(async (tx) => {
    // Lock the finding so two people acting at once cannot both move it from the same status.
    await tx.select({ id: findings.id }).from(findings).where(eq(findings.id, row.id)).for("update");
    const events = await tx
      .select()
      .from(findingEvents)
      .where(eq(findingEvents.findingId, row.id))
      .orderBy(asc(findingEvents.at), asc(findingEvents.id));
    const lifecycle: LifecycleEvent[] = events.map((e) => ({
      kind: e.kind,
      status: e.status,
      on: e.on,
      result: e.result,
    }));
    const result = "result" in input ? input.result : undefined;
    const t = transition(lifecycle, input.action, result, verification, system?.retiredOn ?? null);
    if (!t.ok) throw conflict(t.message);
    const afterRetirement = system ? leftServiceDayError(input.action, on, system) : null;
    if (afterRetirement)
      throw badRequest(`Please check: on ${afterRetirement}.`, {
        on: afterRetirement,
      });
    const last = events.at(-1);
    if (last && compareDates(on, last.on) < 0) {
      // Days written as every screen writes them: the form shows this under its date field.
      throw badRequest(
        `Please check: ${formatCalendarDay(on)} is before the finding's previous step (${formatCalendarDay(last.on)}).`,
        {
          on: `must not be before ${formatCalendarDay(last.on)}, the day of the previous step`,
        },
      );
    }
    if (input.action === "confirm" && !input.component && !row.component) {
      throw badRequest("Please check: component is required to confirm a leak (where on the system it is).", {
        component: "is required to confirm the leak",
      });
    }
    const at = new Date(Math.max(Date.now(), (last?.at.getTime() ?? 0) + 1));
    await tx.insert(findingEvents).values({
      findingId: row.id,
      kind: t.kind,
      status: t.status,
      on,
      at,
      byId: userId,
      result: result ?? null,
      note: input.note ?? "",
    });
    await tx
      .update(findings)
      .set({
        status: t.status,
        updatedAt: new Date(),
        ...(input.action === "confirm" && input.component ? { component: input.component } : {}),
        ...(input.action === "dismiss" ? { dismissReason: input.reason } : {}),
      })
      .where(eq(findings.id, row.id));
    if (t.kind === "closed-left-service" && system?.retiredOn) {
      // The audit trail says who closed it this way and when (docs/decisions/0166).
      const what = row.component
        ? COMPONENT_LABELS[row.component as keyof typeof COMPONENT_LABELS]
        : "component not recorded";
      await tx.insert(complianceAudit).values({
        companyId: viewer.companyId,
        systemId: system.id,
        action: "finding-closed-left-service",
        byId: userId,
        at,
        summary: `Finding of ${lifecycle[0]?.on ?? on} (${what.toLowerCase()}, ${lifecycle.at(-1)?.status ?? "suspected"}) closed on ${on}: ${system.name} left service on ${system.retiredOn}; no repair, verification or leak check is owed on it`,
      });
    }
  });
  return getFinding(ctx, viewer, id);
}

/** The finding's system with the day it left service (null while in service), or null when it names none. */
async function findingSystem(ctx: AppContext, systemId: string | null, store: StoreRow) {
  if (!systemId) return null;
  const [s] = await ctx.db
    .select({ id: systems.id, name: systems.name, retiredAt: systems.retiredAt, retiredOn: systems.retiredOn })
    .from(systems)
    .where(eq(systems.id, systemId));
  return s ? { id: s.id, name: s.name, retiredOn: retiredOnOf(s, store.timeZone) } : null;
}
