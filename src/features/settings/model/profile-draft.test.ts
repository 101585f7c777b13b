import { describe, expect, it } from "vitest";
import { addTopBand, getAt, numberFromText, pathKey, removeTopBand, setAt } from "./profile-draft";
import { ruleProfileSchema } from "#core/contracts/rule-profile";
import { startCustomProfile } from "#core/domain/compliance/company-profile";

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

  it("add and remove a top band so the bands still pass the shared schema", () => {
    const p = startCustomProfile("eu-fgas");
    const bands = p.leakChecks!.co2eBands.value; // 5–50–500 t [S:E1]
    const more = addTopBand(bands);
    expect(more.map((b) => [b.from, b.to])).toEqual([
      [5, 50],
      [50, 500],
      [500, 5000],
      [5000, null],
    ]);
    expect(ruleProfileSchema.safeParse(setAt(p, ["leakChecks", "co2eBands", "value"], more)).success).toBe(true);
    const fewer = removeTopBand(bands);
    expect(fewer.map((b) => [b.from, b.to])).toEqual([
      [5, 50],
      [50, null],
    ]);
    expect(ruleProfileSchema.safeParse(setAt(p, ["leakChecks", "co2eBands", "value"], fewer)).success).toBe(true);
  });
});
