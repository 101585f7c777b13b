/**
 * Refrigerant catalogue types. Every fact carries its source tag as in
 * docs/reference/standards.md: `[S:id]` sourced, `[M]` from memory, `[D]` derived there.
 */

export type RefrigerantKind = "HFC" | "HCFC" | "HFO" | "HC" | "natural" | "blend";

/** ASHRAE 34 safety classes: toxicity A/B, flammability 1, 2L, 2, 3. */
export type SafetyClass = "A1" | "A2L" | "A2" | "A3" | "B1" | "B2L" | "B2" | "B3";

/**
 * GWP-100 bases. `EU-517/2014` holds only the values Regulation 517/2014 gives where IPCC AR4 has
 * none (HFOs, hydrocarbons); for HFCs that regulation uses AR4 [S:E3], so rule profiles list
 * `["EU-517/2014", "AR4"]` and the first basis with a value wins.
 */
export type GwpBasis = "AR4" | "AR5" | "AR6" | "EU-517/2014";

export interface Sourced<T> {
  value: T;
  /** Source tag and short citation, e.g. "[S:G1] IPCC AR4 via openclimatedata". */
  source: string;
  note?: string;
}

export type GwpTable = Partial<Record<GwpBasis, Sourced<number>>>;

interface RefrigerantBase {
  /** ASHRAE 34 designation with the hyphen: "R-410A", "R-1234ze(E)". */
  id: string;
  name: string;
  safetyClass: Sourced<SafetyClass>;
}

export interface PureRefrigerant extends RefrigerantBase {
  kind: Exclude<RefrigerantKind, "blend">;
  /** Molecular formula in Hill-like order, used to tell halogenated from not (detection.ts). */
  formula: string;
  /** Ozone-depleting substance (contains chlorine or bromine; R-22 is an HCFC). */
  ods: boolean;
  molarMass: Sourced<number>;
  gwp: GwpTable;
}

export interface BlendComponent {
  id: string;
  /** Mass per cent as printed in ASHRAE 34 (24.3, not 0.243) so the sums stay exact decimals. */
  massPercent: number;
}

export interface BlendRefrigerant extends RefrigerantBase {
  kind: "blend";
  components: readonly BlendComponent[];
  compositionSource: string;
}

/**
 * What a company says its own refrigerant is, for the rules: it contains an ozone-depleting substance
 * (US Part 82), an HFC (EU Annex I; US Part 84 when its GWP is above 53), HFOs only (EU Annex II
 * section 1), or no fluorinated gas at all (hydrocarbons, natural refrigerants).
 */
export type SubstanceClass = "ods" | "hfc" | "hfo" | "other";

/** A GWP the company states for its refrigerant, on one basis, with where it read it. */
export interface StatedGwp {
  value: number;
  basis: GwpBasis;
  source: string;
}

/**
 * A refrigerant a company entered itself because the catalogue lacks it (docs/decisions/0073).
 * Either `components` (catalogue refrigerants by mass %, so its GWP is computed on each profile's
 * basis as a catalogue blend's is) or `statedGwp` is set, never both. Fixed once entered.
 */
export interface CompanyRefrigerant extends RefrigerantBase {
  kind: "company";
  substanceClass: SubstanceClass;
  components: readonly BlendComponent[] | null;
  statedGwp: StatedGwp | null;
  /** g/mol; null when the company does not know it and gave no composition. */
  molarMass: number | null;
  /** Hidden from the system form's picker; systems that use it keep it. */
  retired: boolean;
}

/** What the catalogue holds: the same for every company. */
export type CatalogueRefrigerant = PureRefrigerant | BlendRefrigerant;

export type Refrigerant = CatalogueRefrigerant | CompanyRefrigerant;

/** Blends and company refrigerants entered by composition: both are sums over catalogue components. */
export function componentsOf(r: Refrigerant): readonly BlendComponent[] | null {
  if (r.kind === "blend") return r.components;
  if (r.kind === "company") return r.components;
  return null;
}

/** The designation a reader sees: the R-number, or the name a company gave its own refrigerant. */
export function designationOf(r: Refrigerant): string {
  return r.kind === "company" ? r.name : r.id;
}
