import { fireEvent, render, screen } from "@testing-library/react";
import { useState } from "react";
import { beforeAll, describe, expect, it } from "vitest";
import type { Fixture } from "#core/contracts/fixtures";
import type { LocalReading, LocalSweep } from "../model/local-types";
import { startPass } from "../model/pinpoint-pass";
import { PinpointPassPanel } from "./pinpoint-pass-panel";
import { NoticeStrip } from "./notice-strip";

const CASE: Fixture = {
  id: "11111111-1111-4111-8111-111111111111",
  kind: "open-case",
  label: "Dairy 3",
  systemId: "22222222-2222-4222-8222-222222222222",
  hasFans: true,
  polygon: [
    [1, 2],
    [9, 2],
    [9, 3],
    [1, 3],
  ],
};
const sweep: LocalSweep = {
  id: "s",
  storeId: "st",
  planId: "p",
  detectorId: "d",
  detectorName: "Diode",
  systemIds: [],
  fans: "running",
  defrost: false,
  startedAt: new Date(Date.now() - 30 * 60_000).toISOString(),
  status: "in-progress",
  transportDelayS: 5,
  timeConstantS: 1.5,
  alarmPpm: 2,
  warnings: [],
  sync: { kind: "on-server" },
  passes: [],
};
let seq = 0;
const reading = (x: number, y: number, ppm: number): LocalReading => ({
  id: `r${++seq}`,
  sweepId: "s",
  seq,
  x,
  y,
  takenAt: new Date().toISOString(),
  ppm,
  atLeast: false,
  samplePoint: "grille",
  note: "",
  passId: null,
  sync: { kind: "synced" },
});
const level = [
  ...[6, 6.5, 6, 7, 6.5].map((ppm, i) => reading(1.5 + i, 3.2, ppm)),
  ...[1, 3, 5].map((x) => reading(x, 6, 0.5)),
];
// R-290 is safety class A3 (ASHRAE 34): flammable
const R290 = {
  id: "R-290",
  name: "Propane",
  designation: "R-290",
  enteredByCompany: false,
  safetyClass: "A3",
  safetyClassSource: "ASHRAE 34",
  gwp: null,
  gwpNote: null,
};
const panel = (
  s: LocalSweep,
  committed: LocalReading[],
  systems = [{ id: CASE.systemId!, refrigerant: R290 }],
  settled: { fixtureId: string | null } | null = null,
) =>
  render(
    <PinpointPassPanel
      sweep={s}
      fixtures={[CASE]}
      committed={committed}
      systems={systems}
      readOnly={false}
      reload={async () => {}}
      settled={settled && { rank: 1, x: 4, y: 2.5, radius: 3.3, score: 0.7, riskPointId: null, ...settled }}
    />,
  );

// jsdom has no modal dialogs: opening one only sets its open attribute here (the browser test opens it for real).
beforeAll(() => {
  HTMLDialogElement.prototype.showModal ??= function (this: HTMLDialogElement) {
    this.setAttribute("open", "");
  };
  HTMLDialogElement.prototype.close ??= function (this: HTMLDialogElement) {
    this.removeAttribute("open");
  };
});

describe("the still-air pass panel", () => {
  it("advises stopping the fans of a case its readings say are mixing, and opens the start with the cautions", () => {
    panel(sweep, level);
    expect(screen.getByTestId("mixing-advice").textContent).toMatch(
      /Level at about 6\.5 ppm across Dairy 3: its fans are mixing the gas/,
    );
    fireEvent.click(screen.getByRole("button", { name: "Still-air pass…" }));
    const dialog = screen.getByRole("dialog", { hidden: true });
    const text = dialog.textContent ?? "";
    // product temperature first; the case's system runs R-290 (ASHRAE 34 class A3): the flammable caution;
    // the last one defers to the codes
    expect(text).toMatch(/product warms up/);
    expect(text).toMatch(/flammable/);
    expect(text).toMatch(/local codes/);
    expect(text.indexOf("product warms up")).toBeLessThan(text.indexOf("local codes"));
  });

  it("says nothing while the readings point at a spot", () => {
    panel(sweep, [...[1, 2, 9, 2, 1].map((ppm, i) => reading(1.5 + i, 3.2, ppm)), reading(3, 6, 0.5)]);
    expect(screen.queryByTestId("mixing-advice")).toBeNull();
  });

  it("offers a still-air pass at the case a settled live suspect holds to when the readings are not level", () => {
    const peaked = [...[1, 2, 9, 2, 1].map((ppm, i) => reading(1.5 + i, 3.2, ppm)), reading(3, 6, 0.5)];
    panel(sweep, peaked, undefined, { fixtureId: CASE.id });
    expect(screen.queryByTestId("mixing-advice")).toBeNull();
    expect(screen.getByTestId("still-air-offer").textContent).toMatch(
      /Suspect 1 holds at Dairy 3: its fans spread the gas\. Stop them or start a defrost/,
    );
    fireEvent.click(screen.getByRole("button", { name: "Still-air pass…" }));
    const text = screen.getByRole("dialog", { hidden: true }).textContent ?? "";
    expect(text).toMatch(/product warms up/);
    expect(text).toMatch(/local codes/);
  });

  it("shows the open pass with the time left to restore the fans, and turns to an alert once it is due", () => {
    const open = startPass(sweep, { condition: "fans-stopped", fixtureId: CASE.id }, "p2", new Date().toISOString());
    const { unmount } = panel(open, level);
    const banner = screen.getByTestId("pass-banner");
    expect(banner.getAttribute("role")).toBe("status");
    expect(banner.textContent).toMatch(/Pass 2: fans stopped at Dairy 3\. Restore the fans in (20:00|19:5\d)\./);
    expect(screen.queryByTestId("mixing-advice")).toBeNull();
    unmount();
    const late = startPass(
      sweep,
      { condition: "defrost", fixtureId: null },
      "p2",
      new Date(Date.now() - 25 * 60_000).toISOString(),
    );
    panel(late, level);
    const due = screen.getByTestId("pass-banner");
    expect(due.getAttribute("role")).toBe("alert");
    expect(due.textContent).toMatch(
      /Pass 2: in defrost at the whole store\. Restore the fans now: 5:0\d past the 20 min reminder\./,
    );
  });

  it("offers the case a settled live suspect holds to before the advice of level readings elsewhere", () => {
    // level readings along Dairy 3, but the live first suspect has settled on Dairy 4 beside it
    const next: Fixture = { ...CASE, id: "44444444-4444-4444-8444-444444444444", label: "Dairy 4" };
    render(
      <PinpointPassPanel
        sweep={sweep}
        fixtures={[CASE, next]}
        committed={level}
        systems={[]}
        readOnly={false}
        reload={async () => {}}
        settled={{ rank: 1, x: 10, y: 2.5, radius: 2.5, score: 0.7, riskPointId: null, fixtureId: next.id }}
      />,
    );
    expect(screen.getByTestId("still-air-offer").textContent).toMatch(/^Suspect 1 holds at Dairy 4/);
    expect(screen.queryByTestId("mixing-advice")).toBeNull();
  });

  it("on the folded strip is one line without its buttons; a tap shows the open pass in full with its cautions", () => {
    const open = startPass(sweep, { condition: "fans-stopped", fixtureId: CASE.id }, "p2", new Date().toISOString());
    function Strip() {
      const [shown, setShown] = useState(false);
      return (
        <NoticeStrip open={shown} onOpen={setShown}>
          <PinpointPassPanel
            sweep={open}
            fixtures={[CASE]}
            committed={level}
            systems={[{ id: CASE.systemId!, refrigerant: R290 }]}
            readOnly={false}
            reload={async () => {}}
          />
        </NoticeStrip>
      );
    }
    render(<Strip />);
    const line = screen.getByTestId("pass-banner");
    expect(line.textContent).toMatch(/^⚠ Pass 2: fans stopped at Dairy 3\. Restore the fans in (20:00|19:5\d)\./);
    expect(screen.queryByRole("button", { name: "Fans back on — end pass" })).toBeNull();
    expect(screen.queryByTestId("pass-cautions")).toBeNull();
    // a tap anywhere on the line opens it
    fireEvent.click(line);
    expect(screen.getByRole("button", { name: "Fans back on — end pass" })).toBeTruthy();
    // the cautions open over the whole screen, not inside the banners' short scrolling box
    expect(screen.queryByTestId("pass-cautions")).toBeNull();
    fireEvent.click(screen.getByRole("button", { name: "Cautions while the air is still" }));
    const cautions = screen.getByTestId("pass-cautions").textContent ?? "";
    // R-290 is flammable (ASHRAE 34 class A3); the last caution defers to the codes
    expect(cautions).toMatch(/product warms up/);
    expect(cautions).toMatch(/flammable/);
    expect(cautions).toMatch(/local codes/);
    fireEvent.click(screen.getByRole("button", { name: "Back to the pass" }));
    expect(screen.queryByTestId("pass-cautions")).toBeNull();
    fireEvent.click(screen.getByRole("button", { name: "Fold the notices to one line" }));
    expect(screen.queryByTestId("pass-cautions")).toBeNull();
  });
});
