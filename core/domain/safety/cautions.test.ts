import { describe, expect, it } from "vitest";
import { getRefrigerant } from "../refrigerants/catalogue";
import { cautionsFor, isFlammableClass } from "./cautions";

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
