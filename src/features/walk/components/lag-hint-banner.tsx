import { formatLength, type LengthPreference } from "#core/domain/units/format-units";
import type { LagHint } from "../model/lag-hint";
import { StripChip, useFoldedStrip } from "./notice-strip";

/**
 * The sweep's peak so far (not merely the latest alarm), where its air was really sampled, and the
 * closer re-check to make from there.
 */
export function LagHintBanner({
  hint,
  ppm,
  atLeast = false,
  readingNumber,
  place,
  lengthUnit = "m",
  compact = false,
  onDismiss,
}: {
  hint: LagHint;
  ppm: number;
  atLeast?: boolean;
  /** The peak reading's number in the sweep (#1 is the first tap). */
  readingNumber: number;
  /** The fixture where the peak's air was sampled, when it is at one. */
  place: string | null;
  lengthUnit?: LengthPreference;
  /** One line (the keypad is open and the plan needs the room): the peak and its place only. */
  compact?: boolean;
  onDismiss(): void;
}) {
  const folded = useFoldedStrip();
  // Feet to the nearest inch: a walking distance, not a measurement.
  const len = (m: number) => formatLength(m, lengthUnit, { decimals: 1, denominator: 1 });
  const alarm = `Alarm: ${atLeast ? "≥ " : ""}${ppm} ppm`;
  const peak = `peak so far (#${readingNumber})${place ? `, sampled at ${place}` : ""}.`;
  const advice = hint.beforeDelay
    ? "The detector had not yet drawn air from before where this walk began (the sweep, a still-air pass or a long pause; yellow diamond): re-check around there."
    : `Its air was about ${len(hint.backM)} back along your path (yellow diamond): re-check at about ${len(0.6)} spacing (rings).`;
  if (folded)
    return (
      <StripChip tone="danger" role="alert" data-testid="lag-hint" data-peak-index={hint.index}>
        {alarm} <span data-testid="lag-hint-peak">{peak}</span> {advice}
      </StripChip>
    );
  return (
    <div
      role="alert"
      className="flex items-center justify-between gap-2 rounded-md border-l-4 border-danger bg-danger-soft px-3 py-1 text-sm leading-snug edge"
      data-testid="lag-hint"
      data-peak-index={hint.index}
    >
      <span className={compact ? "line-clamp-2" : undefined}>
        <strong className="text-base">{alarm}</strong> <span data-testid="lag-hint-peak">{peak}</span>{" "}
        {compact ? null : advice}
      </span>
      <button type="button" className="min-h-12 shrink-0 font-bold underline" onClick={onDismiss}>
        OK
      </button>
    </div>
  );
}
