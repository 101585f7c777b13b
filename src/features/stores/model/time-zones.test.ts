import { describe, expect, it } from "vitest";
import { searchZones, zoneIds, zoneOption } from "./time-zones";

// Offsets from the IANA tz database as the runtime's Intl applies them (ICU): on 15 Jan 2026
// Chicago is on standard time (UTC−6), Berlin on CET (UTC+1), Kolkata UTC+5:30 all year.
const JAN = new Date("2026-01-15T12:00:00Z");
const options = zoneIds().map((id) => zoneOption(id, JAN));

describe("time zone picker", () => {
  it("shows a zone as its place, region and offset now", () => {
    expect(zoneOption("America/Chicago", JAN)).toMatchObject({
      place: "Chicago",
      region: "America",
      offset: "UTC−06:00",
    });
    expect(zoneOption("Asia/Kolkata", JAN).offset).toBe("UTC+05:30");
    expect(zoneOption("America/Argentina/Buenos_Aires", JAN)).toMatchObject({
      place: "Buenos Aires",
      region: "America / Argentina",
    });
  });

  it("finds a zone by the place typed with a space, any case, or accents", () => {
    expect(searchZones(options, "new york").map((o) => o.id)).toContain("America/New_York");
    expect(searchZones(options, "SAO PAULO").map((o) => o.id)).toContain("America/Sao_Paulo");
    expect(searchZones(options, "são paulo").map((o) => o.id)).toContain("America/Sao_Paulo");
  });

  it("finds zones by offset and lists places starting with the query first", () => {
    const plusOne = searchZones(options, "utc+01:00", 500).map((o) => o.id);
    expect(plusOne).toContain("Europe/Berlin");
    expect(plusOne).not.toContain("America/Chicago");
    expect(searchZones(options, "paris")[0].id).toBe("Europe/Paris");
  });
});
