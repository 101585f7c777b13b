import { eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { companies } from "../../db/schema/index";
import { formatGrouped, type NumberFormat } from "#core/domain/numbers/number-format";
import type { MassPreference } from "#core/domain/units/format-units";

const KG_PER_LB = 0.45359237; // NIST SP 811, appendix B.8

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

/** "4.54 kg (10.0 lb)" for a kg company, "10.0 lb (4.54 kg)" for an lb one: kg to 2 places, lb to 1. */
export function printMass(kg: number, d: MassDisplay): string {
  const kgText = `${formatGrouped(kg, d.number, 2)} kg`;
  const lbText = `${formatGrouped(kg / KG_PER_LB, d.number, 1)} lb`;
  return d.mass === "lb" ? `${lbText} (${kgText})` : `${kgText} (${lbText})`;
}
