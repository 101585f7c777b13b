import { describe, expect, it, vi } from "vitest";
import { fireEvent, render, screen } from "@testing-library/react";
import { delayCheckWords } from "#core/domain/locator-words/delay-words";
import { wordsContext } from "#core/domain/locator-words/present-analysis";
import { DelayCheckPanel } from "./delay-check-panel";

// shifts 6.5 s stated and 8 s estimated with a 1.5 s time constant: delays of 5 s and 6.5 s
const words = delayCheckWords(
  { statedS: 6.5, estimatedS: 8, supported: true, usedS: 8, statedMisfit: 0.4, estimatedMisfit: 0.1 },
  wordsContext({ length: "m", mass: "kg", names: new Map(), delaySetByHand: false }, 1.5),
);

describe("delay check panel", () => {
  it("shows what the readings fit and offers members who manage detectors to update the detector", () => {
    const onUpdate = vi.fn();
    const { rerender } = render(
      <DelayCheckPanel
        words={words}
        sweepDelayS={5}
        canUpdate
        onUpdate={onUpdate}
        busy={false}
        updatedTo={null}
        error={null}
      />,
    );
    expect(screen.getByText("Readings fit a 6.5 s delay better than the detector's 5 s.")).toBeVisible();
    fireEvent.click(screen.getByRole("button", { name: "Set the detector's delay to 6.5 s" }));
    expect(onUpdate).toHaveBeenCalledWith(6.5);
    rerender(
      <DelayCheckPanel
        words={words}
        sweepDelayS={5}
        canUpdate
        onUpdate={onUpdate}
        busy={false}
        updatedTo={6.5}
        error={null}
      />,
    );
    expect(screen.getByText(/The detector's delay is now 6.5 s/)).toBeVisible();
    expect(screen.queryByRole("button", { name: /Set the detector's delay/ })).toBeNull();
  });

  it("offers nothing to members who may not edit detectors, or when the readings support no other delay", () => {
    render(
      <DelayCheckPanel
        words={words}
        sweepDelayS={5}
        canUpdate={false}
        onUpdate={() => {}}
        busy={false}
        updatedTo={null}
        error={null}
      />,
    );
    expect(screen.queryByRole("button")).toBeNull();
    render(
      <DelayCheckPanel
        words={{ ...words, suggestedDelayS: null }}
        sweepDelayS={5}
        canUpdate
        onUpdate={() => {}}
        busy={false}
        updatedTo={null}
        error={null}
      />,
    );
    expect(screen.queryByRole("button")).toBeNull();
  });
});
