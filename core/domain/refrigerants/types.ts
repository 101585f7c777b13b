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

export type Refrigerant = PureRefrigerant | BlendRefrigerant;
