import { DomainInputError } from "../input-error";
import { BLENDS } from "./blends";
import { PURE_REFRIGERANTS } from "./pure-substances";
import type { CatalogueRefrigerant, PureRefrigerant, Refrigerant } from "./types";

/** Every refrigerant Plumeline knows, pure substances first. */
export const REFRIGERANTS: readonly CatalogueRefrigerant[] = [...PURE_REFRIGERANTS, ...BLENDS];

const byKey = new Map(REFRIGERANTS.map((r) => [keyOf(r.id), r]));

/** "r410a", "R 410A", "410A" and "R-410A" are the same refrigerant; "(E)" is kept significant. */
function keyOf(text: string): string {
  return text
    .trim()
    .toUpperCase()
    .replace(/^R[\s-]*/, "")
    .replace(/[\s-]/g, "");
}

/** Looks a refrigerant up by its R-number, forgiving case, spaces and the hyphen. */
export function findRefrigerant(id: string): CatalogueRefrigerant | undefined {
  return typeof id === "string" ? byKey.get(keyOf(id)) : undefined;
}

/** Like findRefrigerant, but an unknown R-number is a field error. */
export function getRefrigerant(id: string, field = "refrigerant"): CatalogueRefrigerant {
  const r = findRefrigerant(id);
  if (!r) throw new DomainInputError(field, `unknown refrigerant ${JSON.stringify(id)}`);
  return r;
}

/** A blend's component or any pure refrigerant; a missing component is a catalogue bug. */
export function getPure(id: string): PureRefrigerant {
  const r = findRefrigerant(id);
  if (!r || r.kind === "blend") throw new Error(`catalogue: ${id} is not a pure refrigerant in the catalogue`);
  return r;
}

/** True when the refrigerant is, or contains, an ozone-depleting substance (R-22 is an HCFC). */
export function isOzoneDepleting(r: Refrigerant): boolean {
  if (r.kind === "company") return r.substanceClass === "ods";
  return r.kind === "blend" ? r.components.some((c) => getPure(c.id).ods) : r.ods;
}
