/** The international foot is exactly 0.3048 m (NIST SP 811, 2008, appendix B.8). */
export const METRES_PER_FOOT = 0.3048;

export type LengthUnit = "m" | "ft";

export function feetToMetres(feet: number): number {
  return feet * METRES_PER_FOOT;
}

export function metresToFeet(metres: number): number {
  return metres / METRES_PER_FOOT;
}

export function toMetres(value: number, unit: LengthUnit): number {
  return unit === "ft" ? feetToMetres(value) : value;
}

export function fromMetres(metres: number, unit: LengthUnit): number {
  return unit === "ft" ? metresToFeet(metres) : metres;
}
