import { addDays, addMonths, daysBetween, formatIsoDate, type IsoDate } from "../dates/calendar-date";
import { localDateOf } from "../dates/time-zone";
import type { LeakRatePart, RuleProfile } from "./rule-profile";
import { DomainInputError } from "../input-error";

/** Repair due: the date the breach was learned (the addition's date) plus the part's repair days. */
export function repairDueDate(part: LeakRatePart, learnedOn: IsoDate): IsoDate {
  return addDays(learnedOn, part.repairDays.value, "learnedOn");
}

/**
 * Initial verification test due: the repair's date (store calendar) plus the part's days; the US
 * rule is "as soon as practicable after the repair is completed" [S:R8], i.e. the repair day.
 */
export function initialVerificationDueDate(part: LeakRatePart, repairedOn: IsoDate): IsoDate {
  return addDays(repairedOn, part.initialVerificationDays.value, "repairedOn");
}

/** Follow-up verification due: the initial verification test's date plus the part's days. */
export function followUpVerificationDueDate(part: LeakRatePart, initialTestOn: IsoDate): IsoDate {
  return addDays(initialTestOn, part.followUpVerificationDays.value, "initialTestOn");
}

/** Chronic-leaker report due for a calendar year: the profile's month/day of the next year (1 March). */
export function chronicReportDueDate(part: LeakRatePart, year: number): IsoDate {
  const { month, day } = part.chronicLeaker.reportBy.value;
  return formatIsoDate({ year: year + 1, month, day });
}

/** EU: re-check after a repair within the profile's months (1 month [S:E6]). */
export function recheckAfterRepairDueDate(profile: RuleProfile, repairedOn: IsoDate): IsoDate {
  if (!profile.leakChecks) throw new DomainInputError("profile", `${profile.name} sets no re-check after repair`);
  return addMonths(repairedOn, profile.leakChecks.recheckAfterRepairMonths.value, "repairedOn");
}

/** The last day records of an event must still be kept: the event date plus the retention years. */
export function keepRecordsUntil(profile: RuleProfile, eventOn: IsoDate): IsoDate {
  return addMonths(eventOn, profile.recordRetentionYears.value * 12, "eventOn");
}

export interface DueStatus {
  /** Days from the store's today to the due date: 0 due today, negative overdue. */
  daysLeft: number;
  state: "overdue" | "due-today" | "due-soon" | "upcoming";
}

/**
 * How a due date stands at an instant, judged on the store's calendar: a repair due on 31 March
 * in Los Angeles is still "due today" at 06:00 UTC on 1 April. "Due soon" is within `soonDays`.
 */
export function dueStatus(dueOn: IsoDate, now: Date, timeZone: string, soonDays = 7): DueStatus {
  const today = localDateOf(now, timeZone);
  const daysLeft = daysBetween(today, dueOn);
  const state =
    daysLeft < 0 ? "overdue" : daysLeft === 0 ? "due-today" : daysLeft <= soonDays ? "due-soon" : "upcoming";
  return { daysLeft, state };
}
