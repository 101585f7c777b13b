import type { PureRefrigerant } from "./types";

/**
 * Single-compound refrigerants. GWP-100: HFC/HCFC values [S:G1] (AR4 also [S:G2]); CO2 = 1 by
 * definition [S:G1]; HFOs, hydrocarbons and ammonia [M]. Molar masses from IUPAC atomic weights
 * [D] (docs/reference/standards.md §4). Safety classes: IMC Table 1103.1 [S:S1] where listed, else [M].
 */
const G1 = "[S:G1] IPCC GWP-100 (openclimatedata globalwarmingpotentials)";
const D4 = "[D] docs/reference/standards.md §4, from IUPAC atomic weights";
const S1 = "[S:S1] IMC Table 1103.1 (from ASHRAE 34)";
// [M]: recalled, not yet checked in the standard (verify in ASHRAE 34 Tables 4-1/4-2).
const M = "[M] ASHRAE 34 Tables 4-1/4-2";
const EU517 = "[M] Regulation (EU) 517/2014 value (no AR4 value exists)";
const AR5_LT1 =
  "[M] AR5 lists <1; 1 is used as the upper bound, which reproduces the AR5 blend values in docs/reference/standards.md §3 (R-454B 467)";

export const PURE_REFRIGERANTS: readonly PureRefrigerant[] = [
  {
    id: "R-22",
    name: "Chlorodifluoromethane",
    kind: "HCFC",
    formula: "CHClF2",
    ods: true,
    molarMass: { value: 86.47, source: D4 },
    safetyClass: { value: "A1", source: S1 },
    gwp: { AR4: { value: 1810, source: G1 }, AR5: { value: 1760, source: G1 }, AR6: { value: 1960, source: G1 } },
  },
  {
    id: "R-32",
    name: "Difluoromethane",
    kind: "HFC",
    formula: "CH2F2",
    ods: false,
    molarMass: { value: 52.02, source: D4 },
    safetyClass: {
      value: "A2L",
      source: "[M] A2L in current ASHRAE 34; A2 in the edition behind IMC Table 1103.1 [S:S1]",
    },
    gwp: { AR4: { value: 675, source: G1 }, AR5: { value: 677, source: G1 }, AR6: { value: 771, source: G1 } },
  },
  {
    id: "R-125",
    name: "Pentafluoroethane",
    kind: "HFC",
    formula: "C2HF5",
    ods: false,
    molarMass: { value: 120.02, source: D4 },
    safetyClass: { value: "A1", source: S1 },
    gwp: { AR4: { value: 3500, source: G1 }, AR5: { value: 3170, source: G1 }, AR6: { value: 3740, source: G1 } },
  },
  {
    id: "R-134a",
    name: "1,1,1,2-Tetrafluoroethane",
    kind: "HFC",
    formula: "C2H2F4",
    ods: false,
    molarMass: { value: 102.03, source: D4 },
    safetyClass: { value: "A1", source: S1 },
    gwp: { AR4: { value: 1430, source: G1 }, AR5: { value: 1300, source: G1 }, AR6: { value: 1530, source: G1 } },
  },
  {
    id: "R-143a",
    name: "1,1,1-Trifluoroethane",
    kind: "HFC",
    formula: "C2H3F3",
    ods: false,
    molarMass: { value: 84.04, source: D4 },
    safetyClass: { value: "A2L", source: M },
    gwp: { AR4: { value: 4470, source: G1 }, AR5: { value: 4800, source: G1 }, AR6: { value: 5810, source: G1 } },
  },
  {
    id: "R-1234yf",
    name: "2,3,3,3-Tetrafluoropropene",
    kind: "HFO",
    formula: "C3H2F4",
    ods: false,
    molarMass: { value: 114.04, source: D4 },
    safetyClass: { value: "A2L", source: M },
    gwp: {
      "EU-517/2014": { value: 4, source: EU517 },
      AR5: { value: 1, source: AR5_LT1 },
      AR6: { value: 0.501, source: "[M] IPCC AR6" },
    },
  },
  {
    id: "R-1234ze(E)",
    name: "trans-1,3,3,3-Tetrafluoropropene",
    kind: "HFO",
    formula: "C3H2F4",
    ods: false,
    molarMass: { value: 114.04, source: D4 },
    safetyClass: { value: "A2L", source: M },
    gwp: {
      "EU-517/2014": { value: 7, source: EU517 },
      AR5: { value: 1, source: AR5_LT1 },
      AR6: { value: 1.37, source: "[M] IPCC AR6" },
    },
  },
  {
    id: "R-744",
    name: "Carbon dioxide",
    kind: "natural",
    formula: "CO2",
    ods: false,
    molarMass: { value: 44.01, source: D4 },
    safetyClass: { value: "A1", source: M },
    gwp: {
      AR4: { value: 1, source: "[S:G1] reference gas, 1 by definition" },
      AR5: { value: 1, source: "[S:G1] reference gas, 1 by definition" },
      AR6: { value: 1, source: "[S:G1] reference gas, 1 by definition" },
    },
  },
  {
    id: "R-290",
    name: "Propane",
    kind: "HC",
    formula: "C3H8",
    ods: false,
    molarMass: { value: 44.1, source: D4 },
    safetyClass: { value: "A3", source: M },
    gwp: {
      "EU-517/2014": { value: 3, source: EU517 },
      AR6: { value: 0.02, source: "[M] IPCC AR6, approximate (~0.02)" },
    },
  },
  {
    id: "R-600a",
    name: "Isobutane",
    kind: "HC",
    formula: "C4H10",
    ods: false,
    molarMass: { value: 58.12, source: D4 },
    safetyClass: { value: "A3", source: M },
    gwp: { "EU-517/2014": { value: 3, source: EU517 } },
  },
  // Hydrocarbon components of supermarket retrofit blends (R-422D, R-438A). From memory: no entry in
  // docs/reference/standards.md; the blend tests check them against the blends' published GWPs.
  {
    id: "R-600",
    name: "Butane",
    kind: "HC",
    formula: "C4H10",
    ods: false,
    molarMass: { value: 58.12, source: "[D] from IUPAC atomic weights" },
    safetyClass: { value: "A3", source: M },
    gwp: { "EU-517/2014": { value: 4, source: "[M] Regulation (EU) 517/2014 value for butane (no AR4 value exists)" } },
  },
  {
    id: "R-601a",
    name: "Isopentane",
    kind: "HC",
    formula: "C5H12",
    ods: false,
    molarMass: { value: 72.15, source: "[D] from IUPAC atomic weights" },
    safetyClass: { value: "A3", source: M },
    gwp: {
      "EU-517/2014": { value: 5, source: "[M] Regulation (EU) 517/2014 value for isopentane (no AR4 value exists)" },
    },
  },
  {
    id: "R-717",
    name: "Ammonia",
    kind: "natural",
    formula: "NH3",
    ods: false,
    molarMass: { value: 17.03, source: D4 },
    safetyClass: { value: "B2L", source: M },
    gwp: {
      AR4: { value: 0, source: "[M] docs/reference/standards.md §3" },
      AR5: { value: 0, source: "[M] docs/reference/standards.md §3" },
      AR6: { value: 0, source: "[M] docs/reference/standards.md §3" },
    },
  },
];
