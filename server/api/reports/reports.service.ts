/** The sweep report as PDF and CSV, and sending it by e-mail with a record of each send. */
import { and, desc, eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { ReportRecipient, ReportSend, SendReportInput } from "#core/contracts/reports";
import { memberships, membershipStores, reportSends, users } from "../../db/schema/index";
import { createConcentrationScale } from "#core/domain/fieldmap/concentration-ramp";
import { readingsCsv } from "#core/domain/reports/readings-csv";
import { badRequest, conflict, notFound } from "../../lib/http-error";
import { deliveriesFor } from "../../mail/mail-status";
import { createReportRunner } from "../../jobs/report-runner";
import type { ReportJob } from "../../jobs/report.worker";
import { uploadsStorage } from "../../storage/uploads-storage";
import type { Viewer } from "../../access/store-access";
import { loadVisibleSweep } from "../../access/sweep-access";
import { loadReportFacts, type ReportFacts } from "./report-facts";
import type { ReaderUnits } from "./reader-units";

const slug = (s: string) =>
  s
    .normalize("NFKD")
    .replace(/[^\w]+/g, "-")
    .replace(/^-|-$/g, "")
    .toLowerCase();

function fileBase(f: ReportFacts): string {
  const day = new Intl.DateTimeFormat("sv-SE", { timeZone: f.timeZone }).format(f.sweep.startedAt);
  return `sweep-${slug(f.storeName)}-${day}`;
}

/** The PDF, drawn and laid out in a worker thread so the event loop keeps answering meanwhile. */
export async function buildReportPdf(ctx: AppContext, f: ReportFacts): Promise<Buffer> {
  let map: ReportJob["map"] = null;
  if (f.field) {
    const scale = createConcentrationScale({ maxPpm: f.maxPpm, log: true });
    const planImage = f.planImage.displayKey ? await uploadsStorage(ctx).get(f.planImage.displayKey) : null;
    map = {
      planImage: planImage ? new Uint8Array(planImage) : null,
      widthM: f.planImage.widthM,
      heightM: f.planImage.heightM,
      field: f.field,
      maxPpm: f.maxPpm,
      outlines: f.outlines,
      legend: `Colour: lag-corrected concentration on a log scale from 0 (pale sand) to ${f.maxPpm} ppm (deep plum); ${scale.ticks().join(", ")} ppm. Hatched or clear: not sampled enough to say — unknown, not clean. Numbered rings: suspect spots with their search radius.`,
    };
  }
  ctx.reportRunner ??= createReportRunner();
  const bytes = await ctx.reportRunner.run({ model: f.model, map });
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
}

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

export async function sendSweepReport(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  sweepId: string,
  input: ParsedSend,
  units: ReaderUnits,
): Promise<ReportSend> {
  const facts = await loadReportFacts(ctx, viewer, sweepId, units);
  const to = new Set(input.addresses.map((a) => a.toLowerCase()));
  if (input.storeContacts) {
    const contacts = await storeContacts(ctx, facts.sweep.companyId, facts.sweep.storeId);
    if (contacts.length === 0 && to.size === 0)
      throw badRequest("This store has no store contact yet: type an address instead.", {
        storeContacts: "the store has no store contact",
      });
    for (const c of contacts) to.add(c.email.toLowerCase());
  }
  const pdf = await buildReportPdf(ctx, facts);
  const filename = `${fileBase(facts)}.pdf`;
  const [sender] = await ctx.db.select({ name: users.name }).from(users).where(eq(users.id, userId));
  const subject = `Sweep report: ${facts.storeName}, ${facts.model.sweep.started}`;
  const top = facts.model.suspects[0];
  const text = [
    input.message,
    `${sender?.name ?? "A colleague"} sent you the sweep report for ${facts.storeName} (${facts.model.company}).`,
    top ? `Top suspect spot: ${top.fixture} at ${top.position} — ${top.reason}` : facts.model.noSpot,
    "The report is attached as a PDF. Safety: leak checks and repairs are for certified technicians; local codes apply.",
  ]
    .filter(Boolean)
    .join("\n\n");
  const recipients = [...to];
  // The PDF is made now and kept with the queued message: the recipients get the report as it
  // was when it was sent, even if the sweep changes before the mail server takes it.
  const { row, mailId } = await ctx.db.transaction(async (tx) => {
    const [row] = await tx
      .insert(reportSends)
      .values({
        companyId: facts.sweep.companyId,
        sweepId,
        sentById: userId,
        recipients,
        subject,
        filename,
        bytes: pdf.length,
        readingsRevision: facts.sweep.readingsRevision,
      })
      .returning();
    const mailId = await ctx.mailer.queue(
      {
        kind: "report",
        subjectId: row.id,
        to: recipients,
        subject,
        text,
        attachments: [{ filename, content: pdf, contentType: "application/pdf" }],
        companyId: facts.sweep.companyId,
      },
      tx,
    );
    return { row, mailId };
  });
  await ctx.mailer.notify(mailId);
  const delivery = (await deliveriesFor(ctx.db, [row.id])).get(row.id) ?? null;
  return {
    id: row.id,
    sweepId,
    sentBy: sender?.name ?? null,
    recipients,
    subject,
    filename,
    bytes: row.bytes,
    sentAt: row.sentAt.toISOString(),
    delivery,
  };
}

/** Puts a report send whose e-mail failed back in the queue, unchanged (same PDF, same recipients). */
export async function retryReportSend(ctx: AppContext, viewer: Viewer, sweepId: string, sendId: string) {
  await loadVisibleSweep(ctx, viewer, sweepId);
  const [send] = await ctx.db
    .select({ id: reportSends.id })
    .from(reportSends)
    .where(and(eq(reportSends.id, sendId), eq(reportSends.sweepId, sweepId)));
  if (!send) throw notFound("That report send");
  const delivery = (await deliveriesFor(ctx.db, [send.id])).get(send.id);
  if (!delivery || delivery.state !== "failed") throw conflict("Only a send whose e-mail failed can be sent again.");
  await ctx.mailer.retry(delivery.mailId);
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
  return rows.map(({ s, by }) => ({
    id: s.id,
    sweepId: s.sweepId,
    sentBy: by,
    recipients: s.recipients,
    subject: s.subject,
    filename: s.filename,
    bytes: s.bytes,
    sentAt: s.sentAt.toISOString(),
    delivery: deliveries.get(s.id) ?? null,
  }));
}
