import { useEffect, useMemo, useRef, useState } from "react";
import type Konva from "konva";
import { Group, Layer, Line, Rect, Stage, Transformer } from "react-konva";
import type { SceneAction } from "../../model/actions";
import {
  stagePoint,
  stageLengthToPlan,
  stageToPlan,
  zoomAbout,
  IMAGE_ZOOM,
  type PlanPoint,
  type View,
} from "../../../../lib/plan-view/coordinates";
import type { Scene } from "../../model/scene";
import type { SnapGuide } from "../../model/snapping";
import { idleState, runTool, type ActiveTool, type AnyToolState } from "../../model/tools/active-tool";
import { toolContext } from "../../model/tools/context";
import {
  ALL_ANCHORS,
  anchorHitRect,
  MAX_INWARD_PX,
  selectionHandles,
  targetSizes,
  type PointerKind,
} from "../../model/touch-targets";
import { unionBounds } from "../../model/fixture-geometry";
import type { ToolEvent, ToolPreview } from "../../model/tools/tool";
import { useShapeHandlers } from "../../hooks/use-shape-handlers";
import { applyPinch } from "../../../../lib/plan-view/pinch";
import { useTwoFingerPinch } from "../../../../lib/plan-view/use-two-finger-pinch";
import { FixtureShape } from "./fixture-shape";
import { SELECTION_STROKE } from "../../../../lib/plan-view/fixture-look";
import { gridSpacing, StageBackdrop, type Backdrop } from "./stage-backdrop";

export interface EditorStageProps {
  scene: Scene;
  backdrop: Backdrop;
  view: View;
  onViewChange: (view: View | ((v: View) => View)) => void;
  width: number;
  height: number;
  active: ActiveTool;
  /** Space held: the pointer pans whatever the tool. */
  panning: boolean;
  canEdit: boolean;
  gridM: number | null;
  showGrid: boolean;
  snapToFixtures: boolean;
  apply: (actions: readonly SceneAction[], gesture?: string | null) => void;
  endGesture: () => void;
  onMessage: (message: string | null) => void;
  /** An outline is half drawn (corners placed, not closed): Undo then takes back its last corner. */
  onDrawingOutline?: (drawing: boolean) => void;
  /** Keys for the tool in hand (Escape, Enter, Backspace while drawing); set by the stage. */
  toolKeys: React.MutableRefObject<((key: string) => boolean) | null>;
}

const NO_SELECTION_HANDLES = { inwardPx: MAX_INWARD_PX, anchors: ALL_ANCHORS };

/** Snap distance is a screen distance (the same feel at every zoom); pick and drag distances follow the pointer (touch-targets.ts). */
const SNAP_PX = 8;

/** A tablet starts with finger-sized targets; a mouse press switches back (and a touch forward again). */
function startingPointer(): PointerKind {
  return typeof window !== "undefined" && ("ontouchstart" in window || navigator.maxTouchPoints > 0)
    ? "touch"
    : "mouse";
}

/** Metres per screen pixel in √2 steps, so shapes re-render only when the zoom moves a step. */
function quantise(metresPerScreenPixel: number): number {
  return 2 ** (Math.round(Math.log2(metresPerScreenPixel) * 2) / 2);
}

function newId(): string {
  return crypto.randomUUID();
}

export function EditorStage(p: EditorStageProps) {
  const { scene, backdrop, view, width, height, active } = p;
  const mpp = backdrop.metresPerPixel;
  const sceneRef = useRef(scene);
  sceneRef.current = scene;
  const tolerance = stageLengthToPlan(SNAP_PX, mpp, view);
  const snapRef = useRef({ gridM: p.gridM, snapToFixtures: p.snapToFixtures, toleranceM: tolerance });
  snapRef.current = { gridM: p.gridM, snapToFixtures: p.snapToFixtures, toleranceM: tolerance };
  const selectingRef = useRef(active.tool === "select" && !p.panning);
  selectingRef.current = active.tool === "select" && !p.panning;
  const guideX = useRef<Konva.Line>(null);
  const guideY = useRef<Konva.Line>(null);
  const transformer = useRef<Konva.Transformer>(null);
  const dragGroup = useRef<Konva.Group>(null);
  const [preview, setPreview] = useState<ToolPreview | null>(null);
  const toolState = useRef<AnyToolState>(idleState(active));
  const panStart = useRef<{ x: number; y: number; view: View } | null>(null);
  /** Two fingers are down (from the second landing to the last lifting). */
  const pinching = useRef(false);
  /** The tool's state before the first finger of a gesture landed: a pinch goes back to it. */
  const beforeTouch = useRef<AnyToolState | null>(null);
  /** A finger on empty plan with the select tool: a tap selects, a drag pans. */
  const fingerPress = useRef<{ x: number; y: number; point: PlanPoint; panning: boolean } | null>(null);
  const [pointerKind, setPointerKind] = useState<PointerKind>(startingPointer);
  const sizes = targetSizes(pointerKind);
  const sizesRef = useRef(sizes);
  sizesRef.current = sizes;
  const stageRef = useRef<Konva.Stage>(null);
  /** The last two presses (stage px): Konva calls any two taps within 400 ms a double-tap, wherever they land. */
  const presses = useRef<{ x: number; y: number }[]>([]);

  const { handlers, nodes, cancel } = useShapeHandlers({
    pinching,
    scene: sceneRef,
    snap: snapRef,
    selecting: selectingRef,
    apply: p.apply,
    endGesture: p.endGesture,
    onError: p.onMessage,
    dragGroup,
    showGuides: (guides: readonly SnapGuide[]) => {
      const x = guides.find((g) => g.axis === "x");
      const y = guides.find((g) => g.axis === "y");
      const s = sceneRef.current.plan;
      guideX.current?.setAttrs({ visible: !!x, points: x ? [x.value, 0, x.value, s.height] : [] });
      guideY.current?.setAttrs({ visible: !!y, points: y ? [0, y.value, s.width, y.value] : [] });
    },
  });

  const outlineOpen = useRef(false);
  const noteOutline = (state: AnyToolState) => {
    const open = active.tool === "polygon" && (state as { phase: string }).phase !== "idle";
    if (open !== outlineOpen.current) {
      outlineOpen.current = open;
      p.onDrawingOutline?.(open);
    }
  };
  const noteOutlineRef = useRef(noteOutline);
  noteOutlineRef.current = noteOutline;

  // A new tool starts idle, with nothing half drawn.
  useEffect(() => {
    toolState.current = idleState(active);
    beforeTouch.current = null;
    setPreview(null);
    noteOutlineRef.current(toolState.current);
  }, [active]);

  // The transformer holds the selected outlines (points only move).
  useEffect(() => {
    const tr = transformer.current;
    if (!tr) return;
    const selected =
      p.canEdit && active.tool === "select"
        ? scene.selection.filter((id) => scene.fixtures[id] && !("point" in scene.fixtures[id]))
        : [];
    tr.nodes(selected.map((id) => nodes.current.get(id)).filter((n): n is Konva.Group => n !== undefined));
    tr.getLayer()?.batchDraw();
  }, [scene.selection, scene.fixtures, active, p.canEdit, nodes]);

  function feed(event: ToolEvent) {
    const sz = sizesRef.current;
    const settings = {
      gridM: p.gridM,
      snapToFixtures: p.snapToFixtures,
      toleranceM: tolerance,
      dragThresholdM: stageLengthToPlan(sz.dragPx, mpp, view),
      pickToleranceM: stageLengthToPlan(sz.pickPx, mpp, view),
    };
    const ctx = toolContext(sceneRef.current, settings, newId);
    const r = runTool(active, toolState.current, event, ctx);
    toolState.current = r.state;
    noteOutline(r.state);
    setPreview(r.preview && r.preview.kind !== "move" ? r.preview : null);
    p.onMessage(r.message);
    if (r.actions.length) p.apply(r.actions);
  }
  const feedRef = useRef(feed);
  feedRef.current = feed;

  // The pointer of the gesture under way, and the last plan point the tool saw from it. Konva hears
  // only what happens over its canvas: a mouse let go past the stage's edge, or a pointer the
  // browser cancels, never reaches onUp, and the tool would keep its drag and draw its outline on.
  const loose = useRef<{ id: number; point: PlanPoint } | null>(null);
  useEffect(() => {
    // Bubbling on the window runs after Konva's own listener: a release over the stage has gone
    // through onUp already (which clears `loose`).
    const end = (evt: PointerEvent) => {
      const l = loose.current;
      if (!l || evt.pointerId !== l.id) return;
      loose.current = null;
      if ((toolState.current as { phase: string }).phase === "idle") return;
      feedRef.current(evt.type === "pointercancel" ? { type: "cancel" } : { type: "pointer-up", point: l.point });
    };
    window.addEventListener("pointerup", end);
    window.addEventListener("pointercancel", end);
    return () => {
      window.removeEventListener("pointerup", end);
      window.removeEventListener("pointercancel", end);
    };
  }, []);
  p.toolKeys.current = (key: string) => {
    const state = toolState.current as { phase: string; active?: unknown };
    if (active.tool === "vertex") {
      // Delete removes the corner last touched, not the fixture; Escape with nothing under way leaves the tool.
      if (key === "Escape" && state.phase === "idle") return false;
      if ((key === "Delete" || key === "Backspace") && !state.active) return true;
      feed({ type: "key", key });
      return true;
    }
    if (active.tool === "select" || state.phase === "idle") return false;
    feed({ type: "key", key });
    return true;
  };

  function pointer(stage: Konva.Stage): PlanPoint | null {
    const pos = stage.getPointerPosition();
    return pos ? stageToPlan(stagePoint(pos.x, pos.y), mpp, view) : null;
  }

  function notePointer(evt: PointerEvent) {
    const kind: PointerKind = evt.pointerType === "mouse" ? "mouse" : "touch";
    if (kind !== sizesRef.current.kind) {
      sizesRef.current = targetSizes(kind);
      setPointerKind(kind);
    }
  }

  function onDown(e: Konva.KonvaEventObject<PointerEvent>) {
    const stage = e.target.getStage();
    notePointer(e.evt);
    if (!stage || pinching.current) return;
    const at = stage.getPointerPosition();
    if (at) presses.current = [...presses.current.slice(-1), at];
    if (e.evt.pointerType === "touch" && e.evt.isPrimary) beforeTouch.current = toolState.current;
    // A press on a transformer handle belongs to the transformer: no marquee, tap or pan.
    if (e.target !== stage && e.target.findAncestor("Transformer")) return;
    const pos = stage.getPointerPosition();
    if (p.panning || active.tool === "pan" || e.evt.button === 1) {
      if (pos) panStart.current = { x: pos.x, y: pos.y, view };
      return;
    }
    // A finger on empty plan pans (the page cannot scroll the stage away under it); a tap
    // without a drag still selects or clears, fed to the select tool on release.
    if (e.evt.pointerType === "touch" && active.tool === "select") {
      const pt = pointer(stage);
      if (pos && pt) fingerPress.current = { x: pos.x, y: pos.y, point: pt, panning: false };
      return;
    }
    if (!p.canEdit && active.tool !== "select") return;
    const pt = pointer(stage);
    if (!pt) return;
    // A release never heard (let go outside the window): that gesture ends before this one starts.
    if (loose.current) feed({ type: "cancel" });
    loose.current = { id: e.evt.pointerId, point: pt };
    feed({ type: "pointer-down", point: pt, shift: e.evt.shiftKey });
  }

  function onMove(e: Konva.KonvaEventObject<PointerEvent>) {
    const stage = e.target.getStage();
    if (!stage || pinching.current) return;
    const finger = fingerPress.current;
    if (finger && !finger.panning) {
      const pos = stage.getPointerPosition();
      if (pos && Math.hypot(pos.x - finger.x, pos.y - finger.y) > sizesRef.current.dragPx) {
        finger.panning = true;
        panStart.current = { x: finger.x, y: finger.y, view };
      }
    }
    if (panStart.current) {
      const pos = stage.getPointerPosition();
      const s = panStart.current;
      if (pos) p.onViewChange({ ...s.view, panX: s.view.panX + pos.x - s.x, panY: s.view.panY + pos.y - s.y });
      return;
    }
    if ((toolState.current as { phase: string }).phase === "idle" && active.tool !== "polygon") return;
    const pt = pointer(stage);
    if (!pt) return;
    if (loose.current?.id === e.evt.pointerId) loose.current.point = pt;
    feed({ type: "pointer-move", point: pt, shift: e.evt.shiftKey });
  }

  function onUp(e: Konva.KonvaEventObject<PointerEvent>) {
    const stage = e.target.getStage();
    const finger = fingerPress.current;
    fingerPress.current = null;
    loose.current = null;
    if (panStart.current) {
      panStart.current = null;
      return;
    }
    if (finger && !pinching.current) {
      feed({ type: "pointer-down", point: finger.point });
      feed({ type: "pointer-up", point: finger.point });
      return;
    }
    if (!stage || (toolState.current as { phase: string }).phase === "idle") return;
    const pt = pointer(stage);
    if (pt) feed({ type: "pointer-up", point: pt, shift: e.evt.shiftKey });
  }

  /**
   * Konva calls any two presses within 400 ms a double-click (or double-tap), wherever they land,
   * and on a tablet it sends one for quick corner taps: only two presses on one spot count.
   */
  function onDouble(e: Konva.KonvaEventObject<Event>) {
    const stage = e.target.getStage();
    const pt = stage && pointer(stage);
    const [a, b] = presses.current;
    const sameSpot = a !== undefined && b !== undefined && Math.hypot(a.x - b.x, a.y - b.y) <= sizesRef.current.pickPx;
    if (pt && sameSpot && !pinching.current && (active.tool === "polygon" || active.tool === "vertex"))
      feed({ type: "double-click", point: pt });
  }

  function onWheel(e: Konva.KonvaEventObject<WheelEvent>) {
    e.evt.preventDefault();
    const pos = e.target.getStage()?.getPointerPosition();
    if (!pos) return;
    // Trackpad pinches arrive as wheel events with ctrlKey and small deltas: zoom smoothly.
    const factor = Math.exp(-e.evt.deltaY * (e.evt.ctrlKey ? 0.01 : 0.0015));
    p.onViewChange((v) => zoomAbout(v, stagePoint(pos.x, pos.y), factor));
  }

  // Pinch and two-finger pan (src/lib/plan-view/); the first finger has often started a drag.
  useTwoFingerPinch(() => stageRef.current?.container(), pinching, {
    onStart: () => {
      cancel();
      loose.current = null;
      panStart.current = null;
      fingerPress.current = null;
      // Each finger's press reached the tool before the browser said it was a pinch: go back to
      // how the tool stood before the first one, so a half-drawn outline keeps its corners.
      toolState.current = beforeTouch.current ?? idleState(active);
      if ((toolState.current as { phase: string }).phase === "idle") {
        noteOutline(toolState.current);
        setPreview(null);
      } else feed({ type: "key", key: "Unidentified" }); // redraws the preview; no tool acts on it
    },
    onPinch: (step) => p.onViewChange((v) => applyPinch(v, step, IMAGE_ZOOM)),
  });

  // Handles sized to the selection on screen, so a small fixture's body stays grabbable by a finger.
  const outlines = p.canEdit && active.tool === "select" ? selectedOutlineBox(scene) : null;
  const handles = outlines
    ? selectionHandles(
        ((outlines.maxX - outlines.minX) / mpp) * view.zoom,
        ((outlines.maxY - outlines.minY) / mpp) * view.zoom,
        sizes,
      )
    : NO_SELECTION_HANDLES;
  const inwardRef = useRef(handles.inwardPx);
  inwardRef.current = handles.inwardPx;
  // The style function reads the reach when Konva lays the handles out: lay them out again when it changes.
  useEffect(() => {
    transformer.current?.forceUpdate();
  }, [handles.inwardPx]);

  const unit = quantise(mpp / view.zoom);
  const k = 1 / mpp;
  const draggable = p.canEdit && active.tool === "select" && !p.panning;
  const selected = useMemo(() => new Set(scene.selection), [scene.selection]);
  const gridShown = p.showGrid ? Math.max(p.gridM ?? 1, gridSpacing(unit)) : null;

  return (
    <Stage
      ref={stageRef}
      width={width}
      height={height}
      x={view.panX}
      y={view.panY}
      scaleX={view.zoom}
      scaleY={view.zoom}
      onPointerDown={onDown}
      onPointerMove={onMove}
      onPointerUp={onUp}
      onDblClick={onDouble}
      onDblTap={onDouble}
      onWheel={onWheel}
      style={{
        cursor: p.panning || active.tool === "pan" ? "grab" : active.tool === "select" ? "default" : "crosshair",
        touchAction: "none",
      }}
    >
      <StageBackdrop backdrop={backdrop} plan={scene.plan} gridM={gridShown} />
      <Layer listening={active.tool === "select" && !p.panning}>
        <Group scaleX={k} scaleY={k}>
          {scene.order.map((id) => (
            <FixtureShape
              key={id}
              fixture={scene.fixtures[id]}
              selected={selected.has(id)}
              draggable={draggable}
              unit={unit}
              handlers={handlers}
            />
          ))}
        </Group>
      </Layer>
      {/* Dragged fixtures and the transformer live here, so a drag redraws only this layer. */}
      <Layer listening={active.tool === "select" && !p.panning}>
        <Group ref={dragGroup} scaleX={k} scaleY={k} />
        <Transformer
          ref={transformer}
          rotateEnabled
          keepRatio={false}
          ignoreStroke
          anchorSize={sizes.anchorVisualPx}
          enabledAnchors={handles.anchors as string[]}
          rotateAnchorOffset={sizes.rotateOffsetPx}
          anchorStyleFunc={(anchor) => {
            // A finger-sized target that reaches out from the outline (touch-targets.ts).
            const r = anchorHitRect(
              anchor.name(),
              sizesRef.current.anchorVisualPx,
              sizesRef.current.anchorHitPx,
              inwardRef.current,
            );
            anchor.hitFunc((ctx, shape) => {
              ctx.beginPath();
              ctx.rect(r.x, r.y, r.width, r.height);
              ctx.fillStrokeShape(shape);
            });
          }}
          anchorStroke={SELECTION_STROKE}
          borderStroke={SELECTION_STROKE}
          rotationSnaps={[0, 45, 90, 135, 180, 225, 270, 315]}
          rotationSnapTolerance={4}
          boundBoxFunc={(old, next) => (Math.abs(next.width) < 4 || Math.abs(next.height) < 4 ? old : next)}
        />
      </Layer>
      <Layer listening={false}>
        <Group scaleX={k} scaleY={k}>
          <Line
            ref={guideX}
            visible={false}
            stroke="#CC79A7"
            strokeWidth={1.5}
            dash={[6, 4]}
            strokeScaleEnabled={false}
          />
          <Line
            ref={guideY}
            visible={false}
            stroke="#CC79A7"
            strokeWidth={1.5}
            dash={[6, 4]}
            strokeScaleEnabled={false}
          />
          <PreviewShape preview={preview} />
          {active.tool === "vertex" ? <CornerHandles scene={scene} unit={unit} sizePx={sizes.anchorVisualPx} /> : null}
        </Group>
      </Layer>
    </Stage>
  );
}

/** The box round the selected outlines (points have no handles), in plan metres. */
function selectedOutlineBox(scene: Scene) {
  return unionBounds(scene.selection.map((id) => scene.fixtures[id]).filter((f) => f !== undefined && !("point" in f)));
}

/** The selected outline's corners, as squares to grab with the corner tool (it hit-tests them itself). */
function CornerHandles({ scene, unit, sizePx }: { scene: Scene; unit: number; sizePx: number }) {
  const f = scene.selection.length === 1 ? scene.fixtures[scene.selection[0]] : undefined;
  if (!f || "point" in f) return null;
  const h = (sizePx - 2) * unit;
  return (
    <>
      {f.polygon.map(([x, y], i) => (
        <Rect
          key={i}
          x={x - h / 2}
          y={y - h / 2}
          width={h}
          height={h}
          fill="#ffffff"
          stroke={SELECTION_STROKE}
          strokeWidth={2}
          strokeScaleEnabled={false}
        />
      ))}
    </>
  );
}

/** Konva name of every node a tool's preview draws (browser tests look for strays by it). */
const PREVIEW_NAME = "tool-preview";

function PreviewShape({ preview }: { preview: ToolPreview | null }) {
  if (!preview) return null;
  if (preview.kind === "marquee") {
    const b = preview.box;
    return (
      <Rect
        name={PREVIEW_NAME}
        x={b.minX}
        y={b.minY}
        width={b.maxX - b.minX}
        height={b.maxY - b.minY}
        stroke="#1f4e5f"
        strokeWidth={1.5}
        dash={[5, 4]}
        fill="rgba(31,78,95,0.08)"
        strokeScaleEnabled={false}
      />
    );
  }
  if (preview.kind !== "outline") return null;
  const vs = preview.hover ? [...preview.vertices, preview.hover] : preview.vertices;
  return (
    <>
      <Line
        name={PREVIEW_NAME}
        points={vs.flatMap((v) => [v.x, v.y])}
        closed={preview.closed}
        stroke="#1f4e5f"
        strokeWidth={2}
        dash={[6, 4]}
        fill={preview.closed ? "rgba(31,78,95,0.12)" : undefined}
        strokeScaleEnabled={false}
      />
      {preview.vertices.map((v, i) => (
        <Rect
          key={i}
          name={PREVIEW_NAME}
          x={v.x}
          y={v.y}
          width={0.001}
          height={0.001}
          stroke="#1f4e5f"
          strokeWidth={8}
          strokeScaleEnabled={false}
        />
      ))}
    </>
  );
}
