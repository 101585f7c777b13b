import { fireEvent, render, screen } from "@testing-library/react";
import { describe, expect, it, vi } from "vitest";
import { PpmKeypad, type KeypadValue } from "./ppm-keypad";

const initial: KeypadValue = { ppm: 0, atLeast: false, samplePoint: "return", note: "" };

function setup(extra: Partial<Parameters<typeof PpmKeypad>[0]> = {}) {
  const onSave = vi.fn();
  render(
    <PpmKeypad
      title="Reading #3"
      initial={initial}
      recent={[2.5]}
      onSave={onSave}
      onCancel={() => {}}
      cancelLabel="Discard this tap"
      {...extra}
    />,
  );
  return onSave;
}

describe("the ppm keypad", () => {
  it("saves a zero in one tap, keeping the remembered sample point", () => {
    const onSave = setup();
    fireEvent.click(screen.getByRole("button", { name: "0 ppm — save" }));
    expect(onSave).toHaveBeenCalledWith({ ppm: 0, atLeast: false, samplePoint: "return", note: "" });
  });

  it("types decimals, stores an over-range entry as at least, and offers recent values", () => {
    const onSave = setup();
    for (const k of ["1", "Decimal point", "5"]) fireEvent.click(screen.getByRole("button", { name: k }));
    fireEvent.click(screen.getByRole("button", { name: "Over range" }));
    fireEvent.click(screen.getByRole("button", { name: "Save" }));
    expect(onSave).toHaveBeenLastCalledWith({ ppm: 1.5, atLeast: true, samplePoint: "return", note: "" });
    fireEvent.click(screen.getByRole("button", { name: "2.5 ppm" }));
    expect(onSave).toHaveBeenLastCalledWith({ ppm: 2.5, atLeast: false, samplePoint: "return", note: "" });
  });

  it("shows a decimal-comma company's mark on the key, in the value and in the recent picks, and saves the number", () => {
    // "1.234,5" and "1 234,5" write the decimal mark as a comma (CLDR de-DE, fr-FR: Intl.NumberFormat).
    const mark = new Intl.NumberFormat("de-DE").formatToParts(1.5).find((p) => p.type === "decimal")!.value;
    const onSave = setup({ numberFormat: "1.234,5" });
    for (const k of ["1", "Decimal point", "5"]) fireEvent.click(screen.getByRole("button", { name: k }));
    expect(screen.getByRole("button", { name: "Decimal point" }).textContent).toBe(mark);
    expect(screen.getByLabelText("Value").textContent).toContain(`1${mark}5`);
    fireEvent.click(screen.getByRole("button", { name: "Save" }));
    expect(onSave).toHaveBeenLastCalledWith({ ppm: 1.5, atLeast: false, samplePoint: "return", note: "" });
    fireEvent.click(screen.getByRole("button", { name: `2${mark}5 ppm` }));
    expect(onSave).toHaveBeenLastCalledWith({ ppm: 2.5, atLeast: false, samplePoint: "return", note: "" });
  });

  it("keeps the remembered sample point behind one button and changes it from the choices it opens", () => {
    const onSave = setup();
    expect(screen.queryByRole("radiogroup", { name: "Sample point" })).toBeNull();
    fireEvent.click(screen.getByRole("button", { name: /^Sample point: Return air/ }));
    fireEvent.click(screen.getByRole("radio", { name: "Floor level" }));
    expect(screen.queryByRole("radiogroup", { name: "Sample point" })).toBeNull();
    fireEvent.click(screen.getByRole("button", { name: "0 ppm — save" }));
    expect(onSave).toHaveBeenLastCalledWith({ ppm: 0, atLeast: false, samplePoint: "floor", note: "" });
  });

  it("refuses a value above the 10,000 ppm ceiling", () => {
    setup();
    for (const k of ["1", "2", "0", "0", "0"])
      fireEvent.click(screen.getByRole("button", { name: k, exact: true } as never));
    expect(screen.getByRole("button", { name: "Save" })).toHaveProperty("disabled", true);
    expect(screen.getByText(/Above the 10,000 ppm ceiling/)).toBeVisible();
  });

  it("maps a detector level to its ppm band, stored as at least the band's floor", () => {
    const onSave = setup({
      levels: [
        { level: "1", minPpm: 0, maxPpm: 5 },
        { level: "2", minPpm: 5, maxPpm: 20 },
        { level: "3", minPpm: 20, maxPpm: null },
      ],
    });
    fireEvent.click(screen.getByRole("button", { name: "Level 2" }));
    expect(onSave).toHaveBeenLastCalledWith({
      ppm: 5,
      atLeast: true,
      samplePoint: "return",
      note: "Level 2 (5–20 ppm)",
    });
    fireEvent.click(screen.getByRole("button", { name: "Level 3" }));
    expect(onSave).toHaveBeenLastCalledWith({
      ppm: 20,
      atLeast: true,
      samplePoint: "return",
      note: "Level 3 (20+ ppm)",
    });
  });
});
