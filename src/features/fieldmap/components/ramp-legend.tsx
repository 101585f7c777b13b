import { LUT_SIZE } from "#core/domain/fieldmap/concentration-ramp";
import { formatQuantity, type NumberFormat } from "#core/domain/numbers/number-format";

/** A ramp bar with ppm ticks, and a swatch for unknown (hatched) areas. */
export function RampLegend({
  lut,
  position,
  ticks,
  unit = "ppm",
  title,
  numberFormat,
}: {
  /** The company's number format, for the ticks. */
  numberFormat: NumberFormat;
  lut: Uint8ClampedArray;
  position(v: number): number;
  ticks: number[];
  unit?: string;
  title: string;
}) {
  const stops: string[] = [];
  for (let i = 0; i < LUT_SIZE; i += 15)
    stops.push(`rgb(${lut[i * 3]},${lut[i * 3 + 1]},${lut[i * 3 + 2]}) ${((i / (LUT_SIZE - 1)) * 100).toFixed(1)}%`);
  stops.push(`rgb(${lut[(LUT_SIZE - 1) * 3]},${lut[(LUT_SIZE - 1) * 3 + 1]},${lut[(LUT_SIZE - 1) * 3 + 2]}) 100%`);
  return (
    <figure className="text-sm" aria-label={title}>
      <figcaption className="mb-1 font-bold">{title}</figcaption>
      <div
        className="relative h-4 w-full max-w-md rounded edge"
        style={{ background: `linear-gradient(to right, ${stops.join(", ")})` }}
      />
      <div className="relative h-5 w-full max-w-md">
        {ticks.map((t) => (
          <span
            key={t}
            className="absolute -translate-x-1/2 text-xs text-muted"
            style={{ left: `${position(t) * 100}%` }}
          >
            {`${t > 0 && unit === "ppm" && ticks.some((x) => x < 0) ? "+" : ""}${formatQuantity(t, numberFormat)}`}
          </span>
        ))}
      </div>
      <p className="flex items-center gap-2 text-xs text-muted">
        <span
          aria-hidden
          className="inline-block h-3 w-6 rounded edge"
          style={{ background: "repeating-linear-gradient(45deg, rgba(84,88,96,0.6) 0 2px, transparent 2px 6px)" }}
        />
        Hatched: not sampled enough to say (unknown, not clean). Values in {unit}.
      </p>
    </figure>
  );
}
