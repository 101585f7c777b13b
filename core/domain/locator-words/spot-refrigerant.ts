import { findRefrigerant } from "../refrigerants/catalogue";
import { molarMassOf } from "../refrigerants/molar-mass";

/**
 * The refrigerant a suspect spot's strength is weighed in: that of the system the nearest fixture hangs
 * off, else a default blend, said so. R-404A because it is the blend most supermarket racks of the last
 * decades were charged with (common practice, no published source); 97.60 g/mol
 * (docs/reference/standards.md §3).
 */
export const DEFAULT_REFRIGERANT_ID = "R-404A";

export type SpotRefrigerant =
  | { source: "system"; refrigerantId: string; molarMassGPerMol: number; systemName: string }
  | {
      source: "default";
      refrigerantId: string;
      molarMassGPerMol: number;
      /**
       * Why the default: no fixture near the spot, a fixture linked to no system, a refrigerant not in the
       * catalogue, or no systems known at all (the command line).
       */
      why: "no-fixture" | "no-system" | "unknown-refrigerant" | "no-systems-known";
    };

type DefaultWhy = Extract<SpotRefrigerant, { source: "default" }>["why"];

/** The default blend, for callers that know no systems at all. */
export function defaultRefrigerant(why: DefaultWhy): SpotRefrigerant {
  return { source: "default", refrigerantId: DEFAULT_REFRIGERANT_ID, molarMassGPerMol: defaultMolarMass(), why };
}

export interface FixtureSystem {
  systemName: string;
  refrigerantId: string;
}

const defaultMolarMass = () => molarMassOf(findRefrigerant(DEFAULT_REFRIGERANT_ID)!);

export function spotRefrigerant(
  fixtureId: string | null,
  systemOf: (fixtureId: string) => FixtureSystem | null,
): SpotRefrigerant {
  const fallback = defaultRefrigerant;
  if (!fixtureId) return fallback("no-fixture");
  const system = systemOf(fixtureId);
  if (!system) return fallback("no-system");
  const r = findRefrigerant(system.refrigerantId);
  if (!r) return fallback("unknown-refrigerant");
  return { source: "system", refrigerantId: r.id, molarMassGPerMol: molarMassOf(r), systemName: system.systemName };
}
