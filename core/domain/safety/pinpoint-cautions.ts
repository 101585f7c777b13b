import type { Refrigerant } from "../refrigerants/types";
import { cautionsFor, roomCautions, type Caution, type CautionPlace } from "./cautions";

/**
 * Stopped fans and a defrost let the product warm: the pass is kept short and a reminder asks for the
 * fans back. How long product may stay out of temperature is the store's food-safety rule, not ours.
 */
export const PRODUCT_TEMPERATURE: Caution = {
  id: "product-temperature",
  level: "warning",
  text: "With the fans stopped or in a defrost the product warms up. Keep the pass short, watch the case or room temperature, follow the store's food-safety procedure for product that runs warm, and restore the fans as soon as you are done.",
  source: "common practice, no published source",
};

/** Cautions that follow the refrigerant wherever it is (a case on the sales floor). */
const FOLLOWS_REFRIGERANT = new Set<string>([
  "flammable",
  "toxic-ammonia",
  "high-pressure-co2",
  "co2-exposure",
  "certified-technicians",
  "codes-govern",
]);

/**
 * Before a pinpoint pass: the product-temperature warning, then the place's cautions for the refrigerants
 * of its systems (a walk-in or machine room: where a leak collects with the air still, ammonia, CO2 and
 * flammable refrigerants; a case: the refrigerants' own), ending with the caution that defers to local
 * codes and certified practice.
 */
export function pinpointPassCautions(place: CautionPlace, refrigerants: readonly Refrigerant[]): Caution[] {
  if (place !== "sales-floor") return [PRODUCT_TEMPERATURE, ...roomCautions(place, refrigerants)];
  const byId = new Map<string, Caution>();
  const each = refrigerants.length ? refrigerants : [undefined];
  for (const r of each)
    for (const c of cautionsFor({ refrigerant: r, place })) if (FOLLOWS_REFRIGERANT.has(c.id)) byId.set(c.id, c);
  const list = [...byId.values()];
  // warnings first, the codes last
  list.sort((a, b) => rank(a) - rank(b));
  return [PRODUCT_TEMPERATURE, ...list];
}

function rank(c: Caution): number {
  return c.id === "codes-govern" ? 2 : c.level === "warning" ? 0 : 1;
}
