import { describe, expect, it } from "vitest";
import type { LocalSweep } from "./local-types";
import {
  clockText,
  DEFAULT_RESTORE_AFTER_MIN,
  endPass,
  openPass,
  passConfirmed,
  passIdAt,
  passIdForNewReading,
  passNumbers,
  restoreReminder,
  setRestoreMinutes,
  startPass,
} from "./pinpoint-pass";

const sweep: LocalSweep = {
  id: "s",
  storeId: "st",
  planId: "p",
  detectorId: "d",
  detectorName: "Diode",
  systemIds: [],
  fans: "running",
  defrost: false,
  startedAt: "2026-11-02T14:00:00.000Z",
  status: "in-progress",
  transportDelayS: 5,
  timeConstantS: 1.5,
  alarmPpm: 2,
  warnings: [],
  sync: { kind: "on-server" },
  passes: [],
};
const at = (min: number) => new Date(Date.parse("2026-11-02T14:00:00.000Z") + min * 60_000).toISOString();

describe("pinpoint passes on the device", () => {
  it("gives new readings to the open pass and back to the first pass once it ends", () => {
    expect(passIdForNewReading(sweep)).toBeNull();
    const started = startPass(sweep, { condition: "fans-stopped", fixtureId: "case-4" }, "p2", at(10));
    expect(openPass(started)).toMatchObject({ id: "p2", fans: "stopped", defrost: false, fixtureId: "case-4" });
    expect(passIdForNewReading(started)).toBe("p2");
    const ended = endPass(started, at(25));
    expect(ended.passes[0]).toMatchObject({ endedAt: at(25), sync: { kind: "queued" } });
    expect(passIdForNewReading(ended)).toBeNull();
    // a reading read from the detector's log afterwards goes to the pass its time falls in
    expect(passIdAt(ended, at(12))).toBe("p2");
    expect(passIdAt(ended, at(26))).toBeNull();
    expect(passIdAt(ended, at(5))).toBeNull();
  });

  it("records a defrost as fans stopped in a defrost, keeps one pass open at a time and numbers them from 2", () => {
    const a = startPass(sweep, { condition: "defrost", fixtureId: null }, "p2", at(10));
    expect(a.passes[0]).toMatchObject({ fans: "stopped", defrost: true, fixtureId: null });
    const b = startPass(a, { condition: "fans-stopped", fixtureId: "case-4" }, "p3", at(30));
    expect(b.passes.map((p) => [p.id, p.endedAt])).toEqual([
      ["p2", at(30)],
      ["p3", null],
    ]);
    expect([...passNumbers(b).entries()]).toEqual([
      ["p2", 2],
      ["p3", 3],
    ]);
    // a clock set back never ends a pass before it started
    expect(endPass(b, at(20)).passes[1].endedAt).toBe(at(30));
  });

  it("reminds to restore the fans after 20 minutes by default, adjustable within 5–60 minutes", () => {
    // 20 min: common practice, no published source (see DEFAULT_RESTORE_AFTER_MIN)
    expect(DEFAULT_RESTORE_AFTER_MIN).toBe(20);
    const s = startPass(sweep, { condition: "fans-stopped", fixtureId: null }, "p2", at(10));
    const p = s.passes[0];
    expect(restoreReminder(p, Date.parse(at(10)))).toMatchObject({ leftMs: 20 * 60_000, overdue: false });
    expect(restoreReminder(p, Date.parse(at(30)))).toMatchObject({ leftMs: 0, overdue: true });
    expect(clockText(restoreReminder(p, Date.parse(at(15.5))).leftMs)).toBe("14:30");
    expect(clockText(restoreReminder(p, Date.parse(at(33))).leftMs)).toBe("3:00");
    expect(setRestoreMinutes(s, "p2", 25).passes[0].restoreAfterMin).toBe(25);
    expect(setRestoreMinutes(s, "p2", 500).passes[0].restoreAfterMin).toBe(60);
    expect(setRestoreMinutes(s, "p2", 1).passes[0].restoreAfterMin).toBe(5);
    expect(setRestoreMinutes(s, "p2", Number.NaN).passes[0].restoreAfterMin).toBe(20);
  });

  it("marks a pass as on the server only for the version that was sent", () => {
    const s = startPass(sweep, { condition: "fans-stopped", fixtureId: null }, "p2", at(10));
    const sent = s.passes[0];
    const endedMeanwhile = endPass(s, at(20));
    expect(passConfirmed(endedMeanwhile, sent).passes[0].sync).toEqual({ kind: "queued" });
    expect(passConfirmed(s, sent).passes[0].sync).toEqual({ kind: "on-server" });
  });
});
