import { desc, inArray } from "drizzle-orm";
import type { MailDelivery } from "#core/contracts/mail-delivery";
import type { Db } from "../db/client";
import { outgoingMail } from "../db/schema/index";

/** The latest message about each subject (an invitation, a report send), as its sender sees it. */
export async function deliveriesFor(db: Db, subjectIds: string[]): Promise<Map<string, MailDelivery>> {
  const out = new Map<string, MailDelivery>();
  if (!subjectIds.length) return out;
  const rows = await db
    .select({
      id: outgoingMail.id,
      subjectId: outgoingMail.subjectId,
      state: outgoingMail.state,
      attempts: outgoingMail.attempts,
      lastError: outgoingMail.lastError,
      sentAt: outgoingMail.sentAt,
    })
    .from(outgoingMail)
    .where(inArray(outgoingMail.subjectId, subjectIds))
    .orderBy(desc(outgoingMail.createdAt));
  for (const r of rows) {
    if (!r.subjectId || out.has(r.subjectId)) continue;
    out.set(r.subjectId, {
      mailId: r.id,
      state: r.state,
      attempts: r.attempts,
      error: r.lastError,
      sentAt: r.sentAt?.toISOString() ?? null,
    });
  }
  return out;
}
