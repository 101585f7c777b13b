/**
 * The company's jobs that failed after every retry (docs/decisions/0035, 0085): undelivered e-mail
 * from `outgoing_mail`, and analyses and digests that pg-boss left `failed` (they also sit in the
 * dead-letter queue). Password resets are never listed: they must not reveal an account.
 */
import { and, desc, eq, ne, sql } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { FailedJob } from "#core/contracts/jobs";
import { outgoingMail } from "../../db/schema/index";
import { ANALYSIS_JOB } from "../analysis/analysis.service";
import { DIGEST_JOB } from "../../jobs/job-kinds";

const LIMIT = 200;

interface BossRow {
  id: string;
  name: string;
  data: { sweepId?: string } | null;
  retry_count: number;
  output: { reason?: string } | null;
  created_on: Date;
}

async function failedBossJobs(ctx: AppContext, companyId: string): Promise<FailedJob[]> {
  // pg-boss makes its schema when a worker first starts; a database that never ran one has none.
  const { rows: exists } = await ctx.pool.query<{ t: string | null }>("select to_regclass('pgboss.job')::text as t");
  if (!exists[0]?.t) return [];
  const { rows } = await ctx.pool.query<BossRow>(
    `select id, name, data, retry_count, output, created_on from pgboss.job
      where name = any($1::text[]) and state = 'failed' and data->>'companyId' = $2
      order by created_on desc limit ${LIMIT}`,
    [[ANALYSIS_JOB, DIGEST_JOB], companyId],
  );
  return rows.map((r) => ({
    id: r.id,
    kind: r.name === ANALYSIS_JOB ? "analysis" : "digest",
    subjectId: r.data?.sweepId ?? null,
    to: [],
    subject: r.name === ANALYSIS_JOB ? "Field map computation" : "Daily digest",
    attempts: r.retry_count + 1,
    reason: r.output?.reason ?? null,
    queuedAt: r.created_on.toISOString(),
  }));
}

export async function failedJobs(ctx: AppContext, companyId: string): Promise<FailedJob[]> {
  const rows = await ctx.db
    .select()
    .from(outgoingMail)
    .where(
      and(
        eq(outgoingMail.companyId, companyId),
        eq(outgoingMail.state, "failed"),
        // Resets carry no company; never list them even so (they must not reveal an account).
        ne(outgoingMail.kind, "password-reset"),
      ),
    )
    .orderBy(desc(outgoingMail.createdAt), sql`${outgoingMail.id}`)
    .limit(LIMIT);
  const mail: FailedJob[] = rows.map((r) => ({
    id: r.id,
    kind: r.kind as FailedJob["kind"],
    subjectId: r.subjectId,
    to: r.to,
    subject: r.subject,
    attempts: r.attempts,
    reason: r.lastError,
    queuedAt: r.createdAt.toISOString(),
  }));
  const all = [...mail, ...(await failedBossJobs(ctx, companyId))];
  return all.sort((a, b) => b.queuedAt.localeCompare(a.queuedAt)).slice(0, LIMIT);
}
