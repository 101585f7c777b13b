import { useMemo, useRef, useState, type ReactNode } from "react";
import type { RefrigerantSummary } from "#core/contracts/systems";
import { useNavigate } from "react-router";
import type { CautionPlace, CautionRules } from "#core/domain/safety/cautions";
import { FIXTURE_KIND_NAMES } from "#core/contracts/fixture-kinds";
import { Alert } from "../../../components/ui/alert";
import type { LengthPreference } from "#core/domain/units/format-units";
import type { NumberFormat } from "#core/domain/numbers/number-format";
import { Spinner } from "../../../components/ui/spinner";
import { countOf } from "../../../lib/format";
import { usePlanPack, useStorePack } from "../api/store-pack";
import { useHighContrast } from "../hooks/use-high-contrast";
import { useSyncStatus } from "../hooks/use-sync-status";
import { useQueuedFindings } from "../hooks/use-queued-findings";
import { useOpenReading } from "../hooks/use-open-reading";
import { useWalk } from "../hooks/use-walk";
import { useLiveGuide } from "../hooks/use-live-guide";
import { fixtureAt, unsampledFixtures } from "../model/coverage";
import { peakLagHint } from "../model/lag-hint";
import type { LocalReading } from "../model/local-types";
import { enteredRoom, roomSystemIds } from "../model/room-entry";
import { walkModelFor } from "../model/walk-model";
import { submitQueued, sweepStateText } from "../model/sweep-sync";
import { editedReading, walkStep, type WalkEvent, type WalkMode } from "../model/walk-mode";
import { CautionDialog } from "./caution-dialog";
import { LagHintBanner } from "./lag-hint-banner";
import { LeakForm } from "./leak-form";
import { LiveGuidePanel } from "./live-guide-panel";
import { LiveMarks } from "./live-marks";
import { liveWordsContext } from "../model/live-words";
import { settledSuspect } from "../model/live-state";
import { supplyCheckOf } from "../model/supply-check";
import { supplyAirNote } from "#core/domain/locator-words/live-guide-words";
import { LogImport } from "./log-import";
import { PinpointPassPanel } from "./pinpoint-pass-panel";
import { PlanStage } from "./plan-stage";
import { PpmKeypad, type KeypadValue } from "./ppm-keypad";
import { ReadingsDrawer } from "./readings-drawer";
import { SubmitSummary } from "./submit-summary";
import { SweepWarnings } from "./sweep-warnings";
import { SyncBanner } from "./sync-banner";
import { NoticeStrip } from "./notice-strip";
import { DoneNotice, RefusedSweepNotice } from "./walk-notices";
import { WalkTools } from "./walk-tools";

const SUBMITTED_NOTICE = "Sweep submitted on this device. It goes to the server as soon as every reading is uploaded.";

/** The sweep capture screen: the plan fills the screen; one tap drops a reading there. */
export function WalkScreen({
  storeId,
  sweepId,
  contrastToggle,
  leaveTo,
  lengthUnit = "m",
  numberFormat = "1,234.5",
  cautionRules = "us",
}: {
  storeId: string;
  sweepId: string;
  contrastToggle: ReactNode;
  leaveTo: string;
  lengthUnit?: LengthPreference;
  numberFormat?: NumberFormat;
  /** Whose rules the room cautions name (the company's profile, from the session kept offline). */
  cautionRules?: CautionRules;
}) {
  const walk = useWalk(sweepId);
  const storePack = useStorePack(storeId);
  const planPack = usePlanPack(walk.sweep?.planId);
  const sync = useSyncStatus();
  const queuedFindings = useQueuedFindings(sweepId);
  const { draftId, draftRef, setDraftId, typed, readingsRef, serial, commitOpen, keepTyped, undo } =
    useOpenReading(walk);
  const highContrast = useHighContrast();
  // One mode (model/walk-mode.ts): what a tap means, the edit keypad, the leak form.
  const [mode, setMode] = useState<WalkMode<LocalReading>>({ kind: "walking" });
  const modeRef = useRef(mode);
  const send = (event: WalkEvent<LocalReading>) => {
    const step = walkStep(modeRef.current, event, walk.sweep?.status === "reviewed");
    modeRef.current = step.mode;
    setMode(step.mode);
    return step.effect;
  };
  const editing = editedReading(mode);
  const [caution, setCaution] = useState<{
    place: CautionPlace;
    name: string;
    refrigerants: RefrigerantSummary[];
  } | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [dialog, setDialog] = useState<"list" | "summary" | "import" | null>(null);
  const [dismissedAlarm, setDismissedAlarm] = useState(-1);
  const navigate = useNavigate();

  const fixtures = planPack.data?.fixtures ?? [];
  // Every reading counts from its tap, the open one included: the count, coverage, the list and the
  // submit summary see it. The lag hint and quick picks wait for its value to be committed.
  const all = walk.readings;
  // Kept identical while only the open reading changes (typing), so the lag hint is not redone per key.
  const committedRef = useRef<LocalReading[]>([]);
  const committed = useMemo(() => {
    const next = walk.readings.filter((r) => r.sync.kind !== "draft");
    const prev = committedRef.current;
    if (prev.length === next.length && next.every((r, i) => r === prev[i])) return prev;
    committedRef.current = next;
    return next;
  }, [walk.readings]);
  // Where readings were taken, kept identical while only values change (typing on the keypad).
  const positionsRef = useRef<{ x: number; y: number }[]>([]);
  const positions = useMemo(() => {
    const prev = positionsRef.current;
    if (prev.length === all.length && all.every((r, i) => r.x === prev[i].x && r.y === prev[i].y)) return prev;
    positionsRef.current = all.map((r) => ({ x: r.x, y: r.y }));
    return positionsRef.current;
  }, [all]);
  const unsampled = useMemo(() => unsampledFixtures(fixtures, positions), [fixtures, positions]);
  // Keyed by content, so the fixtures layer (and the plan image under it) redraws only when
  // coverage really changes, not on every tap.
  const unsampledKey = unsampled.map((f) => f.id).join(",");
  const unsampledIds = useMemo(() => new Set(unsampledKey ? unsampledKey.split(",") : []), [unsampledKey]);
  const sweep = walk.sweep;
  // The locator's route between taps (around solid bodies) and pace, built once per plan.
  const planDims = planPack.data?.plan;
  const walkModel = useMemo(() => {
    try {
      return walkModelFor({ widthM: planDims?.widthM ?? null, heightM: planDims?.heightM ?? null }, fixtures);
    } catch {
      return {}; // a plan the locator cannot read yet: straight lines between taps
    }
    // fixtures come with the plan pack
  }, [planPack.data]);
  const hint = useMemo(
    () =>
      sweep ? peakLagHint(committed, sweep.transportDelayS, sweep.timeConstantS, sweep.alarmPpm, walkModel) : null,
    [committed, sweep, walkModel],
  );
  const live = useLiveGuide({ sweep: sweep ?? null, plan: planDims ?? null, fixtures, readings: committed });
  const liveWords = useMemo(
    () => liveWordsContext(fixtures, lengthUnit, numberFormat, sweep?.timeConstantS ?? 0),
    [fixtures, lengthUnit, numberFormat, sweep?.timeConstantS],
  );
  // The live guide starts folded to one line over the plan's bottom edge: the plan stays the screen.
  const [guideOpen, setGuideOpen] = useState(false);
  // The banners start folded to one line too.
  const [noticesOpen, setNoticesOpen] = useState(false);
  const settled = useMemo(() => settledSuspect(live), [live]);
  const supply = useMemo(() => supplyCheckOf(settled, committed), [settled, committed]);
  const recent = useMemo(() => {
    const out: number[] = [];
    for (let i = committed.length - 1; i >= 0 && out.length < 4; i--)
      if (committed[i].ppm > 0 && !out.includes(committed[i].ppm)) out.push(committed[i].ppm);
    return out;
  }, [committed]);

  if (walk.loading || planPack.isPending) return <Spinner label="Opening the sweep…" />;
  if (walk.error || !sweep)
    return (
      <Alert tone="error" title="This sweep could not be opened">
        {walk.error ?? "It is not on this device, and the server could not be reached."}
      </Alert>
    );
  if (planPack.isError || !planPack.data)
    return (
      <Alert tone="error" title="The plan is not on this device">
        Open the store once while online so its plan is kept on this device.
      </Alert>
    );
  const plan = planPack.data.plan;
  const draft = walk.readings.find((r) => r.id === draftId) ?? null;
  const readOnly = sweep.status === "reviewed";

  const onTap = serial(async (x: number, y: number, at: number, preset?: { samplePoint: "supply"; note: string }) => {
    const effect = send({ type: "tap", x, y, fixtureId: fixtureAt(fixtures, x, y)?.id ?? null });
    if (effect.kind === "move-reading") {
      const moved = await walk.move(effect.readingId, x, y);
      if (moved) send({ type: "moved", reading: moved });
      return;
    }
    if (effect.kind !== "take-reading") return;
    // the keypad takes the room: the banners fold to their line
    setNoticesOpen(false);
    const open = draftRef.current;
    const before = readingsRef.current.filter((r) => r.sync.kind !== "draft" || r.id === open);
    const previous = before.length ? before[before.length - 1] : null;
    const room = enteredRoom(fixtures, previous, { x, y });
    if (room) {
      // The room's systems (from the store pack kept on the device) decide which cautions apply.
      const ids = roomSystemIds(fixtures, room.fixture);
      const refrigerants = (storePack.data?.systems ?? []).filter((x) => ids.includes(x.id)).map((x) => x.refrigerant);
      setCaution({
        place: room.place,
        name: room.fixture.label || FIXTURE_KIND_NAMES[room.fixture.kind],
        refrigerants,
      });
    }
    const v = typed.current;
    typed.current = null;
    // The next tap saves what the keypad shows and takes its place, without closing it.
    const r = open
      ? await walk.saveAndTap(
          open,
          v ? { ppm: v.ppm, atLeast: v.atLeast, samplePoint: v.samplePoint, note: v.note } : {},
          x,
          y,
          at,
          preset,
        )
      : await walk.tap(x, y, at, preset);
    setDraftId(r.id);
  });

  const saveKeypad = serial(async (v: KeypadValue) => {
    if (editing) {
      await walk.save(editing.id, v);
      send({ type: "done" });
      return;
    }
    const id = draftRef.current;
    if (!id) return;
    setDraftId(null);
    await walk.save(id, v);
  });

  const submit = serial(async () => {
    setDialog(null);
    await commitOpen();
    await walk.submit();
    setNotice(SUBMITTED_NOTICE);
  });

  const leave = serial(async () => {
    await commitOpen();
    navigate(leaveTo);
  });

  const keypadFor = draft ?? editing;
  const showHint = hint && hint.index !== dismissedAlarm ? hint : null;
  const peak = showHint ? committed[showHint.index] : undefined;
  // Where the peak's air was sampled (the lag-corrected point), else where it was tapped.
  const peakFixture = showHint
    ? (fixtureAt(fixtures, showHint.x, showHint.y) ?? (peak ? fixtureAt(fixtures, peak.x, peak.y) : null))
    : null;
  const peakPlace = peakFixture ? peakFixture.label || FIXTURE_KIND_NAMES[peakFixture.kind] : null;

  return (
    <div className="fixed inset-0 z-30 flex flex-col bg-paper" data-testid="walk-screen">
      <header className="flex flex-col gap-1 bg-surface px-2 py-1 edge border-x-0 border-t-0">
        <div className="flex items-center justify-between gap-2">
          <button
            type="button"
            onClick={() => leave()}
            className="inline-flex min-h-12 shrink-0 items-center whitespace-nowrap rounded-md px-3 font-bold edge"
          >
            ← Leave
          </button>
          <p className="min-w-0 flex-1 text-center leading-tight">
            <span className="block truncate font-bold">{storePack.data?.store.name ?? "Sweep"}</span>
            <span className="block truncate text-sm text-muted" data-testid="walk-count">
              {[countOf(all.length, "reading"), sweepStateText(sweep.status, sweep.sync), sweep.detectorName]
                .filter(Boolean)
                .join(" · ")}
            </span>
          </p>
          {contrastToggle}
        </div>
        {/* Every banner folds into one line that a tap opens: the plan keeps the phone (decision 0140). */}
        {/* The banners and the guide open one at a time: the two together would cover the plan. */}
        <NoticeStrip
          open={noticesOpen && !keypadFor}
          onOpen={(open) => {
            setNoticesOpen(open);
            if (open) setGuideOpen(false);
          }}
        >
          <PinpointPassPanel
            sweep={sweep}
            fixtures={fixtures}
            committed={committed}
            systems={storePack.data?.systems ?? []}
            readOnly={readOnly}
            reload={walk.reload}
            settled={settled}
            // the pass is walked on the plan: the guide folds to its line (the dialog showed the cautions in
            // full; the pass's line keeps them one tap away)
            onPassStarted={() => setGuideOpen(false)}
          />
          {showHint ? (
            <LagHintBanner
              hint={showHint}
              ppm={peak?.ppm ?? 0}
              atLeast={peak?.atLeast ?? false}
              readingNumber={peak ? all.indexOf(peak) + 1 : 0}
              place={peakPlace}
              lengthUnit={lengthUnit}
              compact={keypadFor !== null}
              onDismiss={() => setDismissedAlarm(showHint.index)}
            />
          ) : null}
          <RefusedSweepNotice sync={sweep.sync} />
          <DoneNotice
            text={
              notice === SUBMITTED_NOTICE && sweep.status !== "in-progress"
                ? "Sweep submitted: the server has it."
                : notice
            }
            onDismiss={() => setNotice(null)}
          />
          <SweepWarnings warnings={sweep.warnings}>
            <SyncBanner status={sync} onShowRejected={() => setDialog("list")} />
          </SweepWarnings>
        </NoticeStrip>
        {mode.kind === "placing-leak" ? <Alert tone="info">Tap the plan where the leak is.</Alert> : null}
        {mode.kind === "moving" ? (
          <div
            role="status"
            className="flex items-center justify-between gap-2 rounded-md border-l-4 border-accent bg-accent-soft px-3 edge"
          >
            <span className="font-bold">
              Tap the plan where reading #{all.findIndex((r) => r.id === mode.readingId) + 1} was taken.
            </span>
            <button
              type="button"
              className="min-h-12 shrink-0 font-bold underline"
              onClick={() => send({ type: "cancel" })}
            >
              Cancel move
            </button>
          </div>
        ) : null}
      </header>
      <div className="flex min-h-0 flex-1 flex-col landscape:md:flex-row">
        <div className="relative min-h-0 min-w-0 flex-1">
          <PlanStage
            widthM={plan.widthM ?? 1}
            heightM={plan.heightM ?? 1}
            image={planPack.data.image}
            fixtures={fixtures}
            unsampled={unsampledIds}
            readings={walk.readings}
            alarmPpm={sweep.alarmPpm}
            lagHint={showHint}
            selectedId={keypadFor?.id ?? null}
            focus={keypadFor ? { x: keypadFor.x, y: keypadFor.y } : null}
            highContrast={highContrast}
            onTap={(x, y, at) => onTap(x, y, at)}
            overlay={(zoom) => (
              <LiveMarks
                suspects={live.estimate?.kind === "suspects" ? live.estimate.suspects : []}
                lead={live.estimate?.kind === "no-spot" ? (live.estimate.lead ?? null) : null}
                probes={live.probes}
                zoom={zoom}
                highContrast={highContrast}
              />
            )}
          />
          {keypadFor || readOnly ? null : (
            <LiveGuidePanel
              state={live}
              words={liveWords}
              from={committed.length ? committed[committed.length - 1] : null}
              onProbe={(p) => onTap(p.x, p.y, Date.now())}
              supply={supply}
              onSupplyCheck={(s) =>
                onTap(s.x, s.y, Date.now(), { samplePoint: "supply", note: supplyAirNote(s, liveWords) })
              }
              folded={!guideOpen}
              onFold={(folded) => {
                setGuideOpen(!folded);
                if (!folded) setNoticesOpen(false);
              }}
              fieldMapHref={
                sweep.status === "submitted" && sweep.sync.kind === "on-server"
                  ? `/stores/${sweep.storeId}/sweeps/${sweep.id}/map`
                  : null
              }
            />
          )}
        </div>
        {keypadFor ? (
          <div className="landscape:md:w-96 landscape:md:overflow-y-auto">
            <PpmKeypad
              key={keypadFor.id}
              title={
                editing ? `Edit #${walk.readings.indexOf(keypadFor) + 1}` : `#${walk.readings.indexOf(keypadFor) + 1}`
              }
              initial={{
                ppm: keypadFor.ppm,
                atLeast: keypadFor.atLeast,
                samplePoint: keypadFor.samplePoint,
                note: keypadFor.note,
              }}
              recent={recent}
              levels={storePack.data?.detectors.find((d) => d.id === sweep.detectorId)?.levelScale ?? null}
              onTyped={(v) => (editing ? undefined : keepTyped(keypadFor.id, v))}
              onMove={() => send({ type: "move", readingId: keypadFor.id })}
              numberFormat={numberFormat}
              onSave={(v) => saveKeypad(v)}
              cancelLabel={editing ? "Cancel" : "Discard"}
              onCancel={() => (editing ? send({ type: "cancel" }) : undo())}
            />
          </div>
        ) : null}
      </div>
      <WalkTools
        readOnly={readOnly}
        canUndo={all.length > 0}
        canSubmit={sweep.status === "in-progress" && !submitQueued(sweep.sync)}
        leakMode={mode.kind === "placing-leak"}
        onUndo={() => undo()}
        onList={() => setDialog("list")}
        onLeak={() => send({ type: "toggle-leak" })}
        onImport={() => setDialog("import")}
        onSubmit={() => setDialog("summary")}
      />
      <CautionDialog
        place={caution?.place ?? null}
        name={caution?.name ?? ""}
        refrigerants={caution?.refrigerants ?? []}
        rules={cautionRules}
        onClose={() => setCaution(null)}
      />
      <ReadingsDrawer
        open={dialog === "list"}
        readings={all}
        openId={draftId}
        findings={queuedFindings.list}
        onDiscardFinding={(id) => void queuedFindings.discard(id)}
        timeZone={storePack.data?.store.timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone}
        onEdit={(r) => {
          setDialog(null);
          if (r.id !== draftRef.current) send({ type: "edit", reading: r });
        }}
        onMove={(r) => {
          setDialog(null);
          send({ type: "move", readingId: r.id });
        }}
        onDelete={(r) => (r.id === draftRef.current ? undo() : void walk.remove(r.id))}
        onClose={() => setDialog(null)}
      />
      {dialog === "summary" ? (
        <SubmitSummary
          open
          readings={all.map((r) => (r.id === draftId && typed.current ? { ...r, ...typed.current } : r))}
          alarmPpm={sweep.alarmPpm}
          unsampled={unsampled}
          waiting={sync.waiting}
          onClose={() => setDialog(null)}
          onSubmit={() => submit()}
        />
      ) : null}
      {dialog === "import" ? (
        <LogImport
          open
          taps={committed.map((r) => ({
            x: r.x,
            y: r.y,
            takenAtMs: Date.parse(r.takenAt),
            samplePoint: r.samplePoint,
          }))}
          sweepStartMs={Date.parse(sweep.startedAt)}
          onClose={() => setDialog(null)}
          onImport={(list) => {
            setDialog(null);
            void walk.addMany(list);
            setNotice(`${countOf(list.length, "reading")} added from the detector's log.`);
          }}
        />
      ) : null}
      {mode.kind === "describing-leak" ? (
        <LeakForm
          spot={mode.spot}
          storeId={storeId}
          planId={plan.id}
          sweepId={sweep.id}
          fixtures={fixtures}
          inServiceSystemIds={new Set((storePack.data?.systems ?? []).map((x) => x.id))}
          lengthUnit={lengthUnit}
          onClose={() => send({ type: "cancel" })}
          onSaved={() => {
            send({ type: "done" });
            setNotice("Finding saved. It is kept on this device and uploads with the readings.");
          }}
        />
      ) : null}
    </div>
  );
}
