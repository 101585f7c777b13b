import type { LengthPreference } from "#core/domain/units/format-units";
import { scaleBarReadout } from "../../model/scale-readout";

/**
 * A graduated bar of a round length (1-2-5 series) for a plan drawn at `metresPerScreenPixel`;
 * drawn in black and white, with the length in words, so it reads in high contrast too.
 */
export function ScaleBar({
  metresPerScreenPixel,
  maxPixels = 160,
  preference,
}: {
  metresPerScreenPixel: number;
  maxPixels?: number;
  preference: LengthPreference;
}) {
  const bar = scaleBarReadout(metresPerScreenPixel, maxPixels, preference);
  const w = Math.max(1, Math.round(bar.pixels));
  const label = bar.label;
  return (
    <figure className="inline-flex items-center gap-2" aria-label={`Scale bar: ${label}`}>
      <svg width={w + 2} height={14} aria-hidden="true">
        <rect x={1} y={4} width={w / 2} height={6} fill="#1c2529" />
        <rect x={1 + w / 2} y={4} width={w / 2} height={6} fill="#ffffff" stroke="#1c2529" strokeWidth={1} />
        <rect x={1} y={4} width={w} height={6} fill="none" stroke="#1c2529" strokeWidth={1.5} />
      </svg>
      <figcaption className="text-sm font-bold">{label}</figcaption>
    </figure>
  );
}
