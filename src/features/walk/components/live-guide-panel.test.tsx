import { MemoryRouter } from "react-router";
import { describe, expect, it, vi } from "vitest";
import { fireEvent, render, screen } from "@testing-library/react";
import { wordsContext } from "#core/domain/locator-words/present-analysis";
import type { LiveProbe } from "#core/analysis/guide/live-guide";
import { LIVE_START, type LiveState } from "../model/live-state";
import { LiveGuidePanel } from "./live-guide-panel";

const words = wordsContext(
  {
    length: "m",
    mass: "kg",
    names: new Map([
      ["c3", "Dairy 3"],
      ["c4", "Dairy 4"],
    ]),
    delaySetByHand: false,
  },
  1.5,
);
const box = { x: 0, y: 0, width: 20, height: 10 };
const probes: LiveProbe[] = [
  {
    x: 4,
    y: 1.2,
    kind: "case-front",
    fixtureId: "c3",
    reason: { kind: "separates", ranks: [1, 2], fixtureIds: ["c3", "c4"] },
  },
  { x: 6, y: 1.2, kind: "case-front", fixtureId: "c4", reason: { kind: "narrows", rank: 1, fixtureId: "c3" } },
];
const state: LiveState = {
  ...LIVE_START,
  sent: 3,
  estimate: {
    kind: "suspects",
    readings: 40,
    box,
    suspects: [{ rank: 1, x: 4.2, y: 0.8, radius: 2.5, score: 1, fixtureId: "c3", riskPointId: null }],
  },
  probes,
};

const noCheck = { supply: { kind: "none" } as const, onSupplyCheck: () => {}, folded: false, onFold: () => {} };

describe("LiveGuidePanel", () => {
  it("lists the next probe points in walking order with their reasons, and says it is provisional", () => {
    render(<LiveGuidePanel state={state} words={words} from={{ x: 4, y: 4.2 }} onProbe={() => {}} {...noCheck} />);
    expect(screen.getByTestId("live-first").textContent).toBe("Suspect 1: Dairy 3, within 2.5 m");
    const items = screen.getAllByRole("listitem").map((li) => li.textContent);
    expect(items[0]).toContain("Probe 1: Dairy 3, at the front grille · 3.0 m away");
    expect(items[0]).toContain("Tells Dairy 3 from Dairy 4");
    expect(items[1]).toContain("Narrows down where on Dairy 3 the leak is");
    expect(screen.getByText(/the full analysis after submit is the reference/)).toBeTruthy();
  });

  it("tells two probe points at the same place apart by the distance between them", () => {
    const twin: LiveProbe = { ...probes[0], x: 5.2, reason: { kind: "narrows", rank: 1, fixtureId: "c3" } };
    render(
      <LiveGuidePanel
        state={{ ...state, probes: [probes[0], twin] }}
        words={words}
        from={null}
        onProbe={() => {}}
        {...noCheck}
      />,
    );
    const items = screen.getAllByRole("listitem").map((li) => li.textContent);
    expect(items[0]).toMatch(/^1Probe 1: Dairy 3, at the front grille(Tells|$)/);
    expect(items[1]).toContain("Probe 2: Dairy 3, at the front grille, 1.2 m from probe 1");
  });

  it("hands the tapped probe point to the screen, which opens the keypad there", () => {
    const onProbe = vi.fn();
    render(<LiveGuidePanel state={state} words={words} from={null} onProbe={onProbe} {...noCheck} />);
    fireEvent.click(screen.getByRole("button", { name: /Probe 2/ }));
    expect(onProbe).toHaveBeenCalledWith(probes[1]);
  });

  it("folds to one line that still names the first suspect and counts the probe points, and shows nothing before any reading reaches the alarm", () => {
    const onFold = vi.fn();
    const { rerender, unmount } = render(
      <LiveGuidePanel state={state} words={words} from={null} onProbe={() => {}} {...noCheck} onFold={onFold} />,
    );
    fireEvent.click(screen.getByRole("button", { name: "Hide" }));
    expect(onFold).toHaveBeenCalledWith(true);
    rerender(<LiveGuidePanel state={state} words={words} from={null} onProbe={() => {}} {...noCheck} folded />);
    expect(screen.queryAllByRole("listitem")).toHaveLength(0);
    expect(screen.getByTestId("live-first").textContent).toBe("Suspect 1: Dairy 3, within 2.5 m");
    expect(screen.getByTestId("live-folded").textContent).toBe("2 probe points · live estimate");
    expect(screen.getByRole("button", { name: "Show guide" })).toBeTruthy();
    unmount();
    const quiet = render(
      <LiveGuidePanel
        state={{ ...LIVE_START, estimate: { kind: "no-alarm", readings: 5 } }}
        words={words}
        from={null}
        onProbe={() => {}}
        {...noCheck}
      />,
    );
    expect(quiet.container.textContent).toBe("");
  });

  it("once the sweep is submitted, points to its field map as the reference instead of the probe points", () => {
    render(
      <MemoryRouter>
        <LiveGuidePanel
          state={state}
          words={words}
          from={null}
          onProbe={() => {}}
          {...noCheck}
          folded
          fieldMapHref="/stores/st/sweeps/sw/map"
        />
      </MemoryRouter>,
    );
    expect(screen.getByTestId("live-folded").textContent).toBe("Submitted: see the field map");
    expect(screen.getByRole("link", { name: "field map" }).getAttribute("href")).toBe("/stores/st/sweeps/sw/map");
  });

  it("asks for the supply-air check of a settled suspect and hands the suspect over when asked to read it", () => {
    const onSupplyCheck = vi.fn();
    const suspect = state.estimate?.kind === "suspects" ? state.estimate.suspects[0] : null;
    render(
      <LiveGuidePanel
        state={state}
        words={words}
        from={null}
        onProbe={() => {}}
        supply={{ kind: "ask", suspect: suspect! }}
        onSupplyCheck={onSupplyCheck}
        folded={false}
        onFold={() => {}}
      />,
    );
    expect(screen.getByTestId("supply-ask").textContent).toMatch(
      /Suspect 1 has stayed on Dairy 3 over the last 3 estimates\. Confirm it: read the supply air at Dairy 3's discharge grille/,
    );
    fireEvent.click(screen.getByRole("button", { name: "Read the supply air here" }));
    expect(onSupplyCheck).toHaveBeenCalledWith(suspect);
  });
});
