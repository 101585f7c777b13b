import { Bar, CartesianGrid, ComposedChart, Legend, Line, Scatter, Tooltip, XAxis, YAxis } from "recharts";
import type { SystemRecordsView } from "#core/contracts/compliance";
import { formatGrouped, formatQuantity, type NumberFormat } from "#core/domain/numbers/number-format";
import type { MassUnit } from "../model/figures";
import { chargeSeries, dayLabel, leakCheckSeries, leakRateSeries, timeDomain } from "../model/plot-series";

import { PLOT_COLOURS, Plot } from "../../../components/ui/plot-frame";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";

const { accent: ACCENT, danger: DANGER, muted: MUTED, ok: OK } = PLOT_COLOURS;
const HEIGHT = 240;

const timeAxis = (ts: number[]) => (
  <XAxis
    dataKey="t"
    type="number"
    scale="time"
    domain={timeDomain(ts)}
    tickFormatter={dayLabel}
    tickCount={5}
    label={{ value: "Date (store calendar)", position: "insideBottom", offset: -4 }}
    height={44}
  />
);

function LeakRatePlot({ r, numberFormat }: { r: SystemRecordsView; numberFormat: NumberFormat }) {
  const one = (v: number) => formatGrouped(v, numberFormat, 1);
  const data = leakRateSeries(r);
  const above = data.filter((p) => p.exceeds).length;
  const hasThreshold = data.some((p) => p.threshold !== null);
  return (
    <Plot
      title="Leak rate at each addition"
      summary={`${data.length} figure${data.length === 1 ? "" : "s"}, ${above} above the threshold${hasThreshold ? "" : " (no threshold applies)"}; the dashed line is the threshold in force.`}
      table={{
        head: ["Date", "Leak rate (% per year)", "Threshold (% per year)"],
        rows: data.map((p) => [
          formatCalendarDay(p.day),
          one(p.percent),
          p.threshold === null ? "none" : formatQuantity(p.threshold, numberFormat),
        ]),
      }}
    >
      {(width) => (
        <ComposedChart width={width} height={HEIGHT} data={data} margin={{ top: 8, right: 12, bottom: 8, left: 8 }}>
          <CartesianGrid stroke="#e3e7e8" />
          {timeAxis(data.map((p) => p.t))}
          <YAxis
            unit=" %"
            tickFormatter={(v: number) => formatGrouped(v, numberFormat, 0)}
            width={64}
            label={{ value: "Leak rate, % per year", angle: -90, position: "insideLeft", offset: 4, dy: 60 }}
          />
          <Tooltip labelFormatter={(t) => dayLabel(Number(t))} formatter={(v) => `${one(Number(v))} %`} />
          <Legend verticalAlign="top" height={28} />
          <Line
            name="Threshold"
            dataKey="threshold"
            type="stepAfter"
            stroke={DANGER}
            strokeDasharray="6 4"
            dot={false}
            isAnimationActive={false}
          />
          <Line
            name="Leak rate"
            dataKey="percent"
            stroke={ACCENT}
            strokeWidth={2}
            dot={{ r: 4, fill: ACCENT }}
            isAnimationActive={false}
          />
        </ComposedChart>
      )}
    </Plot>
  );
}

function ChargePlot({
  r,
  unit,
  numberFormat,
  withChecks,
}: {
  r: SystemRecordsView;
  unit: MassUnit;
  numberFormat: NumberFormat;
  withChecks: boolean;
}) {
  const charge = chargeSeries(r, unit);
  const checks = withChecks ? leakCheckSeries(r) : [];
  const found = checks.filter((c) => c.leakFound).map((c) => ({ t: c.t, y: 0 }));
  const clean = checks.filter((c) => !c.leakFound).map((c) => ({ t: c.t, y: 0 }));
  const total = charge.at(-1)?.total ?? 0;
  const digits = unit === "lb" ? 1 : 2;
  const fixed = (v: number) => formatGrouped(v, numberFormat, digits);
  const title = withChecks ? "Charge added and leak checks over time" : "Charge added over time";
  return (
    <Plot
      title={title}
      summary={`${fixed(total)} ${unit} added on ${charge.length} day${charge.length === 1 ? "" : "s"} (bars: each day's addition; line: running total)${withChecks ? `; ${checks.length} leak check${checks.length === 1 ? "" : "s"}, ${found.length} finding a leak (marks on the date axis)` : ""}.`}
      table={{
        head: ["Date", `Added (${unit})`, `Running total (${unit})`, ...(withChecks ? ["Leak check"] : [])],
        // Oldest first, additions and checks interleaved by their ISO day; shown as every screen writes days.
        rows: [
          ...charge.map((p) => [p.day, fixed(p.added), fixed(p.total), ...(withChecks ? [""] : [])]),
          ...checks.map((c) => [c.day, "", "", c.leakFound ? "leak found" : "no leak found"]),
        ]
          .sort((a, b) => a[0].localeCompare(b[0]))
          .map(([day, ...rest]) => [formatCalendarDay(day), ...rest]),
      }}
    >
      {(width) => (
        <ComposedChart width={width} height={HEIGHT} data={charge} margin={{ top: 8, right: 12, bottom: 8, left: 8 }}>
          <CartesianGrid stroke="#e3e7e8" />
          {timeAxis([...charge.map((p) => p.t), ...checks.map((c) => c.t)])}
          <YAxis
            unit={` ${unit}`}
            tickFormatter={(v: number) => formatQuantity(v, numberFormat)}
            width={64}
            label={{ value: `Refrigerant, ${unit}`, angle: -90, position: "insideLeft", offset: 4, dy: 50 }}
          />
          <Tooltip labelFormatter={(t) => dayLabel(Number(t))} formatter={(v) => `${fixed(Number(v))} ${unit}`} />
          <Legend verticalAlign="top" height={28} />
          <Bar name="Added that day" dataKey="added" fill={ACCENT} barSize={10} isAnimationActive={false} />
          <Line
            name="Running total"
            dataKey="total"
            type="stepAfter"
            stroke={MUTED}
            dot={false}
            isAnimationActive={false}
          />
          {withChecks ? (
            <Scatter
              name="Leak check: no leak"
              data={clean}
              dataKey="y"
              fill={OK}
              shape="circle"
              isAnimationActive={false}
            />
          ) : null}
          {withChecks ? (
            <Scatter
              name="Leak check: leak found"
              data={found}
              dataKey="y"
              fill={DANGER}
              shape="cross"
              isAnimationActive={false}
            />
          ) : null}
        </ComposedChart>
      )}
    </Plot>
  );
}

/**
 * The system's records as plots, in the reader's mass unit: under a rule with a leak-rate threshold
 * (the US parts) the leak rate at each addition against it, and the charge added; under EU F-gas,
 * which sets leak-check intervals instead of a threshold, the charge added and the leak checks.
 */
export function SystemPlots({
  r,
  unit,
  numberFormat,
}: {
  r: SystemRecordsView;
  unit: MassUnit;
  numberFormat: NumberFormat;
}) {
  const anything = r.additions.some((a) => !a.voided) || r.leakChecks.length > 0;
  if (!anything) return null;
  return (
    <section aria-labelledby="plots" className="space-y-3">
      <h2 id="plots" className="text-xl font-bold">
        Over time
      </h2>
      <div className="grid gap-4 xl:grid-cols-2">
        {r.profile.leakRateRules && r.leakRates.length ? <LeakRatePlot r={r} numberFormat={numberFormat} /> : null}
        <ChargePlot r={r} unit={unit} numberFormat={numberFormat} withChecks={!r.profile.leakRateRules} />
      </div>
    </section>
  );
}
