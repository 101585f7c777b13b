import type { RefrigerantKind } from "./types";

/** Which EU group a refrigerant falls in for leak checks. */
export type FgasGroup = "annex-I" | "annex-II-hfo" | "not-covered";

/**
 * HFCs and mixtures containing any HFC are Annex I gases (checked by CO2e); pure HFOs (and mixtures
 * of HFOs only) are Annex II section 1 (checked by kg, 2024/573). HCFCs fall under the ozone
 * regulation and natural refrigerants under neither (docs/reference/standards.md §2).
 */
export function fgasGroupOfKinds(kinds: readonly RefrigerantKind[]): FgasGroup {
  if (kinds.includes("HFC")) return "annex-I";
  if (kinds.includes("HFO") && kinds.every((k) => k === "HFO")) return "annex-II-hfo";
  return "not-covered";
}
