/**
 * How each fixture kind looks on every plan screen: one table. The layout editor draws the full
 * look (`lookOf`); the Walk screen and the field map draw fixtures as a quiet backdrop under their
 * own data (`backdropOf`). The full look is our own scheme, readable without colour. Families
 * differ by line and fill, not hue alone:
 * - air volumes: a light fill and a solid outline; rooms (walk-ins, machine room) a thick wall
 *   outline with the door gap left open; glass-door cases show their doors as ticks;
 * - solid bodies: hatched (diagonal lines), as sections are drawn on building plans;
 * - zones: a dashed outline over a dotted fill;
 * - points: a glyph per kind (circle with a cross, bow-tie, zig-zag square).
 * Hues come from the Okabe–Ito palette, chosen to stay distinct under the common forms of
 * colour-vision deficiency (Okabe & Ito, "Color Universal Design", 2008).
 */
import { FIXTURE_FAMILY, type FixtureKind } from "#core/contracts/fixture-kinds";

export const OKABE_ITO = {
  blue: "#0072B2",
  orange: "#E69F00",
  vermilion: "#D55E00",
  green: "#009E73",
  purple: "#CC79A7",
  sky: "#56B4E9",
  black: "#000000",
} as const;

export type Pattern = "none" | "hatch" | "cross-hatch" | "dots";

export interface FixtureLook {
  stroke: string;
  /** Screen pixels (strokes do not scale with zoom). */
  strokeWidth: number;
  fill: string;
  pattern: Pattern;
  dash: number[] | null;
  /** Rooms: the outline is a wall with a gap at the door. */
  wall: boolean;
}

const LOOKS: Record<Exclude<FixtureKind, "line-set-drop" | "valve" | "coil">, FixtureLook> = {
  "open-case": {
    stroke: OKABE_ITO.blue,
    strokeWidth: 2,
    fill: "rgba(86,180,233,0.30)",
    pattern: "none",
    dash: null,
    wall: false,
  },
  "island-case": {
    stroke: OKABE_ITO.blue,
    strokeWidth: 2,
    fill: "rgba(86,180,233,0.18)",
    pattern: "dots",
    dash: null,
    wall: false,
  },
  "door-case": {
    stroke: OKABE_ITO.blue,
    strokeWidth: 2.5,
    fill: "rgba(86,180,233,0.30)",
    pattern: "none",
    dash: null,
    wall: false,
  },
  "walk-in-cooler": {
    stroke: OKABE_ITO.blue,
    strokeWidth: 5,
    fill: "rgba(86,180,233,0.12)",
    pattern: "none",
    dash: null,
    wall: true,
  },
  "walk-in-freezer": {
    stroke: "#003f66",
    strokeWidth: 5,
    fill: "rgba(0,114,178,0.16)",
    pattern: "none",
    dash: null,
    wall: true,
  },
  "machine-room": {
    stroke: OKABE_ITO.vermilion,
    strokeWidth: 5,
    fill: "rgba(213,94,0,0.10)",
    pattern: "none",
    dash: null,
    wall: true,
  },
  wall: {
    stroke: "#333333",
    strokeWidth: 1.5,
    fill: "rgba(60,60,60,0.55)",
    pattern: "cross-hatch",
    dash: null,
    wall: false,
  },
  gondola: {
    stroke: "#5b4a00",
    strokeWidth: 1.5,
    fill: "rgba(230,159,0,0.22)",
    pattern: "hatch",
    dash: null,
    wall: false,
  },
  checkout: {
    stroke: "#5b4a00",
    strokeWidth: 1.5,
    fill: "rgba(230,159,0,0.35)",
    pattern: "hatch",
    dash: null,
    wall: false,
  },
  column: {
    stroke: "#222222",
    strokeWidth: 1.5,
    fill: "rgba(40,40,40,0.7)",
    pattern: "cross-hatch",
    dash: null,
    wall: false,
  },
  "benign-zone": {
    stroke: OKABE_ITO.green,
    strokeWidth: 2,
    fill: "rgba(0,158,115,0.10)",
    pattern: "dots",
    dash: [8, 5],
    wall: false,
  },
};

export function lookOf(kind: FixtureKind): FixtureLook {
  return kind in LOOKS
    ? LOOKS[kind as keyof typeof LOOKS]
    : { stroke: OKABE_ITO.purple, strokeWidth: 2, fill: "#ffffff", pattern: "none", dash: null, wall: false };
}

export const POINT_COLOURS: Record<"line-set-drop" | "valve" | "coil", string> = {
  "line-set-drop": "#7a2e5c",
  valve: OKABE_ITO.vermilion,
  coil: "#005a8c",
};

/** The selection's colour: the focus amber of the app's theme, also drawn thicker. */
export const SELECTION_STROKE = "#d98e04";

const TILE = 12;
const patternCache = new Map<Pattern, HTMLCanvasElement>();

/** A small repeating tile for Konva's fillPatternImage; made once per pattern. */
export function patternTile(pattern: Pattern, colour = "rgba(0,0,0,0.55)"): HTMLCanvasElement | undefined {
  if (pattern === "none" || typeof document === "undefined") return undefined;
  const hit = patternCache.get(pattern);
  if (hit) return hit;
  const c = document.createElement("canvas");
  c.width = TILE;
  c.height = TILE;
  const g = c.getContext("2d");
  if (!g) return undefined;
  g.strokeStyle = colour;
  g.fillStyle = colour;
  g.lineWidth = 1.2;
  if (pattern === "hatch" || pattern === "cross-hatch") {
    g.beginPath();
    // Diagonals drawn past the tile's corners so the tiles join without gaps.
    g.moveTo(-2, TILE + 2);
    g.lineTo(TILE + 2, -2);
    g.moveTo(-2, 2);
    g.lineTo(2, -2);
    g.moveTo(TILE - 2, TILE + 2);
    g.lineTo(TILE + 2, TILE - 2);
    if (pattern === "cross-hatch") {
      g.moveTo(-2, -2);
      g.lineTo(TILE + 2, TILE + 2);
    }
    g.stroke();
  } else {
    g.beginPath();
    g.arc(TILE / 2, TILE / 2, 1.3, 0, Math.PI * 2);
    g.fill();
  }
  patternCache.set(pattern, c);
  return c;
}

/** A tile is PATTERN_METRES wide on the plan: hatching scales with the drawing, like a printed plan's. */
export const PATTERN_METRES = 0.45;
export const PATTERN_SCALE = PATTERN_METRES / TILE;

/**
 * A fixture under the Walk screen's coverage or the field map's concentrations: only its weight,
 * so the data on top keeps the colour. "ink": walls and columns, drawn solid (nobody walks
 * through them); "shade": other solid bodies (shelving, checkouts); "outline": air volumes;
 * "dashed": zones; "point": risk points.
 */
export type BackdropWeight = "ink" | "shade" | "outline" | "dashed" | "point";

export function backdropOf(kind: string): BackdropWeight {
  if (kind === "wall" || kind === "column") return "ink";
  switch (FIXTURE_FAMILY[kind as FixtureKind]) {
    case "solid-body":
      return "shade";
    case "zone":
      return "dashed";
    case "point":
      return "point";
    default:
      return "outline";
  }
}
