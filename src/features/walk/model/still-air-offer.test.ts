import { describe, expect, it } from "vitest";
import type { Fixture } from "#core/contracts/fixtures";
import type { LocalPass } from "./local-types";
import { stillAirOffer } from "./still-air-offer";

const fixture = (id: string, kind: "open-case" | "island-case" | "gondola", hasFans: boolean): Fixture => ({
  id,
  kind,
  label: id,
  systemId: null,
  hasFans,
  polygon: [
    [1, 2],
    [9, 2],
    [9, 3],
    [1, 3],
  ],
});
const fixtures = [
  fixture("Dairy 3", "open-case", true),
  fixture("Produce island", "island-case", false),
  fixture("Aisle 4", "gondola", false),
];
const pass = (fixtureId: string | null, endedAt: string | null = "2026-11-02T14:30:00Z"): LocalPass => ({
  id: "p2",
  fans: "stopped",
  defrost: false,
  fixtureId,
  startedAt: "2026-11-02T14:10:00Z",
  endedAt,
  restoreAfterMin: 20,
  sync: { kind: "queued" },
});
const running = { fans: "running" as const, passes: [] };

describe("the still-air pass offered on a settled live suspect", () => {
  it("offers it at a case whose fans run, as the analysis's own next check says (stop the fans, re-check close)", () => {
    expect(stillAirOffer(running, fixtures, { fixtureId: "Dairy 3" })?.id).toBe("Dairy 3");
  });

  it("offers nothing for a fixture without fans, a solid body, no fixture, or no settled suspect", () => {
    expect(stillAirOffer(running, fixtures, { fixtureId: "Produce island" })).toBeNull();
    expect(stillAirOffer(running, fixtures, { fixtureId: "Aisle 4" })).toBeNull();
    expect(stillAirOffer(running, fixtures, { fixtureId: null })).toBeNull();
    expect(stillAirOffer(running, fixtures, null)).toBeNull();
  });

  it("offers nothing once a pass stilled that fixture or the whole store, while a pass is open, or in a still-air sweep", () => {
    const at = { fixtureId: "Dairy 3" };
    expect(stillAirOffer({ fans: "running", passes: [pass("Dairy 3")] }, fixtures, at)).toBeNull();
    expect(stillAirOffer({ fans: "running", passes: [pass(null)] }, fixtures, at)).toBeNull();
    expect(stillAirOffer({ fans: "running", passes: [pass("Produce island", null)] }, fixtures, at)).toBeNull();
    expect(stillAirOffer({ fans: "stopped", passes: [] }, fixtures, at)).toBeNull();
    // a pass over another fixture, ended: this one may still be stilled
    expect(stillAirOffer({ fans: "running", passes: [pass("Produce island")] }, fixtures, at)?.id).toBe("Dairy 3");
  });
});
