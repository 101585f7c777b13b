import { DomainInputError } from "../input-error";
import { findRefrigerant, getPure, isOzoneDepleting } from "./catalogue";
import { fgasGroupOfKinds } from "./fgas-kinds";
import type { BlendComponent, CompanyRefrigerant, Refrigerant, SafetyClass, StatedGwp, SubstanceClass } from "./types";

/**
 * A composition must add up to 100 % within this many percentage points: enough for three components
 * rounded to one decimal each, too little to hide a missing component. Our own choice (decision 0073).
 */
export const COMPOSITION_TOLERANCE_PERCENT = 0.1;

const KEY_PREFIX = "company:";

/** The id a system stores for a company refrigerant: never an R-number, so a future catalogue entry cannot take it over. */
export function companyRefrigerantKey(rowId: string): string {
  return `${KEY_PREFIX}${rowId}`;
}

/** The row id inside a company refrigerant's key, or null for a catalogue id. */
export function companyRefrigerantRowId(key: string): string | null {
  return key.startsWith(KEY_PREFIX) ? key.slice(KEY_PREFIX.length) : null;
}

export interface CompanyRefrigerantFacts {
  name: string;
  safetyClass: SafetyClass;
  /** Stated with a GWP; derived from the components with a composition. */
  substanceClass?: SubstanceClass;
  molarMass?: number | null;
  composition?: readonly { refrigerantId: string; massPercent: number }[];
  statedGwp?: StatedGwp;
}

/** What the facts come to once checked: components by catalogue id, the class derived when a composition gives it. */
export interface CheckedCompanyRefrigerant {
  name: string;
  safetyClass: SafetyClass;
  substanceClass: SubstanceClass;
  components: BlendComponent[] | null;
  statedGwp: StatedGwp | null;
  molarMass: number | null;
}

/**
 * Checks a company's own refrigerant before it is saved: the name is no catalogue designation,
 * a composition names catalogue pure refrigerants once each and adds up to 100 %, a stated GWP comes
 * with its class, and a stated class agrees with the composition. Throws a DomainInputError naming the field.
 */
export function checkCompanyRefrigerant(facts: CompanyRefrigerantFacts): CheckedCompanyRefrigerant {
  const clash = findRefrigerant(facts.name);
  if (clash) throw new DomainInputError("name", `is the catalogue's ${clash.id}: pick that one instead`);
  if (facts.composition && facts.statedGwp)
    throw new DomainInputError("statedGwp", "give either a composition or a stated GWP, not both");
  if (facts.composition) return checkComposition(facts, facts.composition);
  if (!facts.statedGwp) throw new DomainInputError("composition", "give a composition or a stated GWP");
  if (!facts.substanceClass)
    throw new DomainInputError("substanceClass", "is required with a stated GWP (ODS, HFC, HFO only or other)");
  return {
    name: facts.name,
    safetyClass: facts.safetyClass,
    substanceClass: facts.substanceClass,
    components: null,
    statedGwp: facts.statedGwp,
    molarMass: facts.molarMass ?? null,
  };
}

function checkComposition(
  facts: CompanyRefrigerantFacts,
  composition: readonly { refrigerantId: string; massPercent: number }[],
): CheckedCompanyRefrigerant {
  const components: BlendComponent[] = [];
  composition.forEach((c, i) => {
    const field = `composition.${i}.refrigerantId`;
    const r = findRefrigerant(c.refrigerantId);
    if (!r) throw new DomainInputError(field, `${JSON.stringify(c.refrigerantId)} is not in the refrigerant catalogue`);
    if (r.kind === "blend") throw new DomainInputError(field, `${r.id} is a blend: enter its components instead`);
    if (components.some((k) => k.id === r.id)) throw new DomainInputError(field, `${r.id} is listed twice`);
    components.push({ id: r.id, massPercent: c.massPercent });
  });
  const total = components.reduce((s, c) => s + c.massPercent, 0);
  if (Math.abs(total - 100) > COMPOSITION_TOLERANCE_PERCENT + 1e-9) {
    const shown = Math.round(total * 1000) / 1000;
    throw new DomainInputError(
      "composition",
      `mass per cents add up to ${shown} %, not 100 % (within ±${COMPOSITION_TOLERANCE_PERCENT} percentage points)`,
    );
  }
  const derived = classOfComponents(components);
  if (facts.substanceClass && facts.substanceClass !== derived) {
    throw new DomainInputError("substanceClass", `the composition makes it ${CLASS_WORDS[derived]}`);
  }
  if (facts.molarMass != null)
    throw new DomainInputError("molarMass", "leave it empty: it is computed from the composition");
  return {
    name: facts.name,
    safetyClass: facts.safetyClass,
    substanceClass: derived,
    components,
    statedGwp: null,
    molarMass: null,
  };
}

/** The class a composition gives, by the same reading the catalogue blends get. */
function classOfComponents(components: readonly BlendComponent[]): SubstanceClass {
  const pures = components.map((c) => getPure(c.id));
  if (pures.some((r) => isOzoneDepleting(r))) return "ods";
  const group = fgasGroupOfKinds(pures.map((r) => r.kind));
  return group === "annex-I" ? "hfc" : group === "annex-II-hfo" ? "hfo" : "other";
}

export const CLASS_WORDS: Readonly<Record<SubstanceClass, string>> = {
  ods: "ozone-depleting (contains a CFC or HCFC)",
  hfc: "an HFC or a blend containing an HFC",
  hfo: "HFOs only",
  other: "no fluorinated gas (hydrocarbon or natural refrigerant)",
};

export interface CompanyRefrigerantRow extends CheckedCompanyRefrigerant {
  id: string;
  retired: boolean;
}

/** The domain refrigerant of a saved row: every figure (GWP, CO2e, parts, bands, cautions) reads it as it reads the catalogue. */
export function toCompanyRefrigerant(row: CompanyRefrigerantRow): CompanyRefrigerant {
  return {
    id: companyRefrigerantKey(row.id),
    name: row.name,
    kind: "company",
    safetyClass: { value: row.safetyClass, source: "entered by the company" },
    substanceClass: row.substanceClass,
    components: row.components,
    statedGwp: row.statedGwp,
    molarMass: row.molarMass,
    retired: row.retired,
  };
}

/** Looks a refrigerant up in the catalogue, then among the company's own (by key). */
export function refrigerantLookup(own: readonly CompanyRefrigerant[]): (id: string) => Refrigerant | undefined {
  const byKey = new Map(own.map((r) => [r.id, r]));
  return (id) => (companyRefrigerantRowId(id) !== null ? byKey.get(id) : findRefrigerant(id));
}

/**
 * The refrigerant behind a summary the client holds (a system's, kept on the device for the Walk):
 * the catalogue's own, or a company's as far as the summary says: enough for the room's cautions
 * (safety class; where a leak collects is then said to be unknown) and, with its composition, for
 * which detectors see it.
 */
export function refrigerantOfSummary(s: {
  id: string;
  designation: string;
  safetyClass: string;
  components?: readonly { id: string; massPercent: number }[];
}): Refrigerant {
  return (
    findRefrigerant(s.id) ?? {
      id: s.id,
      name: s.designation,
      kind: "company",
      safetyClass: { value: s.safetyClass as SafetyClass, source: "entered by the company" },
      substanceClass: "other",
      components: s.components ?? null,
      statedGwp: null,
      molarMass: null,
      retired: false,
    }
  );
}
