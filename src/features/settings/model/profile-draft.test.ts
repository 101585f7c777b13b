import { describe, expect, it } from "vitest";
import { getAt, numberFromText, pathKey, setAt } from "./profile-draft";

describe("rule-profile drafts", () => {
  it("replace one value by path without touching the original", () => {
    const draft = { parts: [{ days: { value: 30, source: "a" } }] };
    const next = setAt(draft, ["parts", 0, "days", "value"], 14);
    expect(getAt(next, ["parts", 0, "days", "value"])).toBe(14);
    expect(draft.parts[0].days.value).toBe(30);
    expect(next.parts[0].days.source).toBe("a");
    expect(pathKey(["parts", 0, "days", "value"])).toBe("parts.0.days.value");
  });
  it("keep text that is not a number, so the schema can name the field", () => {
    expect(numberFromText("14")).toBe(14);
    expect(numberFromText(" 2,5 ")).toBe(2.5);
    expect(numberFromText("")).toBe("");
    expect(numberFromText("twelve")).toBe("twelve");
  });
});
