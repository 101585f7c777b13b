import { DEFAULT_CELL_SIZE_M } from "../../contracts/locator-input";

// What a caller may set: the grid cell (the server's analysis sets it) and the walking pace, both also
// used by the Walk screen's lag hint so it marks the point the locator will use, and whether the delay
// may be taken from the readings. Everything else is a calibrated model setting (settings.ts).

export interface LocatorOptions {
  /** Grid cell, m (docs/locator/design-ranges.md). */
  cellSize: number;
  /** Walking pace between stops for the stop-and-go lag model, m/s (docs/locator/design-ranges.md: 0.7–1.2); 0 = move evenly between taps. */
  walkSpeedMps: number;
  /**
   * Place the spots with the delay the readings support when it clearly differs from the stated one
   * (core/analysis/lag/delay-check.ts). Off when someone set the delay by hand for this analysis.
   */
  delayFromReadings: boolean;
}

export const DEFAULT_LOCATOR_OPTIONS: Readonly<LocatorOptions> = {
  walkSpeedMps: 1,
  cellSize: DEFAULT_CELL_SIZE_M,
  delayFromReadings: true,
};
