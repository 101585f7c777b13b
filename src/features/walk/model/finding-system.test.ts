import { describe, expect, it } from "vitest";
import { findingSystemId } from "./finding-system";

const fixtures = [
  { id: "case-1", systemId: "rack-a" },
  { id: "case-2", systemId: "rack-old" },
  { id: "wall-1", systemId: null },
];

describe("the system a leak marked at a fixture is recorded on", () => {
  it("is the fixture's system while it is in service", () => {
    expect(findingSystemId(fixtures, "case-1", new Set(["rack-a"]))).toBe("rack-a");
  });
  it("is none when the fixture's system is retired (not among the store's systems in service)", () => {
    expect(findingSystemId(fixtures, "case-2", new Set(["rack-a"]))).toBeNull();
  });
  it("is none without a fixture or for a fixture with no system", () => {
    expect(findingSystemId(fixtures, null, new Set(["rack-a"]))).toBeNull();
    expect(findingSystemId(fixtures, "wall-1", new Set(["rack-a"]))).toBeNull();
  });
});
