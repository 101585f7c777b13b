/**
 * Every edit of the scene is a named action applied by one pure reducer, so undo/redo,
 * keyboard shortcuts and tools all speak the same language. Create actions with the
 * functions below: they check their arguments up front and throw a RangeError naming the
 * field; the reducer then trusts them, ignores ids that no longer exist, and returns the same
 * scene object when nothing changed (history.ts skips such no-ops).
 */
import type { Bounds, Vec } from "#core/analysis/geometry/types";
import { LABEL_MAX, type Fixture, type RoomDoor, type Vertex } from "#core/contracts/fixtures";
import type { FixtureKind } from "#core/contracts/fixture-kinds";
import { canChangeKind, changeKind } from "./change-kind";
import { arrayCopies, duplicateCopies } from "./copies";
import {
  fitDoor,
  fixtureCentroid,
  relocateDoor,
  resizeFixture,
  rotateFixture,
  translateFixture,
  unionBounds,
} from "./fixture-geometry";
import type { Scene } from "./scene";

/** Properties the side panel edits; each applies only to fixtures whose kind has it. */
export interface FixtureProps {
  systemId?: string | null;
  hasFans?: boolean;
  doorCount?: number;
  door?: RoomDoor | null;
  note?: string;
  typicalPpm?: number | null;
}

export type SelectMode = "replace" | "add" | "toggle" | "remove";

export type SceneAction =
  | { type: "add"; fixtures: readonly Fixture[] }
  | { type: "move"; ids: readonly string[]; dx: number; dy: number }
  | { type: "resize"; id: string; box: Bounds }
  | { type: "rotate"; ids: readonly string[]; angle: number; pivot: "each" | Vec }
  | { type: "set-vertices"; id: string; polygon: readonly Vertex[] }
  | { type: "duplicate"; ids: readonly string[]; dx: number; dy: number; newIds: readonly string[] }
  | { type: "array"; ids: readonly string[]; count: number; spacing: number; direction: Vec; newIds: readonly string[] }
  | { type: "delete"; ids: readonly string[] }
  | { type: "set-properties"; ids: readonly string[]; props: FixtureProps }
  | { type: "label"; id: string; label: string }
  | { type: "set-kind"; ids: readonly string[]; kind: FixtureKind }
  | { type: "select"; ids: readonly string[]; mode: SelectMode };

function finite(name: string, ...values: number[]): void {
  if (!values.every(Number.isFinite)) throw new RangeError(`${name} must be finite numbers`);
}

export const add = (fixtures: readonly Fixture[]): SceneAction => ({ type: "add", fixtures });

export function move(ids: readonly string[], dx: number, dy: number): SceneAction {
  finite("move dx, dy", dx, dy);
  return { type: "move", ids, dx, dy };
}

/** Stretches one fixture onto a new bounding box (min < max on both axes; a point moves to its centre). */
export function resize(id: string, box: Bounds): SceneAction {
  finite("resize box", box.minX, box.minY, box.maxX, box.maxY);
  if (!(box.maxX > box.minX && box.maxY > box.minY))
    throw new RangeError("resize box must have a width and height above 0 m");
  return { type: "resize", id, box };
}

/** Rotates by `angle` radians (clockwise on the y-down plan) about each fixture's centroid or a shared pivot. */
export function rotate(ids: readonly string[], angle: number, pivot: "each" | Vec = "each"): SceneAction {
  finite("rotate angle", angle);
  if (pivot !== "each") finite("rotate pivot", pivot[0], pivot[1]);
  return { type: "rotate", ids, angle, pivot };
}

export function setVertices(id: string, polygon: readonly Vertex[]): SceneAction {
  if (polygon.length < 3) throw new RangeError("set-vertices polygon needs at least 3 vertices");
  finite("set-vertices polygon", ...polygon.flat());
  return { type: "set-vertices", id, polygon };
}

export function duplicate(ids: readonly string[], dx: number, dy: number, newId: () => string): SceneAction {
  finite("duplicate offset", dx, dy);
  const unique = [...new Set(ids)];
  return { type: "duplicate", ids: unique, dx, dy, newIds: unique.map(() => newId()) };
}

/**
 * A row of `count` items including the originals, `spacing` metres apart (centre to centre)
 * along `direction` (any non-zero vector): array(ids, 5, 2.4, [1, 0], uuid) makes four copies.
 */
export function array(
  ids: readonly string[],
  count: number,
  spacing: number,
  direction: Vec,
  newId: () => string,
): SceneAction {
  if (!(Number.isInteger(count) && count >= 2 && count <= 200))
    throw new RangeError("array count must be a whole number from 2 to 200");
  if (!(Number.isFinite(spacing) && spacing > 0)) throw new RangeError("array spacing must be more than 0 m");
  finite("array direction", direction[0], direction[1]);
  if (direction[0] === 0 && direction[1] === 0) throw new RangeError("array direction must not be the zero vector");
  const unique = [...new Set(ids)];
  const newIds = Array.from({ length: (count - 1) * unique.length }, () => newId());
  return { type: "array", ids: unique, count, spacing, direction, newIds };
}

export const remove = (ids: readonly string[]): SceneAction => ({ type: "delete", ids });

export function setProperties(ids: readonly string[], props: FixtureProps): SceneAction {
  if (props.doorCount !== undefined && !(Number.isInteger(props.doorCount) && props.doorCount >= 1))
    throw new RangeError("doorCount must be a whole number of at least 1");
  if (props.typicalPpm != null && !(Number.isFinite(props.typicalPpm) && props.typicalPpm >= 0))
    throw new RangeError("typicalPpm must be 0 ppm or more");
  if (props.door) finite("door offset, width", props.door.offset, props.door.width);
  return { type: "set-properties", ids, props };
}

export function label(id: string, text: string): SceneAction {
  if (text.length > LABEL_MAX) throw new RangeError(`label must be at most ${LABEL_MAX} characters`);
  return { type: "label", id, label: text };
}

/** Changes the kind of the named fixtures that can take it (outlines to outline kinds, points to point kinds). */
export const setKind = (ids: readonly string[], kind: FixtureKind): SceneAction => ({ type: "set-kind", ids, kind });

export const select = (ids: readonly string[], mode: SelectMode = "replace"): SceneAction => ({
  type: "select",
  ids,
  mode,
});

/** Selection changes are not edits: history.ts does not record them as steps of their own. */
export function isSelectionOnly(action: SceneAction): boolean {
  return action.type === "select";
}

function replaceFixtures(scene: Scene, candidates: readonly Fixture[]): Scene {
  const changed = candidates.filter((f) => f !== scene.fixtures[f.id]);
  if (changed.length === 0) return scene;
  const fixtures = { ...scene.fixtures };
  for (const f of changed) fixtures[f.id] = f;
  return { ...scene, fixtures };
}

function existing(scene: Scene, ids: readonly string[]): Fixture[] {
  return [...new Set(ids)].map((id) => scene.fixtures[id]).filter((f): f is Fixture => f !== undefined);
}

function appendFixtures(scene: Scene, added: readonly Fixture[]): Scene {
  const fresh = added.filter((f) => !scene.fixtures[f.id]);
  if (fresh.length === 0) return scene;
  const fixtures = { ...scene.fixtures };
  for (const f of fresh) fixtures[f.id] = f;
  return { ...scene, fixtures, order: [...scene.order, ...fresh.map((f) => f.id)], selection: fresh.map((f) => f.id) };
}

/** Limits a move so the moved fixtures' bounds stay on the plan (a drag cannot lose a case off the edge). */
function clampMove(scene: Scene, moved: readonly Fixture[], dx: number, dy: number): [number, number] {
  const b = unionBounds(moved);
  if (!b) return [dx, dy];
  const clamp = (d: number, min: number, max: number, size: number) =>
    max - min > size ? d : Math.min(Math.max(d, -min), size - max);
  return [clamp(dx, b.minX, b.maxX, scene.plan.width), clamp(dy, b.minY, b.maxY, scene.plan.height)];
}

function applyProps(f: Fixture, props: FixtureProps): Fixture {
  const next: Record<string, unknown> = { ...f };
  let changed = false;
  for (const [key, value] of Object.entries(props)) {
    if (value === undefined || !(key in f)) continue;
    const v = key === "door" && value && "polygon" in f ? fitDoor(value as RoomDoor, f.polygon) : value;
    if (JSON.stringify(v) !== JSON.stringify(next[key])) [next[key], changed] = [v, true];
  }
  return changed ? (next as Fixture) : f;
}

function select_(scene: Scene, ids: readonly string[], mode: SelectMode): Scene {
  const known = ids.filter((id) => scene.fixtures[id]);
  const current = scene.selection;
  let selection: string[];
  if (mode === "replace") selection = [...new Set(known)];
  else if (mode === "add") selection = [...new Set([...current, ...known])];
  else if (mode === "remove") selection = current.filter((id) => !known.includes(id));
  else selection = [...current.filter((id) => !known.includes(id)), ...known.filter((id) => !current.includes(id))];
  const same = selection.length === current.length && selection.every((id, i) => id === current[i]);
  return same ? scene : { ...scene, selection };
}

export function applyAction(scene: Scene, action: SceneAction): Scene {
  switch (action.type) {
    case "add":
      return appendFixtures(scene, action.fixtures);
    case "move": {
      const moved = existing(scene, action.ids);
      const [dx, dy] = clampMove(scene, moved, action.dx, action.dy);
      if (dx === 0 && dy === 0) return scene;
      return replaceFixtures(
        scene,
        moved.map((f) => translateFixture(f, dx, dy)),
      );
    }
    case "resize":
      return replaceFixtures(
        scene,
        existing(scene, [action.id]).map((f) => resizeFixture(f, action.box)),
      );
    case "rotate": {
      if (action.angle === 0) return scene;
      const { pivot } = action;
      return replaceFixtures(
        scene,
        existing(scene, action.ids).map((f) =>
          rotateFixture(f, pivot === "each" ? fixtureCentroid(f) : pivot, action.angle),
        ),
      );
    }
    case "set-vertices":
      return replaceFixtures(
        scene,
        existing(scene, [action.id]).flatMap((f): Fixture[] => {
          if ("point" in f) return [];
          const polygon = action.polygon.map(([x, y]): Vertex => [x, y]);
          return "door" in f
            ? [{ ...f, polygon, door: f.door && relocateDoor(f.door, f.polygon, polygon) }]
            : [{ ...f, polygon }];
        }),
      );
    case "duplicate": {
      const pairs = action.ids.flatMap((id, i) =>
        scene.fixtures[id] ? [[scene.fixtures[id], action.newIds[i]] as const] : [],
      );
      const sources = pairs.map(([f]) => f);
      const ids = pairs.map(([, id]) => id);
      return appendFixtures(scene, duplicateCopies(sources, action.dx, action.dy, ids, Object.values(scene.fixtures)));
    }
    case "array": {
      const sources = existing(scene, action.ids);
      if (sources.length !== action.ids.length) return scene; // ids would no longer line up with newIds
      return appendFixtures(
        scene,
        arrayCopies(
          sources,
          action.count,
          action.spacing,
          action.direction,
          action.newIds,
          Object.values(scene.fixtures),
        ),
      );
    }
    case "delete": {
      const gone = new Set(action.ids.filter((id) => scene.fixtures[id]));
      if (gone.size === 0) return scene;
      const fixtures = { ...scene.fixtures };
      for (const id of gone) delete fixtures[id];
      return {
        ...scene,
        fixtures,
        order: scene.order.filter((id) => !gone.has(id)),
        selection: scene.selection.filter((id) => !gone.has(id)),
      };
    }
    case "set-properties":
      return replaceFixtures(
        scene,
        existing(scene, action.ids).map((f) => applyProps(f, action.props)),
      );
    case "label": {
      const f = scene.fixtures[action.id];
      return !f || f.label === action.label ? scene : replaceFixtures(scene, [{ ...f, label: action.label }]);
    }
    case "set-kind": {
      const changed = existing(scene, action.ids).filter(
        (f) => f.kind !== action.kind && canChangeKind(f, action.kind),
      );
      return replaceFixtures(
        scene,
        changed.map((f) => changeKind(f, action.kind)),
      );
    }
    case "select":
      return select_(scene, action.ids, action.mode);
  }
}

/** Applies several actions in turn (e.g. what one tool gesture emitted). */
export function applyActions(scene: Scene, actions: readonly SceneAction[]): Scene {
  return actions.reduce(applyAction, scene);
}
