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
        numberFormat="1,234.5"
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
        numberFormat="1,234.5"
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
        numberFormat="1,234.5"
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
        numberFormat="1,234.5"
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

  it("writes the seconds in a decimal-comma company's format, in the words and on the button", () => {
    // CLDR's de-DE symbols (Intl.NumberFormat): 6.5 is written "6,5".
    const de = new Intl.NumberFormat("de-DE").format(6.5);
    const commaWords = delayCheckWords(
      { statedS: 6.5, estimatedS: 8, supported: true, usedS: 8, statedMisfit: 0.4, estimatedMisfit: 0.1 },
      wordsContext({ length: "m", mass: "kg", names: new Map(), delaySetByHand: false, numbers: "1.234,5" }, 1.5),
    );
    const onUpdate = vi.fn();
    render(
      <DelayCheckPanel
        numberFormat="1.234,5"
        words={commaWords}
        sweepDelayS={5}
        canUpdate
        onUpdate={onUpdate}
        busy={false}
        updatedTo={null}
        error={null}
      />,
    );
    expect(screen.getByText(`Readings fit a ${de} s delay better than the detector's 5 s.`)).toBeVisible();
    fireEvent.click(screen.getByRole("button", { name: `Set the detector's delay to ${de} s` }));
    expect(onUpdate).toHaveBeenCalledWith(6.5);
  });
});
