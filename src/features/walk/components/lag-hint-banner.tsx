import { formatLength, type LengthPreference } from "#core/domain/units/format-units";
import type { LagHint } from "../model/lag-hint";

/** Where an alarm's air was really sampled, and the closer re-check to make from there. */
export function LagHintBanner({
  hint,
  ppm,
  lengthUnit = "m",
  onDismiss,
}: {
  hint: LagHint;
  ppm: number;
  lengthUnit?: LengthPreference;
  onDismiss(): void;
}) {
  // Feet to the nearest inch: a walking distance, not a measurement.
  const len = (m: number) => formatLength(m, lengthUnit, { decimals: 1, denominator: 1 });
  return (
    <div
      role="alert"
      className="flex items-center justify-between gap-2 rounded-md border-l-4 border-danger bg-danger-soft px-3 py-1 edge"
      data-testid="lag-hint"
    >
      <span>
        <strong>Alarm: {ppm} ppm.</strong>{" "}
        {hint.beforeDelay
          ? "The detector had not yet drawn air from beyond the first reading: re-check around the start."
          : `The air was sampled about ${len(hint.backM)} back along your path (yellow diamond). Re-check at about ${len(0.6)} spacing from there (rings).`}
      </span>
      <button type="button" className="min-h-12 shrink-0 font-bold underline" onClick={onDismiss}>
        OK
      </button>
    </div>
  );
}
