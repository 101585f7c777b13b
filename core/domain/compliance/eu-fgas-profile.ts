import type { RuleProfile } from "./rule-profile";

/**
 * EU F-gas Regulation (EU) 2024/573, which replaced 517/2014. Tags refer to docs/reference/standards.md §2.
 * GWPs: Annex I of 2024/573 keeps the AR4 values for HFCs (HFC-32 675, HFC-134a 1430, HFC-125 3500,
 * HFC-143a 4470; seen in the adopted annex text on eumonitor.eu, Annexes to COM(2022)150);
 * HFO and hydrocarbon values are the 517/2014 ones [M] and may differ in 2024/573 Annex II.
 */
export const EU_FGAS_PROFILE: RuleProfile = {
  id: "eu-fgas",
  name: "EU F-gas Regulation (EU) 2024/573",
  kind: "eu-fgas",
  gwpBases: {
    value: ["EU-517/2014", "AR4"],
    source: "[S:E3,E4] AR4 100-year values for HFCs; 517/2014 values for HFOs and hydrocarbons [M]",
    note: "IPCC AR4 100-year values as in Regulation (EU) 2024/573 Annex I; HFOs and hydrocarbons take the values of Regulation (EU) No 517/2014 (R-1234yf 4, R-1234ze(E) 7, R-290 and R-600a 3)",
  },
  leakRateParts: [],
  leakChecks: {
    co2eBands: {
      value: [
        { from: 5, to: 50, monthsWithoutLds: 12, monthsWithLds: 24, ldsRequired: false },
        { from: 50, to: 500, monthsWithoutLds: 6, monthsWithLds: 12, ldsRequired: false },
        { from: 500, to: null, monthsWithoutLds: 3, monthsWithLds: 6, ldsRequired: true },
      ],
      source: "[S:E1] 517/2014 Art. 4 intervals, unchanged in 2024/573 [M]; LDS mandatory ≥ 500 t [S:E2,E5]",
    },
    hfoBands: {
      value: [
        { from: 1, to: 10, monthsWithoutLds: 12, monthsWithLds: 24, ldsRequired: false },
        { from: 10, to: 100, monthsWithoutLds: 6, monthsWithLds: 12, ldsRequired: false },
        { from: 100, to: null, monthsWithoutLds: 3, monthsWithLds: 6, ldsRequired: true },
      ],
      source: "[S:E5] 2024/573 Art. 5, HFOs from 1 kg and LDS from 100 kg; intervals [M]",
    },
    hermeticExemptBelowTonnes: { value: 10, source: "[S:E1] hermetically sealed, labelled, < 10 t CO2e" },
    recheckAfterRepairMonths: { value: 1, source: "[S:E6] re-check within 1 month of a repair" },
    ldsCheckMonths: { value: 12, source: "[S:E2,E5] a leak detection system is checked at least every 12 months" },
  },
  recordRetentionYears: { value: 5, source: "[S:E8b] 2024/573 Art. 7" },
};
