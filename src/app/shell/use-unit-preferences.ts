import type { NumberFormat } from "#core/domain/numbers/number-format";
import type { LengthPreference, MassPreference } from "#core/domain/units/format-units";
import { useCompanySettings } from "../../features/settings/api/get-company-settings";
import { useSignedIn } from "./session-context";

export interface UnitPreferences {
  length: LengthPreference;
  mass: MassPreference;
  /** The company's number format (a company setting, not a personal one: records read alike). */
  number: NumberFormat;
}

/** The person's own units, else the company's default (docs/product.md); metres and kg until loaded. */
export function useUnitPreferences(): UnitPreferences {
  const { user } = useSignedIn();
  const company = useCompanySettings();
  return {
    length: user.lengthUnit ?? company.data?.lengthUnit ?? "m",
    mass: user.massUnit ?? company.data?.massUnit ?? "kg",
    number: company.data?.numberFormat ?? "1,234.5",
  };
}
