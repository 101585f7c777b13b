import { useMemo } from "react";
import { useParams, useSearchParams } from "react-router";
import { alignmentBetween } from "#core/domain/fieldmap/plan-alignment";
import { differenceMap } from "#core/domain/fieldmap/difference-map";
import { createDifferenceScale, DIFFERENCE_LUT } from "#core/domain/fieldmap/difference-ramp";
import { niceMaxPpm } from "#core/domain/fieldmap/concentration-ramp";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Select } from "../../components/ui/select";
import { Spinner } from "../../components/ui/spinner";
import { usePlanFixtures, usePlans } from "../../entities/plans/plans-api";
import { useStores } from "../../entities/stores/stores-api";
import { useAnalysis } from "../../entities/sweeps/analysis-api";
import { useFixtureTrends } from "../../features/fieldmap/api/get-fixture-trends";
import { FieldCanvas } from "../../features/fieldmap/components/field-canvas";
import { RampLegend } from "../../features/fieldmap/components/ramp-legend";
import { TrendSparkline } from "../../features/fieldmap/components/trend-sparkline";
import { useWidth } from "../../features/fieldmap/components/use-width";
import { DEFAULT_LAYERS } from "../../features/fieldmap/model/layers";
import { concentrationPaint } from "../../features/fieldmap/model/scale-paint";
import { useDocumentTitle } from "../../lib/use-document-title";
import { formatInZone } from "#core/domain/dates/format-in-zone";
import { can } from "#core/domain/roles";
import { useSignedIn } from "../shell/session-context";
import { useUnitPreferences } from "../shell/use-unit-preferences";
import { formatGrouped } from "#core/domain/numbers/number-format";
import { Component as NotFound } from "./not-found";

const SIDE_LAYERS = { ...DEFAULT_LAYERS, corrected: false, path: false };
const DIFF_LAYERS = { ...SIDE_LAYERS, suspects: false, riskPoints: false };

/** Comparing months reads field maps: the service team's, not a store contact's (decision 0072). */
export function Component() {
  const { membership } = useSignedIn();
  return can(membership.role, "sweeps.read") ? <ComparePage /> : <NotFound />;
}

function ComparePage() {
  const { storeId = "" } = useParams();
  const numberFormat = useUnitPreferences().number;
  // ppm to one place, in the company's number format
  const ppm = (v: number) => formatGrouped(v, numberFormat, 1);
  const [search, setSearch] = useSearchParams();
  const trends = useFixtureTrends(storeId, search.get("a"), search.get("b"));
  const stores = useStores();
  const plans = usePlans(storeId);
  const store = stores.data?.find((s) => s.id === storeId);
  const timeZone = store?.timeZone ?? "UTC";
  // Two sweeps on one day are told apart by their time and who walked them.
  const when = (s: { startedAt: string; technicianName: string }) =>
    `${formatInZone(s.startedAt, timeZone)}${s.technicianName ? ` · ${s.technicianName}` : ""}`;
  useDocumentTitle(store ? `Compare · ${store.name}` : "Compare sweeps");
  const t = trends.data;
  const aId = t?.a ?? null;
  const bId = t?.b ?? null;
  const aSweep = t?.sweeps.find((s) => s.id === aId);
  const bSweep = t?.sweeps.find((s) => s.id === bId);
  const A = useAnalysis(aId ?? "", null, !!aId);
  const B = useAnalysis(bId ?? "", null, !!bId);
  const planA = plans.data?.find((p) => p.id === aSweep?.planId);
  const planB = plans.data?.find((p) => p.id === bSweep?.planId);
  const fixA = usePlanFixtures(planA?.id);
  const fixB = usePlanFixtures(planB?.id);
  const [wrapRef, width] = useWidth<HTMLDivElement>();

  const { scale, paint } = useMemo(
    () =>
      concentrationPaint(
        [...(A.data?.readings ?? []), ...(B.data?.readings ?? [])].map((r) => r.ppm),
        2,
        true,
      ),
    [A.data, B.data],
  );
  const diff = useMemo(() => {
    if (!A.data || !B.data || !planA || !planB || !plans.data) return null;
    const align = alignmentBetween(plans.data, planA.id, planB.id);
    const grid = differenceMap(A.data.field, B.data.field, align);
    const ds = createDifferenceScale(niceMaxPpm(grid.maxAbs, 1));
    return { grid, ds, paint: { lut: DIFFERENCE_LUT, index: ds.index } };
  }, [A.data, B.data, planA, planB, plans.data]);

  const overlay = (f: typeof fixA.data) =>
    (f?.fixtures ?? []).map((x) => ({
      id: x.id,
      kind: x.kind,
      label: x.label,
      polygon: "polygon" in x ? x.polygon : undefined,
      point: "point" in x ? x.point : undefined,
    }));
  const maxW = Math.max(planA?.widthM ?? 1, planB?.widthM ?? 1);
  const half = Math.floor((width - 16) / 2);
  const pick = (key: "a" | "b", value: string) => {
    const next = new URLSearchParams(search);
    next.set(key, value);
    if (key === "b" && !search.get("a")) next.delete("a");
    setSearch(next, { replace: true });
  };

  if (trends.isError)
    return <QueryError error={trends.error} what="the comparison" onRetry={() => void trends.refetch()} />;
  if (!t) return <Spinner label="Gathering the store's sweeps…" />;
  const options = t.sweeps.map((s) => ({ value: s.id, label: when(s) }));
  const ia = t.sweeps.findIndex((s) => s.id === aId);
  const ib = t.sweeps.findIndex((s) => s.id === bId);

  return (
    <>
      <PageHeader
        title={`Compare sweeps — ${store?.name ?? "store"}`}
        description="Two sweeps side by side at the same scale and colours, the difference between them, and each fixture over the last 12 months."
      />
      <div className="mb-4 flex flex-wrap gap-4">
        <Select
          label="Earlier sweep"
          options={options}
          value={aId ?? ""}
          onChange={(e) => pick("a", e.currentTarget.value)}
        />
        <Select
          label="Later sweep"
          options={options}
          value={bId ?? ""}
          onChange={(e) => pick("b", e.currentTarget.value)}
        />
      </div>
      <div ref={wrapRef} className="grid grid-cols-2 gap-4" data-testid="compare-side-by-side">
        {[
          { s: aSweep, an: A, plan: planA, fx: fixA, title: "Earlier" },
          { s: bSweep, an: B, plan: planB, fx: fixB, title: "Later" },
        ].map(({ s, an, plan, fx, title }) => (
          <figure key={title}>
            <figcaption className="mb-1 font-bold">
              {title}: {s ? when(s) : "—"}{" "}
              {an.data
                ? `· ${an.data.candidates.length} suspect spot${an.data.candidates.length === 1 ? "" : "s"}`
                : ""}
            </figcaption>
            {an.data && plan ? (
              <FieldCanvas
                label={`${title} sweep field map`}
                widthM={plan.widthM ?? 1}
                heightM={plan.heightM ?? 1}
                planImageUrl={plan.image?.displayUrl ?? null}
                field={an.data.field}
                paint={paint}
                layers={SIDE_LAYERS}
                fixtures={overlay(fx.data)}
                readings={an.data.readings}
                spots={an.data.candidates}
                selected={null}
                width={Math.round((half * (plan.widthM ?? 1)) / maxW)}
              />
            ) : an.isError ? (
              <QueryError error={an.error} what="this sweep's map" />
            ) : (
              <Spinner label="Computing…" />
            )}
          </figure>
        ))}
      </div>
      <div className="mt-3">
        <RampLegend
          numberFormat={numberFormat}
          title="Both maps: lag-corrected concentration (log scale)"
          lut={paint.lut}
          position={scale.position}
          ticks={scale.ticks()}
        />
      </div>
      <section className="mt-6">
        <h2 className="mb-2 text-xl font-bold">Difference (later minus earlier)</h2>
        {diff && planB && B.data ? (
          <div
            className="grid items-start gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]"
            data-testid="difference-map"
          >
            <FieldCanvas
              label="Difference map"
              widthM={planB.widthM ?? 1}
              heightM={planB.heightM ?? 1}
              planImageUrl={planB.image?.displayUrl ?? null}
              field={diff.grid}
              paint={diff.paint}
              layers={DIFF_LAYERS}
              fixtures={overlay(fixB.data)}
              readings={[]}
              spots={[]}
              selected={null}
              width={Math.round(width * 0.64)}
            />
            <div>
              <RampLegend
                numberFormat={numberFormat}
                title="Change in ppm (blue: lower now, copper: higher now)"
                lut={DIFFERENCE_LUT}
                position={(v) => diff.ds.index(v) / 255}
                ticks={diff.ds.ticks()}
              />
              <p className="mt-2 text-sm text-muted">
                Largest change {ppm(diff.grid.maxAbs)} ppm. Areas either sweep left unsampled are hatched: no change can
                be told there.
              </p>
            </div>
          </div>
        ) : (
          <Spinner label="Working out the difference…" />
        )}
      </section>
      <section className="mt-6">
        <h2 className="mb-2 text-xl font-bold">Fixtures over the last 12 months</h2>
        <p className="mb-2 text-sm text-muted">
          Peak and mean ppm of the field around each fixture, per sweep; the fixtures that got worse from the earlier to
          the later sweep first.
        </p>
        <div className="overflow-x-auto">
          <table className="w-full text-sm" data-testid="fixture-trends">
            <thead>
              <tr className="text-left">
                <th className="p-2">Fixture</th>
                <th className="p-2">Trend (peak)</th>
                <th className="p-2">Earlier peak / mean</th>
                <th className="p-2">Later peak / mean</th>
                <th className="p-2">Change</th>
              </tr>
            </thead>
            <tbody>
              {t.fixtures.map((f) => {
                const la = ia >= 0 ? f.levels[ia] : null;
                const lb = ib >= 0 ? f.levels[ib] : null;
                return (
                  <tr key={f.id} className="border-t border-line">
                    <td className="p-2 font-bold">{f.label}</td>
                    <td className="p-2">
                      <TrendSparkline
                        values={f.levels.map((l) => (l ? l.peakPpm : null))}
                        highlight={[ia, ib]}
                        label={`${f.label}: peak ppm per sweep`}
                      />
                    </td>
                    <td className="p-2">{la ? `${ppm(la.peakPpm)} / ${ppm(la.meanPpm)}` : "not sampled"}</td>
                    <td className="p-2">{lb ? `${ppm(lb.peakPpm)} / ${ppm(lb.meanPpm)}` : "not sampled"}</td>
                    <td
                      className={`p-2 font-bold ${f.change !== null && f.change > 1 ? "text-danger" : f.change !== null && f.change < -1 ? "text-ok" : ""}`}
                    >
                      {f.change === null ? "—" : `${f.change > 0 ? "+" : ""}${ppm(f.change)} ppm`}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      </section>
    </>
  );
}
