import { densityRelativeToAir } from "../refrigerants/molar-mass";
import { componentsOf, designationOf, type Refrigerant } from "../refrigerants/types";

/**
 * The usual cautions shown beside refrigerants, systems and findings. Wording is our own, calm and
 * short; each carries the source of the fact behind it (docs/reference/standards.md §8 tags). The last caution
 * always defers to local codes and licensed practice.
 */
export type CautionId =
  | "flammable"
  | "high-pressure-co2"
  | "toxic-ammonia"
  | "higher-toxicity"
  | "co2-exposure"
  | "oxygen-displacement"
  | "pressure-test-nitrogen"
  | "certified-technicians"
  | "codes-govern"
  | "product-temperature";

export type CautionPlace = "walk-in" | "machine-room" | "sales-floor";

/**
 * Whose rules the reader works under, from the company's rule profile: the certification, codes and
 * exposure limits a caution names are the ones of that place (an EU company reads no US rule).
 */
export type CautionRules = "us" | "eu";

export interface Caution {
  id: CautionId;
  /** "warning" for what can hurt someone now; "notice" for practice and law. */
  level: "warning" | "notice";
  text: string;
  source: string;
}

const FLAMMABLE: Caution = {
  id: "flammable",
  level: "warning",
  text: "This refrigerant is flammable. Remove ignition sources before you search or open the system, and use an instrument rated for flammable refrigerants. Hot surfaces and flames can also break HFCs down into hydrogen fluoride.",
  source: "[S:D2] EN 14624 / EN 50676 scopes; HF formation [M]",
};

const HIGH_PRESSURE_CO2: Caution = {
  id: "high-pressure-co2",
  level: "warning",
  text: "R-744 runs at very high pressure: standstill and high-side pressures often exceed 120 bar design, far above other systems. Use tools and hoses rated for CO2, and expect venting liquid to form dry ice, which can block a line and then release suddenly.",
  source: "[M] docs/reference/standards.md §8 (critical point 31.0 °C / 73.8 bar)",
};

const TOXIC_AMMONIA: Caution = {
  id: "toxic-ammonia",
  level: "warning",
  text: "Ammonia (R-717) is toxic and mildly flammable, and it rises: a leak collects near the ceiling, not the floor. Wear the protection your procedure requires and leave if you smell it strongly.",
  source: "[M] safety class B2L; rises: density 0.59 × air [D] docs/reference/standards.md §4, §8",
};

/** ASHRAE 34 class B: toxicity evidence below 400 ppm; only company refrigerants other than ammonia reach this. */
const HIGHER_TOXICITY: Caution = {
  id: "higher-toxicity",
  level: "warning",
  text: "This refrigerant is in a higher-toxicity safety class (B). Wear the protection your procedure requires, ventilate before you search, and leave if the room's detector alarms.",
  source: "ASHRAE 34 safety group letter B (higher toxicity) [M]",
};

/** CO2 exposure limits as docs/reference/standards.md §5 states them; the site's detector and codes decide. */
const CO2_EXPOSURE: Caution = {
  id: "co2-exposure",
  level: "warning",
  text: "CO2 (R-744) is harmful to breathe well before it displaces oxygen. Exposure limits: 5,000 ppm averaged over a work shift and 30,000 ppm over 15 minutes (ACGIH); 5,000 ppm over a shift (OSHA). Trust the site's CO2 detector: leave when it alarms. Local codes and the site's procedure govern.",
  source: "[S:S2] ACGIH TLV 5,000 ppm TWA, 30,000 ppm STEL; OSHA PEL 5,000 ppm TWA [M]",
};

/** The same limits without the US regulator's figure: the brief's ACGIH pair, the site's detector and codes. */
const CO2_EXPOSURE_EU: Caution = {
  ...CO2_EXPOSURE,
  text: "CO2 (R-744) is harmful to breathe well before it displaces oxygen. Exposure limits: 5,000 ppm averaged over a work shift and 30,000 ppm over 15 minutes (ACGIH). Trust the site's CO2 detector: leave when it alarms. Local codes and the site's procedure govern.",
  source: "[S:S2] ACGIH TLV 5,000 ppm TWA, 30,000 ppm STEL",
};

function oxygenCaution(r: Refrigerant | undefined, place: CautionPlace | undefined, rules: CautionRules): Caution {
  const where =
    place === "walk-in"
      ? "this walk-in"
      : place === "machine-room"
        ? "this machine room"
        : "closed rooms such as walk-ins and machine rooms";
  const density = r === undefined ? undefined : densityRelativeToAir(r);
  // A company refrigerant entered without molar mass or composition: say both places, not a guess.
  const layer =
    density === null
      ? "may fill from the floor up or collect near the ceiling (its density is not known)"
      : density !== undefined && density < 1
        ? "collects near the ceiling"
        : "fills from the floor up";
  return {
    id: "oxygen-displacement",
    level: "warning",
    text: `Any refrigerant displaces oxygen. In ${where} a large leak ${layer} without warning. Check the room's refrigerant detector and alarm before you go in, keep the door open and do not work alone; below 19.5 % oxygen the air is unsafe to breathe.`,
    source:
      rules === "eu"
        ? "[M] docs/reference/standards.md §8 (19.5 % O2); density vs air [D] §4"
        : "[M] docs/reference/standards.md §8 (OSHA 19.5 % O2; confined spaces 29 CFR 1910.146); density vs air [D] §4",
  };
}

const PRESSURE_TEST: Caution = {
  id: "pressure-test-nitrogen",
  level: "warning",
  text: "Never pressure-test with oxygen or compressed air. Use dry nitrogen through a pressure regulator.",
  source: "[S:R7]",
};

const CERTIFIED: Caution = {
  id: "certified-technicians",
  level: "notice",
  text: "Only certified technicians attach gauges or add or remove refrigerant (in the US, EPA Section 608 Type I, II, III or Universal, by type of equipment).",
  source: "[S:D3b,R9]",
};

const CODES: Caution = {
  id: "codes-govern",
  level: "notice",
  text: "These notes do not replace the rules that apply where you work: ASHRAE 15, IMC chapter 11, EN 378, ISO 5149, CSA B52, local codes and licensed judgement govern.",
  source: "docs/reference/standards.md §8 disclaimer",
};

/** Under EU rules: dry nitrogen for pressure tests is trade practice, not a rule we can cite there. */
const PRESSURE_TEST_EU: Caution = { ...PRESSURE_TEST, source: "common practice, no published source" };

/** Regulation (EU) 2024/573 asks for certified persons; the article number is from memory. */
const CERTIFIED_EU: Caution = {
  id: "certified-technicians",
  level: "notice",
  text: "Only certified persons attach gauges, check for leaks, or add or remove refrigerant (in the EU, a certificate under Regulation (EU) 2024/573 for the kind of equipment).",
  source: "[M] Regulation (EU) 2024/573, Art. 10 (training and certification)",
};

/** The European codes only: EN 378 and ISO 5149, then national and local codes. */
const CODES_EU: Caution = {
  ...CODES,
  text: "These notes do not replace the rules that apply where you work: EN 378, ISO 5149, national and local codes and licensed judgement govern.",
};

/** Flammability class 2L, 2 or 3 (ASHRAE 34: the digit after the toxicity letter). */
export function isFlammableClass(safetyClass: string): boolean {
  return /^[AB](2L|2|3)$/.test(safetyClass);
}

function isHigherToxicityClass(safetyClass: string): boolean {
  return safetyClass.startsWith("B");
}

/**
 * Cautions for a refrigerant and/or a place, warnings first, then practice and law. With neither
 * argument it returns the general set (oxygen displacement, nitrogen, certification, codes).
 */
export function cautionsFor(
  options: { refrigerant?: Refrigerant; place?: CautionPlace; rules?: CautionRules } = {},
): Caution[] {
  const { refrigerant: r, place, rules = "us" } = options;
  const eu = rules === "eu";
  const list: Caution[] = [];
  if (r && r.id === "R-717") list.push(TOXIC_AMMONIA);
  else if (r && isFlammableClass(r.safetyClass.value)) list.push(FLAMMABLE);
  if (r && r.id !== "R-717" && isHigherToxicityClass(r.safetyClass.value)) list.push(HIGHER_TOXICITY);
  if (r && isMostlyCo2(r)) list.push(HIGH_PRESSURE_CO2, eu ? CO2_EXPOSURE_EU : CO2_EXPOSURE);
  if (place !== "sales-floor") list.push(oxygenCaution(r, place, rules));
  list.push(...(eu ? [PRESSURE_TEST_EU, CERTIFIED_EU, CODES_EU] : [PRESSURE_TEST, CERTIFIED, CODES]));
  return list;
}

function isMostlyCo2(r: Refrigerant): boolean {
  return r.id === "R-744" || (componentsOf(r)?.some((c) => c.id === "R-744" && c.massPercent >= 50) ?? false);
}

/**
 * Cautions for entering a walk-in or machine room that knows the refrigerants of the systems in it:
 * ammonia rises and is toxic, CO2 has exposure limits and high pressure, flammable refrigerants need
 * ignition sources removed, and the oxygen warning says where the gas collects for these refrigerants
 * (heavier than air: from the floor up; ammonia: near the ceiling). Without known systems it gives
 * the general room warning. The last caution defers to local codes.
 */
export function roomCautions(
  place: CautionPlace,
  refrigerants: readonly Refrigerant[],
  rules: CautionRules = "us",
): Caution[] {
  const distinct = [...new Map(refrigerants.map((r) => [r.id, r])).values()];
  const list: Caution[] = [];
  if (distinct.some((r) => r.id === "R-717")) list.push(TOXIC_AMMONIA);
  if (distinct.some(isMostlyCo2)) list.push(rules === "eu" ? CO2_EXPOSURE_EU : CO2_EXPOSURE, HIGH_PRESSURE_CO2);
  const flammable = distinct.filter((r) => r.id !== "R-717" && isFlammableClass(r.safetyClass.value));
  if (flammable.length)
    list.push({ ...FLAMMABLE, text: `${flammable.map(designationOf).join(", ")}: ${FLAMMABLE.text}` });
  const toxic = distinct.filter((r) => r.id !== "R-717" && isHigherToxicityClass(r.safetyClass.value));
  if (toxic.length)
    list.push({ ...HIGHER_TOXICITY, text: `${toxic.map(designationOf).join(", ")}: ${HIGHER_TOXICITY.text}` });
  list.push(roomOxygenCaution(place, distinct, rules));
  list.push(rules === "eu" ? CODES_EU : CODES);
  return list;
}

function roomOxygenCaution(place: CautionPlace, refrigerants: readonly Refrigerant[], rules: CautionRules): Caution {
  if (refrigerants.length === 0) return oxygenCaution(undefined, place, rules);
  const where = place === "machine-room" ? "this machine room" : "this walk-in";
  const densityOf = (r: Refrigerant) => densityRelativeToAir(r);
  const named = (list: readonly Refrigerant[]) => list.map(designationOf).join(", ");
  const rising = refrigerants.filter((r) => (densityOf(r) ?? 1) < 1);
  const sinking = refrigerants.filter((r) => (densityOf(r) ?? 0) >= 1);
  const unknown = refrigerants.filter((r) => densityOf(r) === null);
  const layers = [
    sinking.length ? `${named(sinking)} ${sinking.length > 1 ? "fill" : "fills"} it from the floor up` : "",
    rising.length ? `${named(rising)} ${rising.length > 1 ? "collect" : "collects"} near the ceiling` : "",
    unknown.length ? `${named(unknown)} may fill it from the floor up or collect near the ceiling` : "",
  ].filter(Boolean);
  const base = oxygenCaution(undefined, place, rules);
  return {
    ...base,
    text: `Any refrigerant displaces oxygen. In ${where} a large leak of ${layers.join("; ")}, without warning. Check the room's refrigerant detector and alarm before you go in, keep the door open and do not work alone; below 19.5 % oxygen the air is unsafe to breathe.`,
  };
}
