import { useMemo, useRef, type RefObject } from "react";
import type Konva from "konva";
import type { SceneAction } from "../model/actions";
import { move, select, setVertices } from "../model/actions";
import { bakeNodeTransform } from "../model/node-transform";
import { unionBounds } from "../model/fixture-geometry";
import { sceneFixtures, type Scene } from "../model/scene";
import { snapMove, type SnapGuide } from "../model/snapping";
import type { ShapeHandlers } from "../components/editor/fixture-shape";

export interface SnapSettings {
  gridM: number | null;
  snapToFixtures: boolean;
  toleranceM: number;
}

interface Options {
  scene: RefObject<Scene>;
  snap: RefObject<SnapSettings>;
  /** True while the select tool is in hand (pressing a fixture selects it). */
  selecting: RefObject<boolean>;
  apply: (actions: readonly SceneAction[], gesture?: string | null) => void;
  endGesture: () => void;
  showGuides: (guides: readonly SnapGuide[]) => void;
  /** A group (same metres scale) on a layer of its own: dragged nodes ride on it. */
  dragGroup: RefObject<Konva.Group | null>;
  onError: (message: string) => void;
  /** True while two fingers are down: no drag may start (Konva would start one with the first finger). */
  pinching: RefObject<boolean>;
}

/**
 * The Konva side of moving and transforming: a drag moves the Konva nodes only (the selection
 * follows the dragged node imperatively, snapped); on drag end ONE move action is recorded and
 * the nodes go back to the origin, to be redrawn from the scene. A transform is baked into the
 * vertices on transform end (react-konva's advice: state holds plain objects, nodes are views).
 */
export function useShapeHandlers(o: Options): {
  handlers: ShapeHandlers;
  nodes: RefObject<Map<string, Konva.Group>>;
  cancel: () => void;
} {
  const nodes = useRef(new Map<string, Konva.Group>());
  const drag = useRef<{ ids: string[]; homes: { node: Konva.Group; parent: Konva.Container; index: number }[] } | null>(
    null,
  );
  const transformGesture = useRef(0);
  // Set while a second finger lands: the drag or transform under way ends without an edit.
  const cancelling = useRef(false);
  const opts = useRef(o);
  opts.current = o;

  const handlers = useMemo<ShapeHandlers>(() => {
    const snapped = (ids: readonly string[], dx: number, dy: number) => {
      const { scene, snap } = opts.current;
      const s = scene.current;
      const box = unionBounds(ids.map((id) => s.fixtures[id]).filter((f) => f !== undefined));
      if (!box) return { dx, dy, guides: [] };
      const targets = snap.current.snapToFixtures ? sceneFixtures(s).filter((f) => !ids.includes(f.id)) : [];
      return snapMove(box, dx, dy, { gridM: snap.current.gridM, toleranceM: snap.current.toleranceM, targets });
    };
    return {
      register: (id, node) => {
        if (node) nodes.current.set(id, node);
        else nodes.current.delete(id);
      },
      onPress: (id, e) => {
        if (!opts.current.selecting.current) return;
        e.cancelBubble = true; // not a press on empty plan: no marquee
        const s = opts.current.scene.current;
        if (e.evt.shiftKey) opts.current.apply([select([id], "toggle")]);
        else if (!s.selection.includes(id)) opts.current.apply([select([id])]);
      },
      onDragStart: (id, e) => {
        if (opts.current.pinching.current) {
          cancelling.current = true;
          try {
            e.target.stopDrag();
          } finally {
            cancelling.current = false;
          }
          return;
        }
        const s = opts.current.scene.current;
        const ids = s.selection.includes(id) ? [...s.selection] : [id];
        // Konva's drag advice: move the dragged nodes to a layer of their own for the drag, so
        // each frame redraws them alone, not the 400 fixtures left behind.
        const target = opts.current.dragGroup.current;
        const homes: { node: Konva.Group; parent: Konva.Container; index: number }[] = [];
        if (target) {
          for (const other of ids) {
            const node = nodes.current.get(other);
            const parent = node?.getParent();
            if (!node || !parent) continue;
            homes.push({ node, parent, index: node.zIndex() });
          }
          for (const h of homes) h.node.moveTo(target);
          homes[0]?.parent.getLayer()?.batchDraw();
        }
        drag.current = { ids, homes };
      },
      onDragMove: (id, e) => {
        const d = drag.current;
        if (!d) return;
        const node = e.target;
        const r = snapped(d.ids, node.x(), node.y());
        for (const other of d.ids) nodes.current.get(other)?.position({ x: r.dx, y: r.dy });
        if (!d.ids.includes(id)) node.position({ x: r.dx, y: r.dy });
        opts.current.showGuides(r.guides);
      },
      onDragEnd: (id, e) => {
        const d = drag.current ?? { ids: [id], homes: [] };
        drag.current = null;
        // Back home, in drawing order, before React redraws them from the scene.
        for (const h of [...d.homes].sort((a, b) => a.index - b.index)) {
          h.node.moveTo(h.parent);
          h.node.zIndex(Math.min(h.index, h.parent.children.length - 1));
        }
        const dx = e.target.x();
        const dy = e.target.y();
        for (const other of d.ids) nodes.current.get(other)?.position({ x: 0, y: 0 });
        e.target.position({ x: 0, y: 0 });
        opts.current.showGuides([]);
        if (cancelling.current) return;
        if (dx !== 0 || dy !== 0) opts.current.apply([move(d.ids, dx, dy)]);
      },
      onTransformEnd: (id, node) => {
        const f = opts.current.scene.current.fixtures[id];
        const t = { x: node.x(), y: node.y(), scaleX: node.scaleX(), scaleY: node.scaleY(), rotation: node.rotation() };
        node.setAttrs({ x: 0, y: 0, rotation: 0, scaleX: 1, scaleY: 1, skewX: 0, skewY: 0 });
        if (!f || "point" in f || cancelling.current) return;
        try {
          // Every node of one transform is one undo step: they share a gesture key.
          opts.current.apply(
            [setVertices(id, bakeNodeTransform(f.polygon, t))],
            `transform-${transformGesture.current}`,
          );
        } catch (err) {
          opts.current.onError(err instanceof RangeError ? err.message : "The shape could not be changed.");
        }
        window.setTimeout(() => {
          transformGesture.current += 1;
          opts.current.endGesture();
        }, 0);
      },
    };
  }, []);

  /** A pinch began: put back whatever the first finger was dragging or transforming, recording nothing. */
  const cancel = useMemo(
    () => () => {
      cancelling.current = true;
      try {
        for (const node of nodes.current.values()) if (node.isDragging()) node.stopDrag();
        const layer = opts.current.dragGroup.current?.getLayer();
        for (const tr of layer?.find<Konva.Transformer>("Transformer") ?? [])
          if (tr.isTransforming()) tr.stopTransform();
        layer?.batchDraw();
      } finally {
        cancelling.current = false;
      }
    },
    [],
  );
  return { handlers, nodes, cancel };
}
