import {
  customType,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import type { AnalysisParams, AnalysisSummary } from "#core/contracts/analysis";
import { companies } from "./companies";
import { sweeps } from "./sweeps";

const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => "bytea" });

/**
 * A cached locator result for one sweep and one parameter set. The row is kept when readings change;
 * its readings_revision then differs from the sweep's and the API calls it stale until recomputed.
 */
export const analyses = pgTable(
  "analyses",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    sweepId: uuid()
      .notNull()
      .references(() => sweeps.id, { onDelete: "cascade" }),
    /** Canonical text of `params`, the cache key together with the sweep. */
    paramsKey: text().notNull(),
    params: jsonb().$type<AnalysisParams>().notNull(),
    /** The sweep's readings_revision the result was computed from. */
    readingsRevision: integer().notNull(),
    /** Suspect spots, background, diagnostics, assumptions and corrected readings (JSON). */
    result: jsonb().$type<AnalysisSummary>().notNull(),
    fieldWidth: integer().notNull(),
    fieldHeight: integer().notNull(),
    cellSize: doublePrecision().notNull(),
    /** Float32 little-endian ppm per cell (NaN unknown), row-major. */
    fieldValues: bytea().notNull(),
    /** Confidence per cell quantised to 0..255. */
    fieldConfidence: bytea().notNull(),
    durationMs: integer().notNull(),
    computedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("analyses_sweep_params").on(t.sweepId, t.paramsKey), index("analyses_company").on(t.companyId)],
);
