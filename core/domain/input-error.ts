/**
 * The one error type of the pure domain core: bad input names the field and the reason, so the API
 * layer can turn it into a 400 with a field error without parsing message text.
 */
export class DomainInputError extends Error {
  readonly field: string;
  readonly reason: string;

  constructor(field: string, reason: string) {
    super(`${field}: ${reason}`);
    this.name = "DomainInputError";
    this.field = field;
    this.reason = reason;
  }
}

/** Throws unless `value` is a finite number (NaN, ±Infinity and non-numbers are refused). */
export function requireFinite(value: unknown, field: string): number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new DomainInputError(field, `must be a finite number, got ${String(value)}`);
  }
  return value;
}

/** Throws unless `value` is a finite number ≥ 0. */
export function requireNonNegative(value: unknown, field: string): number {
  const n = requireFinite(value, field);
  if (n < 0) throw new DomainInputError(field, `must not be negative, got ${n}`);
  return n;
}

/** Throws unless `value` is a finite number > 0. */
export function requirePositive(value: unknown, field: string): number {
  const n = requireFinite(value, field);
  if (n <= 0) throw new DomainInputError(field, `must be greater than zero, got ${n}`);
  return n;
}
