import { describe, expect, it, vi } from "vitest";
import { fireEvent, render, screen } from "@testing-library/react";
import { TimeZoneField } from "./time-zone-field";

describe("time zone field", () => {
  it("shows the chosen zone as a place, finds another by a typed city and picks it from the list", () => {
    const onChange = vi.fn();
    render(<TimeZoneField value="America/Chicago" onChange={onChange} />);
    const box = screen.getByRole("combobox", { name: "Time zone" });
    expect(box).toHaveValue("Chicago, America");

    fireEvent.focus(box);
    fireEvent.change(box, { target: { value: "new york" } });
    const option = screen.getByRole("option", { name: /New York, America/ });
    expect(option).toBeVisible();
    fireEvent.mouseDown(option);
    expect(onChange).toHaveBeenCalledWith("America/New_York");
  });

  it("picks with the keyboard and closes on Escape", () => {
    const onChange = vi.fn();
    render(<TimeZoneField value="UTC" onChange={onChange} />);
    const box = screen.getByRole("combobox", { name: "Time zone" });
    fireEvent.change(box, { target: { value: "berlin" } });
    fireEvent.keyDown(box, { key: "Enter" });
    expect(onChange).toHaveBeenCalledWith("Europe/Berlin");

    fireEvent.change(box, { target: { value: "zzz" } });
    expect(screen.getByText("No zone matches “zzz”.")).toBeVisible();
    fireEvent.keyDown(box, { key: "Escape" });
    expect(screen.queryByRole("listbox")).toBeNull();
  });
});
