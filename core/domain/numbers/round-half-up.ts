import { DomainInputError, requireFinite } from "../input-error";

/**
 * Rounds half away from zero to `decimals` places, the way published refrigerant tables round
 * (R-410A: 0.5 × 675 + 0.5 × 3500 = 2087.5 → 2088). `Math.round` would do here for positives but
 * `toFixed` and Python's `round()` round half to even or fall foul of binary noise
 * (0.3 × 675 is 202.49999999999997 in binary, so R-407F's 1824.5 would become 1824).
 * The scaled value is first cleaned to 12 significant digits, which removes that noise while
 * keeping every digit a decimal table could have meant.
 */
export function roundHalfUp(value: number, decimals = 0): number {
  requireFinite(value, "value");
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 10) {
    throw new DomainInputError("decimals", `must be a whole number from 0 to 10, got ${decimals}`);
  }
  const factor = 10 ** decimals;
  const scaled = Number((Math.abs(value) * factor).toPrecision(12));
  const rounded = Math.floor(scaled + 0.5) / factor;
  return value < 0 && rounded !== 0 ? -rounded : rounded;
}

/** Formats with exactly `decimals` places after rounding half up (never `toFixed`'s own rounding). */
export function formatFixed(value: number, decimals: number): string {
  return roundHalfUp(value, decimals).toFixed(decimals);
}
