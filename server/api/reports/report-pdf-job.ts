/**
 * A sent report's PDF is made by a job, not in the request (docs/decisions/0096): the send is
 * recorded with its message "preparing"; the job (any process, retried, dead-lettered) loads the
 * report, draws the PDF on the CPU pool, writes the e-mail's body and attachment and marks the
 * message "queued" for the mail queue. A render that fails for good leaves the message "failed"
 * with a plain reason, which the sender sees on the send and an owner under Failed jobs.
 */
import { and, eq, isNull, lt, sql } from "drizzle-orm";
import type { AppContext } from "../../context";
import { outgoingMail, reportSends, users } from "../../db/schema/index";
import { reportMailFindings } from "#core/domain/reports/report-mail-text";
import type { Viewer } from "../../access/store-access";
import { loadReportFacts } from "./report-facts";
import { readerUnits } from "./reader-units";
import { buildReportPdf } from "./report-pdf";

export const REPORT_PDF_JOB = "report-pdf";
/** One try: waiting for a fresh analysis (at most 60 s, decision 0085) and drawing the PDF. */
export const REPORT_PDF_TIME_LIMIT_S = 180;
/** The hand-over check (stranded or dead render jobs), a pg-boss cron job run once across processes. */
export const REPORT_PDF_SWEEP_JOB = "report-pdf-sweep";

/** What the sender reads when the PDF could not be made. */
export function renderFailure(reason: string): string {
  return `The PDF report could not be made: ${reason}`.slice(0, 300);
}

/** The report's e-mail body: the sender's note, who sent it, what the sweep found, the attachment and the caution. */
export function reportMailText(
  note: string,
  sender: string,
  storeName: string,
  facts: Awaited<ReturnType<typeof loadReportFacts>>,
) {
  return [
    note,
    `${sender} sent you the sweep report for ${storeName} (${facts.model.company}).`,
    ...reportMailFindings(facts.model.findings, facts.model.suspects, facts.model.noSpot),
    "The report is attached as a PDF. Safety: leak checks and repairs are for certified technicians; local codes apply.",
  ]
    .filter(Boolean)
    .join("\n\n");
}

/** Hands a recorded send's render to the job queue; without a queue (API tests, tools) it waits for prepareReports. */
export async function queueReportPdf(ctx: AppContext, companyId: string, sendId: string, mailId: string) {
  if (!ctx.jobs?.running) return;
  try {
    const jobId = await ctx.jobs.send(REPORT_PDF_JOB, { sendId, companyId });
    if (jobId)
      await ctx.db
        .update(outgoingMail)
        .set({ jobId })
        .where(and(eq(outgoingMail.id, mailId), eq(outgoingMail.state, "preparing")));
  } catch (err) {
    // The send is committed: the sweep hands it over later.
    ctx.logger.warn(
      { err: { message: (err as Error).message }, sendId },
      "report recorded; PDF job hand-over deferred",
    );
  }
}

/** Makes one send's PDF and queues its e-mail; does nothing when it is no longer preparing (done by another try). */
export async function runReportPdfJob(ctx: AppContext, { sendId }: { sendId: string }): Promise<void> {
  const [row] = await ctx.db
    .select({ send: reportSends, mailId: outgoingMail.id, note: outgoingMail.text })
    .from(reportSends)
    .innerJoin(outgoingMail, and(eq(outgoingMail.subjectId, reportSends.id), eq(outgoingMail.kind, "report")))
    .where(and(eq(reportSends.id, sendId), eq(outgoingMail.state, "preparing")));
  if (!row) {
    // Made by another try, or the send went with its sweep: a message left preparing says so.
    const [send] = await ctx.db.select({ id: reportSends.id }).from(reportSends).where(eq(reportSends.id, sendId));
    if (!send) await reportPdfGaveUp(ctx, { sendId }, "the sweep it was made from has been deleted");
    return;
  }
  const { send } = row;
  const [sender] = send.sentById
    ? await ctx.db
        .select({ name: users.name, lengthUnit: users.lengthUnit, massUnit: users.massUnit })
        .from(users)
        .where(eq(users.id, send.sentById))
    : [];
  // The sender's units and the company's number format, as when the sender downloads it.
  const units = await readerUnits(ctx, sender ?? { lengthUnit: null, massUnit: null }, send.companyId);
  // Who may send it was checked when the send was recorded; the job reads the sweep as the company.
  const company: Viewer = { companyId: send.companyId, role: "owner", storeIds: [] };
  const facts = await loadReportFacts(ctx, company, send.sweepId, units);
  const pdf = await buildReportPdf(ctx, facts);
  const text = reportMailText(row.note, sender?.name ?? "A colleague", facts.storeName, facts);
  const made = await ctx.db.transaction(async (tx) => {
    const done = await tx
      .update(outgoingMail)
      .set({
        text,
        attachments: [
          { filename: send.filename, contentType: "application/pdf", contentBase64: pdf.toString("base64") },
        ],
        state: "queued",
        jobId: null,
        lastError: null,
      })
      .where(and(eq(outgoingMail.id, row.mailId), eq(outgoingMail.state, "preparing")))
      .returning({ id: outgoingMail.id });
    if (!done.length) return false;
    await tx
      .update(reportSends)
      .set({ bytes: pdf.length, readingsRevision: facts.sweep.readingsRevision })
      .where(eq(reportSends.id, sendId));
    return true;
  });
  if (made) await ctx.mailer.notify(row.mailId);
}

/** After the last try: the message is "failed" with the reason, so the sender sees it and may send again. */
export async function reportPdfGaveUp(ctx: AppContext, { sendId }: { sendId: string }, reason: string) {
  await ctx.db
    .update(outgoingMail)
    .set({ state: "failed", lastError: renderFailure(reason), jobId: null })
    .where(
      and(eq(outgoingMail.subjectId, sendId), eq(outgoingMail.kind, "report"), eq(outgoingMail.state, "preparing")),
    );
}

/**
 * Preparing sends that lost their job: never handed over (a crash between commit and hand-over) are
 * handed over; those whose job pg-boss failed without our last-try hook (a worker that died on the
 * last try) are marked failed with the job's reason.
 */
export async function sweepPreparingReports(ctx: AppContext): Promise<void> {
  const stranded = await ctx.db
    .select({ id: outgoingMail.id, sendId: outgoingMail.subjectId, companyId: outgoingMail.companyId })
    .from(outgoingMail)
    .where(
      and(
        eq(outgoingMail.state, "preparing"),
        isNull(outgoingMail.jobId),
        lt(outgoingMail.createdAt, sql`now() - interval '30 seconds'`),
      ),
    )
    .limit(100);
  for (const r of stranded) if (r.sendId && r.companyId) await queueReportPdf(ctx, r.companyId, r.sendId, r.id);
  const waiting = await ctx.db
    .select({ sendId: outgoingMail.subjectId, jobId: outgoingMail.jobId })
    .from(outgoingMail)
    .where(and(eq(outgoingMail.state, "preparing"), sql`${outgoingMail.jobId} is not null`))
    .limit(500);
  const jobIds = waiting.map((w) => w.jobId!).filter((id) => /^[0-9a-f-]{36}$/i.test(id));
  if (!jobIds.length) return;
  const { rows } = await ctx.pool.query<{ id: string; output: { reason?: string } | null }>(
    "select id, output from pgboss.job where name = $1 and state = 'failed' and id = any($2::uuid[])",
    [REPORT_PDF_JOB, jobIds],
  );
  for (const dead of rows) {
    const w = waiting.find((x) => x.jobId === dead.id);
    if (w?.sendId) await reportPdfGaveUp(ctx, { sendId: w.sendId }, dead.output?.reason ?? "the job stopped");
  }
}

/**
 * Makes every preparing send's PDF now, in this process, one at a time (API tests and tools that
 * run no job worker; `drainMail` calls it before delivering). A failure is thrown to the caller.
 */
export async function prepareReports(ctx: AppContext): Promise<number> {
  const rows = await ctx.db
    .select({ sendId: outgoingMail.subjectId })
    .from(outgoingMail)
    .where(and(eq(outgoingMail.state, "preparing"), eq(outgoingMail.kind, "report")));
  let made = 0;
  for (const r of rows)
    if (r.sendId) {
      await runReportPdfJob(ctx, { sendId: r.sendId });
      made++;
    }
  return made;
}
