import { compareDates, type IsoDate } from "../dates/calendar-date";
import type { ChargeAddition } from "./charge-addition";

/** Additions that make one leak-rate figure: one leak's top-ups before its repair, or one day's. */
export interface AdditionGroup {
  items: ChargeAddition[];
  /** The group's first addition: the repair clock runs from here. */
  firstDate: IsoDate;
  /** The group's last addition: the day its figure is calculated. */
  lastDate: IsoDate;
}

/** A repair recorded on a finding (store calendar). */
export interface FindingRepair {
  findingId: string;
  on: IsoDate;
}

/**
 * Groups live additions for the leak-rate figures. "Multiple additions for the same leak count
 * together" (docs/reference/standards.md §1 [M]); our reading (docs/decisions/0042-same-leak-additions.md):
 * additions tied to the same finding and made before its repair (an addition on the repair day
 * still belongs to it) are one group, and additions on the same day are one group, as one visit's
 * top-up in several steps. Groups joined by either rule merge. Sorted by first date.
 */
export function groupAdditions(
  additions: readonly ChargeAddition[],
  repairs: readonly FindingRepair[] = [],
): AdditionGroup[] {
  const parent = additions.map((_, i) => i);
  const find = (i: number): number => (parent[i] === i ? i : (parent[i] = find(parent[i])));
  const join = (a: number, b: number) => {
    parent[find(a)] = find(b);
  };
  const firstByKey = new Map<string, number>();
  additions.forEach((a, i) => {
    const keys = [`day:${a.date}`];
    if (a.findingId) {
      // The leak's n-th episode: how many of its repairs came strictly before this addition.
      const before = repairs.filter((r) => r.findingId === a.findingId && compareDates(r.on, a.date) < 0).length;
      keys.push(`leak:${a.findingId}:${before}`);
    }
    for (const key of keys) {
      const seen = firstByKey.get(key);
      if (seen === undefined) firstByKey.set(key, i);
      else join(i, seen);
    }
  });
  const groups = new Map<number, ChargeAddition[]>();
  additions.forEach((a, i) => {
    const root = find(i);
    groups.set(root, [...(groups.get(root) ?? []), a]);
  });
  return [...groups.values()]
    .map((items) => {
      const dates = items.map((a) => a.date).sort(compareDates);
      return { items, firstDate: dates[0], lastDate: dates.at(-1)! };
    })
    .sort((x, y) => compareDates(x.firstDate, y.firstDate) || compareDates(x.lastDate, y.lastDate));
}

/** The latest addition before `date` that is not in `group` (the annualizing method counts days from it). */
export function lastAdditionBefore(
  additions: readonly ChargeAddition[],
  group: AdditionGroup,
  date: IsoDate,
): IsoDate | null {
  let last: IsoDate | null = null;
  for (const a of additions) {
    if (group.items.includes(a) || compareDates(a.date, date) >= 0) continue;
    if (last === null || compareDates(a.date, last) > 0) last = a.date;
  }
  return last;
}
