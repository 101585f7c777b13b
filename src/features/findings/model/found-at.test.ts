import { expect, it } from "vitest";
import { localDateOf } from "#core/domain/dates/time-zone";
import { foundAtFor } from "./found-at";

it("sends nothing for today: the server stamps the moment", () => {
  expect(foundAtFor("2026-12-05", "2026-12-05", "America/New_York")).toBeUndefined();
});

it("an earlier day reads back as that day on the store's calendar, across daylight-saving changes", () => {
  // US daylight saving 2026 starts 8 March and ends 1 November (15 U.S.C. 260a: second Sunday in
  // March, first Sunday in November); Europe/Berlin changes 29 March (EU Directive 2000/84/EC, last Sundays).
  for (const [day, zone] of [
    ["2026-02-09", "America/New_York"],
    ["2026-03-08", "America/New_York"],
    ["2026-11-01", "America/New_York"],
    ["2026-03-29", "Europe/Berlin"],
    ["2026-06-30", "Pacific/Honolulu"],
  ] as const) {
    const at = foundAtFor(day, "2026-12-05", zone);
    expect(at, `${day} ${zone}`).toBeDefined();
    expect(localDateOf(new Date(at!), zone)).toBe(day);
  }
});

it("New York noon on 9 Feb 2026 is 17:00 UTC (EST is UTC−5)", () => {
  expect(foundAtFor("2026-02-09", "2026-12-05", "America/New_York")).toBe("2026-02-09T17:00:00.000Z");
});
