import { describe, expect, it, vi } from "vitest";
import { fireEvent, render, screen } from "@testing-library/react";
import { SuspectList } from "./suspect-list";

const spot = {
  rank: 1,
  x: 12.192,
  y: 3.048,
  radius: 0.9144,
  score: 0.82,
  strength: 1,
  strengthGPerYear: 140,
  fixtureId: "c",
  riskPointId: "d",
  reason: "Readings rise to 40 ppm.",
  nextCheck: "Look at the drop first.",
};
const label = (id: string | null) => (id === "c" ? "Dairy 3" : id === "d" ? "Drop D1" : null);

describe("suspect list", () => {
  it("shows each spot in the reader's unit with its fixture, risk point, reason and next check", () => {
    render(
      <SuspectList
        spots={[spot]}
        fixtureLabel={label}
        unit="ft-in"
        selected={null}
        onSelect={() => {}}
        findingRanks={new Set()}
        busyRank={null}
      />,
    );
    // 12.192 m = 40 ft, 3.048 m = 10 ft, 0.9144 m = 3 ft exactly (1 ft = 0.3048 m)
    expect(screen.getByText(/40 ft 0 in across, 10 ft 0 in down, within 3 ft 0 in/)).toBeVisible();
    expect(screen.getByText("Dairy 3")).toBeVisible();
    expect(screen.getByText("Drop D1")).toBeVisible();
    expect(screen.getByText(/Look at the drop first/)).toBeVisible();
    // no findings action without the permission
    expect(screen.queryByRole("button", { name: "Make a finding" })).toBeNull();
  });

  it("zooms and makes a finding in one action; says so once one exists", () => {
    const onSelect = vi.fn();
    const onMake = vi.fn();
    const { rerender } = render(
      <SuspectList
        spots={[spot]}
        fixtureLabel={label}
        unit="m"
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
    expect(onMake).toHaveBeenCalledWith(spot);
    rerender(
      <SuspectList
        spots={[spot]}
        fixtureLabel={label}
        unit="m"
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

  it("says no credible leak when the list is empty", () => {
    render(
      <SuspectList
        spots={[]}
        fixtureLabel={label}
        unit="m"
        selected={null}
        onSelect={() => {}}
        findingRanks={new Set()}
        busyRank={null}
      />,
    );
    expect(screen.getByText(/No credible leak/)).toBeVisible();
  });
});
