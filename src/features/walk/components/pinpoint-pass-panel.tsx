import { useMemo, useState } from "react";
import type { Fixture } from "#core/contracts/fixtures";
import type { RefrigerantSummary } from "#core/contracts/systems";
import type { LiveSuspect } from "#core/analysis/guide/live-guide";
import { FIXTURE_KIND_NAMES } from "#core/contracts/fixture-kinds";
import { usePinpointPass } from "../hooks/use-pinpoint-pass";
import type { LocalReading, LocalSweep } from "../model/local-types";
import { mixingAdvice } from "../model/mixing-advice";
import { stillAirOffer } from "../model/still-air-offer";
import { clockText, passConditionText, passNumbers } from "../model/pinpoint-pass";
import { passCautions } from "../model/pass-cautions";
import { Button } from "../../../components/ui/button";
import { Cautions } from "../../../components/ui/cautions";
import { Dialog } from "../../../components/ui/dialog";
import { StripChip, useFoldedStrip } from "./notice-strip";
import { StartPassDialog } from "./start-pass-dialog";

// The words over the whole width, the actions in a row under them: a phone's header stays short.
const BANNER = "flex flex-col gap-0 rounded-md border-l-4 px-3 pt-1 text-sm leading-snug edge";
const ACTIONS = "flex flex-wrap items-center justify-end gap-2 pt-1";

/**
 * The still-air pass on the Walk screen: the offer once the live first suspect has settled at a fixture
 * whose fans run (or, failing that, the advice when readings say the fans are mixing the gas, the
 * highest level first; docs/decisions/0139), the start dialog with its cautions, and while a pass is
 * open, its reminder to restore the fans with the cautions. On the folded strip each is one line.
 */
export function PinpointPassPanel({
  sweep,
  fixtures,
  committed,
  systems,
  readOnly,
  reload,
  settled,
  onPassStarted,
}: {
  sweep: LocalSweep;
  fixtures: readonly Fixture[];
  committed: readonly LocalReading[];
  systems: readonly { id: string; refrigerant: RefrigerantSummary }[];
  readOnly: boolean;
  reload(): Promise<void>;
  /** The live first suspect once it has settled (model/live-state.ts), else null. */
  settled?: LiveSuspect | null;
  /** A pass has just been started here (the screen makes room for the plan). */
  onPassStarted?: () => void;
}) {
  const folded = useFoldedStrip();
  const pass = usePinpointPass(sweep, reload);
  const [dismissed, setDismissed] = useState<readonly string[]>([]);
  const [starting, setStarting] = useState<Fixture | null>(null);
  const [readingCautions, setReadingCautions] = useState(false);
  const advice = useMemo(
    () => mixingAdvice(sweep, fixtures, committed, sweep.alarmPpm),
    [sweep, fixtures, committed],
  ).filter((a) => !dismissed.includes(a.fixture.id));
  const offered = stillAirOffer(sweep, fixtures, settled ?? null);
  const offer = offered && !dismissed.includes(offered.id) ? offered : null;
  const name = (f: Fixture | undefined) => (f ? f.label || FIXTURE_KIND_NAMES[f.kind] : "the whole store");

  if (readOnly || sweep.status !== "in-progress") return null;
  if (pass.open && pass.reminder) {
    const r = pass.reminder;
    const number = passNumbers(sweep).get(pass.open.id) ?? 2;
    const stilled = fixtures.find((f) => f.id === pass.open!.fixtureId);
    const title = `Pass ${number}: ${passConditionText(pass.open)} at ${name(stilled)}.`;
    const timer = r.overdue
      ? `Restore the fans now: ${clockText(r.leftMs)} past the ${pass.open.restoreAfterMin} min reminder.`
      : `Restore the fans in ${clockText(r.leftMs)}.`;
    const role = r.overdue ? "alert" : "status";
    // the cautions are one tap away on the folded line (⚠), and in full with the pass's banner
    if (folded)
      return (
        <StripChip tone={r.overdue ? "danger" : "accent"} role={role} data-testid="pass-banner">
          ⚠ {title} <span data-testid="pass-timer">{timer}</span>
        </StripChip>
      );
    return (
      <div
        role={role}
        data-testid="pass-banner"
        className={`${BANNER} pb-2 ${r.overdue ? "border-danger bg-danger-soft" : "border-accent bg-accent-soft"}`}
      >
        <span>
          <strong className="text-base">{title}</strong> <span data-testid="pass-timer">{timer}</span>
        </span>
        {/* drawn as buttons: a row of bare words in 48 px targets reads as an empty row on a phone */}
        <span className={ACTIONS}>
          <Button
            variant="secondary"
            aria-label="Cautions while the air is still"
            className="mr-auto min-h-12 px-3"
            onClick={() => setReadingCautions(true)}
          >
            ⚠ Cautions
          </Button>
          <Button
            variant="secondary"
            className="min-h-12 px-3"
            onClick={() => void pass.setMinutes(pass.open!.id, pass.open!.restoreAfterMin + 5)}
          >
            +5 min
          </Button>
          <Button className="min-h-12 px-3" onClick={() => void pass.end()}>
            Fans back on — end pass
          </Button>
        </span>
        {/* a dialog over the whole screen, not the banners' short scrolling box: read in full on a phone */}
        <Dialog
          title={`While the air is still at ${name(stilled)}`}
          open={readingCautions}
          onClose={() => setReadingCautions(false)}
        >
          <div className="text-sm" data-testid="pass-cautions">
            <Cautions items={passCautions(stilled, fixtures, systems)} title="Keep in mind" />
          </div>
          <Button className="min-h-12" onClick={() => setReadingCautions(false)}>
            Back to the pass
          </Button>
        </Dialog>
      </div>
    );
  }
  const first = advice[0];
  const dialog = starting ? (
    <StartPassDialog
      fixture={starting}
      fixtures={fixtures}
      systems={systems}
      onClose={() => setStarting(null)}
      onStart={(s) => {
        setStarting(null);
        void pass.start(s);
        onPassStarted?.();
      }}
    />
  ) : null;
  if (folded)
    return (
      <>
        {offer ? (
          <StripChip tone="note" role="status" data-testid="still-air-offer">
            Suspect 1 holds at {name(offer)}: its fans spread the gas. Still-air pass?
          </StripChip>
        ) : first ? (
          <StripChip tone="note" role="status" data-testid="mixing-advice">
            Level at about {first.levelPpm} ppm across {name(first.fixture)}: its fans are mixing the gas. Still-air
            pass?
          </StripChip>
        ) : null}
        {dialog}
      </>
    );
  return (
    <>
      {offer ? null : first ? (
        <div role="status" data-testid="mixing-advice" className={`${BANNER} border-note bg-note-soft`}>
          <span>
            <strong className="text-base">
              Level at about {first.levelPpm} ppm across {name(first.fixture)}:
            </strong>{" "}
            its fans are mixing the gas. Stop them or start a defrost, then re-check in still air.
          </span>
          <span className={ACTIONS}>
            <button
              type="button"
              className="min-h-12 px-2 font-bold underline"
              onClick={() => setStarting(first.fixture)}
            >
              Still-air pass…
            </button>
            <button
              type="button"
              className="min-h-12 px-2 underline"
              onClick={() => setDismissed((d) => [...d, first.fixture.id])}
            >
              Not now
            </button>
          </span>
        </div>
      ) : null}
      {offer ? (
        <div role="status" data-testid="still-air-offer" className={`${BANNER} border-note bg-note-soft`}>
          <span>
            <strong className="text-base">Suspect 1 holds at {name(offer)}:</strong> its fans spread the gas. Stop them
            or start a defrost and re-check in still air to pin the leak down.
          </span>
          <span className={ACTIONS}>
            <button type="button" className="min-h-12 px-2 font-bold underline" onClick={() => setStarting(offer)}>
              Still-air pass…
            </button>
            <button
              type="button"
              className="min-h-12 px-2 underline"
              onClick={() => setDismissed((d) => [...d, offer.id])}
            >
              Not now
            </button>
          </span>
        </div>
      ) : null}
      {dialog}
    </>
  );
}
