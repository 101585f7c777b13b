import { DomainInputError, requireFinite } from "../input-error";
import { roundHalfUp } from "../numbers/round-half-up";

/** Exact by definition: 1 ft = 0.3048 m (international foot; NIST SP 811, appendix B.8). */
export const METRES_PER_FOOT = 0.3048;
/** Exact: 1 in = 0.0254 m (NIST SP 811, appendix B.8). */
export const METRES_PER_INCH = 0.0254;
export const INCHES_PER_FOOT = 12;

export function feetToMetres(feet: number): number {
  return requireFinite(feet, "feet") * METRES_PER_FOOT;
}

export function metresToFeet(metres: number): number {
  return requireFinite(metres, "metres") / METRES_PER_FOOT;
}

export function inchesToMetres(inches: number): number {
  return requireFinite(inches, "inches") * METRES_PER_INCH;
}

/** A length split into whole feet, whole inches and a reduced fraction of an inch. */
export interface FeetInches {
  negative: boolean;
  feet: number;
  inches: number;
  /** Fraction of an inch, reduced (2/4 → 1/2); numerator 0 when there is none. */
  numerator: number;
  denominator: number;
}

const DENOMINATORS = [1, 2, 4, 8, 16] as const;
export type InchDenominator = (typeof DENOMINATORS)[number];

/**
 * Splits metres into feet, inches and a fraction, rounded half up to the nearest 1/`denominator` inch;
 * 11 7/8 in rounded to the half inch carries into the next foot (never "12 ft 12 in").
 */
export function toFeetInches(metres: number, denominator: InchDenominator = 2): FeetInches {
  requireFinite(metres, "metres");
  if (!DENOMINATORS.includes(denominator)) {
    throw new DomainInputError("denominator", `must be one of ${DENOMINATORS.join(", ")}, got ${denominator}`);
  }
  const steps = roundHalfUp((Math.abs(metres) / METRES_PER_INCH) * denominator);
  const stepsPerFoot = INCHES_PER_FOOT * denominator;
  const feet = Math.floor(steps / stepsPerFoot);
  const rest = steps - feet * stepsPerFoot;
  const inches = Math.floor(rest / denominator);
  let numerator = rest - inches * denominator;
  let den: number = denominator;
  while (numerator > 0 && numerator % 2 === 0 && den % 2 === 0) {
    numerator /= 2;
    den /= 2;
  }
  return { negative: metres < 0 && steps > 0, feet, inches, numerator, denominator: numerator === 0 ? 1 : den };
}

/**
 * Formats metres as feet and inches in one ASCII style: `12 ft 3 1/2 in`, `0 ft 7 in`, `5 ft 0 in`.
 * ASCII (not ′ ″ ½) so the text survives CSV, PDF fonts and screen readers alike.
 */
export function formatFeetInches(metres: number, denominator: InchDenominator = 2): string {
  const p = toFeetInches(metres, denominator);
  const fraction = p.numerator > 0 ? ` ${p.numerator}/${p.denominator}` : "";
  return `${p.negative ? "-" : ""}${p.feet} ft ${p.inches}${fraction} in`;
}
