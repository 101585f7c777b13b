import { findRefrigerant } from "../refrigerants/catalogue";
import { molarMassOf } from "../refrigerants/molar-mass";
import type { Refrigerant, SafetyClass } from "../refrigerants/types";

/**
 * The refrigerant a suspect spot's strength is weighed in: that of the system the nearest fixture hangs
 * off, else a default blend, said so. R-404A because it is the blend most supermarket racks of the last
 * decades were charged with (common practice, no published source); 97.60 g/mol
 * (docs/reference/standards.md §3).
 */
export const DEFAULT_REFRIGERANT_ID = "R-404A";

export interface EnteredRefrigerant {
  name: string;
  safetyClass: string;
  components: { id: string; massPercent: number }[] | null;
  molarMass: number | null;
}

export type SpotRefrigerant =
  | {
      source: "system";
      refrigerantId: string;
      molarMassGPerMol: number;
      systemName: string;
      /** A company's own refrigerant, carried whole enough to word it and give its cautions. */
      entered?: EnteredRefrigerant;
      /** Its molar mass is not known: the strength is weighed in this default's instead, said so. */
      molarMassAssumedFrom?: string;
    }
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
  lookup: (id: string) => Refrigerant | undefined = findRefrigerant,
): SpotRefrigerant {
  const fallback = defaultRefrigerant;
  if (!fixtureId) return fallback("no-fixture");
  const system = systemOf(fixtureId);
  if (!system) return fallback("no-system");
  const r = lookup(system.refrigerantId);
  if (!r) return fallback("unknown-refrigerant");
  const molarMass = molarMassOf(r);
  const entered =
    r.kind === "company"
      ? {
          entered: {
            name: r.name,
            safetyClass: r.safetyClass.value,
            components: r.components ? r.components.map((c) => ({ ...c })) : null,
            molarMass,
          },
        }
      : {};
  return {
    source: "system",
    refrigerantId: r.id,
    molarMassGPerMol: molarMass ?? defaultMolarMass(),
    systemName: system.systemName,
    ...entered,
    ...(molarMass === null ? { molarMassAssumedFrom: DEFAULT_REFRIGERANT_ID } : {}),
  };
}

/** What a reader calls the spot's refrigerant: the R-number, or the company's name for its own. */
export function spotRefrigerantName(r: SpotRefrigerant): string {
  return r.source === "system" && r.entered ? r.entered.name : r.refrigerantId;
}

/** The refrigerant whose cautions apply at the spot: the system's, from the catalogue or as the company entered it. */
export function cautionRefrigerant(r: SpotRefrigerant): Refrigerant | undefined {
  if (r.source !== "system") return undefined;
  if (!r.entered) return findRefrigerant(r.refrigerantId);
  return {
    id: r.refrigerantId,
    name: r.entered.name,
    kind: "company",
    safetyClass: { value: r.entered.safetyClass as SafetyClass, source: "entered by the company" },
    substanceClass: "other",
    components: r.entered.components,
    statedGwp: null,
    molarMass: r.entered.molarMass,
    retired: false,
  };
}
