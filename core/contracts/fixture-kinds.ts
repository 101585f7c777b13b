/**
 * Fixture kinds: our own stable ids, stored in the database and sent over the API, so never
 * rename one. Display names and families live here too, so the editor's palette, the list
 * view, the server's validation and the locator's translation all read one table.
 */

export const AIR_VOLUME_KINDS = [
  "open-case",
  "island-case",
  "door-case",
  "walk-in-cooler",
  "walk-in-freezer",
  "machine-room",
] as const;
export const SOLID_BODY_KINDS = ["wall", "gondola", "checkout", "column"] as const;
export const ZONE_KINDS = ["benign-zone"] as const;
export const POINT_KINDS = ["line-set-drop", "valve", "coil"] as const;
/** Air volumes whose outline is a wall that blocks air except at one marked door. */
export const ROOM_KINDS = ["walk-in-cooler", "walk-in-freezer", "machine-room"] as const;

export const FIXTURE_KINDS = [...AIR_VOLUME_KINDS, ...SOLID_BODY_KINDS, ...ZONE_KINDS, ...POINT_KINDS] as const;

export type FixtureKind = (typeof FIXTURE_KINDS)[number];
export type PointKind = (typeof POINT_KINDS)[number];
export type RoomKind = (typeof ROOM_KINDS)[number];
export type PolygonKind = Exclude<FixtureKind, PointKind>;

export type FixtureFamily = "air-volume" | "solid-body" | "zone" | "point";

export const FIXTURE_FAMILY: Readonly<Record<FixtureKind, FixtureFamily>> = {
  "open-case": "air-volume",
  "island-case": "air-volume",
  "door-case": "air-volume",
  "walk-in-cooler": "air-volume",
  "walk-in-freezer": "air-volume",
  "machine-room": "air-volume",
  wall: "solid-body",
  gondola: "solid-body",
  checkout: "solid-body",
  column: "solid-body",
  "benign-zone": "zone",
  "line-set-drop": "point",
  valve: "point",
  coil: "point",
};

/** Plain English names for menus, tables and reports (the words of docs/product.md). */
export const FIXTURE_KIND_NAMES: Readonly<Record<FixtureKind, string>> = {
  "open-case": "Open case",
  "island-case": "Island case",
  "door-case": "Glass-door case",
  "walk-in-cooler": "Walk-in cooler",
  "walk-in-freezer": "Walk-in freezer",
  "machine-room": "Machine room",
  wall: "Wall or partition",
  gondola: "Gondola or shelving run",
  checkout: "Checkout",
  column: "Column",
  "benign-zone": "Benign-source zone",
  "line-set-drop": "Line-set drop",
  valve: "Valve",
  coil: "Coil",
};

export const FIXTURE_FAMILY_NAMES: Readonly<Record<FixtureFamily, string>> = {
  "air-volume": "Air volumes",
  "solid-body": "Solid bodies",
  zone: "Zones",
  point: "Points",
};

export function isPointKind(kind: FixtureKind): kind is PointKind {
  return (POINT_KINDS as readonly string[]).includes(kind);
}

export function isRoomKind(kind: FixtureKind): kind is RoomKind {
  return (ROOM_KINDS as readonly string[]).includes(kind);
}
