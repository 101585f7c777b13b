import { describe, expect, it } from "vitest";
import { fixtureRows } from "./fixture-table";
import { createScene } from "./scene";
import { MIXED, selectionPanel } from "./selection-panel";
import { openCase, rect, room, uuid, valve } from "./test-builders";

const scene = () =>
  createScene({ width: 40, height: 20 }, [
    openCase(1, rect(2, 2, 4, 1), "Case 10"),
    openCase(2, rect(8, 2, 2, 1), "Case 2"),
    room(3, rect(30, 2, 6, 4), null),
    valve(4, 5, 5),
  ]);

describe("fixture list rows", () => {
  it("gives names, centres and areas in metres, and sorts labels numerically", () => {
    const rows = fixtureRows(scene());
    expect(rows[0]).toMatchObject({
      kindName: "Open case",
      family: "air-volume",
      x: 4,
      y: 2.5,
      widthM: 4,
      depthM: 1,
      areaM2: 4,
    });
    expect(rows[3]).toMatchObject({ kindName: "Valve", areaM2: null, x: 5, y: 5 });
    expect(fixtureRows(scene(), "label").map((r) => r.label)).toEqual(["Case 2", "Case 10", "Room 3", "Valve 4"]);
    expect(fixtureRows(scene(), "areaM2", true).map((r) => r.id)).toEqual([uuid(3), uuid(1), uuid(2), uuid(4)]);
  });
});

describe("selection panel", () => {
  it("shows shared values, marks differences as mixed and hides fields some kinds lack", () => {
    const s = scene();
    expect(selectionPanel(s)).toBeNull();
    const one = selectionPanel({ ...s, selection: [uuid(3)] });
    expect(one?.title).toBe("Walk-in cooler");
    expect(one?.fields).toEqual({ label: "Room 3", systemId: null, hasFans: true, door: null });
    const many = selectionPanel({ ...s, selection: [uuid(1), uuid(2), uuid(4)] });
    expect(many?.title).toBe("3 fixtures");
    expect(many?.fields).toEqual({ systemId: null, hasFans: MIXED });
    expect(selectionPanel({ ...s, selection: [uuid(1), uuid(2)] })?.title).toBe("2 × Open case");
  });
});
