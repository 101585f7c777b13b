import { eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { companies } from "../../db/schema/index";
import type { NumberFormat } from "#core/domain/numbers/number-format";
import type { LengthPreference, MassPreference } from "#core/domain/units/format-units";

export interface ReaderUnits {
  length: LengthPreference;
  mass: MassPreference;
  /** The company's number format: a company setting, so records read alike for everyone. */
  number: NumberFormat;
}

/** The reader's length and mass units (their own choices, else the company's) and the company's number format. */
export async function readerUnits(
  ctx: AppContext,
  user: { lengthUnit: LengthPreference | null; massUnit: MassPreference | null },
  companyId: string,
): Promise<ReaderUnits> {
  const [c] = await ctx.db
    .select({ lengthUnit: companies.lengthUnit, massUnit: companies.massUnit, numberFormat: companies.numberFormat })
    .from(companies)
    .where(eq(companies.id, companyId));
  return {
    length: user.lengthUnit ?? c?.lengthUnit ?? "m",
    mass: user.massUnit ?? c?.massUnit ?? "kg",
    number: c?.numberFormat ?? "1,234.5",
  };
}
