import { asc, desc, eq, sql } from "drizzle-orm";
import type { Similarity } from "#core/analysis/geometry/similarity";
import { fixtures, plans } from "../schema/index";
import { transformFixture } from "#core/domain/plans/transform-fixture";
import type { DbOrTx } from "../tx";
import { fixtureToRow, rowToFixture, type FixtureRow, type PlanRow } from "./plan-rows";

type NewPlan = Omit<
  typeof plans.$inferInsert,
  "version" | "previousPlanId" | "alignment" | "alignmentMatched" | "layoutRevision"
>;

export async function latestVersion(tx: DbOrTx, storeId: string): Promise<PlanRow | undefined> {
  const [row] = await tx.select().from(plans).where(eq(plans.storeId, storeId)).orderBy(desc(plans.version)).limit(1);
  return row;
}

/** Serializes version numbering per store (advisory lock on the store id, held to commit). */
export async function lockStoreVersions(tx: DbOrTx, storeId: string): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${storeId}, 7))`);
}

/** Inserts rows in chunks that stay well under PostgreSQL's 65535 bind parameters. */
export async function insertFixtureRows(tx: DbOrTx, rows: FixtureRow[]): Promise<void> {
  for (let i = 0; i < rows.length; i += 1000) await tx.insert(fixtures).values(rows.slice(i, i + 1000));
}

export async function loadFixtureRows(tx: DbOrTx, planId: string): Promise<FixtureRow[]> {
  return tx.select().from(fixtures).where(eq(fixtures.planId, planId)).orderBy(asc(fixtures.position));
}

/**
 * Adds the store's next plan version. The previous current version stays untouched; its
 * fixtures are copied with the SAME ids (so a fixture's history runs across versions), moved
 * by `transform` when the new version's metres differ (a re-calibration), and the alignment
 * from the previous version is stored. Must run inside a transaction.
 */
export async function addPlanVersion(
  tx: DbOrTx,
  values: NewPlan,
  options: { transform?: Similarity; alignmentKnown?: boolean; id?: string } = {},
): Promise<PlanRow> {
  await lockStoreVersions(tx, values.storeId);
  const previous = await latestVersion(tx, values.storeId);
  const alignment = previous ? (options.transform ?? { scale: 1, rotation: 0, tx: 0, ty: 0 }) : null;
  const [row] = await tx
    .insert(plans)
    .values({
      ...values,
      ...(options.id ? { id: options.id } : {}),
      version: (previous?.version ?? 0) + 1,
      previousPlanId: previous?.id ?? null,
      alignment,
      alignmentMatched: Boolean(previous && options.alignmentKnown),
    })
    .returning();
  if (previous) {
    const copied = (await loadFixtureRows(tx, previous.id)).map((r) => {
      const f = options.transform ? transformFixture(rowToFixture(r), options.transform) : rowToFixture(r);
      return fixtureToRow(row.id, f, r.position);
    });
    if (copied.length) await insertFixtureRows(tx, copied);
  }
  return row;
}
