import { fireEvent, screen } from "@testing-library/react";
import { describe, expect, it, vi } from "vitest";
import { renderOnRoute } from "../../../../../tests/helpers/render-client";
import { stubFetch } from "../../../../../tests/helpers/stub-fetch";
import { ArrayDialog } from "./array-dialog";

describe("array dialog", () => {
  it("offers the spacing in feet and inches to a feet-and-inches member, and keeps the exact width untouched", () => {
    stubFetch({});
    const onArray = vi.fn();
    // 2.4384 m = 8 ft exactly (1 ft = 0.3048 m, NIST SP 811).
    renderOnRoute(
      <ArrayDialog size={{ width: 2.4384, depth: 1.1 }} preference="ft-in" onArray={onArray} onClose={() => {}} />,
      { path: "/layout" },
    );
    const spacing = screen.getByLabelText(/Spacing, centre to centre/) as HTMLInputElement;
    expect(spacing.value).toBe("8 ft 0 in");
    fireEvent.click(screen.getByRole("button", { name: "Make copies" }));
    expect(onArray).toHaveBeenLastCalledWith(4, 2.4384, [1, 0]);
    // 9 ft = 2.7432 m.
    fireEvent.change(spacing, { target: { value: "9 ft" } });
    fireEvent.click(screen.getByRole("button", { name: "Make copies" }));
    expect(onArray.mock.lastCall![1]).toBeCloseTo(2.7432, 9);
  });
  it("in metres for a metric member", () => {
    stubFetch({});
    renderOnRoute(
      <ArrayDialog size={{ width: 2.4384, depth: 1.1 }} preference="m" onArray={() => {}} onClose={() => {}} />,
      { path: "/layout" },
    );
    expect((screen.getByLabelText(/Spacing, centre to centre/) as HTMLInputElement).value).toBe("2.438 m");
  });
});
