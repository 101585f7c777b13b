import { fireEvent, screen } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import type { FindingDetail } from "#core/contracts/finding-actions";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { FindingActions } from "./finding-actions";

// A confirmed leak on a rack retired on 30 Apr 2026 (docs/decisions/0166).
const finding = {
  id: "6f1e2b1c-3d4e-4f50-8a6b-7c8d9e0f1a2b",
  component: "brazed-joint",
  nextActions: ["close-left-service", "repair", "dismiss"],
  systemRetiredOn: "2026-04-30",
} as unknown as FindingDetail;

describe("the next step of a finding whose system left service", () => {
  it("offers the closing first, dated today and not before the retirement day; other steps by that day", () => {
    stubFetch({});
    renderOnRoute(<FindingActions finding={finding} role="engineer" today="2026-06-10" />, { path: "/findings/x" });
    const buttons = screen.getAllByRole("button", { pressed: false }).map((b) => b.textContent);
    expect(screen.getByRole("button", { pressed: true })).toHaveTextContent("Close: the system left service");
    expect(buttons).toEqual(["Record the repair", "Dismiss the finding"]);
    const date = screen.getByLabelText("Date") as HTMLInputElement;
    expect([date.value, date.min, date.max]).toEqual(["2026-06-10", "2026-04-30", "2026-06-10"]);
    fireEvent.click(screen.getByRole("button", { name: "Record the repair" }));
    expect([date.value, date.min, date.max]).toEqual(["2026-04-30", "", "2026-04-30"]);
  });

  it("leaves the closing to engineers and owners: a technician sees only the steps of the record", () => {
    stubFetch({});
    renderOnRoute(<FindingActions finding={finding} role="technician" today="2026-06-10" />, { path: "/findings/x" });
    expect(screen.queryByRole("button", { name: "Close: the system left service" })).toBeNull();
    expect(screen.getByRole("button", { pressed: true })).toHaveTextContent("Record the repair");
    expect((screen.getByLabelText("Date") as HTMLInputElement).value).toBe("2026-04-30");
  });
});
