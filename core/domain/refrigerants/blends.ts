import type { BlendRefrigerant } from "./types";

/**
 * Zeotropic and azeotropic blends: compositions in mass per cent per ASHRAE 34-2019 [S:G3].
 * GWP and molar mass are never stored here: they are computed from the components (gwp.ts,
 * molar-mass.ts), so a corrected component value corrects every blend. Blend classes [M].
 */
const G3 = "[S:G3] ASHRAE 34-2019 via openscm-units mixtures.yaml";
// [M]: recalled, not yet checked in the standard (verify in ASHRAE 34).
const M = "[M] ASHRAE 34";

const blend = (
  id: string,
  name: string,
  safety: "A1" | "A2L",
  components: [string, number][],
  compositionSource = G3,
): BlendRefrigerant => ({
  id,
  name,
  kind: "blend",
  safetyClass: { value: safety, source: M },
  components: components.map(([cid, massPercent]) => ({ id: cid, massPercent })),
  compositionSource,
});

/**
 * Blends common in supermarkets that docs/reference/standards.md does not hold: compositions from memory
 * ([M]), checked against each blend's published GWP in refrigerants.test.ts.
 */
const FROM_MEMORY = "[M] ASHRAE 34 designation";

export const BLENDS: readonly BlendRefrigerant[] = [
  blend("R-404A", "R-125/143a/134a (44/52/4)", "A1", [
    ["R-125", 44],
    ["R-143a", 52],
    ["R-134a", 4],
  ]),
  blend("R-507A", "R-125/143a (50/50)", "A1", [
    ["R-125", 50],
    ["R-143a", 50],
  ]),
  blend("R-407A", "R-32/125/134a (20/40/40)", "A1", [
    ["R-32", 20],
    ["R-125", 40],
    ["R-134a", 40],
  ]),
  blend("R-407C", "R-32/125/134a (23/25/52)", "A1", [
    ["R-32", 23],
    ["R-125", 25],
    ["R-134a", 52],
  ]),
  blend("R-407F", "R-32/125/134a (30/30/40)", "A1", [
    ["R-32", 30],
    ["R-125", 30],
    ["R-134a", 40],
  ]),
  blend("R-410A", "R-32/125 (50/50)", "A1", [
    ["R-32", 50],
    ["R-125", 50],
  ]),
  blend("R-448A", "R-32/125/1234yf/134a/1234ze(E) (26/26/20/21/7)", "A1", [
    ["R-32", 26],
    ["R-125", 26],
    ["R-1234yf", 20],
    ["R-134a", 21],
    ["R-1234ze(E)", 7],
  ]),
  blend("R-449A", "R-32/125/1234yf/134a (24.3/24.7/25.3/25.7)", "A1", [
    ["R-32", 24.3],
    ["R-125", 24.7],
    ["R-1234yf", 25.3],
    ["R-134a", 25.7],
  ]),
  blend("R-454B", "R-32/1234yf (68.9/31.1)", "A2L", [
    ["R-32", 68.9],
    ["R-1234yf", 31.1],
  ]),
  blend("R-455A", "R-744/32/1234yf (3/21.5/75.5)", "A2L", [
    ["R-744", 3],
    ["R-32", 21.5],
    ["R-1234yf", 75.5],
  ]),
  // Retrofit and lower-GWP blends seen in supermarkets (from memory; see FROM_MEMORY).
  blend(
    "R-422D",
    "R-125/134a/600a (65.1/31.5/3.4)",
    "A1",
    [
      ["R-125", 65.1],
      ["R-134a", 31.5],
      ["R-600a", 3.4],
    ],
    FROM_MEMORY,
  ),
  blend(
    "R-427A",
    "R-32/125/143a/134a (15/25/10/50)",
    "A1",
    [
      ["R-32", 15],
      ["R-125", 25],
      ["R-143a", 10],
      ["R-134a", 50],
    ],
    FROM_MEMORY,
  ),
  blend(
    "R-438A",
    "R-32/125/134a/600/601a (8.5/45/44.2/1.7/0.6)",
    "A1",
    [
      ["R-32", 8.5],
      ["R-125", 45],
      ["R-134a", 44.2],
      ["R-600", 1.7],
      ["R-601a", 0.6],
    ],
    FROM_MEMORY,
  ),
  blend(
    "R-513A",
    "R-1234yf/134a (56/44)",
    "A1",
    [
      ["R-1234yf", 56],
      ["R-134a", 44],
    ],
    FROM_MEMORY,
  ),
  blend(
    "R-450A",
    "R-134a/1234ze(E) (42/58)",
    "A1",
    [
      ["R-134a", 42],
      ["R-1234ze(E)", 58],
    ],
    FROM_MEMORY,
  ),
  blend(
    "R-452A",
    "R-32/125/1234yf (11/59/30)",
    "A1",
    [
      ["R-32", 11],
      ["R-125", 59],
      ["R-1234yf", 30],
    ],
    FROM_MEMORY,
  ),
];
