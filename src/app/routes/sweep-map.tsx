import { useMemo, useState } from "react";
import { countOf } from "../../lib/format";
import { Link, useParams, useSearchParams } from "react-router";
import { can } from "#core/domain/roles";
import { AIR_VOLUME_KINDS } from "#core/contracts/fixture-kinds";
import { Alert } from "../../components/ui/alert";
import { Button } from "../../components/ui/button";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { useFindings } from "../../entities/findings/findings-api";
import { usePlanFixtures, usePlans } from "../../entities/plans/plans-api";
import { useStores } from "../../entities/stores/stores-api";
import { useAnalysis } from "../../entities/sweeps/analysis-api";
import { useSweep, useSweepReadings } from "../../entities/sweeps/sweeps-api";
import { PassKey } from "../../features/fieldmap/components/pass-key";
import { withPasses } from "../../features/fieldmap/model/reading-passes";
import { useFindingFromSpot } from "../../features/fieldmap/api/findings";
import { useReviewSweep } from "../../features/fieldmap/api/reports";
import { DelayControl } from "../../features/fieldmap/components/delay-control";
import { DelayCheckPanel } from "../../features/fieldmap/components/delay-check-panel";
import { useUpdateDetectorDelay } from "../../features/fieldmap/api/update-detector-delay";
import { presentAnalysis } from "#core/domain/locator-words/present-analysis";
import { useUnitPreferences } from "../shell/use-unit-preferences";
import { formatGrouped, formatShort } from "#core/domain/numbers/number-format";
import { AnalysisProgress } from "../../features/fieldmap/components/analysis-progress";
import { FieldCanvas } from "../../features/fieldmap/components/field-canvas";
import { FindingsPanel } from "../../features/fieldmap/components/findings-panel";
import { LayerToggles } from "../../features/fieldmap/components/layer-toggles";
import { RampLegend } from "../../features/fieldmap/components/ramp-legend";
import { ReportPanel } from "../../features/fieldmap/components/report-panel";
import { SuspectList } from "../../features/fieldmap/components/suspect-list";
import { useWidth } from "../../features/fieldmap/components/use-width";
import { DEFAULT_LAYERS } from "../../features/fieldmap/model/layers";
import { concentrationPaint } from "../../features/fieldmap/model/scale-paint";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";
import { formatInZone } from "#core/domain/dates/format-in-zone";
import { SweepReportPage } from "./sweep-report-page";

const AIR = new Set<string>(AIR_VOLUME_KINDS);

/** The field map for the service team; a store contact gets the sweep's report instead (decision 0072). */
export function Component() {
  const { membership } = useSignedIn();
  return can(membership.role, "sweeps.read") ? <FieldMapPage /> : <SweepReportPage />;
}

function FieldMapPage() {
  const { storeId = "", sweepId = "" } = useParams();
  const [search, setSearch] = useSearchParams();
  const delayParam = search.get("transportDelayS");
  const delay = delayParam === null || !Number.isFinite(Number(delayParam)) ? null : Number(delayParam);
  const { membership } = useSignedIn();
  const units = useUnitPreferences();
  const sweep = useSweep(sweepId);
  const plans = usePlans(storeId);
  const stores = useStores();
  const plan = plans.data?.find((p) => p.id === sweep.data?.planId);
  const fixtures = usePlanFixtures(sweep.data?.planId);
  const analysis = useAnalysis(sweepId, delay, !!sweep.data);
  // which pass each reading was taken in, drawn on the map when the sweep has pinpoint passes
  const stored = useSweepReadings(sweepId, (sweep.data?.passes.length ?? 0) > 0);
  const findings = useFindings(storeId);
  const review = useReviewSweep(sweepId);
  const makeFinding = useFindingFromSpot(storeId, sweepId, sweep.data?.planId ?? "");
  const updateDelay = useUpdateDetectorDelay();
  const [layers, setLayers] = useState(DEFAULT_LAYERS);
  const [log, setLog] = useState(true);
  const [selected, setSelected] = useState<number | null>(null);
  const [wrapRef, width] = useWidth<HTMLDivElement>();
  const store = stores.data?.find((s) => s.id === storeId);
  const timeZone = store?.timeZone ?? "UTC";
  const zoned = (iso: string) => formatInZone(iso, timeZone);
  useDocumentTitle(store ? `Field map · ${store.name}` : "Field map");

  const a = analysis.data;
  // A recompute runs while the answer is on its way or the server says the map it has is stale.
  const recomputing = analysis.isFetching || Boolean(a?.stale);
  const { scale, paint } = useMemo(
    () => concentrationPaint(a?.readings.map((r) => r.ppm) ?? [], sweep.data?.alarmPpm ?? 2, log),
    [a, sweep.data?.alarmPpm, log],
  );
  const label = useMemo(() => {
    const m = new Map((fixtures.data?.fixtures ?? []).map((f) => [f.id, f.label || f.kind]));
    return (id: string | null) => (id ? (m.get(id) ?? null) : null);
  }, [fixtures.data]);
  // the one presenter (core/domain/locator-words/): the reader's units and the names on the plan
  const words = useMemo(
    () =>
      a
        ? presentAnalysis(a, {
            length: units.length,
            mass: units.mass,
            numbers: units.number,
            names: new Map((fixtures.data?.fixtures ?? []).map((f) => [f.id, f.label])),
            delaySetByHand: delay !== null,
          })
        : null,
    [a, units.length, units.mass, units.number, fixtures.data, delay],
  );
  const overlayFixtures = useMemo(
    () =>
      (fixtures.data?.fixtures ?? []).map((f) => ({
        id: f.id,
        kind: f.kind,
        label: f.label,
        polygon: "polygon" in f ? f.polygon : undefined,
        point: "point" in f ? f.point : undefined,
      })),
    [fixtures.data],
  );
  const sweepFindings = (findings.data ?? []).filter((f) => f.sweepId === sweepId);
  const findingRanks = new Set(
    // a finding from this sweep inside the spot's search radius already answers it
    (a?.candidates ?? [])
      .filter((c) =>
        sweepFindings.some((f) => f.x !== null && f.y !== null && Math.hypot(f.x - c.x, f.y - c.y) <= c.radius),
      )
      .map((c) => c.rank),
  );
  const today = new Intl.DateTimeFormat("sv-SE", { timeZone }).format(new Date());

  if (sweep.isError) return <QueryError error={sweep.error} what="the sweep" onRetry={() => void sweep.refetch()} />;
  if (!sweep.data || !plans.data) return <Spinner label="Loading the sweep…" />;
  const s = sweep.data;
  const widthM = plan?.widthM ?? 1;
  const heightM = plan?.heightM ?? 1;

  return (
    <>
      <PageHeader
        title={`Field map — ${store?.name ?? "store"}`}
        description={`${zoned(s.startedAt)} · ${s.technicianName} · ${s.detectorName} · fans ${s.fans}${s.defrost ? ", defrost" : ""} · ${countOf(s.readingCount, "reading")} · ${s.status.replace("-", " ")}`}
        actions={
          <>
            <Link
              className="inline-flex min-h-11 items-center rounded-md edge bg-surface px-4 font-bold no-underline"
              to={`/stores/${storeId}/compare?b=${sweepId}`}
            >
              Compare with the month before
            </Link>
            <Link
              className="inline-flex min-h-11 items-center rounded-md edge bg-surface px-4 font-bold no-underline"
              to={`/stores/${storeId}/sweeps`}
            >
              All sweeps
            </Link>
            {can(membership.role, "sweeps.review") && s.status === "submitted" ? (
              <Button busy={review.isPending} onClick={() => review.mutate()}>
                Mark reviewed
              </Button>
            ) : null}
          </>
        }
      />
      {review.isError ? <Alert tone="error">{review.error.message}</Alert> : null}
      {s.status === "reviewed" && s.reviewedAt ? (
        <p className="mb-3 text-sm text-ok">Reviewed {zoned(s.reviewedAt)}.</p>
      ) : null}
      {analysis.isError ? (
        <QueryError error={analysis.error} what="the analysis" onRetry={() => void analysis.refetch()} />
      ) : null}
      {a?.stale ? (
        <div className="mb-3">
          <Alert tone="note" title="Readings changed since this map was made">
            Recomputing on the server… the map updates by itself when the new one is ready.
          </Alert>
        </div>
      ) : null}
      <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,3fr)_minmax(20rem,1.2fr)]">
        <div className="space-y-4">
          <div ref={wrapRef} className="relative" aria-busy={recomputing}>
            {a ? (
              <FieldCanvas
                label={`Field map with ${a.candidates.length} numbered suspect spots`}
                widthM={widthM}
                heightM={heightM}
                planImageUrl={plan?.image?.displayUrl ?? null}
                field={a.field}
                paint={paint}
                layers={layers}
                fixtures={overlayFixtures}
                readings={withPasses(a.readings, stored.data, sweep.data?.passes ?? [])}
                spots={a.candidates}
                selected={selected}
                width={width}
                onSelect={setSelected}
              />
            ) : analysis.isPending ? (
              <Spinner label="Computing the field map on the server…" />
            ) : null}
            <div className="absolute right-2 top-2">
              <AnalysisProgress working={recomputing} computedAt={a ? zoned(a.computedAt) : null} />
            </div>
          </div>
          <RampLegend
            numberFormat={units.number}
            title={`Lag-corrected concentration, ${log ? "log" : "linear"} scale`}
            lut={paint.lut}
            position={scale.position}
            ticks={scale.ticks()}
          />
          <LayerToggles layers={layers} onChange={setLayers} log={log} onLog={setLog} />
          {sweep.data ? (
            <PassKey sweep={sweep.data} name={(id) => label(id) ?? "a fixture"} time={(iso) => zoned(iso)} />
          ) : null}
          {can(membership.role, "analyses.tune") ? (
            <DelayControl
              detectorDelayS={s.transportDelayS}
              current={delay ?? s.transportDelayS}
              busy={recomputing}
              onApply={(v) => {
                const next = new URLSearchParams(search);
                if (v === null) next.delete("transportDelayS");
                else next.set("transportDelayS", String(v));
                setSearch(next, { replace: true });
              }}
            />
          ) : null}
          {a ? (
            <p className="text-sm text-muted">
              Background {formatGrouped(a.background.ppm, units.number, 1)} ppm · transport delay{" "}
              {formatShort(a.params.transportDelayS, units.number)} s, time constant{" "}
              {formatShort(a.params.timeConstantS, units.number)} s · computed {zoned(a.computedAt)} in {a.durationMs}{" "}
              ms
            </p>
          ) : null}
        </div>
        <aside className="space-y-5">
          <section>
            <h2 className="mb-2 text-xl font-bold">Suspect spots</h2>
            {a ? (
              <SuspectList
                spots={a.candidates}
                words={words!.spots}
                noSpot={words!.noSpot ?? ""}
                selected={selected}
                onSelect={setSelected}
                findingRanks={findingRanks}
                numberFormat={units.number}
                busyRank={makeFinding.isPending ? (makeFinding.variables?.spot.rank ?? null) : null}
                onMakeFinding={
                  can(membership.role, "findings.record")
                    ? (spot, spotWords) =>
                        makeFinding.mutate({
                          spot,
                          words: spotWords,
                          fixtureIsAirVolume: AIR.has(
                            fixtures.data?.fixtures.find((f) => f.id === spot.fixtureId)?.kind ?? "",
                          ),
                        })
                    : undefined
                }
              />
            ) : null}
            {makeFinding.isError ? <Alert tone="error">{makeFinding.error.message}</Alert> : null}
          </section>
          {words ? (
            <DelayCheckPanel
              words={words.delay}
              sweepDelayS={s.transportDelayS}
              canUpdate={can(membership.role, "detectors.manage")}
              onUpdate={(v) => updateDelay.mutate({ detectorId: s.detectorId, transportDelayS: v })}
              busy={updateDelay.isPending}
              updatedTo={updateDelay.isSuccess ? updateDelay.variables.transportDelayS : null}
              error={updateDelay.isError ? updateDelay.error.message : null}
              numberFormat={units.number}
            />
          ) : null}
          <section>
            <h2 className="mb-2 text-xl font-bold">Diagnostics</h2>
            {a && a.diagnostics.length === 0 ? <p className="text-sm">Nothing unusual about this sweep.</p> : null}
            <ul className="space-y-2">
              {words?.diagnostics.map((d, i) => (
                <li key={i}>
                  <Alert tone={d.kind.startsWith("detector") ? "error" : "note"}>{d.text}</Alert>
                </li>
              ))}
            </ul>
          </section>
          <section>
            <h2 className="mb-2 text-xl font-bold">Findings</h2>
            <FindingsPanel
              findings={sweepFindings}
              canRecord={can(membership.role, "findings.record")}
              today={today}
              label={label}
            />
          </section>
          <section>
            <h2 className="mb-2 text-xl font-bold">Report</h2>
            <ReportPanel sweepId={sweepId} canSend={can(membership.role, "reports.send")} zoned={zoned} />
          </section>
        </aside>
      </div>
    </>
  );
}
