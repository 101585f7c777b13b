import { eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { companies } from "../../db/schema/index";
import type { LengthPreference, MassPreference } from "#core/domain/units/format-units";

export interface ReaderUnits {
  length: LengthPreference;
  mass: MassPreference;
}

/** The reader's length and mass units: their own choices, else the company's defaults. */
export async function readerUnits(
  ctx: AppContext,
  user: { lengthUnit: LengthPreference | null; massUnit: MassPreference | null },
  companyId: string,
): Promise<ReaderUnits> {
  if (user.lengthUnit && user.massUnit) return { length: user.lengthUnit, mass: user.massUnit };
  const [c] = await ctx.db
    .select({ lengthUnit: companies.lengthUnit, massUnit: companies.massUnit })
    .from(companies)
    .where(eq(companies.id, companyId));
  return { length: user.lengthUnit ?? c?.lengthUnit ?? "m", mass: user.massUnit ?? c?.massUnit ?? "kg" };
}
