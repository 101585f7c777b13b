import { eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { companies } from "../../db/schema/index";
import type { NumberFormat } from "#core/domain/numbers/number-format";
import type { MassPreference } from "#core/domain/units/format-units";

/** How a company's records print masses: its unit first, the other beside it, in its number format. */
export interface MassDisplay {
  mass: MassPreference;
  number: NumberFormat;
}

export const DEFAULT_MASS_DISPLAY: MassDisplay = { mass: "kg", number: "1,234.5" };

export async function companyMassDisplay(ctx: AppContext, companyId: string): Promise<MassDisplay> {
  const [c] = await ctx.db
    .select({ mass: companies.massUnit, number: companies.numberFormat })
    .from(companies)
    .where(eq(companies.id, companyId));
  return c ?? DEFAULT_MASS_DISPLAY;
}
