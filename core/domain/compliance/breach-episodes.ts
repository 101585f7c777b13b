import { compareDates, type IsoDate } from "../dates/calendar-date";
import type { AssessedPoint } from "./assess-leak-rate";
import { repairDueDate } from "./deadlines";
import type { RuleProfile } from "./rule-profile";

/** A run of exceedances from the first one until a repair on or after it. */
export interface BreachEpisode {
  /** The first exceedance: its group's first addition starts the repair clock. */
  first: AssessedPoint;
  /** Every exceedance of the episode, oldest first (later ones never move the deadline). */
  exceedances: AssessedPoint[];
  partId: string;
  /** The first exceedance's clock start + the part's repair days (82.157 / 84.106: 30 days [S:R4]). */
  repairDue: IsoDate;
  /** The repair that closed the episode; null while it is open. */
  repairedOn: IsoDate | null;
}

/**
 * Breach episodes (docs/decisions/0041-repair-clock.md): an episode opens at an exceedance, and is
 * closed by the first repair recorded on or after the day that exceedance was learned. A later
 * exceedance learned on or before that repair belongs to the same episode and never extends its
 * 30 days, which run from the first exceedance.
 */
export function breachEpisodes(
  profile: RuleProfile,
  points: readonly AssessedPoint[],
  repairedOn: readonly IsoDate[],
): BreachEpisode[] {
  const repairs = [...repairedOn].sort(compareDates);
  const exceedances = points
    .filter((p) => p.exceeds && p.partId)
    .sort((x, y) => compareDates(x.date, y.date) || compareDates(x.clockFrom, y.clockFrom));
  const episodes: BreachEpisode[] = [];
  for (const p of exceedances) {
    const open = episodes.at(-1);
    if (open && (open.repairedOn === null || compareDates(p.date, open.repairedOn) <= 0)) {
      open.exceedances.push(p);
      continue;
    }
    const part = profile.leakRateParts.find((x) => x.id === p.partId);
    if (!part) continue;
    episodes.push({
      first: p,
      exceedances: [p],
      partId: part.id,
      repairDue: repairDueDate(part, p.clockFrom),
      repairedOn: repairs.find((r) => compareDates(r, p.date) >= 0) ?? null,
    });
  }
  return episodes;
}
