/**
 * A typed real length for calibration or a blank plan's size. A bare number is taken in the
 * user's unit and sent as typed (so "10" ft stays exactly 10 ft for the server's 0.3048
 * conversion); anything with units ("3.2 m", "12 ft 6 in", "12' 6\"") is read by the domain's
 * parseLength and sent in metres.
 */
import { DomainInputError } from "#core/domain/input-error";
import { parseLength } from "#core/domain/units/parse-length";
import type { LengthPreference } from "#core/domain/units/format-units";

export interface LengthEntry {
  value: number;
  unit: "m" | "ft";
}

export type LengthEntryResult = { ok: true; length: LengthEntry } | { ok: false; message: string };

const BARE = /^\s*(\d+(?:\.\d+)?|\.\d+)\s*$/;

export function readLengthEntry(
  text: string,
  preference: LengthPreference,
  options: { allowZero?: boolean } = {},
): LengthEntryResult {
  const ok = (v: number) => v > 0 || (options.allowZero === true && v === 0);
  const unit = preference === "ft-in" ? "ft" : "m";
  const bare = BARE.exec(text);
  if (bare) {
    const value = Number(bare[1]);
    return ok(value) ? { ok: true, length: { value, unit } } : { ok: false, message: "must be more than 0" };
  }
  try {
    const metres = parseLength(text, unit);
    return ok(metres)
      ? { ok: true, length: { value: metres, unit: "m" } }
      : { ok: false, message: "must be more than 0" };
  } catch (e) {
    if (e instanceof DomainInputError) return { ok: false, message: e.reason };
    throw e;
  }
}
