import { describe, expect, it } from "vitest";
import * as act from "./actions";
import { canRedo, canUndo, createHistory, endGesture, record, recordAll, redo, undo } from "./history";
import { createScene } from "./scene";
import { openCase, rect, uuid } from "./test-builders";

const start = () => createHistory(createScene({ width: 40, height: 20 }, [openCase(1, rect(2, 2, 2, 1))]));
const x0 = (h: ReturnType<typeof start>) =>
  "polygon" in h.present.fixtures[uuid(1)]
    ? (h.present.fixtures[uuid(1)] as { polygon: number[][] }).polygon[0][0]
    : NaN;

describe("history", () => {
  it("undoes and redoes round trip to the very same scenes", () => {
    const h0 = start();
    const h1 = record(h0, act.move([uuid(1)], 1, 0));
    const h2 = record(h1, act.label(uuid(1), "Deli 1"));
    const back = undo(undo(h2));
    expect(back.present).toBe(h0.present);
    expect(canUndo(back)).toBe(false);
    const again = redo(redo(back));
    expect(again.present).toBe(h2.present);
    expect(canRedo(again)).toBe(false);
  });

  it("coalesces one drag into one step", () => {
    let h = start();
    for (let i = 0; i < 10; i++) h = record(h, act.move([uuid(1)], 0.1, 0), "drag-1");
    h = endGesture(h);
    h = record(h, act.move([uuid(1)], 1, 0), "drag-2");
    expect(h.past).toHaveLength(2);
    expect(x0(h)).toBeCloseTo(4, 12);
    h = undo(h);
    expect(x0(h)).toBeCloseTo(3, 12);
    h = undo(h);
    expect(x0(h)).toBe(2);
  });

  it("does not record selection changes or no-ops as steps, and a new edit clears redo", () => {
    let h = record(start(), act.select([uuid(1)]));
    expect(h.past).toHaveLength(0);
    expect(h.present.selection).toEqual([uuid(1)]);
    h = record(h, act.move(["gone"], 1, 1));
    expect(h.past).toHaveLength(0);
    h = undo(record(h, act.move([uuid(1)], 1, 0)));
    expect(canRedo(h)).toBe(true);
    h = record(h, act.label(uuid(1), "Meat 1"));
    expect(canRedo(h)).toBe(false);
  });

  it("keeps at most maxDepth steps, dropping the oldest", () => {
    let h = createHistory(start().present, 3);
    for (let i = 0; i < 5; i++) h = record(h, act.move([uuid(1)], 1, 0));
    expect(h.past).toHaveLength(3);
    while (canUndo(h)) h = undo(h);
    expect(x0(h)).toBe(4); // two oldest steps were dropped
  });

  it("records a batch as one step", () => {
    const h = recordAll(start(), [act.duplicate([uuid(1)], 0, 2, () => uuid(9)), act.select([uuid(1)], "add")]);
    expect(h.past).toHaveLength(1);
    expect(h.present.order).toHaveLength(2);
    expect(h.present.selection).toEqual([uuid(9), uuid(1)]);
    expect(undo(h).present.order).toHaveLength(1);
  });
});
