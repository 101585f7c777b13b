import { describe, expect, it } from "vitest";
import { readRetireDraft } from "./retire-draft";

const bounds = { today: "2026-12-05", inServiceOn: "2024-03-01" };

describe("the retire dialog's input (decision 0124)", () => {
  it("reads a day, a reason and its words", () => {
    expect(
      readRetireDraft({ retiredOn: "2026-10-31", reasonKind: "replaced", reason: " CO2 booster " }, bounds),
    ).toEqual({ input: { retiredOn: "2026-10-31", reasonKind: "replaced", reason: "CO2 booster" }, errors: null });
  });

  it("names each field that is wrong before anything is sent", () => {
    expect(readRetireDraft({ retiredOn: "", reasonKind: "", reason: "" }, bounds).errors).toEqual({
      retiredOn: "must be a date as YYYY-MM-DD",
      reasonKind: "pick why the system left service",
    });
    expect(readRetireDraft({ retiredOn: "2026-12-06", reasonKind: "removed", reason: "" }, bounds).errors).toEqual({
      retiredOn: "must not be after today (5 Dec 2026)",
    });
    expect(readRetireDraft({ retiredOn: "2024-02-29", reasonKind: "removed", reason: "" }, bounds).errors).toEqual({
      retiredOn: "must not be before the day it entered service (1 Mar 2024)",
    });
    expect(readRetireDraft({ retiredOn: "2026-10-31", reasonKind: "other", reason: "  " }, bounds).errors).toEqual({
      reason: "say why the system left service",
    });
  });
});
