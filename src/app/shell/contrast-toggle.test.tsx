import { fireEvent, render, screen } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { applyStoredContrast } from "../../lib/contrast";
import { ContrastToggle } from "./contrast-toggle";

describe("high-contrast toggle", () => {
  it("puts a class on <html>, says it is pressed and remembers the choice", () => {
    render(<ContrastToggle />);
    const button = screen.getByRole("button", { name: "High contrast" });
    expect(button.getAttribute("aria-pressed")).toBe("false");

    fireEvent.click(button);
    expect(document.documentElement.classList.contains("hc")).toBe(true);
    expect(button.getAttribute("aria-pressed")).toBe("true");

    // A fresh visit starts from the remembered choice.
    document.documentElement.className = "";
    applyStoredContrast();
    expect(document.documentElement.classList.contains("hc")).toBe(true);

    fireEvent.click(button);
    expect(document.documentElement.classList.contains("hc")).toBe(false);
    applyStoredContrast();
    expect(document.documentElement.classList.contains("hc")).toBe(false);
  });
});
