import type { NumberFormat } from "#core/domain/numbers/number-format";
import type { LengthPreference, MassPreference } from "#core/domain/units/format-units";
import { useSignedIn } from "./session-context";

export interface UnitPreferences {
  length: LengthPreference;
  mass: MassPreference;
  /** The company's number format (a company setting, not a personal one: records read alike). */
  number: NumberFormat;
}

/**
 * The units to show: the person's own choice, else the company's default (docs/product.md), as
 * the server resolved them into the session. The session is the copy the device keeps for working
 * offline, so after a reload without a connection lengths stay in the member's units rather than
 * falling back to metres while the company settings cannot be fetched.
 */
export function useUnitPreferences(): UnitPreferences {
  const { session } = useSignedIn();
  return { length: session.units.length, mass: session.units.mass, number: session.units.number };
}
