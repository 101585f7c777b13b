/** Builds a ToolContext with snapping wired to snapping.ts and the scene's other fixtures. */
import type { PlanPoint } from "../../../../lib/plan-view/coordinates";
import { unionBounds } from "../fixture-geometry";
import { sceneFixtures, type Scene } from "../scene";
import { snapMove, snapPoint } from "../snapping";
import type { ToolContext } from "./tool";

export interface ToolSettings {
  /** Grid spacing in metres, or null for no grid. */
  gridM: number | null;
  /** Snap to other fixtures' vertices and edges. */
  snapToFixtures: boolean;
  /** Screen tolerances already converted to metres (coordinates.stageLengthToPlan). */
  toleranceM: number;
  dragThresholdM: number;
  /** How near a press must be to pick a point or corner (a finger needs more than a mouse); toleranceM when absent. */
  pickToleranceM?: number;
}

export function toolContext(scene: Scene, settings: ToolSettings, newId: () => string): ToolContext {
  const all = sceneFixtures(scene);
  const others = (ids: readonly string[]) => (settings.snapToFixtures ? all.filter((f) => !ids.includes(f.id)) : []);
  const snapOptions = (ids: readonly string[]) => ({
    gridM: settings.gridM,
    toleranceM: settings.toleranceM,
    targets: others(ids),
  });
  return {
    scene,
    newId,
    snap: (p: PlanPoint, exclude: readonly string[] = []) => snapPoint(p, snapOptions(exclude)).point,
    snapMove: (ids, dx, dy) => {
      const box = unionBounds(ids.map((id) => scene.fixtures[id]).filter((f) => f !== undefined));
      if (!box) return { dx, dy };
      const s = snapMove(box, dx, dy, snapOptions(ids));
      return { dx: s.dx, dy: s.dy };
    },
    dragThresholdM: settings.dragThresholdM,
    pickToleranceM: settings.pickToleranceM ?? settings.toleranceM,
  };
}
