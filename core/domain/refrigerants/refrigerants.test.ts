import { describe, expect, it } from "vitest";
import { findRefrigerant, getRefrigerant, isOzoneDepleting, REFRIGERANTS } from "./catalogue";
import { molarMassFromFormula } from "./formula";
import { gwpOf } from "./gwp";
import { densityRelativeToAir, molarMassOf } from "./molar-mass";
import type { GwpBasis } from "./types";

const EU: GwpBasis[] = ["EU-517/2014", "AR4"];
const gwp = (id: string, bases: GwpBasis[]) => {
  const g = gwpOf(getRefrigerant(id), bases);
  if (!g.known) throw new Error(g.reason);
  return g.value;
};

describe("catalogue", () => {
  it("holds every refrigerant the product needs", () => {
    const ids = [
      "R-22",
      "R-32",
      "R-125",
      "R-134a",
      "R-143a",
      "R-1234yf",
      "R-1234ze(E)",
      "R-744",
      "R-290",
      "R-600a",
      "R-717",
      "R-404A",
      "R-507A",
      "R-407A",
      "R-407C",
      "R-407F",
      "R-410A",
      "R-448A",
      "R-449A",
      "R-454B",
      "R-455A",
    ];
    for (const id of ids) expect(findRefrigerant(id)?.id).toBe(id);
    expect(new Set(REFRIGERANTS.map((r) => r.id)).size).toBe(REFRIGERANTS.length);
  });
  it("forgives spelling and refuses unknown R-numbers by field", () => {
    expect(findRefrigerant("r410a")?.id).toBe("R-410A");
    expect(findRefrigerant("R 404A")?.id).toBe("R-404A");
    expect(findRefrigerant("1234ze(e)")?.id).toBe("R-1234ze(E)");
    expect(() => getRefrigerant("R-999", "system.refrigerant")).toThrow(
      /^system.refrigerant: unknown refrigerant "R-999"/,
    );
  });
  it("has blend compositions that add up to 100 % of known components", () => {
    // ASHRAE 34-2019 compositions are nominal mass-% summing to 100 (docs/reference/standards.md §3 [S:G3]).
    for (const r of REFRIGERANTS) {
      if (r.kind !== "blend") continue;
      const sum = r.components.reduce((s, c) => s + c.massPercent, 0);
      expect(sum, r.id).toBeCloseTo(100, 9);
      for (const c of r.components) expect(findRefrigerant(c.id)?.kind, `${r.id} ${c.id}`).not.toBe("blend");
    }
  });
  it("marks R-22 (an HCFC) as ozone-depleting and the HFC blends not", () => {
    // 40 CFR 82 subpart F covers ODS (CFC/HCFC) only since 10 Apr 2020 (docs/reference/standards.md §1 [S:R1,R2]).
    expect(isOzoneDepleting(getRefrigerant("R-22"))).toBe(true);
    expect(getRefrigerant("R-22").kind).toBe("HCFC");
    for (const id of ["R-404A", "R-410A", "R-448A", "R-744", "R-717", "R-290"])
      expect(isOzoneDepleting(getRefrigerant(id))).toBe(false);
  });
  it("carries the IMC Table 1103.1 safety classes", () => {
    // IMC Table 1103.1 [S:S1], R-134a are A1.
    for (const id of ["R-22", "R-125", "R-134a"]) expect(getRefrigerant(id).safetyClass.value).toBe("A1");
    // From memory (docs/reference/standards.md §5 [M]): R-290 A3, R-717 B2L, R-1234yf A2L, R-454B A2L.
    expect(getRefrigerant("R-290").safetyClass.value).toBe("A3");
    expect(getRefrigerant("R-717").safetyClass.value).toBe("B2L");
    expect(getRefrigerant("R-1234yf").safetyClass.value).toBe("A2L");
    expect(getRefrigerant("R-454B").safetyClass.value).toBe("A2L");
  });
});

describe("blend GWP from components (mass-weighted, round half up)", () => {
  it("matches the published EU/AR4 values with the EU's HFO values", () => {
    // Regulation 517/2014 Annex IV / leak-check guidance [S:E1]: R-404A 3922, R-407C 1774.
    expect(gwp("R-404A", EU)).toBe(3922);
    expect(gwp("R-407C", EU)).toBe(1774);
    // 2024/573 Art. 3 CO2e example [S:E7]: R-410A 2088 (2087.5 rounded half up).
    expect(gwp("R-410A", EU)).toBe(2088);
    // Published AR4 blend values, from memory (docs/reference/standards.md §3 [M]).
    expect(gwp("R-407A", EU)).toBe(2107);
    expect(gwp("R-448A", EU)).toBe(1387);
    expect(gwp("R-449A", EU)).toBe(1397);
    expect(gwp("R-507A", EU)).toBe(3985);
    expect(gwp("R-407F", EU)).toBe(1825); // 1824.5 → 1825, docs/reference/standards.md §3 test notes
    expect(gwp("R-454B", EU)).toBe(466);
    expect(gwp("R-455A", EU)).toBe(148);
  });
  it("does not treat a missing HFO value as zero", () => {
    // docs/reference/standards.md §3 test notes: with HFO GWP = 0, R-448A/R-449A would give 1386/1396, not 1387/1397.
    const plainAr4 = gwpOf(getRefrigerant("R-448A"), ["AR4"]);
    expect(plainAr4.known).toBe(false);
    if (!plainAr4.known) expect(plainAr4.missing).toEqual(["R-1234yf", "R-1234ze(E)"]);
  });
  it("reproduces the AR5 and AR6 blend columns", () => {
    // docs/reference/standards.md §3 blend table, computed there from IPCC values [D] (HFC values [S:G1], HFO [M]).
    const ar5: Record<string, number> = {
      "R-404A": 3943,
      "R-507A": 3985,
      "R-407A": 1923,
      "R-407C": 1624,
      "R-407F": 1674,
      "R-410A": 1924,
      "R-448A": 1273,
      "R-449A": 1282,
      "R-454B": 467,
      "R-455A": 146,
    };
    const ar6: Record<string, number> = {
      "R-404A": 4728,
      "R-507A": 4775,
      "R-407A": 2262,
      "R-407C": 1908,
      "R-407F": 1965,
      "R-410A": 2256,
      "R-448A": 1494,
      "R-449A": 1504,
      "R-454B": 531,
      "R-455A": 166,
    };
    // R-449A AR6: docs/reference/standards.md §3 prints 1505, but its own inputs give 0.243×771 + 0.247×3740 +
    // 0.253×0.501 + 0.257×1530 = 1504.47 → 1504 (hand calculation); the table entry is inconsistent.
    for (const [id, v] of Object.entries(ar5)) expect(gwp(id, ["AR5"]), id).toBe(v);
    for (const [id, v] of Object.entries(ar6)) expect(gwp(id, ["AR6"]), id).toBe(v);
  });
  it("gives pure values with their source and basis", () => {
    const g = gwpOf(getRefrigerant("R-1234yf"), EU);
    expect(g.known && g.value).toBe(4);
    expect(g.known && g.terms[0].basis).toBe("EU-517/2014");
    expect(gwp("R-134a", EU)).toBe(1430); // AR4 [S:G1,G2]
    expect(gwp("R-744", ["AR6"])).toBe(1); // reference gas [S:G1]
    expect(gwpOf(getRefrigerant("R-600a"), ["AR6"]).known).toBe(false);
  });
});

describe("molar mass", () => {
  it("computes blends as 1/Σ(wᵢ/Mᵢ)", () => {
    // docs/reference/standards.md §3 molar-mass column [D].
    const published: Record<string, number> = {
      "R-404A": 97.6,
      "R-507A": 98.86,
      "R-407A": 90.11,
      "R-407C": 86.2,
      "R-407F": 82.06,
      "R-410A": 72.58,
      "R-448A": 86.28,
      "R-449A": 87.21,
      "R-454B": 62.61,
      "R-455A": 87.45,
    };
    // Within 0.01: R-407F computes to 82.0546, which the table double-rounds (82.055 → 82.06).
    for (const [id, m] of Object.entries(published))
      expect(Math.abs(molarMassOf(getRefrigerant(id)) - m), id).toBeLessThan(0.01);
    expect(molarMassOf(getRefrigerant("R-407F"))).toBeCloseTo(82.0546, 4); // hand calculation, 1/Σ(wᵢ/Mᵢ)
  });
  it("agrees with the formula and IUPAC atomic weights", () => {
    // Abridged IUPAC atomic weights, from memory; the catalogue values are docs/reference/standards.md §4 [D].
    for (const r of REFRIGERANTS) {
      if (r.kind === "blend") continue;
      expect(Math.abs(molarMassFromFormula(r.formula) - r.molarMass.value), r.id).toBeLessThan(0.01);
    }
  });
  it("tells heavier-than-air refrigerants from ammonia, which rises", () => {
    // docs/reference/standards.md §4 [D]: R-134a 3.52, R-410A 2.51, R-744 1.52, R-717 0.59.
    expect(densityRelativeToAir(getRefrigerant("R-134a"))).toBeCloseTo(3.52, 2);
    expect(densityRelativeToAir(getRefrigerant("R-410A"))).toBeCloseTo(2.51, 2);
    expect(densityRelativeToAir(getRefrigerant("R-744"))).toBeCloseTo(1.52, 2);
    expect(densityRelativeToAir(getRefrigerant("R-717"))).toBeCloseTo(0.59, 2);
  });
});

describe("supermarket blends added from memory, checked against their published GWPs", () => {
  // Compositions (ASHRAE 34 designations) and published AR4 blend GWPs are from memory; component GWPs are
  // IPCC AR4 [S:G1] and the 517/2014 values for HFOs and hydrocarbons ([M], docs/reference/standards.md §3).
  // A wrong recollection of a composition shows up as a mismatch here.
  const EU = ["EU-517/2014", "AR4"] as const;
  const published: Record<string, number> = {
    "R-422D": 2729, // 0.651×3500 + 0.315×1430 + 0.034×3 = 2729.05
    "R-427A": 2138, // 0.15×675 + 0.25×3500 + 0.10×4470 + 0.50×1430 = 2138.25
    "R-438A": 2265, // 0.085×675 + 0.45×3500 + 0.442×1430 + 0.017×4 + 0.006×5 = 2264.53
    "R-513A": 631, // 0.56×4 + 0.44×1430 = 631.44
    "R-450A": 605, // 0.42×1430 + 0.58×7 = 604.66
    "R-452A": 2140, // 0.11×675 + 0.59×3500 + 0.30×4 = 2140.45
  };
  it("gives each blend's published AR4 GWP from its composition", () => {
    for (const [id, v] of Object.entries(published)) expect(gwp(id, [...EU]), id).toBe(v);
  });
  it("gives the published AR5 values of the HFO blends (from memory: R-513A 573, R-450A 547)", () => {
    // AR5 with "<1" counted as 1: 0.44×1300 + 0.56×1 = 572.56; 0.42×1300 + 0.58×1 = 546.58.
    expect(gwp("R-513A", ["AR5"])).toBe(573);
    expect(gwp("R-450A", ["AR5"])).toBe(547);
  });
  it("lists the components and marks the compositions from memory", () => {
    for (const id of ["R-600", "R-601a"]) expect(getRefrigerant(id).kind).toBe("HC");
    for (const id of Object.keys(published)) {
      const r = getRefrigerant(id);
      expect(r.kind === "blend" && r.compositionSource, id).toMatch(/^\[M\] /); // [M]: from memory
    }
  });
});
