import { type IsoDate } from "#core/domain/dates/calendar-date";
import { startOfLocalDay } from "#core/domain/dates/time-zone";

/**
 * The instant sent for a finding found on `day` of the store's calendar. Today sends nothing (the
 * server stamps the moment it is recorded); an earlier day, typed up later from a service ticket,
 * is sent as that day's noon in the store's zone, so the day the server reads back is the one
 * typed whatever the zone's daylight-saving shift.
 */
export function foundAtFor(day: IsoDate, today: IsoDate, timeZone: string): string | undefined {
  if (day === today) return undefined;
  return new Date(startOfLocalDay(day, timeZone).getTime() + 12 * 3_600_000).toISOString();
}
