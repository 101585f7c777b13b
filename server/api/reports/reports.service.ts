/** The sweep report as PDF and CSV, and sending it by e-mail with a record of each send. */
import { and, desc, eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { ReportRecipient, ReportSend, SendReportInput } from "#core/contracts/reports";
import type { MailDelivery } from "#core/contracts/mail-delivery";
import { memberships, membershipStores, outgoingMail, reportSends, stores, users } from "../../db/schema/index";
import { readingsCsv } from "#core/domain/reports/readings-csv";
import { badRequest, conflict, notFound } from "../../lib/http-error";
import { deliveriesFor } from "../../mail/mail-status";
import type { Viewer } from "../../access/store-access";
import { loadVisibleSweep } from "../../access/sweep-access";
import { loadReportFacts, zonedDateTime, type ReportFacts } from "./report-facts";
import type { ReaderUnits } from "./reader-units";
import { buildReportPdf, reportFileBase } from "./report-pdf";
import { queueReportPdf } from "./report-pdf-job";

const fileBase = (f: ReportFacts) => reportFileBase(f.storeName, f.timeZone, f.sweep.startedAt);

export async function sweepReportPdf(
  ctx: AppContext,
  viewer: Viewer,
  sweepId: string,
  units: ReaderUnits,
): Promise<{ filename: string; pdf: Buffer }> {
  const facts = await loadReportFacts(ctx, viewer, sweepId, units);
  return { filename: `${fileBase(facts)}.pdf`, pdf: await buildReportPdf(ctx, facts) };
}

export async function sweepReadingsCsv(
  ctx: AppContext,
  viewer: Viewer,
  sweepId: string,
  units: ReaderUnits,
): Promise<{ filename: string; csv: string }> {
  const facts = await loadReportFacts(ctx, viewer, sweepId, units);
  return { filename: `${fileBase(facts)}-readings.csv`, csv: readingsCsv(facts.csv, units.length, facts.timeZone) };
}

/** The store contacts named on the sweep's store: the "send to the store contact" choice. */
export async function storeContacts(ctx: AppContext, companyId: string, storeId: string): Promise<ReportRecipient[]> {
  const rows = await ctx.db
    .select({ name: users.name, email: users.email })
    .from(membershipStores)
    .innerJoin(memberships, eq(memberships.id, membershipStores.membershipId))
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(
      and(
        eq(membershipStores.storeId, storeId),
        eq(memberships.companyId, companyId),
        eq(memberships.role, "store-contact"),
      ),
    );
  return rows;
}

export async function reportRecipients(ctx: AppContext, viewer: Viewer, sweepId: string): Promise<ReportRecipient[]> {
  const sweep = await loadVisibleSweep(ctx, viewer, sweepId);
  return storeContacts(ctx, sweep.companyId, sweep.storeId);
}

type ParsedSend = Required<Pick<SendReportInput, "storeContacts" | "addresses" | "message">>;

/** A send as its sender sees it; the size is unknown until the PDF is made. */
function sendView(
  s: typeof reportSends.$inferSelect,
  sentBy: string | null,
  delivery: MailDelivery | null,
): ReportSend {
  return {
    id: s.id,
    sweepId: s.sweepId,
    sentBy,
    recipients: s.recipients,
    subject: s.subject,
    filename: s.filename,
    bytes: s.bytes > 0 ? s.bytes : null,
    sentAt: s.sentAt.toISOString(),
    delivery,
  };
}

/**
 * Records the send and answers at once: the PDF is made by a job (report-pdf-job.ts), which then
 * queues the e-mail. Only what is cheap is done here: the access check, the recipients, the subject.
 */
export async function sendSweepReport(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  sweepId: string,
  input: ParsedSend,
): Promise<ReportSend> {
  const sweep = await loadVisibleSweep(ctx, viewer, sweepId);
  const to = new Set(input.addresses.map((a) => a.toLowerCase()));
  if (input.storeContacts) {
    const contacts = await storeContacts(ctx, sweep.companyId, sweep.storeId);
    if (contacts.length === 0 && to.size === 0)
      throw badRequest("This store has no store contact yet: type an address instead.", {
        storeContacts: "the store has no store contact",
      });
    for (const c of contacts) to.add(c.email.toLowerCase());
  }
  const [[store], [sender]] = await Promise.all([
    ctx.db.select({ name: stores.name, timeZone: stores.timeZone }).from(stores).where(eq(stores.id, sweep.storeId)),
    ctx.db.select({ name: users.name }).from(users).where(eq(users.id, userId)),
  ]);
  const filename = `${reportFileBase(store.name, store.timeZone, sweep.startedAt)}.pdf`;
  const subject = `Sweep report: ${store.name}, ${zonedDateTime(sweep.startedAt, store.timeZone)}`;
  const recipients = [...to];
  const { row, mailId } = await ctx.db.transaction(async (tx) => {
    const [row] = await tx
      .insert(reportSends)
      .values({
        companyId: sweep.companyId,
        sweepId,
        sentById: userId,
        recipients,
        subject,
        filename,
        bytes: 0,
        readingsRevision: sweep.readingsRevision,
      })
      .returning();
    // "preparing" until the job has made the PDF; meanwhile its body is the sender's own note.
    const mailId = await ctx.mailer.queue(
      {
        kind: "report",
        subjectId: row.id,
        to: recipients,
        subject,
        text: input.message,
        companyId: sweep.companyId,
        preparing: true,
      },
      tx,
    );
    return { row, mailId };
  });
  await queueReportPdf(ctx, sweep.companyId, row.id, mailId);
  const delivery = (await deliveriesFor(ctx.db, [row.id])).get(row.id) ?? null;
  return sendView(row, sender?.name ?? null, delivery);
}

/**
 * Puts a report send whose e-mail failed back in the queue: unchanged (same PDF, same recipients)
 * when its PDF was made, or back to "preparing" for a new try at the PDF when making it failed.
 */
export async function retryReportSend(ctx: AppContext, viewer: Viewer, sweepId: string, sendId: string) {
  await loadVisibleSweep(ctx, viewer, sweepId);
  const [send] = await ctx.db
    .select({ id: reportSends.id })
    .from(reportSends)
    .where(and(eq(reportSends.id, sendId), eq(reportSends.sweepId, sweepId)));
  if (!send) throw notFound("That report send");
  const delivery = (await deliveriesFor(ctx.db, [send.id])).get(send.id);
  if (!delivery || delivery.state !== "failed") throw conflict("Only a send whose e-mail failed can be sent again.");
  const [mail] = await ctx.db
    .select({ attachments: outgoingMail.attachments, companyId: outgoingMail.companyId })
    .from(outgoingMail)
    .where(eq(outgoingMail.id, delivery.mailId));
  if (mail && mail.attachments.length === 0) {
    // The PDF was never made (a report's message always carries it once made): make it again.
    const back = await ctx.db
      .update(outgoingMail)
      .set({ state: "preparing", attempts: 0, lastError: null, jobId: null, lockedUntil: null })
      .where(and(eq(outgoingMail.id, delivery.mailId), eq(outgoingMail.state, "failed")))
      .returning({ id: outgoingMail.id });
    if (back.length) await queueReportPdf(ctx, mail.companyId ?? viewer.companyId, send.id, delivery.mailId);
  } else await ctx.mailer.retry(delivery.mailId);
  return (await listReportSends(ctx, viewer, sweepId)).find((s) => s.id === send.id)!;
}

export async function listReportSends(ctx: AppContext, viewer: Viewer, sweepId: string): Promise<ReportSend[]> {
  await loadVisibleSweep(ctx, viewer, sweepId);
  const rows = await ctx.db
    .select({ s: reportSends, by: users.name })
    .from(reportSends)
    .leftJoin(users, eq(users.id, reportSends.sentById))
    .where(eq(reportSends.sweepId, sweepId))
    .orderBy(desc(reportSends.sentAt));
  const deliveries = await deliveriesFor(
    ctx.db,
    rows.map(({ s }) => s.id),
  );
  return rows.map(({ s, by }) => sendView(s, by, deliveries.get(s.id) ?? null));
}
