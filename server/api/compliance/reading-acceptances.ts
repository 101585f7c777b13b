import { and, asc, eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { AcceptReadingInput, ReadingsResponse } from "#core/contracts/compliance";
import { profileReadings } from "#core/domain/compliance/readings";
import { complianceAudit, readingAcceptances, users } from "../../db/schema/index";
import { badRequest } from "../../lib/http-error";
import type { Viewer } from "../../access/store-access";
import { companyRules } from "./system-records";

/** The profile's readings, each with the owner's acceptance of its present wording, if any. */
export async function listReadings(ctx: AppContext, companyId: string): Promise<ReadingsResponse> {
  const { profile } = await companyRules(ctx, companyId);
  const rows = await ctx.db
    .select({ text: readingAcceptances.text, note: readingAcceptances.note, at: readingAcceptances.at, by: users.name })
    .from(readingAcceptances)
    .innerJoin(users, eq(users.id, readingAcceptances.byId))
    .where(and(eq(readingAcceptances.companyId, companyId), eq(readingAcceptances.profileId, profile.id)))
    .orderBy(asc(readingAcceptances.at));
  // The first acceptance of the same words stands; a later one adds nothing.
  const accepted = new Map<string, { by: string; at: string; note: string }>();
  for (const r of rows)
    if (!accepted.has(r.text)) accepted.set(r.text, { by: r.by, at: r.at.toISOString(), note: r.note });
  return {
    profileId: profile.id,
    profileName: profile.name,
    readings: profileReadings(profile).map((r) => ({ ...r, accepted: accepted.get(r.text) ?? null })),
  };
}

/**
 * Records that the owner accepts a reading as worded, with who and when, and writes it to the
 * compliance audit trail. Words no longer listed (the profile changed meanwhile) are refused with
 * the reason; accepting the same words again changes nothing.
 */
export async function acceptReading(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  input: AcceptReadingInput,
): Promise<ReadingsResponse> {
  const current = await listReadings(ctx, viewer.companyId);
  const reading = current.readings.find((r) => r.text === input.text);
  if (!reading)
    throw badRequest(`Please check: that is not one of the readings of ${current.profileName} as listed now.`, {
      text: `is not a reading of ${current.profileName} as listed now (reload the list)`,
    });
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
