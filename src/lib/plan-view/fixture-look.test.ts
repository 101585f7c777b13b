import { describe, expect, it } from "vitest";
import { FIXTURE_KINDS, POINT_KINDS } from "#core/contracts/fixture-kinds";
import { backdropOf, lookOf, POINT_COLOURS } from "./fixture-look";

describe("one table of fixture looks", () => {
  it("gives every polygon kind a look of its own and every point kind a colour", () => {
    const fallback = lookOf("not-a-kind" as never);
    for (const kind of FIXTURE_KINDS) {
      if ((POINT_KINDS as readonly string[]).includes(kind)) expect(POINT_COLOURS[kind as "valve"]).toMatch(/^#/);
      else expect(lookOf(kind), kind).not.toEqual(fallback);
    }
  });

  it("draws walls and columns solid under the data, other bodies shaded, zones dashed, air volumes outlined", () => {
    expect(FIXTURE_KINDS.map((k) => [k, backdropOf(k)])).toEqual([
      ["open-case", "outline"],
      ["island-case", "outline"],
      ["door-case", "outline"],
      ["walk-in-cooler", "outline"],
      ["walk-in-freezer", "outline"],
      ["machine-room", "outline"],
      ["wall", "ink"],
      ["gondola", "shade"],
      ["checkout", "shade"],
      ["column", "ink"],
      ["benign-zone", "dashed"],
      ["line-set-drop", "point"],
      ["valve", "point"],
      ["coil", "point"],
    ]);
  });
});
