import type { SuspectSpot } from "#core/contracts/analysis";
import type { PresentedSpot } from "#core/domain/locator-words/present-analysis";
import { formatGrouped, type NumberFormat } from "#core/domain/numbers/number-format";
import { Button } from "../../../components/ui/button";

export interface SuspectListProps {
  spots: SuspectSpot[];
  /** The same spots in words (core/domain/locator-words/present-analysis.ts), in the reader's units. */
  words: PresentedSpot[];
  /** What to say when no spot is listed. */
  noSpot: string;
  selected: number | null;
  onSelect(rank: number | null): void;
  /** Present when the reader may record findings. */
  onMakeFinding?: (spot: SuspectSpot, words: PresentedSpot) => void;
  /** Ranks that already have a finding from this sweep. */
  findingRanks: Set<number>;
  busyRank: number | null;
  /** The company's number format. */
  numberFormat: NumberFormat;
}

export function SuspectList(p: SuspectListProps) {
  if (p.spots.length === 0) return <p className="rounded-md edge bg-surface p-4">{p.noSpot}</p>;
  return (
    <ol className="space-y-3" aria-label="Suspect spots">
      {p.spots.map((s, i) => {
        const w = p.words[i];
        return (
          <li
            key={s.rank}
            className={`rounded-md edge bg-surface p-3 ${p.selected === s.rank ? "ring-2 ring-accent" : ""}`}
            data-testid="suspect-spot"
          >
            <div className="flex items-start justify-between gap-2">
              <p className="font-bold">
                <span className="mr-2 inline-flex h-7 w-7 items-center justify-center rounded-full bg-[#14143c] text-white">
                  {s.rank}
                </span>
                {w.place}
              </p>
              <span className="text-sm text-muted" title="For ordering only, 0 to 1">
                score {formatGrouped(s.score, p.numberFormat, 2)}
              </span>
            </div>
            <p className="mt-1 text-sm">{w.reason}</p>
            <p className="mt-1 text-sm">
              <span className="font-bold">Next check:</span> {w.nextCheck}
            </p>
            {w.cautions.length > 0 ? (
              <ul className="mt-1 space-y-1 text-sm text-danger" aria-label={`Cautions at spot ${s.rank}`}>
                {w.cautions.map((c) => (
                  <li key={c}>⚠ {c}</li>
                ))}
              </ul>
            ) : null}
            <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-sm text-muted">
              <dt>Where</dt>
              <dd>{w.where}</dd>
              <dt>Nearest risk point</dt>
              <dd>{w.riskPoint}</dd>
              <dt>Strength</dt>
              <dd>{w.strength}</dd>
            </dl>
            <div className="mt-2 flex flex-wrap gap-2">
              <Button variant="secondary" onClick={() => p.onSelect(p.selected === s.rank ? null : s.rank)}>
                {p.selected === s.rank ? "Show whole plan" : `Zoom to spot ${s.rank}`}
              </Button>
              {p.onMakeFinding ? (
                p.findingRanks.has(s.rank) ? (
                  <span className="self-center text-sm text-ok">Finding recorded</span>
                ) : (
                  <Button busy={p.busyRank === s.rank} onClick={() => p.onMakeFinding!(s, w)}>
                    Make a finding
                  </Button>
                )
              ) : null}
            </div>
          </li>
        );
      })}
    </ol>
  );
}
