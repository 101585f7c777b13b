import { randomUUID } from "node:crypto";
import type { Fixture, Vertex } from "#core/contracts/fixtures";

/**
 * The demo store's floor, invented for Plumeline: a 60 m × 36 m supermarket with a back room
 * (walk-in cooler, walk-in freezer, machine room) behind a partition, case lineups along the
 * back wall, a glass-door freezer run on the left wall, produce islands, shelving, checkouts and
 * a bakery corner where aerosol release agent reads on detectors without being a leak.
 */
export const DEMO_PLAN = { widthM: 60, heightM: 36, metresPerPixel: 0.05 } as const;

export type DemoSystemKey = "rack-mt" | "rack-lt" | "walk-ins";

export const DEMO_SYSTEMS: {
  key: DemoSystemKey;
  name: string;
  refrigerantId: string;
  fullChargeLb: number;
  automaticLeakDetection: boolean;
}[] = [
  // No automatic leak detection on Rack A: below the 1,500 lb where Part 84 requires it [S:R4], so
  // after a breach it is inspected quarterly (≥ 500 lb commercial [M]); the demo shows that schedule.
  {
    key: "rack-mt",
    name: "Rack A – medium temperature",
    refrigerantId: "R-448A",
    fullChargeLb: 1150,
    automaticLeakDetection: false,
  },
  {
    key: "rack-lt",
    name: "Rack B – low temperature (CO2)",
    refrigerantId: "R-744",
    fullChargeLb: 420,
    automaticLeakDetection: true,
  },
  {
    key: "walk-ins",
    name: "Condensing unit – walk-ins",
    refrigerantId: "R-404A",
    fullChargeLb: 38,
    automaticLeakDetection: false,
  },
];

const rect = (x: number, y: number, w: number, h: number): Vertex[] => [
  [x, y],
  [x + w, y],
  [x + w, y + h],
  [x, y + h],
];

// Omit distributed over the union, so each kind keeps its own fields.
type Draft = (Fixture extends infer F ? (F extends Fixture ? Omit<F, "id" | "systemId"> : never) : never) & {
  system?: DemoSystemKey;
};

function drafts(): Draft[] {
  const list: Draft[] = [];
  const solid = (kind: "wall" | "gondola" | "checkout" | "column", label: string, polygon: Vertex[]) =>
    list.push({ kind, label, hasFans: false, polygon });

  // Outer walls (0.3 m), the entrance gap in the front wall, and the back-room partition with its opening.
  solid("wall", "North wall", rect(0, 0, 60, 0.3));
  solid("wall", "West wall", rect(0, 0.3, 0.3, 35.4));
  solid("wall", "East wall", rect(59.7, 0.3, 0.3, 35.4));
  solid("wall", "Front wall (west of entrance)", rect(0, 35.7, 34, 0.3));
  solid("wall", "Front wall (east of entrance)", rect(40, 35.7, 20, 0.3));
  solid("wall", "Back-room partition (west)", rect(0.3, 8, 27.7, 0.3));
  solid("wall", "Back-room partition (east)", rect(31, 8, 28.7, 0.3));

  // Back room: rooms whose outline blocks air except at the marked door (bottom edge = edge 2).
  list.push({
    kind: "walk-in-cooler",
    label: "Dairy walk-in cooler",
    hasFans: true,
    polygon: rect(2, 1, 10, 6),
    door: { edge: 2, offset: 1, width: 1.2 },
    system: "walk-ins",
  });
  list.push({
    kind: "walk-in-freezer",
    label: "Walk-in freezer",
    hasFans: true,
    polygon: rect(13.5, 1, 8, 6),
    door: { edge: 2, offset: 1, width: 1.1 },
    system: "walk-ins",
  });
  list.push({
    kind: "machine-room",
    label: "Machine room",
    hasFans: true,
    polygon: rect(47, 1, 12, 6),
    door: { edge: 3, offset: 2, width: 1.0 },
  });

  // Wall lineup of open multideck cases along the partition (3.66 m = 12 ft cases).
  for (let i = 0; i < 6; i++)
    list.push({
      kind: "open-case",
      label: `Dairy ${i + 1}`,
      hasFans: true,
      polygon: rect(2 + i * 3.66, 8.4, 3.66, 1.1),
      system: "rack-mt",
    });
  for (let i = 0; i < 4; i++)
    list.push({
      kind: "open-case",
      label: `Meat ${i + 1}`,
      hasFans: true,
      polygon: rect(32 + i * 3.66, 8.4, 3.66, 1.1),
      system: "rack-mt",
    });

  // Glass-door freezer run on the west wall: four 4.6 m cases of six doors (≈ 0.76 m per door).
  for (let i = 0; i < 4; i++)
    list.push({
      kind: "door-case",
      label: `Frozen ${i + 1}`,
      hasFans: true,
      polygon: rect(0.4, 11 + i * 4.6, 1.1, 4.6),
      doorCount: 6,
      system: "rack-lt",
    });

  // Produce islands.
  list.push({
    kind: "island-case",
    label: "Produce island 1",
    hasFans: true,
    polygon: rect(6, 13, 6, 2),
    system: "rack-mt",
  });
  list.push({
    kind: "island-case",
    label: "Produce island 2",
    hasFans: true,
    polygon: rect(6, 18, 6, 2),
    system: "rack-mt",
  });

  // Shelving, checkouts.
  for (let i = 0; i < 4; i++) solid("gondola", `Aisle ${i + 1}`, rect(22 + i * 4, 13, 1.2, 14));
  for (let i = 0; i < 3; i++) solid("checkout", `Checkout ${i + 1}`, rect(12 + i * 4, 31, 1, 2.6));

  // Bakery corner: aerosol release agent reads on detectors (typical 3 ppm), not a leak.
  list.push({
    kind: "benign-zone",
    label: "Bakery aerosol storage",
    hasFans: false,
    polygon: rect(50, 24, 8, 6),
    note: "Release-agent and whipped-topping aerosols are stored and used here; readings around 3 ppm are normal.",
    typicalPpm: 3,
  });

  // Points: line-set drops over the lineups, valves, evaporator coils in the walk-ins.
  const point = (
    kind: "line-set-drop" | "valve" | "coil",
    label: string,
    x: number,
    y: number,
    system?: DemoSystemKey,
  ) => list.push({ kind, label, hasFans: false, point: { x, y }, system });
  point("line-set-drop", "Drop D1 (dairy)", 9.3, 8.9, "rack-mt");
  point("line-set-drop", "Drop M1 (meat)", 39.3, 8.9, "rack-mt");
  point("line-set-drop", "Drop F1 (frozen)", 0.95, 20.2, "rack-lt");
  point("valve", "Rack A suction service valve", 50, 4, "rack-mt");
  point("valve", "Rack B liquid line ball valve", 54, 4, "rack-lt");
  point("valve", "Freezer run EEV", 0.95, 11.3, "rack-lt");
  point("coil", "Cooler evaporator coil", 7, 1.6, "walk-ins");
  point("coil", "Freezer evaporator coil", 17.5, 1.6, "walk-ins");
  return list;
}

/** The demo fixtures with fresh ids, linked to the seeded systems. */
export function demoFixtures(systemIds: Record<DemoSystemKey, string>): Fixture[] {
  return drafts().map(
    ({ system, ...f }) => ({ ...f, id: randomUUID(), systemId: system ? systemIds[system] : null }) as Fixture,
  );
}
