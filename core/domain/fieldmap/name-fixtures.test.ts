import { describe, expect, it } from "vitest";
import { nameFixtures } from "./name-fixtures";

describe("naming fixtures in the locator's sentences", () => {
  const a = "4e59f119-b35d-4566-9617-c22926646d09";
  const w = "6fdd8f5c-3624-47a3-9a6c-8ad8025af9ea";
  const labels = new Map([
    [a, "Meat 2"],
    [w, "Dairy walk-in cooler"],
  ]);

  it("swaps ids and room walls for names and leaves unknown ids alone", () => {
    expect(nameFixtures(`one source inside open case ${a} explains them best`, labels)).toBe(
      "one source inside open case Meat 2 explains them best",
    );
    expect(nameFixtures(`blocked by ${w}:wall:2`, labels)).toBe("blocked by the wall of Dairy walk-in cooler");
    const unknown = "00000000-0000-4000-8000-000000000000";
    expect(nameFixtures(`near ${unknown}`, labels)).toBe(`near ${unknown}`);
  });
});
