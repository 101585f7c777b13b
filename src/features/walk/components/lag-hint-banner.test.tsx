import { render, screen } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { LagHintBanner } from "./lag-hint-banner";

const hint = { index: 6, x: 3, y: 4, beforeDelay: false, backM: 5, recheck: [] };

describe("the lag hint banner", () => {
  it("names the sweep's peak, the reading it came from and where its air was sampled, in metres", () => {
    render(<LagHintBanner hint={hint} ppm={30} readingNumber={7} place="Dairy case 2" onDismiss={() => {}} />);
    const text = screen.getByTestId("lag-hint").textContent;
    expect(text).toContain("Alarm: 30 ppm peak so far (#7), sampled at Dairy case 2.");
    expect(text).toContain("about 5.0 m back along your path");
    expect(text).toContain("about 0.6 m spacing");
  });

  it("and in feet and inches for those who work in them", () => {
    render(
      <LagHintBanner hint={hint} ppm={9} readingNumber={7} place={null} lengthUnit="ft-in" onDismiss={() => {}} />,
    );
    // 1 ft = 0.3048 m exactly (NIST SP 811): 5 m = 16.40 ft = 16 ft 4.85 in, to the inch 16 ft 5 in;
    // 0.6 m = 23.6 in, to the inch 2 ft 0 in.
    const text = screen.getByTestId("lag-hint").textContent;
    expect(text).toContain("peak so far (#7).");
    expect(text).toContain("about 16 ft 5 in back along your path");
    expect(text).toContain("about 2 ft 0 in spacing");
  });
});
