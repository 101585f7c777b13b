import type { EXCLUSIONS } from "#core/contracts/compliance";

/** How a charge-added entry that counts no leak loss is named on screens (40 CFR 82.157 [S:R1]). */
export const EXCLUSION_NAMES: Record<(typeof EXCLUSIONS)[number], string> = {
  retrofit: "fill after a retrofit",
  "new-installation": "fill of a new installation",
  "seasonal-variance": "seasonal variance",
};
