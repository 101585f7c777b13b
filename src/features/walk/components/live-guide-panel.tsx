import { Link } from "react-router";
import type { LiveProbe, LiveSuspect } from "#core/analysis/guide/live-guide";
import { formatShort } from "#core/domain/numbers/number-format";
import { SETTLE_ESTIMATES } from "../model/live-state";
import type { SupplyCheck } from "../model/supply-check";
import type { WordsContext } from "#core/domain/locator-words/words-context";
import {
  LIVE_PROVISIONAL_WORDS,
  liveLeadWords,
  liveSuspectWords,
  probePlaceWords,
  probeReasonWords,
  supplyAirAskWords,
} from "#core/domain/locator-words/live-guide-words";
import { lengthWords } from "#core/domain/locator-words/length-words";
import type { LiveState } from "../model/live-state";

/**
 * The live estimate over the bottom of the Walk plan (over it, not beside it, so the plan never moves
 * under a finger when an answer comes): the first suspect, the next probe points in walking order
 * with why each helps (tapping one opens the keypad there, as tapping the plan does), and the label
 * that says it is provisional. Folds to one line so the plan keeps the screen.
 */
export function LiveGuidePanel({
  state,
  words,
  from,
  onProbe,
  supply,
  onSupplyCheck,
  folded,
  onFold,
  fieldMapHref = null,
}: {
  state: LiveState;
  words: WordsContext;
  /** Where the technician stands (the last reading), for "2.1 m from you". */
  from: { x: number; y: number } | null;
  onProbe(probe: LiveProbe): void;
  /** The supply-air check of the settled first suspect: asked for, or made. */
  supply: SupplyCheck;
  onSupplyCheck(suspect: LiveSuspect): void;
  /** Folded to one line (the screen keeps this, so it stays as set while the keypad comes and goes). */
  folded: boolean;
  onFold(folded: boolean): void;
  /** Once the sweep is submitted: its field map, where the full analysis (the reference) is. */
  fieldMapHref?: string | null;
}) {
  const e = state.estimate;
  if (!e || e.kind === "no-alarm") return null;
  const first = e.kind === "suspects" ? e.suspects[0] : null;
  return (
    <section
      aria-label="Live guide"
      data-testid="live-guide"
      data-suspects={e.kind === "suspects" ? e.suspects.length : 0}
      data-probes={state.probes.length}
      data-estimates={state.answered}
      className="absolute inset-x-0 bottom-0 max-h-[30vh] overflow-y-auto border-t-2 border-[#5b2d8c] bg-surface/95 px-2 py-1"
    >
      <div className="flex items-center justify-between gap-2">
        <p className="min-w-0 flex-1 leading-tight">
          <span
            className="block truncate font-bold"
            data-testid="live-first"
            data-at={first ? `${first.x} ${first.y} ${first.radius}` : undefined}
            data-lead={!first && e.kind === "no-spot" && e.lead ? `${e.lead.x} ${e.lead.y}` : undefined}
            data-fixture={first?.fixtureId ?? undefined}
          >
            {first
              ? liveSuspectWords(first, words)
              : e.kind === "no-spot" && e.lead
                ? liveLeadWords(e.lead, words)
                : "Live estimate: no spot fits the readings yet"}
          </span>
          {folded && fieldMapHref ? (
            <span className="block truncate text-sm" data-testid="live-folded">
              Submitted: see the{" "}
              <Link to={fieldMapHref} className="font-bold underline">
                field map
              </Link>
            </span>
          ) : folded ? (
            <span className="block truncate text-sm" data-testid="live-folded">
              {[
                state.probes.length ? `${state.probes.length} probe point${state.probes.length > 1 ? "s" : ""}` : null,
                supply.kind === "ask" ? "supply-air check due" : null,
                "live estimate",
              ]
                .filter(Boolean)
                .join(" · ")}
            </span>
          ) : null}
        </p>
        <button
          type="button"
          className="min-h-12 shrink-0 px-2 font-bold underline"
          aria-expanded={!folded}
          onClick={() => onFold(!folded)}
        >
          {folded ? "Show guide" : "Hide"}
        </button>
      </div>
      {folded ? null : (
        <>
          {supply.kind === "ask" ? (
            <div
              role="status"
              className="my-1 rounded-md border-l-4 border-[#5b2d8c] bg-paper px-2 py-1"
              data-testid="supply-ask"
            >
              <p className="text-sm">{supplyAirAskWords(supply.suspect, SETTLE_ESTIMATES, words)}</p>
              <button
                type="button"
                className="min-h-12 font-bold underline"
                onClick={() => onSupplyCheck(supply.suspect)}
              >
                Read the supply air here
              </button>
            </div>
          ) : null}
          {supply.kind === "read" ? (
            <p className="text-sm font-bold" data-testid="supply-read">
              Supply air read at suspect 1: {formatShort(supply.reading.ppm, words.numbers)} ppm
              {supply.reading.atLeast ? " or more" : ""}.
            </p>
          ) : null}
          {state.probes.length ? (
            <ol className="flex flex-col gap-1" aria-label="Where to probe next">
              {state.probes.map((p, i) => (
                <li key={`${p.x},${p.y},${p.kind}`}>
                  <button
                    type="button"
                    className="flex min-h-12 w-full items-center gap-2 rounded-md px-2 text-left edge active:opacity-70"
                    data-at={`${p.x} ${p.y}`}
                    onClick={() => onProbe(p)}
                  >
                    <span
                      aria-hidden="true"
                      className="flex h-7 w-7 shrink-0 items-center justify-center border-2 border-[#1d6b4f] bg-[#e8f3ee] font-bold text-[#1d6b4f]"
                    >
                      {i + 1}
                    </span>
                    <span className="min-w-0 leading-tight">
                      <span className="block font-bold">
                        Probe {i + 1}: {probePlaceWords(p, words)}
                        {sameAs(state.probes, i, words)}
                        {from
                          ? ` · ${lengthWords(Math.hypot(p.x - from.x, p.y - from.y), words.length, words.numbers)} away`
                          : ""}
                      </span>
                      <span className="block text-sm">{capitalised(probeReasonWords(p, words))}</span>
                    </span>
                  </button>
                </li>
              ))}
            </ol>
          ) : null}
          {fieldMapHref ? (
            <p className="text-sm">
              Submitted: the full analysis on the{" "}
              <Link to={fieldMapHref} className="font-bold underline">
                field map
              </Link>{" "}
              is the reference.
            </p>
          ) : (
            <p className="text-sm text-muted">{LIVE_PROVISIONAL_WORDS}</p>
          )}
        </>
      )}
    </section>
  );
}

const capitalised = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * Two probe points at the same place in words ("Dairy 4, at the front grille") read alike in the list:
 * the later one says how far it is from the first of them (the plan numbers both).
 */
function sameAs(probes: readonly LiveProbe[], i: number, words: WordsContext): string {
  const place = probePlaceWords(probes[i], words);
  const k = probes.findIndex((q) => probePlaceWords(q, words) === place);
  if (k < 0 || k >= i) return "";
  const d = Math.hypot(probes[i].x - probes[k].x, probes[i].y - probes[k].y);
  return `, ${lengthWords(d, words.length, words.numbers)} from probe ${k + 1}`;
}
