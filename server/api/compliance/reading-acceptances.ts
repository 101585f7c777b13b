import { and, asc, eq } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { AppContext } from "../../context";
import type { AcceptReadingInput, ReadingsResponse, WithdrawReadingInput } from "#core/contracts/compliance";
import { profileReadings } from "#core/domain/compliance/readings";
import type { RuleProfile } from "#core/domain/compliance/rule-profile";
import { complianceAudit, readingAcceptances, readingWithdrawals, users } from "../../db/schema/index";
import { badRequest } from "../../lib/http-error";
import type { Viewer } from "../../access/store-access";
import { companyRules } from "./system-records";

type Reading = ReadingsResponse["readings"][number];
type Standing = { acceptanceId: string; by: string; at: string; note: string };

const withdrawer = alias(users, "withdrawer");

/**
 * Each reading's history under the profile, and the acceptance standing now: the one not withdrawn
 * (accepting is refused while one stands, so there is at most one).
 */
async function acceptanceHistory(ctx: AppContext, companyId: string, profileId: string) {
  const rows = await ctx.db
    .select({
      id: readingAcceptances.id,
      text: readingAcceptances.text,
      note: readingAcceptances.note,
      at: readingAcceptances.at,
      by: users.name,
      withdrawnAt: readingWithdrawals.at,
      withdrawReason: readingWithdrawals.reason,
      withdrawnBy: withdrawer.name,
    })
    .from(readingAcceptances)
    .innerJoin(users, eq(users.id, readingAcceptances.byId))
    .leftJoin(readingWithdrawals, eq(readingWithdrawals.acceptanceId, readingAcceptances.id))
    .leftJoin(withdrawer, eq(withdrawer.id, readingWithdrawals.byId))
    .where(and(eq(readingAcceptances.companyId, companyId), eq(readingAcceptances.profileId, profileId)))
    .orderBy(asc(readingAcceptances.at), asc(readingAcceptances.id));
  const history = new Map<string, Reading["history"]>();
  const standing = new Map<string, Standing>();
  for (const r of rows) {
    const list = history.get(r.text) ?? [];
    list.push({ kind: "accepted", by: r.by, at: r.at.toISOString(), note: r.note });
    if (r.withdrawnAt)
      list.push({
        kind: "withdrawn",
        by: r.withdrawnBy ?? "",
        at: r.withdrawnAt.toISOString(),
        note: r.withdrawReason ?? "",
      });
    else if (!standing.has(r.text))
      standing.set(r.text, { acceptanceId: r.id, by: r.by, at: r.at.toISOString(), note: r.note });
    history.set(r.text, list);
  }
  for (const list of history.values()) list.sort((a, b) => a.at.localeCompare(b.at));
  return { history, standing };
}

/** The profile's readings, each with the owner's standing acceptance of its present wording, if any, and its history. */
export async function listReadings(ctx: AppContext, companyId: string): Promise<ReadingsResponse> {
  const { profile } = await companyRules(ctx, companyId);
  const { history, standing } = await acceptanceHistory(ctx, companyId, profile.id);
  return {
    profileId: profile.id,
    profileName: profile.name,
    readings: profileReadings(profile).map((r) => {
      const s = standing.get(r.text);
      return {
        ...r,
        accepted: s ? { by: s.by, at: s.at, note: s.note } : null,
        history: history.get(r.text) ?? [],
      };
    }),
  };
}

/**
 * The words of the profile's readings the owner has accepted now: what a printed statement marks as
 * accepted. Takes the profile the caller has already read.
 */
export async function acceptedReadingTexts(
  ctx: AppContext,
  companyId: string,
  profile: RuleProfile,
): Promise<Set<string>> {
  const { standing } = await acceptanceHistory(ctx, companyId, profile.id);
  return new Set(
    profileReadings(profile)
      .map((r) => r.text)
      .filter((text) => standing.has(text)),
  );
}

function notListed(profileName: string) {
  return badRequest(`Please check: that is not one of the readings of ${profileName} as listed now.`, {
    text: `is not a reading of ${profileName} as listed now (reload the list)`,
  });
}

/**
 * Records that the owner accepts a reading as worded, with who and when, and writes it to the
 * compliance audit trail. Words no longer listed (the profile changed meanwhile) are refused with
 * the reason; accepting words whose acceptance stands changes nothing. After a withdrawal the
 * words may be accepted again: a new row.
 */
export async function acceptReading(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  input: AcceptReadingInput,
): Promise<ReadingsResponse> {
  const current = await listReadings(ctx, viewer.companyId);
  const reading = current.readings.find((r) => r.text === input.text);
  if (!reading) throw notListed(current.profileName);
  if (reading.accepted) return current;
  await ctx.db.transaction(async (tx) => {
    await tx.insert(readingAcceptances).values({
      companyId: viewer.companyId,
      profileId: current.profileId,
      text: input.text,
      note: input.note,
      byId: userId,
    });
    await tx.insert(complianceAudit).values({
      companyId: viewer.companyId,
      systemId: null,
      action: "reading-accepted",
      byId: userId,
      summary: `Reading accepted under ${current.profileName}: ${input.text}${input.note ? ` (${input.note})` : ""}`,
    });
  });
  return listReadings(ctx, viewer.companyId);
}

/**
 * Withdraws the standing acceptance of a listed reading, with the reason: a new row beside the
 * acceptance (both stay in the history and the archive) and a `reading-withdrawn` audit row. The
 * figures that use the reading show it as not accepted again (docs/decisions/0048-accepting-readings.md).
 */
export async function withdrawReading(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  input: WithdrawReadingInput,
): Promise<ReadingsResponse> {
  const { profile } = await companyRules(ctx, viewer.companyId);
  if (!profileReadings(profile).some((r) => r.text === input.text)) throw notListed(profile.name);
  const { standing } = await acceptanceHistory(ctx, viewer.companyId, profile.id);
  const accepted = standing.get(input.text);
  if (!accepted)
    throw badRequest("Please check: that reading is not accepted now, so there is nothing to withdraw.", {
      text: "is not accepted now: nothing to withdraw",
    });
  await ctx.db.transaction(async (tx) => {
    // One withdrawal per acceptance (unique index): a second request at the same time changes nothing.
    const [row] = await tx
      .insert(readingWithdrawals)
      .values({ companyId: viewer.companyId, acceptanceId: accepted.acceptanceId, reason: input.reason, byId: userId })
      .onConflictDoNothing()
      .returning({ id: readingWithdrawals.id });
    if (!row) return;
    await tx.insert(complianceAudit).values({
      companyId: viewer.companyId,
      systemId: null,
      action: "reading-withdrawn",
      byId: userId,
      summary: `Acceptance withdrawn under ${profile.name}: ${input.text} (reason: ${input.reason})`,
    });
  });
  return listReadings(ctx, viewer.companyId);
}
