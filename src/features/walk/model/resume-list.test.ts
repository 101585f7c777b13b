import { describe, expect, it } from "vitest";
import type { Sweep } from "#core/contracts/sweeps";
import type { LocalSweep } from "./local-types";
import { resumeList, type LocalSweepSummary } from "./resume-list";

const ME = "11111111-1111-4111-8111-111111111111";
const OTHER = "22222222-2222-4222-8222-222222222222";
const STORE = "33333333-3333-4333-8333-333333333333";

function local(id: string, startedAt: string, over: Partial<LocalSweep> = {}): LocalSweep {
  return {
    id,
    storeId: STORE,
    planId: "p",
    detectorId: "d",
    detectorName: "Diode",
    systemIds: [],
    fans: "running",
    defrost: false,
    startedAt,
    passes: [],
    status: "in-progress",
    transportDelayS: 5,
    timeConstantS: 1.5,
    alarmPpm: 2,
    warnings: [],
    sync: { kind: "on-server" },
    ...over,
  };
}
function remote(
  id: string,
  startedAt: string,
  technicianId: string,
  readingCount: number,
  status = "in-progress",
): Sweep {
  return {
    ...local(id, startedAt),
    passes: [],
    technicianId,
    technicianName: technicianId === ME ? "Me" : "Dana",
    status: status as Sweep["status"],
    submittedAt: null,
    reviewedAt: null,
    readingsRevision: 0,
    readingCount,
  } as Sweep;
}
const summary = (sweep: LocalSweep, readings: number, waiting: number): LocalSweepSummary => ({
  sweep,
  readings,
  waiting,
});

describe("the list of sweeps to resume", () => {
  it("merges the device's sweeps with the server's, the member's own first, then the newest", () => {
    const list = resumeList(
      [
        summary(
          local("device-only", "2026-11-02T09:00:00Z", { sync: { kind: "queued-new", thenSubmit: false } }),
          4,
          4,
        ),
        summary(local("both", "2026-11-02T08:00:00Z"), 12, 3),
      ],
      [
        remote("both", "2026-11-02T08:00:00Z", ME, 9),
        remote("theirs", "2026-11-02T10:00:00Z", OTHER, 20),
        remote("mine-elsewhere", "2026-11-01T08:00:00Z", ME, 5),
        remote("done", "2026-11-02T11:00:00Z", ME, 30, "submitted"),
      ],
      ME,
    );
    expect(list.map((e) => e.sweepId)).toEqual(["device-only", "both", "mine-elsewhere", "theirs"]);
    expect(list[0]).toMatchObject({ onlyOnDevice: true, readings: 4, waiting: 4 });
    // The device holds 12 of which 3 wait; the server has 9 so far.
    expect(list[1]).toMatchObject({ readings: 12, waiting: 3, onlyOnDevice: false, technicianName: "Me" });
    expect(list[3]).toMatchObject({ own: false, technicianName: "Dana", readings: 20, waiting: 0 });
  });

  it("leaves out a sweep whose submit waits on this device, and keeps the device's list when the server is away", () => {
    const submitted = local("submitted-here", "2026-11-02T08:00:00Z", { sync: { kind: "queued-submit" } });
    const open = local("open", "2026-11-02T09:00:00Z");
    const offline = resumeList([summary(submitted, 5, 0), summary(open, 2, 2)], null, ME);
    expect(offline.map((e) => e.sweepId)).toEqual(["open"]);
    const online = resumeList(
      [summary(submitted, 5, 0)],
      [remote("submitted-here", "2026-11-02T08:00:00Z", ME, 5)],
      ME,
    );
    expect(online).toEqual([]);
  });

  it("shows one store's sweeps on that store's page", () => {
    const elsewhere = local("elsewhere", "2026-11-02T09:00:00Z", { storeId: "44444444-4444-4444-8444-444444444444" });
    const here = local("here", "2026-11-02T08:00:00Z");
    expect(resumeList([summary(elsewhere, 1, 0), summary(here, 1, 0)], null, ME, STORE).map((e) => e.sweepId)).toEqual([
      "here",
    ]);
  });
});
