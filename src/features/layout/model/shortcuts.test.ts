import { describe, expect, it } from "vitest";
import * as act from "./actions";
import { createHistory, endGesture, record, undo } from "./history";
import { createScene } from "./scene";
import { commandForKey } from "./shortcuts";
import { openCase, rect, uuid } from "./test-builders";

describe("shortcuts", () => {
  it("maps the usual editor keys on both Ctrl and Cmd", () => {
    expect(commandForKey({ key: "z", ctrl: true })).toEqual({ command: "undo" });
    expect(commandForKey({ key: "Z", meta: true, shift: true })).toEqual({ command: "redo" });
    expect(commandForKey({ key: "y", ctrl: true })).toEqual({ command: "redo" });
    expect(commandForKey({ key: "d", meta: true })).toEqual({ command: "duplicate" });
    expect(commandForKey({ key: "Delete" })).toEqual({ command: "delete" });
    expect(commandForKey({ key: "ArrowLeft", shift: true })).toEqual({ command: "nudge", dx: -0.5, dy: 0 });
    expect(commandForKey({ key: "q" })).toBeNull();
    expect(commandForKey({ key: "r", ctrl: true })).toBeNull(); // leave the browser's reload alone
  });

  it("coalesces a run of nudges into one undo step", () => {
    let h = createHistory(createScene({ width: 20, height: 10 }, [openCase(1, rect(2, 2, 2, 1))]));
    for (let i = 0; i < 4; i++) {
      const c = commandForKey({ key: "ArrowRight" });
      if (c?.command === "nudge") h = record(h, act.move([uuid(1)], c.dx, c.dy), "nudge");
    }
    h = endGesture(h);
    expect(h.past).toHaveLength(1);
    expect(undo(h).present.fixtures[uuid(1)]).toEqual(openCase(1, rect(2, 2, 2, 1)));
  });
});
