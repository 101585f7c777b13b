import { describe, expect, it } from "vitest";
import { paperFor } from "./paper";

describe("report paper", () => {
  it("is A4 under EU F-gas and US Letter under US federal rules; a custom profile follows its base", () => {
    expect(paperFor({ kind: "eu-fgas" })).toBe("a4");
    expect(paperFor({ kind: "us-federal" })).toBe("letter");
    expect(paperFor({ kind: "custom", basedOn: "eu-fgas" })).toBe("a4");
    expect(paperFor({ kind: "custom", basedOn: "us-federal" })).toBe("letter");
  });
});
