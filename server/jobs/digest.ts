import { and, asc, eq, inArray } from "drizzle-orm";
import type { AppContext } from "../context";
import type { DueItem } from "#core/contracts/compliance";
import { companies, digestRuns, memberships, stores, users } from "../db/schema/index";
import { addDays, compareDates } from "#core/domain/dates/calendar-date";
import { localDateOf, zoneOffsetMs } from "#core/domain/dates/time-zone";
import { digestMail } from "../mail/digest-mail";
import { today } from "../api/compliance/today.service";

/** The digest covers what falls due within this many days of the local today (7, docs/product.md). */
export const DIGEST_DAYS = 7;
/** Local hour from which the scheduled digest goes out (early, before the day's service calls). */
export const DIGEST_HOUR = 6;

/** The company's calendar: the time zone of its first store (UTC when it has none yet). */
async function companyZone(ctx: AppContext, companyId: string): Promise<string> {
  const [s] = await ctx.db
    .select({ tz: stores.timeZone })
    .from(stores)
    .where(eq(stores.companyId, companyId))
    .orderBy(asc(stores.createdAt))
    .limit(1);
  return s?.tz ?? "UTC";
}

export async function digestItems(ctx: AppContext, companyId: string, now: Date): Promise<DueItem[]> {
  const view = await today(ctx, { companyId, role: "owner", storeIds: [] }, {}, now);
  return view.due.filter((i) => {
    if (i.dueOn === null) return true;
    const localToday =
      view.stores.find((s) => s.id === i.storeId)?.today ?? view.stores[0]?.today ?? localDateOf(now, "UTC");
    return compareDates(i.dueOn, addDays(localToday, DIGEST_DAYS)) <= 0;
  });
}

export interface DigestResult {
  sent: boolean;
  localDate: string;
  recipients: string[];
  itemCount: number;
  message: string;
}

/**
 * Sends a company's digest for its local today at most once: the digest_runs row, unique per
 * (company, local date), is claimed before any mail goes out, so a second process or a restart
 * finds it taken. A failed send releases the claim so the next run retries.
 */
export async function sendDigest(
  ctx: AppContext,
  companyId: string,
  trigger: "schedule" | "manual",
  now = new Date(),
): Promise<DigestResult> {
  const zone = await companyZone(ctx, companyId);
  const localDate = localDateOf(now, zone);
  const [claim] = await ctx.db
    .insert(digestRuns)
    .values({ companyId, localDate, status: "sending", trigger })
    .onConflictDoNothing({ target: [digestRuns.companyId, digestRuns.localDate] })
    .returning({ id: digestRuns.id });
  if (!claim) {
    const [run] = await ctx.db
      .select()
      .from(digestRuns)
      .where(and(eq(digestRuns.companyId, companyId), eq(digestRuns.localDate, localDate)));
    const when = run?.sentAt ? ` at ${run.sentAt.toISOString().slice(11, 16)} UTC` : "";
    return {
      sent: false,
      localDate,
      recipients: run?.recipients ?? [],
      itemCount: run?.itemCount ?? 0,
      message: `Today's digest (${localDate}) was already sent${when}; it goes out once a day.`,
    };
  }
  try {
    const [company] = await ctx.db.select({ name: companies.name }).from(companies).where(eq(companies.id, companyId));
    const people = await ctx.db
      .select({ email: users.email })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.companyId, companyId), inArray(memberships.role, ["owner", "engineer"])))
      .orderBy(asc(users.email));
    const items = await digestItems(ctx, companyId, now);
    const recipients = people.map((p) => p.email);
    if (recipients.length) {
      const mail = digestMail({
        companyName: company.name,
        localDate,
        items,
        appUrl: ctx.config.appUrl,
        days: DIGEST_DAYS,
      });
      await ctx.mailer.send({ to: recipients, companyId, kind: "digest", ...mail });
    }
    await ctx.db
      .update(digestRuns)
      .set({ status: "sent", sentAt: new Date(), recipients, itemCount: items.length })
      .where(eq(digestRuns.id, claim.id));
    return {
      sent: true,
      localDate,
      recipients,
      itemCount: items.length,
      message: `Sent today's digest (${items.length} items) to ${recipients.length} people.`,
    };
  } catch (err) {
    await ctx.db.delete(digestRuns).where(eq(digestRuns.id, claim.id));
    throw err;
  }
}

/** Companies whose local clock has reached the digest hour (their digest may be due today). */
export async function companiesPastDigestHour(ctx: AppContext, now = new Date()): Promise<string[]> {
  const all = await ctx.db.select({ id: companies.id }).from(companies);
  const due: string[] = [];
  for (const c of all) {
    const zone = await companyZone(ctx, c.id);
    const localHour = new Date(now.getTime() + zoneOffsetMs(now, zone)).getUTCHours();
    if (localHour >= DIGEST_HOUR) due.push(c.id);
  }
  return due;
}

/** One pass of the schedule, in this process: every company whose local clock has reached the digest hour. */
export async function runDueDigests(ctx: AppContext, now = new Date()): Promise<DigestResult[]> {
  const results: DigestResult[] = [];
  for (const companyId of await companiesPastDigestHour(ctx, now)) {
    try {
      results.push(await sendDigest(ctx, companyId, "schedule", now));
    } catch (err) {
      ctx.logger.error({ err, companyId }, "digest failed; the next hourly run retries");
    }
  }
  return results;
}
