import { describe, expect, it, vi } from "vitest";
import { fireEvent, render, screen } from "@testing-library/react";
import type { SuspectSpotWithRefrigerant } from "#core/contracts/analysis";
import { presentAnalysis } from "#core/domain/locator-words/present-analysis";
import { SuspectList } from "./suspect-list";

const spot: SuspectSpotWithRefrigerant = {
  rank: 1,
  x: 12.192,
  y: 3.048,
  radius: 0.9144,
  score: 0.82,
  strength: 1,
  molPerYear: 1.5,
  fixtureId: "c",
  riskPointId: "d",
  reason: {
    kind: "fitted",
    supportCount: 5,
    peakPpm: 40,
    backgroundPpm: 0.3,
    fixture: { id: "c", kind: "open-case", distanceM: 0 },
    oneSided: false,
  },
  nextChecks: [{ kind: "risk-point-first", riskPointId: "d", riskPointKind: "line-set", distanceM: 0.3048 }],
  refrigerant: { source: "system", refrigerantId: "R-448A", molarMassGPerMol: 86.28, systemName: "Rack B" },
};

function wordsIn(length: "m" | "ft-in", spots: SuspectSpotWithRefrigerant[] = [spot]) {
  return presentAnalysis(
    {
      candidates: spots,
      diagnostics: [],
      assumptions: {
        shiftS: 6.5,
        mixingHeightM: 3,
        airChangesPerH: 2,
        molarVolumeL: 24.465,
        temperatureC: 25,
        pressureKPa: 101.325,
      },
      delay: {
        statedS: 6.5,
        estimatedS: null,
        supported: false,
        usedS: 6.5,
        statedMisfit: null,
        estimatedMisfit: null,
      },
      params: { timeConstantS: 1.5 },
    },
    {
      length,
      mass: length === "m" ? "kg" : "lb",
      names: new Map([
        ["c", "Dairy 3"],
        ["d", "Drop D1"],
      ]),
      delaySetByHand: false,
    },
  );
}

describe("suspect list", () => {
  it("shows each spot in the reader's unit with its fixture, risk point, reason and next check, by name", () => {
    const w = wordsIn("ft-in");
    render(
      <SuspectList
        numberFormat="1,234.5"
        spots={[spot]}
        words={w.spots}
        noSpot=""
        selected={null}
        onSelect={() => {}}
        findingRanks={new Set()}
        busyRank={null}
      />,
    );
    // 12.192 m = 40 ft, 3.048 m = 10 ft, 0.9144 m = 3 ft exactly (1 ft = 0.3048 m; NIST SP 811, B.8)
    expect(screen.getByText("40 ft across, 10 ft down, within 3 ft")).toBeVisible();
    expect(screen.getByText("Dairy 3")).toBeVisible();
    expect(screen.getByText("Drop D1")).toBeVisible();
    expect(screen.getByText(/Look at the line-set drop Drop D1 \(1 ft away\) first/)).toBeVisible();
    expect(screen.getByText(/inside the open case Dairy 3/)).toBeVisible();
    // no findings action without the permission
    expect(screen.queryByRole("button", { name: "Make a finding" })).toBeNull();
  });

  it("zooms and makes a finding in one action; says so once one exists", () => {
    const onSelect = vi.fn();
    const onMake = vi.fn();
    const w = wordsIn("m");
    const { rerender } = render(
      <SuspectList
        numberFormat="1,234.5"
        spots={[spot]}
        words={w.spots}
        noSpot=""
        selected={null}
        onSelect={onSelect}
        onMakeFinding={onMake}
        findingRanks={new Set()}
        busyRank={null}
      />,
    );
    fireEvent.click(screen.getByRole("button", { name: "Zoom to spot 1" }));
    expect(onSelect).toHaveBeenCalledWith(1);
    fireEvent.click(screen.getByRole("button", { name: "Make a finding" }));
    expect(onMake).toHaveBeenCalledWith(spot, w.spots[0]);
    rerender(
      <SuspectList
        numberFormat="1,234.5"
        spots={[spot]}
        words={w.spots}
        noSpot=""
        selected={1}
        onSelect={onSelect}
        onMakeFinding={onMake}
        findingRanks={new Set([1])}
        busyRank={null}
      />,
    );
    expect(screen.getByText("Finding recorded")).toBeVisible();
    expect(screen.getByRole("button", { name: "Show whole plan" })).toBeVisible();
  });

  it("says what the presenter says when the list is empty", () => {
    const w = wordsIn("m", []);
    render(
      <SuspectList
        numberFormat="1,234.5"
        spots={[]}
        words={[]}
        noSpot={w.noSpot!}
        selected={null}
        onSelect={() => {}}
        findingRanks={new Set()}
        busyRank={null}
      />,
    );
    expect(screen.getByText(/No credible leak/)).toBeVisible();
  });
});
