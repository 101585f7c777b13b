import { describe, expect, it } from "vitest";
import type { SuspectSpotWithRefrigerant } from "../../contracts/analysis";
import type { LocatorAssumptions } from "../../contracts/locator-output";
import { getRefrigerant } from "../refrigerants/catalogue";
import { checkCompanyRefrigerant, refrigerantLookup, toCompanyRefrigerant } from "../refrigerants/company-refrigerant";
import { molarMassOf } from "../refrigerants/molar-mass";
import { delayCheckWords } from "./delay-words";
import { diagnosticWords, noSpotWords } from "./diagnostic-words";
import { lengthWords } from "./length-words";
import { massPerYearWords } from "./mass-words";
import { formatGrouped, formatSignificant } from "../numbers/number-format";
import { presentAnalysis, wordsContext, type ReaderSettings } from "./present-analysis";
import { spotRefrigerant } from "./spot-refrigerant";
import { gramsPerYear } from "./spot-words";

const CASE = "3f0c6a52-8a1e-4f51-9a55-0c1d2e3f4a5b";
const DROP = "9b1d2c3e-4f50-4a6b-8c7d-1e2f3a4b5c6d";
const names = new Map([
  [CASE, "Dairy 3"],
  [DROP, "Drop D-3"],
]);

// An invented spot on an invented store's dairy line.
const spot: SuspectSpotWithRefrigerant = {
  rank: 1,
  x: 12.192,
  y: 3.048,
  radius: 2.4384,
  score: 0.8,
  strength: 1,
  // 3,700 mol/yr × 86.28 g/mol ≈ 319 kg/yr: the size that read "about 319500 g/yr" before
  molPerYear: 3703,
  fixtureId: CASE,
  riskPointId: DROP,
  reason: {
    kind: "fitted",
    supportCount: 6,
    peakPpm: 31.5,
    backgroundPpm: 0.4,
    fixture: { id: CASE, kind: "open-case", distanceM: 0 },
    oneSided: true,
  },
  nextChecks: [
    { kind: "risk-point-first", riskPointId: DROP, riskPointKind: "line-set", distanceM: 0.1524 },
    { kind: "grid-recheck", spacingM: 0.6, withinM: 2.4384 },
    { kind: "other-face" },
  ],
  refrigerant: spotRefrigerant(CASE, () => ({ systemName: "Rack B", refrigerantId: "R-448A" })),
};

const assumptions: LocatorAssumptions = {
  shiftS: 6.5,
  mixingHeightM: 3,
  airChangesPerH: 2,
  molarVolumeL: 24.465,
  temperatureC: 25,
  pressureKPa: 101.325,
};

const reader = (length: "m" | "ft-in", mass: "kg" | "lb"): ReaderSettings => ({
  length,
  mass,
  names,
  delaySetByHand: false,
});

const facts = (
  candidates: SuspectSpotWithRefrigerant[],
  diagnostics: Parameters<typeof presentAnalysis>[0]["diagnostics"] = [],
) => ({
  candidates,
  diagnostics,
  assumptions,
  delay: { statedS: 6.5, estimatedS: 8, supported: true, usedS: 8, statedMisfit: 0.4, estimatedMisfit: 0.1 },
  params: { timeConstantS: 1.5 },
});

describe("the locator's words", () => {
  it("words the same spot in metres and kg, and in feet-inches and lb, never mixing them", () => {
    const m = presentAnalysis(facts([spot]), reader("m", "kg")).spots[0];
    const ft = presentAnalysis(facts([spot]), reader("ft-in", "lb")).spots[0];
    // 12.192 m = 40 ft, 3.048 m = 10 ft, 2.4384 m = 8 ft, 0.1524 m = 6 in exactly (1 ft = 0.3048 m; NIST SP 811, B.8)
    expect(m.where).toBe("12.2 m across, 3.0 m down, within 2.4 m");
    expect(ft.where).toBe("40 ft across, 10 ft down, within 8 ft");
    expect(m.nextCheck).toBe(
      "Look at the line-set drop Drop D-3 (0.2 m away) first; re-check every 0.6 m within 2.4 m of this spot, probe slow and close to joints; make a pass along the other face to tell which side the leak is on.",
    );
    expect(ft.nextCheck).toBe(
      "Look at the line-set drop Drop D-3 (6 in away) first; re-check every 2 ft within 8 ft of this spot, probe slow and close to joints; make a pass along the other face to tell which side the leak is on.",
    );
    for (const text of [ft.where, ft.reason, ft.nextCheck, ft.strength])
      expect(text).not.toMatch(/\d m\b|\bkg\b|\bg\/yr/);
    for (const text of [m.where, m.reason, m.nextCheck, m.strength])
      expect(text).not.toMatch(/\bft\b|\bin\b|\blb\b|\boz\b/);
  });

  it("names fixtures and risk points by the names on the plan, never by id", () => {
    const w = presentAnalysis(facts([spot]), reader("m", "kg"));
    expect(w.spots[0].place).toBe("Dairy 3");
    expect(w.spots[0].riskPoint).toBe("Drop D-3");
    expect(w.spots[0].reason).toBe(
      "6 readings nearby rise to 31.5 ppm against a background of 0.4 ppm; one source inside the open case Dairy 3 explains them best. The readings come from one pass, so the side of the path is uncertain.",
    );
    const all = JSON.stringify(w);
    expect(all).not.toContain(CASE);
    expect(all).not.toContain(DROP);
    // a fixture nobody named is described, not identified by its id
    const unnamed = presentAnalysis(facts([spot]), { ...reader("m", "kg"), names: new Map() });
    expect(unnamed.spots[0].reason).toContain("inside an unnamed open case");
    expect(JSON.stringify(unnamed)).not.toContain(CASE);
  });

  it("words a spot from one reading as a place to re-check around, not as a fitted source", () => {
    const one: SuspectSpotWithRefrigerant = {
      ...spot,
      radius: 3,
      reason: { ...spot.reason, kind: "one-reading", supportCount: 1, peakPpm: 11 },
    };
    const m = presentAnalysis(facts([one]), reader("m", "kg")).spots[0];
    expect(m.reason).toBe(
      "One reading at 11 ppm against a background of 0.4 ppm, inside the open case Dairy 3, and no other reading nearby rises with it: too little to fit a source, too much to call the sweep clean, so re-check around it.",
    );
    // 3 m = 9 ft 10.1 in, shown to the inch (1 ft = 0.3048 m; NIST SP 811, B.8)
    expect(presentAnalysis(facts([one]), reader("ft-in", "lb")).spots[0].where).toMatch(/within 9 ft 10 in$/);
  });

  it("gives the strength as an order of magnitude in the reader's mass unit, in the system's refrigerant", () => {
    // 3703 mol/yr × 86.28 g/mol = 319,495 g/yr = 319 kg/yr = 704 lb/yr (1 lb = 453.59237 g; NIST SP 811, B.8)
    expect(gramsPerYear(spot, spot.refrigerant)).toBeCloseTo(3703 * molarMassOf(getRefrigerant("R-448A")), 6);
    const m = presentAnalysis(facts([spot]), reader("m", "kg")).spots[0];
    const lb = presentAnalysis(facts([spot]), reader("ft-in", "lb")).spots[0];
    expect(m.strength).toBe("1.00 of the strongest, about 320 kg/yr of R-448A if well mixed");
    expect(lb.strength).toBe("1.00 of the strongest, about 700 lb/yr of R-448A if well mixed");
    // small leaks in g and oz: 2 mol/yr of R-448A = 172.6 g = 6.09 oz (16 oz = 453.59237 g)
    expect(massPerYearWords(172.6, "kg")).toBe("170 g/yr");
    expect(massPerYearWords(172.6, "lb")).toBe("6.1 oz/yr");
    expect(massPerYearWords(998, "kg")).toBe("1.0 kg/yr");
  });

  it("weighs the spot in the nearest fixture's system's refrigerant, and says when it falls back to the default blend", () => {
    const noSystem = { ...spot, refrigerant: spotRefrigerant(CASE, () => null) };
    const w = presentAnalysis(facts([spot, { ...noSystem, rank: 2 }]), reader("m", "kg"));
    expect(w.spots[1].strength).toMatch(/of R-404A, assumed if well mixed$/);
    expect(w.assumptions[1]).toContain("R-448A (86.28 g/mol, the refrigerant of Rack B) for spot 1");
    expect(w.assumptions[1]).toContain(
      "R-404A (97.60 g/mol), a default blend because the nearest fixture is linked to no system, for spot 2",
    );
    expect(spotRefrigerant(null, () => null)).toMatchObject({ source: "default", why: "no-fixture" });
    expect(spotRefrigerant(CASE, () => ({ systemName: "Rack Z", refrigerantId: "R-999" }))).toMatchObject({
      source: "default",
      why: "unknown-refrigerant",
    });
  });

  it("states the assumptions in the reader's units", () => {
    const ft = presentAnalysis(facts([spot]), reader("ft-in", "lb")).assumptions;
    // 3 m = 9 ft 10.1 in; 25 °C = 77 °F
    expect(ft[1]).toMatch(
      /^Strength per year assumes the store air is well mixed over 9 ft 10 in height with 2 air changes per hour, at 25 °C \(77 °F\) and 101\.325 kPa \(24\.465 L\/mol\)/,
    );
    expect(ft[2]).toMatch(/follow local codes and certified practice/);
  });
});

describe("cautions at a spot", () => {
  it("warns of a flammable or high-pressure refrigerant and of a closed room, and of nothing for a guessed blend", () => {
    const propane = {
      ...spot,
      refrigerant: spotRefrigerant(CASE, () => ({ systemName: "Island", refrigerantId: "R-290" })),
    };
    expect(presentAnalysis(facts([propane]), reader("m", "kg")).spots[0].cautions[0]).toMatch(/flammable/);
    const co2InWalkIn = {
      ...spot,
      reason: { ...spot.reason, fixture: { id: CASE, kind: "walk-in" as const, distanceM: 0 } },
      refrigerant: spotRefrigerant(CASE, () => ({ systemName: "CO2 rack", refrigerantId: "R-744" })),
    };
    const co2 = presentAnalysis(facts([co2InWalkIn]), reader("m", "kg")).spots[0].cautions.join(" ");
    expect(co2).toMatch(/very high pressure/);
    expect(co2).toMatch(/displaces oxygen\. In this walk-in/);
    const guessed = { ...spot, refrigerant: spotRefrigerant(CASE, () => null) };
    expect(presentAnalysis(facts([guessed]), reader("m", "kg")).spots[0].cautions).toEqual([]);
  });
});

describe("molar masses the strength is weighed with", () => {
  it("agree with published molar masses of the blends", () => {
    // R-404A 97.6038 g/mol: NIST REFPROP pseudo-pure fluid file R404A (Lemmon, Int. J. Thermophys. 24(4), 2003).
    expect(molarMassOf(getRefrigerant("R-404A"))).toBeCloseTo(97.6038, 1);
    // R-448A 86.3 kg/kmol: EES (F-Chart Software) fluid documentation for R448A.
    expect(molarMassOf(getRefrigerant("R-448A"))).toBeCloseTo(86.3, 1);
    // R-410A 72.585, R-407C 86.204, R-507A 98.859 g/mol: NIST REFPROP pseudo-pure fluids (Lemmon 2003), from memory.
    expect(molarMassOf(getRefrigerant("R-410A"))).toBeCloseTo(72.585, 1);
    expect(molarMassOf(getRefrigerant("R-407C"))).toBeCloseTo(86.204, 1);
    expect(molarMassOf(getRefrigerant("R-507A"))).toBeCloseTo(98.859, 1);
    // R-449A 87.2 g/mol: manufacturer's data sheets, from memory.
    expect(molarMassOf(getRefrigerant("R-449A"))).toBeCloseTo(87.2, 1);
  });
});

describe("diagnostics and the delay in words", () => {
  const ctx = wordsContext(reader("ft-in", "lb"), 1.5);

  it("words gaps between taps in the reader's units", () => {
    const text = diagnosticWords(
      { kind: "sparse-coverage", count: 2, gapM: 3, longestM: 6.096, at: { x: 30.48, y: 1.524 } },
      ctx,
    );
    // 3 m = 9 ft 10 in, 6.096 m = 20 ft, 30.48 m = 100 ft, 1.524 m = 5 ft; taps every 1.2–1.5 m ≈ 4–5 ft
    expect(text).toBe(
      "2 gaps between taps are longer than 9 ft 10 in (longest 20 ft, around 100 ft across, 5 ft down). A leak there could be missed: walk those stretches again, tapping every 4–5 ft.",
    );
  });

  it("names the fixture whose fans mix the gas", () => {
    const text = diagnosticWords({ kind: "fans-mixing", fixtureId: CASE, count: 9, levelPpm: 12.25 }, ctx);
    expect(text).toMatch(/^9 readings across Dairy 3 are level at about 12\.3 ppm/);
    // after a still-air pass over it, the advice to stop the fans is history, not a next step
    const after = diagnosticWords(
      { kind: "fans-mixing", fixtureId: CASE, count: 9, levelPpm: 12.25, stilledByPass: true },
      ctx,
    );
    expect(after).toMatch(/^9 readings across Dairy 3 were level at about 12\.3 ppm while its fans ran/);
    expect(after).toMatch(/A still-air pass followed/);
    expect(after).not.toMatch(/Stop the fans/);
  });

  it("speaks of the detector's delay (the shift less the time constant)", () => {
    // shifts 6.5 and 8 s with a 1.5 s time constant: delays of 5 and 6.5 s
    const w = delayCheckWords(
      { statedS: 6.5, estimatedS: 8, supported: true, usedS: 8, statedMisfit: 0.4, estimatedMisfit: 0.1 },
      ctx,
    );
    expect(w.headline).toBe("Readings fit a 6.5 s delay better than the detector's 5 s.");
    expect(w.suggestedDelayS).toBe(6.5);
    const byHand = delayCheckWords(
      { statedS: 11.5, estimatedS: 8, supported: true, usedS: 11.5, statedMisfit: 0.4, estimatedMisfit: 0.1 },
      { ...ctx, delaySetByHand: true },
    );
    expect(byHand.headline).toBe("Readings fit a 6.5 s delay better than the 10 s set for this map.");
    expect(byHand.detail).toMatch(/the spots use 10 s as set/);
    const unchecked = delayCheckWords(
      { statedS: 6.5, estimatedS: null, supported: false, usedS: 6.5, statedMisfit: null, estimatedMisfit: null },
      ctx,
    );
    expect(unchecked.suggestedDelayS).toBeNull();
    const agrees = delayCheckWords(
      { statedS: 6.5, estimatedS: 7, supported: false, usedS: 6.5, statedMisfit: 0.2, estimatedMisfit: 0.19 },
      ctx,
    );
    expect(agrees.headline).toBe("Readings agree with the detector's 5 s delay.");
    expect(agrees.suggestedDelayS).toBeNull();
  });

  it("never calls a plume far above the alarm a clean sweep", () => {
    const unsure = [{ kind: "delay-uncertain" as const, plumePpm: 30, alarmPpm: 2, statedS: 11.5, usedS: null }];
    expect(noSpotWords(unsure, ctx)).toBe(
      "No spot could be placed, but this is not a clean sweep: readings reach 30 ppm, 15 times the alarm. See the diagnostics.",
    );
    expect(noSpotWords([], ctx)).toMatch(/^No credible leak/);
    expect(diagnosticWords(unsure[0], ctx)).toMatch(
      /this is not a clean sweep\. The detector's 10 s delay may be wrong/,
    );
  });
});

describe("numbers", () => {
  it("groups thousands and rounds to what an estimate can claim", () => {
    expect(formatGrouped(319512.4, "1,234.5", 0)).toBe("319,512");
    expect(formatGrouped(1234.5, "1.234,5", 1)).toBe("1.234,5");
    // The locator's words share the records' number format (docs/decisions/0054): the space format
    // groups as CLDR's fr-FR does (U+202F, four digits grouped too), no longer with U+00A0 and an
    // ungrouped four-digit number; checked against Intl.NumberFormat.
    const fr = new Intl.NumberFormat("fr-FR", { minimumFractionDigits: 1, maximumFractionDigits: 1 });
    expect(formatGrouped(12345.5, "1 234,5", 1)).toBe(fr.format(12345.5));
    expect(formatGrouped(1234.5, "1 234,5", 1)).toBe(fr.format(1234.5));
    expect(formatGrouped(1234.5, "1 234,5", 1)).toBe("1\u202f234,5");
    expect(formatSignificant(319512, 2)).toBe("320,000");
    expect(formatSignificant(3.456, 2)).toBe("3.5");
    expect(lengthWords(0.3048, "ft-in")).toBe("1 ft");
    expect(lengthWords(1.2, "ft-in")).toBe("3 ft 11 in");
    expect(lengthWords(1.25, "m", "1.234,5")).toBe("1,3 m");
  });
});

describe("a company's own refrigerant at a spot (docs/decisions/0073)", () => {
  const own = toCompanyRefrigerant({
    ...checkCompanyRefrigerant({
      name: "House HC mix",
      safetyClass: "A3",
      substanceClass: "other",
      statedGwp: { value: 3, basis: "EU-517/2014", source: "maker's data sheet" },
    }),
    id: "7e6d5c4b-3a29-4817-8695-a4b3c2d1e0f9",
    retired: false,
  });
  const atSpot = {
    ...spot,
    refrigerant: spotRefrigerant(
      CASE,
      () => ({ systemName: "Island 2", refrigerantId: own.id }),
      refrigerantLookup([own]),
    ),
  };

  it("is named as the company named it, says the fallback molar mass it assumed, and keeps its cautions", () => {
    const words = presentAnalysis(facts([atSpot]), reader("m", "kg"));
    // No molar mass known: weighed as R-404A, 97.60 g/mol ([D] docs/reference/standards.md §3), and said so.
    expect(words.spots[0].strength).toMatch(/of House HC mix, weighed as R-404A if well mixed$/);
    expect(JSON.stringify(words)).toContain(
      "House HC mix (molar mass not known, so R-404A's 97.60 g/mol assumed; the refrigerant of Island 2) for spot 1",
    );
    // Safety group A3 is flammable (ASHRAE 34; docs/reference/standards.md §8).
    expect(words.spots[0].cautions[0]).toMatch(/flammable/);
    expect(JSON.stringify(words)).not.toContain(own.id);
  });
});
