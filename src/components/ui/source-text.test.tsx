import { render, screen } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { profileReadings, readingTextOf } from "#core/domain/compliance/readings";
import { PART_82_SUBPART_F, US_FEDERAL_PROFILE } from "#core/domain/compliance/us-federal-profile";
import { AcceptedReadingsContext, SourceText } from "./source-text";

// A value of the US profile marked from memory (docs/reference/standards.md §1): a "reading".
const SOURCE = PART_82_SUBPART_F.firstCalculationDays!.source;

describe("the reading marker", () => {
  it("names the reading the rule-profile page lists for the same source", () => {
    const text = readingTextOf(SOURCE);
    expect(text).not.toBeNull();
    expect(profileReadings(US_FEDERAL_PROFILE).map((r) => r.text)).toContain(text);
    expect(readingTextOf("[S:R7] 40 CFR 82.152")).toBeNull();
  });

  it("says whether the owner accepted the reading, and says nothing where acceptance is not known", () => {
    const text = readingTextOf(SOURCE)!;
    const { rerender } = render(<SourceText source={SOURCE} />);
    expect(screen.getByRole("link", { name: "reading" })).toHaveAttribute("href", "/settings#readings");
    rerender(
      <AcceptedReadingsContext.Provider value={new Set([text])}>
        <SourceText source={SOURCE} />
      </AcceptedReadingsContext.Provider>,
    );
    expect(screen.getByRole("link", { name: "reading, accepted" })).toBeVisible();
    // Withdrawn: the same words are no longer among the accepted ones.
    rerender(
      <AcceptedReadingsContext.Provider value={new Set()}>
        <SourceText source={SOURCE} />
      </AcceptedReadingsContext.Provider>,
    );
    expect(screen.getByRole("link", { name: "reading, not accepted" })).toBeVisible();
  });
});
