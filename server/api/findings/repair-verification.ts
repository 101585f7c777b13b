import { and, eq, inArray } from "drizzle-orm";
import type { AppContext } from "../../context";
import { leakChecks } from "../../db/schema/index";
import type { Verification } from "#core/domain/findings/lifecycle";

/**
 * How a finding's repair is verified under the company's rules: by the US verification tests, or under
 * EU F-gas rules by a clean leak check of its system on or after the repair day (the re-check).
 */
export async function repairVerification(
  ctx: AppContext,
  wording: "us" | "eu",
  systemIds: readonly (string | null)[],
): Promise<(systemId: string | null) => Verification> {
  if (wording === "us") return () => ({ by: "tests" });
  const ids = [...new Set(systemIds.filter((x): x is string => !!x))];
  const clean = ids.length
    ? await ctx.db
        .select({ systemId: leakChecks.systemId, on: leakChecks.checkedOn })
        .from(leakChecks)
        .where(and(inArray(leakChecks.systemId, ids), eq(leakChecks.leakFound, false)))
    : [];
  return (systemId) => ({
    by: "recheck",
    cleanChecksOn: clean.filter((c) => c.systemId === systemId).map((c) => c.on),
  });
}
