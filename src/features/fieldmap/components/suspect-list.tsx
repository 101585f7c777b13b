import { formatLength, type LengthPreference } from "#core/domain/units/format-units";
import { Button } from "../../../components/ui/button";
import type { SuspectSpot } from "#core/contracts/analysis";

export interface SuspectListProps {
  spots: SuspectSpot[];
  fixtureLabel(id: string | null): string | null;
  unit: LengthPreference;
  selected: number | null;
  onSelect(rank: number | null): void;
  /** Present when the reader may record findings. */
  onMakeFinding?: (spot: SuspectSpot) => void;
  /** Ranks that already have a finding from this sweep. */
  findingRanks: Set<number>;
  busyRank: number | null;
}

export function SuspectList(p: SuspectListProps) {
  if (p.spots.length === 0) {
    return (
      <p className="rounded-md edge bg-surface p-4">
        No credible leak: nothing stands out from the background on this sweep.
      </p>
    );
  }
  const len = (m: number) => formatLength(m, p.unit, { decimals: 1 });
  return (
    <ol className="space-y-3" aria-label="Suspect spots">
      {p.spots.map((s) => (
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
              {p.fixtureLabel(s.fixtureId) ?? "Open floor"}
            </p>
            <span className="text-sm text-muted" title="For ordering only, 0 to 1">
              score {s.score.toFixed(2)}
            </span>
          </div>
          <p className="mt-1 text-sm">{s.reason}</p>
          <p className="mt-1 text-sm">
            <span className="font-bold">Next check:</span> {s.nextCheck}
          </p>
          <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-sm text-muted">
            <dt>Where</dt>
            <dd>
              {len(s.x)} across, {len(s.y)} down, within {len(s.radius)}
            </dd>
            <dt>Nearest risk point</dt>
            <dd>{p.fixtureLabel(s.riskPointId) ?? "none near"}</dd>
            <dt>Strength</dt>
            <dd>
              {s.strength.toFixed(2)} of the strongest
              {Number.isFinite(s.strengthGPerYear)
                ? `, about ${Math.round(s.strengthGPerYear)} g/yr if well mixed`
                : ""}
            </dd>
          </dl>
          <div className="mt-2 flex flex-wrap gap-2">
            <Button variant="secondary" onClick={() => p.onSelect(p.selected === s.rank ? null : s.rank)}>
              {p.selected === s.rank ? "Show whole plan" : `Zoom to spot ${s.rank}`}
            </Button>
            {p.onMakeFinding ? (
              p.findingRanks.has(s.rank) ? (
                <span className="self-center text-sm text-ok">Finding recorded</span>
              ) : (
                <Button busy={p.busyRank === s.rank} onClick={() => p.onMakeFinding!(s)}>
                  Make a finding
                </Button>
              )
            ) : null}
          </div>
        </li>
      ))}
    </ol>
  );
}
