import { describe, expect, it } from "vitest";
import { getRefrigerant } from "../refrigerants/catalogue";
import { cautionsFor, isFlammableClass, roomCautions } from "./cautions";
import { readableSource } from "../compliance/citations";

const ids = (list: { id: string }[]) => list.map((c) => c.id);

describe("cautionsFor", () => {
  it("warns about flammability for A2L and A3 refrigerants", () => {
    // docs/reference/standards.md §8 [S:D2]: R-32, R-1234yf, R-454B, R-455A, R-290, R-600a are flammable (A2L/A3).
    for (const id of ["R-32", "R-1234yf", "R-454B", "R-455A", "R-290", "R-600a"]) {
      expect(ids(cautionsFor({ refrigerant: getRefrigerant(id) })), id).toContain("flammable");
    }
    for (const id of ["R-404A", "R-410A", "R-134a", "R-744"]) {
      expect(ids(cautionsFor({ refrigerant: getRefrigerant(id) })), id).not.toContain("flammable");
    }
  });
  it("adds the R-744 pressure and dry-ice caution and the ammonia one", () => {
    // docs/reference/standards.md §8 [M]: very high R-744 pressures, dry ice on venting; R-717 toxic and rises.
    const co2 = cautionsFor({ refrigerant: getRefrigerant("R-744") });
    expect(ids(co2)).toContain("high-pressure-co2");
    expect(co2.find((c) => c.id === "high-pressure-co2")!.text).toMatch(/dry ice/);
    const nh3 = cautionsFor({ refrigerant: getRefrigerant("R-717"), place: "machine-room" });
    expect(ids(nh3)).toContain("toxic-ammonia");
    // Ammonia is lighter than air (0.59, docs/reference/standards.md §4 [D]): the oxygen caution says so.
    expect(nh3.find((c) => c.id === "oxygen-displacement")!.text).toMatch(/ceiling/);
    expect(
      cautionsFor({ refrigerant: getRefrigerant("R-404A"), place: "walk-in" }).find(
        (c) => c.id === "oxygen-displacement",
      )!.text,
    ).toMatch(/this walk-in a large leak fills from the floor up/);
  });
  it("always ends with nitrogen testing, certification and the codes", () => {
    // docs/reference/standards.md §8: nitrogen [S:R7], EPA 608 [S:D3b,R9], codes disclaimer.
    const list = ids(cautionsFor({ place: "sales-floor" }));
    expect(list).toEqual(["pressure-test-nitrogen", "certified-technicians", "codes-govern"]);
    expect(cautionsFor().at(-1)!.text).toMatch(/ASHRAE 15, IMC chapter 11, EN 378, ISO 5149, CSA B52/);
  });
  it("reads the flammability digit of a safety class", () => {
    // ASHRAE 34 class notation: letter = toxicity, digit = flammability.
    expect(["A1", "B1"].map(isFlammableClass)).toEqual([false, false]);
    expect(["A2L", "A2", "A3", "B2L"].map(isFlammableClass)).toEqual([true, true, true, true]);
  });
});

describe("room cautions know the room's systems", () => {
  const room = (place: "walk-in" | "machine-room", ids: string[]) =>
    roomCautions(
      place,
      ids.map((id) => getRefrigerant(id)),
    );
  it("an ammonia machine room: toxic, and a leak collects near the ceiling, not from the floor up", () => {
    // R-717 toxic (B2L) and lighter than air, density 0.59 × air (docs/reference/standards.md §4 [D], §8).
    const c = room("machine-room", ["R-717"]);
    expect(ids(c)).toEqual(["toxic-ammonia", "oxygen-displacement", "codes-govern"]);
    const o2 = c.find((x) => x.id === "oxygen-displacement")!.text;
    expect(o2).toMatch(/R-717 collects near the ceiling/);
    expect(o2).not.toMatch(/floor up/);
  });
  it("a CO2 machine room gives the exposure limits as published and defers to the site's detector", () => {
    // ACGIH 5,000 ppm TWA and 30,000 ppm STEL [S:S2]; OSHA PEL 5,000 ppm TWA (from memory, docs/reference/standards.md §5).
    const c = room("machine-room", ["R-744", "R-448A"]);
    expect(ids(c)).toEqual(["co2-exposure", "high-pressure-co2", "oxygen-displacement", "codes-govern"]);
    const co2 = c[0].text;
    expect(co2).toMatch(/5,000 ppm averaged over a work shift and 30,000 ppm over 15 minutes \(ACGIH\)/);
    expect(co2).toMatch(/5,000 ppm over a shift \(OSHA\)/);
    expect(co2).toMatch(/Trust the site's CO2 detector/);
    // Both heavier than air (R-744 1.52, R-448A ~2.98 × air, §4 [D]).
    expect(c[2].text).toMatch(/R-744, R-448A fill it from the floor up/);
  });
  it("names flammable refrigerants, and keeps the general warning when the room's systems are unknown", () => {
    const c = room("walk-in", ["R-290"]);
    expect(c[0]).toMatchObject({ id: "flammable" });
    expect(c[0].text).toMatch(/^R-290: This refrigerant is flammable/);
    expect(room("walk-in", []).find((x) => x.id === "oxygen-displacement")!.text).toMatch(
      /this walk-in a large leak fills from the floor up/,
    );
    expect(room("walk-in", []).at(-1)!.id).toBe("codes-govern");
  });
});

describe("under EU F-gas rules the cautions name no US rule", () => {
  // What an EU company may not read (docs/decisions/0116-eu-words-for-cautions-and-leak-checks.md).
  // The words name no US rule or code; the sources cite no US rule. The ACGIH values keep the document
  // they were read in (standards.md §5 [S:S2], the OSHA PEL preamble of 1989): a source, not a rule.
  const US_WORDS = /EPA|Section 608|OSHA|29 CFR|40 CFR|IMC|ASHRAE 15|CSA B52/;
  const US_RULES = /EPA|Section 608|29 CFR|40 CFR|IMC|ASHRAE 15|CSA B52/;
  const words = (list: { id: string; text: string; source: string }[]) => {
    for (const c of list) expect(readableSource(c.source), c.id).not.toMatch(US_RULES);
    return list.map((c) => c.text).join("\n");
  };
  const US = US_WORDS;

  it("a finding on an R-744 system: certification under 2024/573, EN 378 and ISO 5149, and no US rule", () => {
    const eu = cautionsFor({ refrigerant: getRefrigerant("R-744"), place: "machine-room", rules: "eu" });
    expect(words(eu)).not.toMatch(US);
    // Certified persons: Regulation (EU) 2024/573, Art. 10 (from memory: the article number is not in standards.md).
    expect(eu.find((c) => c.id === "certified-technicians")!.text).toMatch(/Regulation \(EU\) 2024\/573/);
    // The closing caution keeps the European codes (standards.md §8 disclaimer: EN 378, ISO 5149).
    expect(eu.at(-1)!.text).toMatch(/EN 378, ISO 5149, national and local codes/);
    // Dry nitrogen for pressure tests is trade practice there: common practice, no published source.
    expect(readableSource(eu.find((c) => c.id === "pressure-test-nitrogen")!.source)).toBe(
      "common practice, no published source",
    );
    // The US profile keeps its own words unchanged.
    const us = cautionsFor({ refrigerant: getRefrigerant("R-744"), place: "machine-room" });
    expect(us.map((c) => c.text).join("\n")).toMatch(/Section 608/);
  });

  it("a CO2 machine room on the Walk screen: ACGIH 5,000 ppm TWA and 30,000 ppm STEL, the site's detector and local codes", () => {
    // ACGIH TLV 5,000 ppm TWA, 30,000 ppm STEL: docs/reference/standards.md §5 [S:S2].
    const room = roomCautions("machine-room", [getRefrigerant("R-744")], "eu");
    const co2 = room.find((c) => c.id === "co2-exposure")!.text;
    expect(co2).toMatch(/5,000 ppm averaged over a work shift and 30,000 ppm over 15 minutes \(ACGIH\)/);
    expect(co2).toMatch(/site's CO2 detector/);
    expect(co2).toMatch(/Local codes/);
    expect(words(room)).not.toMatch(US);
  });

  it("an ammonia or propane machine room: toxic and rising, or flammable, with no US rule", () => {
    // R-717 B2L and lighter than air (standards.md §4 [D], §5 [M]); R-290 A3 (standards.md §5 [M], §8 [S:D2]).
    const nh3 = roomCautions("machine-room", [getRefrigerant("R-717")], "eu");
    expect(ids(nh3)).toContain("toxic-ammonia");
    expect(nh3.find((c) => c.id === "oxygen-displacement")!.text).toMatch(/R-717 collects near the ceiling/);
    const r290 = roomCautions("machine-room", [getRefrigerant("R-290")], "eu");
    expect(r290.find((c) => c.id === "flammable")!.text).toMatch(/^R-290: This refrigerant is flammable/);
    expect(words([...nh3, ...r290])).not.toMatch(US);
  });
});
