import { Bar, CartesianGrid, ComposedChart, Legend, Line, Tooltip, XAxis, YAxis } from "recharts";
import type { SweepSummaryItem } from "#core/contracts/sweep-summary";
import { formatInZone } from "#core/domain/dates/format-in-zone";
import { formatShort, type NumberFormat } from "#core/domain/numbers/number-format";
import { PLOT_COLOURS, Plot } from "../../../components/ui/plot-frame";

const peakText = (s: SweepSummaryItem, format: NumberFormat) =>
  s.peakPpm === null ? "no readings" : `${s.peakAtLeast ? "≥ " : ""}${formatShort(s.peakPpm, format)} ppm`;

/**
 * The store's last sweeps side by side: suspect spots and findings per sweep (bars, counts) and the
 * highest reading (line, ppm on its own axis), so a store that is getting worse shows at a glance.
 */
export function SweepSummaryPlot({
  sweeps,
  timeZone,
  numberFormat,
}: {
  sweeps: SweepSummaryItem[];
  timeZone: string;
  /** The company's number format. */
  numberFormat: NumberFormat;
}) {
  const data = sweeps.map((s) => ({
    ...s,
    label: formatInZone(s.startedAt, timeZone, "date"),
    suspectsShown: s.suspects ?? 0,
  }));
  const unanalysed = sweeps.filter((s) => s.suspects === null).length;
  const confirmed = sweeps.reduce((n, s) => n + s.confirmed, 0);
  return (
    <Plot
      title={`The last ${sweeps.length === 1 ? "sweep" : `${sweeps.length} sweeps`}`}
      summary={`Bars: suspect spots and findings (of them ${confirmed} confirmed); line: the highest reading in ppm.${unanalysed ? ` ${unanalysed} not analysed as they stand yet: open their field map to count their suspect spots.` : ""}`}
      table={{
        head: ["Sweep started", "Technician", "Suspect spots", "Findings", "Confirmed", "Highest reading"],
        rows: data.map((s) => [
          formatInZone(s.startedAt, timeZone, "dateTime"),
          s.technicianName,
          s.suspects ?? "not analysed yet",
          s.findings,
          s.confirmed,
          peakText(s, numberFormat),
        ]),
      }}
    >
      {(width) => (
        <ComposedChart width={width} height={240} data={data} margin={{ top: 8, right: 8, bottom: 8, left: 8 }}>
          <CartesianGrid stroke={PLOT_COLOURS.grid} />
          <XAxis dataKey="label" label={{ value: "Sweep started", position: "insideBottom", offset: -4 }} height={44} />
          <YAxis
            yAxisId="count"
            allowDecimals={false}
            width={48}
            label={{ value: "Count", angle: -90, position: "insideLeft", offset: 8 }}
          />
          <YAxis
            yAxisId="ppm"
            orientation="right"
            width={64}
            unit=" ppm"
            label={{ value: "Highest reading, ppm", angle: 90, position: "insideRight", offset: 0, dy: -60 }}
          />
          <Tooltip />
          <Legend verticalAlign="top" height={28} />
          <Bar
            yAxisId="count"
            name="Suspect spots"
            dataKey="suspectsShown"
            fill={PLOT_COLOURS.muted}
            isAnimationActive={false}
          />
          <Bar
            yAxisId="count"
            name="Findings"
            dataKey="findings"
            fill={PLOT_COLOURS.accent}
            isAnimationActive={false}
          />
          <Bar
            yAxisId="count"
            name="Confirmed"
            dataKey="confirmed"
            fill={PLOT_COLOURS.danger}
            isAnimationActive={false}
          />
          <Line
            yAxisId="ppm"
            name="Highest reading"
            dataKey="peakPpm"
            stroke={PLOT_COLOURS.ok}
            strokeWidth={2}
            dot={{ r: 4 }}
            isAnimationActive={false}
          />
        </ComposedChart>
      )}
    </Plot>
  );
}
