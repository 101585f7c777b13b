import { describe, expect, it } from "vitest";
import { changeKind, canChangeKind } from "./change-kind";
import { applyAction, setKind } from "./actions";
import { createScene } from "./scene";
import { openCase, rect, room, uuid, valve } from "./test-builders";

describe("changing a fixture's kind", () => {
  it("keeps id, label, system, fans and outline, and adds the new kind's defaults", () => {
    const f = { ...openCase(1, rect(0, 0, 3.8, 1), "Dairy 1"), systemId: uuid(9), hasFans: false };
    const g = changeKind(f, "door-case");
    expect(g).toMatchObject({
      id: uuid(1),
      kind: "door-case",
      label: "Dairy 1",
      systemId: uuid(9),
      hasFans: false,
      polygon: f.polygon,
    });
    // 3.8 m of case at about 0.76 m a door (new-fixture.ts, common practice, no published source) is 5 doors.
    expect(g).toHaveProperty("doorCount", 5);
  });
  it("drops properties the new kind does not have", () => {
    const r = room(2, rect(0, 0, 4, 3), { edge: 0, offset: 1, width: 1 });
    const g = changeKind(r, "gondola");
    expect(g).not.toHaveProperty("door");
    expect(changeKind(g, "benign-zone")).toMatchObject({ note: "", typicalPpm: null });
  });
  it("refuses to turn a point into an outline and back", () => {
    expect(canChangeKind(valve(3, 1, 1), "coil")).toBe(true);
    expect(canChangeKind(valve(3, 1, 1), "open-case")).toBe(false);
    expect(() => changeKind(valve(3, 1, 1), "open-case")).toThrow(/points stay points/);
    expect(() => changeKind(openCase(1, rect(0, 0, 1, 1)), "valve")).toThrow(/outlines stay outlines/);
  });
  it("is an action the reducer applies to the named fixtures it can change, skipping the rest", () => {
    const s = createScene({ width: 10, height: 10 }, [openCase(1, rect(0, 0, 2, 1)), valve(3, 5, 5)]);
    const t = applyAction(s, setKind([uuid(1), uuid(3)], "island-case"));
    expect(t.fixtures[uuid(1)].kind).toBe("island-case");
    expect(t.fixtures[uuid(3)]).toBe(s.fixtures[uuid(3)]);
    expect(applyAction(t, setKind([uuid(1)], "island-case"))).toBe(t);
  });
});
