import type { Fixture } from "#core/contracts/fixtures";
import type { Plan } from "#core/contracts/plans";
import { fixtures, plans } from "../schema/index";

export type PlanRow = typeof plans.$inferSelect;
export type FixtureRow = typeof fixtures.$inferSelect;

/** Fixtures may be saved once the plan has a size in metres (calibrated, or blank). */
export function isCalibrated(p: PlanRow): boolean {
  return p.widthM !== null && p.heightM !== null;
}

export function planBounds(p: PlanRow): { width: number; height: number } | null {
  return isCalibrated(p) ? { width: p.widthM!, height: p.heightM! } : null;
}

export function toPlan(p: PlanRow, fixtureCount: number): Plan {
  const base = `/api/plans/${p.id}/image?variant=`;
  const hasImage = p.source === "image" && p.displayKey && p.imageWidthPx && p.imageHeightPx;
  return {
    id: p.id,
    storeId: p.storeId,
    version: p.version,
    source: p.source,
    image: hasImage
      ? {
          widthPx: p.imageWidthPx!,
          heightPx: p.imageHeightPx!,
          originalWidthPx: p.originalWidthPx ?? p.imageWidthPx!,
          originalHeightPx: p.originalHeightPx ?? p.imageHeightPx!,
          originalMime: p.originalMime ?? "image/png",
          displayUrl: `${base}display`,
          thumbUrl: `${base}thumb`,
          originalUrl: `${base}original`,
        }
      : null,
    metresPerPixel: p.metresPerPixel,
    calibration: p.calibration ?? null,
    calibrated: isCalibrated(p),
    widthM: p.widthM,
    heightM: p.heightM,
    previousPlanId: p.previousPlanId,
    alignment: p.alignment ?? null,
    alignmentMatched: p.alignmentMatched,
    layoutRevision: p.layoutRevision,
    fixtureCount,
    createdAt: p.createdAt.toISOString(),
  };
}

export function fixtureToRow(planId: string, f: Fixture, position: number): FixtureRow {
  const row: FixtureRow = {
    planId,
    id: f.id,
    kind: f.kind,
    label: f.label,
    systemId: f.systemId,
    hasFans: f.hasFans,
    polygon: null,
    pointX: null,
    pointY: null,
    doorCount: null,
    door: null,
    note: null,
    typicalPpm: null,
    position,
  };
  if ("point" in f) {
    row.pointX = f.point.x;
    row.pointY = f.point.y;
    return row;
  }
  row.polygon = f.polygon;
  if (f.kind === "door-case") row.doorCount = f.doorCount;
  if ("door" in f) row.door = f.door;
  if (f.kind === "benign-zone") {
    row.note = f.note;
    row.typicalPpm = f.typicalPpm;
  }
  return row;
}

/** Rows only ever come from validated fixtures, so the kind decides the shape. */
export function rowToFixture(r: FixtureRow): Fixture {
  const base = { id: r.id, label: r.label, systemId: r.systemId, hasFans: r.hasFans };
  switch (r.kind) {
    case "line-set-drop":
    case "valve":
    case "coil":
      return { ...base, kind: r.kind, point: { x: r.pointX!, y: r.pointY! } };
    case "door-case":
      return { ...base, kind: r.kind, polygon: r.polygon!, doorCount: r.doorCount! };
    case "walk-in-cooler":
    case "walk-in-freezer":
    case "machine-room":
      return { ...base, kind: r.kind, polygon: r.polygon!, door: r.door ?? null };
    case "benign-zone":
      return { ...base, kind: r.kind, polygon: r.polygon!, note: r.note ?? "", typicalPpm: r.typicalPpm };
    case "open-case":
    case "island-case":
    case "wall":
    case "gondola":
    case "checkout":
    case "column":
      return { ...base, kind: r.kind, polygon: r.polygon! };
    default:
      throw new Error(`fixture ${r.id} has unknown kind ${r.kind}`);
  }
}
