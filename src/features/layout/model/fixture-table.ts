/** Rows of the fixtures list view: plain values in metres, sortable, one per fixture. */
import { polygonArea } from "#core/analysis/geometry/polygon-area";
import {
  FIXTURE_FAMILY,
  FIXTURE_KIND_NAMES,
  type FixtureFamily,
  type FixtureKind,
} from "#core/contracts/fixture-kinds";
import type { Fixture } from "#core/contracts/fixtures";
import { fixtureBounds, fixtureCentroid } from "./fixture-geometry";
import { sceneFixtures, type Scene } from "./scene";

export interface FixtureRow {
  id: string;
  kind: FixtureKind;
  kindName: string;
  family: FixtureFamily;
  label: string;
  systemId: string | null;
  hasFans: boolean;
  /** Centre in plan metres (the point itself for points). */
  x: number;
  y: number;
  /** Bounding-box width and depth, and outline area; null for points. */
  widthM: number | null;
  depthM: number | null;
  areaM2: number | null;
}

export function fixtureRow(f: Fixture): FixtureRow {
  const [x, y] = fixtureCentroid(f);
  const b = fixtureBounds(f);
  const isPoint = "point" in f;
  return {
    id: f.id,
    kind: f.kind,
    kindName: FIXTURE_KIND_NAMES[f.kind],
    family: FIXTURE_FAMILY[f.kind],
    label: f.label,
    systemId: f.systemId,
    hasFans: f.hasFans,
    x,
    y,
    widthM: isPoint ? null : b.maxX - b.minX,
    depthM: isPoint ? null : b.maxY - b.minY,
    areaM2: isPoint ? null : polygonArea(f.polygon),
  };
}

export type RowKey = "kindName" | "label" | "x" | "y" | "areaM2" | "family";

/**
 * Rows in drawing order, or sorted by a column. Text sorts by the user's locale with numbers
 * in labels in numeric order ("Case 2" before "Case 10"); missing values go last.
 */
export function fixtureRows(scene: Scene, sortBy: RowKey | null = null, descending = false): FixtureRow[] {
  const rows = sceneFixtures(scene).map(fixtureRow);
  if (!sortBy) return rows;
  const collator = new Intl.Collator(undefined, { numeric: true, sensitivity: "base" });
  const sign = descending ? -1 : 1;
  return rows.sort((a, b) => {
    const va = a[sortBy];
    const vb = b[sortBy];
    if (va === null || vb === null) return va === vb ? 0 : va === null ? 1 : -1;
    return (
      sign * (typeof va === "number" && typeof vb === "number" ? va - vb : collator.compare(String(va), String(vb)))
    );
  });
}
