/** The kinds of simulated store the benchmark scores, each with its own leak story. */
// New families go last: a store's random stream is keyed by its family's place here.
export const FAMILIES = [
  "single-fans",
  "single-still",
  "no-leak",
  "bg-zone",
  "two-leaks",
  "walkin-fans",
  "pinpoint-pass",
] as const;
export type Family = (typeof FAMILIES)[number];
/** Made only when `generate.ts --family` names them: the committed and held-out sets hold none yet. */
export const ON_REQUEST_FAMILIES: readonly Family[] = ["pinpoint-pass"];

// The invented store as the simulation sees it: axis-aligned rectangles for bodies and air volumes,
// plus the sweep legs a technician would follow. The contract's polygons are made from these.
import type { Rect } from "./grid";

export type FixtureKind = "open-case" | "island-case" | "door-case" | "walk-in" | "machine-room";
export type RiskKind = "line-set" | "valve" | "coil";
export type Side = "x0" | "x1" | "y0" | "y1" | "centre-x" | "centre-y";

export interface SolidBody {
  id: string;
  rect: Rect;
}

export interface FixtureSpec {
  id: string;
  kind: FixtureKind;
  rect: Rect;
  fans: boolean;
  /** Where the case back (the insulated rear wall, or an island's spine) runs. */
  back: Side;
}

export interface RiskPointSpec {
  id: string;
  kind: RiskKind;
  x: number;
  y: number;
  fixtureId: string;
}

export interface ZoneSpec {
  id: string;
  rect: Rect;
  note: string;
}

export type Point = [number, number];

export interface Leg {
  /** Probe path along case fronts or through a room; consecutive points form straight runs. */
  points: Point[];
  label: string;
}

export interface StoreLayout {
  width: number;
  height: number;
  solids: SolidBody[];
  fixtures: FixtureSpec[];
  riskPoints: RiskPointSpec[];
  /** A benign-source area (e.g. aerosol storage); whether it emits is the scenario's choice. */
  zone: ZoneSpec;
  legs: Leg[];
}

/** The random stream of store `n` of a family: fixed per (family, number), so adding stores never changes existing ones. */
export function storeStream(family: Family, n: number): number {
  return 7919 * (FAMILIES.indexOf(family) + 1) + 104729 * n;
}

/** A benchmark store's file name without its extension: `single-fans-07`. */
export function storeName(family: Family, n: number): string {
  return `${family}-${String(n).padStart(2, "0")}`;
}
