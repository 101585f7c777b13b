import { describe, expect, it } from "vitest";
import { applicableLeakRatePart } from "../compliance/applicability";
import { systemCo2e } from "../compliance/co2e";
import { EU_FGAS_PROFILE } from "../compliance/eu-fgas-profile";
import { leakCheckInterval } from "../compliance/leak-check-interval";
import { US_FEDERAL_PROFILE } from "../compliance/us-federal-profile";
import { spotRefrigerant } from "../locator-words/spot-refrigerant";
import { cautionsFor, roomCautions } from "../safety/cautions";
import { poundsToKg } from "../units/mass";
import { getRefrigerant, isOzoneDepleting } from "./catalogue";
import { startWarnings } from "../sweeps/start-warnings";
import { summarizeRefrigerant } from "./refrigerant-summary";
import {
  checkCompanyRefrigerant,
  refrigerantLookup,
  refrigerantOfSummary,
  toCompanyRefrigerant,
  type CompanyRefrigerantFacts,
} from "./company-refrigerant";
import { gwpOf } from "./gwp";
import { molarMassOf } from "./molar-mass";
import type { CompanyRefrigerant } from "./types";

const US = US_FEDERAL_PROFILE.gwpBases.value;
const EU = EU_FGAS_PROFILE.gwpBases.value;

function entered(facts: CompanyRefrigerantFacts, id = "00000000-0000-4000-8000-000000000001"): CompanyRefrigerant {
  return toCompanyRefrigerant({ ...checkCompanyRefrigerant(facts), id, retired: false });
}

const byComposition = (name: string, parts: [string, number][]) =>
  entered({
    name,
    safetyClass: "A1",
    composition: parts.map(([refrigerantId, massPercent]) => ({ refrigerantId, massPercent })),
  });

const byGwp = (value: number, substanceClass: "ods" | "hfc" | "hfo" | "other", basis: "AR4" | "AR5" = "AR4") =>
  entered({
    name: `Stated ${value}`,
    safetyClass: "A1",
    substanceClass,
    statedGwp: { value, basis, source: "maker's data sheet" },
  });

const gwp = (r: Parameters<typeof gwpOf>[0], bases: typeof US) => {
  const g = gwpOf(r, bases);
  return g.known ? g.value : null;
};

describe("a company refrigerant entered by composition", () => {
  it("gives a catalogue blend's GWP when its composition is that blend's, on each profile's basis", () => {
    // R-404A 125/143a/134a 44/52/4: AR4 3922 [S:E1, composition S:G3] (docs/reference/standards.md §3).
    const own404 = byComposition("Rack blend 44", [
      ["R-125", 44],
      ["R-143a", 52],
      ["R-134a", 4],
    ]);
    expect(gwp(own404, EU)).toBe(3922);
    expect(gwp(own404, US)).toBe(gwp(getRefrigerant("R-404A"), US));
    // R-448A 32/125/1234yf/134a/1234ze(E) 26/26/20/21/7: EU basis 1387, US basis 1386 ([D] §3, decision 0045).
    const own448 = byComposition("Low-GWP mix", [
      ["R-32", 26],
      ["R-125", 26],
      ["R-1234yf", 20],
      ["R-134a", 21],
      ["R-1234ze(E)", 7],
    ]);
    expect(gwp(own448, EU)).toBe(1387);
    expect(gwp(own448, US)).toBe(1386);
  });

  it("gives R-410A's molar mass and CO2e when its composition is R-410A's", () => {
    // R-410A 32/125 50/50: molar mass 72.58 g/mol [D] §3; 20 kg × 2088 = 41.76 t CO2e (2024/573 Art. 3 [S:E7]).
    const own410 = byComposition("Split 50", [
      ["R-32", 50],
      ["R-125", 50],
    ]);
    expect(molarMassOf(own410)).toBeCloseTo(72.58, 2);
    const c = systemCo2e(EU_FGAS_PROFILE, own410, 20);
    expect(c.known && c.tonnes).toBeCloseTo(41.76, 12);
  });

  it("accepts a sum within ±0.1 percentage points of 100 % and refuses a larger gap, naming the field", () => {
    // The tolerance is our own choice (docs/decisions/0073): rounding, not a missing component.
    expect(() =>
      byComposition("Rounded", [
        ["R-32", 33.3],
        ["R-125", 33.3],
        ["R-134a", 33.35],
      ]),
    ).not.toThrow();
    expect(() =>
      byComposition("Short", [
        ["R-32", 50],
        ["R-125", 49.8],
      ]),
    ).toThrow(/^composition: mass per cents add up to 99\.8 %/);
  });

  it("refuses a blend, an unknown or a repeated component, and a name that is a catalogue designation", () => {
    const facts =
      (parts: [string, number][], name = "Mine") =>
      () =>
        byComposition(name, parts);
    expect(
      facts([
        ["R-404A", 50],
        ["R-32", 50],
      ]),
    ).toThrow(/^composition\.0\.refrigerantId: R-404A is a blend/);
    expect(
      facts([
        ["R-32", 50],
        ["R-9999", 50],
      ]),
    ).toThrow(/^composition\.1\.refrigerantId: "R-9999" is not in the refrigerant catalogue/);
    expect(
      facts([
        ["R-32", 50],
        ["r32", 50],
      ]),
    ).toThrow(/^composition\.1\.refrigerantId: R-32 is listed twice/);
    expect(
      facts(
        [
          ["R-32", 50],
          ["R-125", 50],
        ],
        "r 410a",
      ),
    ).toThrow(/^name: is the catalogue's R-410A/);
  });

  it("derives its class from the components and refuses a stated class that disagrees", () => {
    // R-22 is an HCFC (ozone-depleting; 40 CFR 82 subpart F, docs/reference/standards.md §1).
    const withR22 = byComposition("Old mix", [
      ["R-22", 60],
      ["R-125", 40],
    ]);
    expect(isOzoneDepleting(withR22)).toBe(true);
    expect(() =>
      checkCompanyRefrigerant({
        name: "Old mix",
        safetyClass: "A1",
        substanceClass: "hfc",
        composition: [
          { refrigerantId: "R-22", massPercent: 60 },
          { refrigerantId: "R-125", massPercent: 40 },
        ],
      }),
    ).toThrow(/^substanceClass: the composition makes it ozone-depleting/);
  });
});

describe("a company refrigerant entered by a stated GWP", () => {
  it("counts only on a profile whose bases include the basis it was stated on", () => {
    const ar5 = byGwp(1300, "hfc", "AR5");
    expect(gwp(ar5, US)).toBe(1300); // the US profile lists AR4, AR5, AR6, EU-517/2014
    const onEu = gwpOf(ar5, EU); // the EU profile reads EU-517/2014 then AR4 only
    expect(onEu.known).toBe(false);
    expect(!onEu.known && onEu.reason).toMatch(/stated on AR5, which is not among EU-517\/2014, AR4/);
  });

  it("needs its class (ODS, HFC, HFO only or other)", () => {
    expect(() =>
      checkCompanyRefrigerant({
        name: "No class",
        safetyClass: "A1",
        statedGwp: { value: 100, basis: "AR4", source: "sheet" },
      }),
    ).toThrow(/^substanceClass: is required with a stated GWP/);
  });

  it("takes the EU check interval from its CO2e band either side of 2,500 × 20 kg = 50 t", () => {
    // 2024/573 Art. 5 bands [S:E1, E5] (docs/reference/standards.md §2): ≥5 <50 t every 12 months (24 with
    // LDS); ≥50 <500 t every 6 (12). CO2e = kg × GWP / 1000 (Art. 3 [S:E7]).
    const months = (value: number, lds: boolean) => {
      const i = leakCheckInterval(EU_FGAS_PROFILE, byGwp(value, "hfc"), 20, { hasLeakDetection: lds });
      return i.required ? i.months : null;
    };
    expect(months(2500, false)).toBe(6); // exactly 50 t
    expect(months(2500, true)).toBe(12);
    expect(months(2499, false)).toBe(12); // 49.98 t
    expect(months(2499, true)).toBe(24);
    expect(months(249, false)).toBeNull(); // 4.98 t: below the first band
  });

  it("puts an HFO-only class in the kg bands and a class with no fluorinated gas outside the checks", () => {
    // 2024/573 Annex II section 1 gases from 1 kg; 10–100 kg every 6 months [S:E5 thresholds; intervals M].
    const hfo = leakCheckInterval(EU_FGAS_PROFILE, byGwp(1, "hfo"), 10, { hasLeakDetection: false });
    expect(hfo.required && hfo.measure).toBe("kg");
    expect(hfo.required && hfo.months).toBe(6);
    const none = leakCheckInterval(EU_FGAS_PROFILE, byGwp(3, "other"), 10, { hasLeakDetection: false });
    expect(none.required).toBe(false);
  });

  it("decides Part 82 or Part 84 by its class and GWP above 53", () => {
    // docs/reference/standards.md §1: Part 82 for ODS from 50 lb [S:R1,R2]; Part 84 for GWP > 53 from 15 lb
    // from 1 Jan 2026 [S:R4].
    const part = (r: CompanyRefrigerant, lb: number) =>
      applicableLeakRatePart(US_FEDERAL_PROFILE, r, poundsToKg(lb), "2026-06-01").part?.id ?? null;
    expect(part(byGwp(1810, "ods"), 50)).toBe("40-cfr-82-subpart-f");
    expect(part(byGwp(54, "hfc"), 15)).toBe("40-cfr-84-subpart-c");
    expect(part(byGwp(53, "hfc"), 500)).toBeNull();
    const reason = applicableLeakRatePart(US_FEDERAL_PROFILE, byGwp(53, "hfc"), 200, "2026-06-01").reason;
    expect(reason).toMatch(/GWP 53 is not above 53/);
  });
});

describe("locator and cautions on a company refrigerant", () => {
  it("weighs a spot in the default blend's molar mass when its own is unknown, and says so", () => {
    const noMass = byGwp(150, "hfc");
    const spot = spotRefrigerant(
      "f1",
      () => ({ systemName: "Rack B", refrigerantId: noMass.id }),
      refrigerantLookup([noMass]),
    );
    expect(spot.source).toBe("system");
    // R-404A 97.60 g/mol [D] docs/reference/standards.md §3.
    expect(spot.molarMassGPerMol).toBeCloseTo(97.6, 1);
    expect(spot.source === "system" && spot.molarMassAssumedFrom).toBe("R-404A");
    expect(spot.source === "system" && spot.entered?.name).toBe("Stated 150");
  });

  it("warns of flammability for an A2L or A3 entry and of toxicity for a class B one", () => {
    // ASHRAE 34 safety groups: 2L, 2, 3 flammable; B higher toxicity (docs/reference/standards.md §5, §8).
    const a3 = entered({
      name: "HC mix",
      safetyClass: "A3",
      substanceClass: "other",
      statedGwp: { value: 3, basis: "AR4", source: "sheet" },
    });
    expect(cautionsFor({ refrigerant: a3 }).map((c) => c.id)).toContain("flammable");
    const b1 = entered({
      name: "B mix",
      safetyClass: "B1",
      substanceClass: "hfc",
      statedGwp: { value: 700, basis: "AR4", source: "sheet" },
    });
    expect(cautionsFor({ refrigerant: b1 }).map((c) => c.id)).toContain("higher-toxicity");
    const room = roomCautions("machine-room", [b1]);
    expect(room.find((c) => c.id === "oxygen-displacement")?.text).toMatch(
      /B mix may fill it from the floor up or collect near the ceiling/,
    );
  });
});

describe("the lookup", () => {
  it("finds the catalogue by R-number and a company's own only by its key", () => {
    const own = byGwp(700, "hfc");
    const lookup = refrigerantLookup([own]);
    expect(lookup("r404a")?.id).toBe("R-404A");
    expect(lookup(own.id)).toBe(own);
    expect(lookup("company:00000000-0000-4000-8000-000000000999")).toBeUndefined();
    expect(lookup(own.name)).toBeUndefined();
  });

  it("warns about a detector that cannot see it from the device's summary as the server does from the full entry", () => {
    // Heated-diode sensors respond to halogen compounds; have none
    // (docs/reference/standards.md, detection section); a blend of only those is invisible to one.
    const own = byComposition("Store CO2-propane mix", [
      ["R-744", 90],
      ["R-290", 10],
    ]);
    const diode = { name: "Diode sniffer", principle: "heated-diode" as const, overdue: false, checkDueOn: null };
    const systems = [{ id: "s1", name: "Booster", refrigerantId: own.id }];
    const server = startWarnings(diode, systems, (id) => (id === own.id ? own : undefined));
    const summary = summarizeRefrigerant(own, { bases: ["AR4"], statement: "AR4" });
    const device = startWarnings(diode, systems, (id) => (id === own.id ? refrigerantOfSummary(summary) : undefined));
    expect(server.map((w) => w.code)).toEqual(["detector-blind"]);
    expect(device).toEqual(server);
  });
});
