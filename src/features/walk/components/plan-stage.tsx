import { useEffect, useMemo, useRef, useState, type ReactNode } from "react";
import { Group, Image as KonvaImage, Layer, Line, Shape, Stage } from "react-konva";
import type { Context } from "konva/lib/Context";
import type { Fixture } from "#core/contracts/fixtures";
import type { LocalReading } from "../model/local-types";
import type { LagHint } from "../model/lag-hint";
import {
  METRE_BASE,
  panBy,
  planPoint,
  planToStage,
  stagePoint,
  stageToPlan,
  zoomAbout,
  type View,
} from "../../../lib/plan-view/coordinates";
import { backdropOf } from "../../../lib/plan-view/fixture-look";
import { applyPinch, pinchStep } from "../../../lib/plan-view/pinch";
import { WALK_ZOOM } from "../model/walk-view";
import { fitClearOfControls } from "../model/walk-fit";
import { ALARM_DOT_FACTOR, markLooks, pathWidthPx, readingDotRadiusPx, TRACE_DOT_FACTOR } from "../model/plan-marks";
import { PlanLegend } from "./plan-legend";

/** A finger that moves less than this is a tap, not a pan (px). */
const TAP_SLOP_PX = 10;

export interface PlanStageProps {
  widthM: number;
  heightM: number;
  image: Blob | null;
  fixtures: readonly Fixture[];
  unsampled: ReadonlySet<string>;
  readings: readonly LocalReading[];
  alarmPpm: number;
  lagHint: LagHint | null;
  selectedId: string | null;
  highContrast: boolean;
  /** A point to keep on screen when the box resizes (the reading on the keypad). */
  focus: { x: number; y: number } | null;
  /** A tap at plan metres (x, y), with the device time of the finger going down. */
  onTap(x: number, y: number, at: number): void;
  /** More marks drawn over the readings, in plan metres, given the view's zoom (px per metre). */
  overlay?: (zoom: number) => ReactNode;
}

function useBlobImage(blob: Blob | null): HTMLImageElement | null {
  const [img, setImg] = useState<HTMLImageElement | null>(null);
  useEffect(() => {
    if (!blob) return;
    const url = URL.createObjectURL(blob);
    const el = new window.Image();
    el.onload = () => setImg(el);
    el.src = url;
    return () => URL.revokeObjectURL(url);
  }, [blob]);
  return img;
}

function useBoxSize(ref: React.RefObject<HTMLDivElement | null>) {
  const [size, setSize] = useState({ w: 0, h: 0 });
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const ro = new ResizeObserver(() => setSize({ w: el.clientWidth, h: el.clientHeight }));
    ro.observe(el);
    setSize({ w: el.clientWidth, h: el.clientHeight });
    return () => ro.disconnect();
  }, [ref]);
  return size;
}

interface Pointer {
  x: number;
  y: number;
  startX: number;
  startY: number;
  at: number;
}

/**
 * The plan filling the screen. Konva only draws: every pointer goes to the container, where one
 * finger pans (or taps, if it barely moved), two fingers pinch-zoom, and the wheel zooms.
 */
export function PlanStage(props: PlanStageProps) {
  const box = useRef<HTMLDivElement>(null);
  const { w, h } = useBoxSize(box);
  const [view, setView] = useState<View | null>(null);
  const viewRef = useRef<View | null>(null);
  viewRef.current = view;
  const pointers = useRef(new Map<number, Pointer>());
  const moved = useRef(false);
  const img = useBlobImage(props.image);

  const focusRef = useRef(props.focus);
  focusRef.current = props.focus;
  // True while the view is the whole-plan fit (first open, "All"); any pan or zoom by hand clears it.
  const fitted = useRef(true);
  const fit = () => {
    fitted.current = true;
    setView(fitClearOfControls(props.widthM, props.heightM, w, h));
  };
  const byHand = (v: View) => {
    fitted.current = false;
    setView(v);
  };
  /** Slides the plan just enough to keep the open reading clear of the box's edges. */
  const follow = (v: View) => {
    const f = focusRef.current;
    if (!f) return;
    const mx = Math.min(64, w * 0.2);
    const my = Math.min(64, h * 0.2);
    const { x: sx, y: sy } = planToStage(planPoint(f.x, f.y), METRE_BASE, v);
    const dx = sx > w - mx ? w - mx - sx : sx < mx ? mx - sx : 0;
    const dy = sy > h - my ? h - my - sy : sy < my ? my - sy : 0;
    if (dx || dy) setView(panBy(v, dx, dy));
  };
  useEffect(() => {
    if (w <= 0 || h <= 0) return;
    const v = viewRef.current;
    // A banner or the keypad coming or going resizes the box. A plan still at its whole-plan fit
    // fits again, so none of it hides; one zoomed in by hand stays put under the finger and only
    // slides to keep the open reading in sight.
    if (!v || fitted.current) fit();
    else follow(v);
    // the size is what changed
  }, [w, h, props.widthM, props.heightM]);
  // The plan follows the open reading as the taps move on.
  useEffect(() => {
    const v = viewRef.current;
    if (v && props.focus) follow(v);
  }, [props.focus?.x, props.focus?.y]);

  function local(e: React.PointerEvent) {
    const r = box.current!.getBoundingClientRect();
    return { x: e.clientX - r.left, y: e.clientY - r.top };
  }

  function onPointerDown(e: React.PointerEvent) {
    box.current?.setPointerCapture(e.pointerId);
    const p = local(e);
    pointers.current.set(e.pointerId, { ...p, startX: p.x, startY: p.y, at: Date.now() });
    moved.current = pointers.current.size > 1;
  }

  function onPointerMove(e: React.PointerEvent) {
    const prev = pointers.current.get(e.pointerId);
    const v = viewRef.current;
    if (!prev || !v) return;
    const p = local(e);
    if (pointers.current.size === 1) {
      if (!moved.current && Math.hypot(p.x - prev.startX, p.y - prev.startY) < TAP_SLOP_PX) return;
      moved.current = true;
      byHand(panBy(v, p.x - prev.x, p.y - prev.y));
    } else if (pointers.current.size === 2) {
      const other = [...pointers.current.entries()].find(([id]) => id !== e.pointerId)![1];
      byHand(applyPinch(v, pinchStep([prev, other], [p, other]), WALK_ZOOM));
    }
    pointers.current.set(e.pointerId, { ...prev, x: p.x, y: p.y });
  }

  function onPointerUp(e: React.PointerEvent) {
    const p = pointers.current.get(e.pointerId);
    pointers.current.delete(e.pointerId);
    const v = viewRef.current;
    if (!p || !v || moved.current || pointers.current.size > 0) {
      if (pointers.current.size === 0) moved.current = false;
      return;
    }
    const at = stageToPlan(stagePoint(p.startX, p.startY), METRE_BASE, v);
    if (at.x >= 0 && at.y >= 0 && at.x <= props.widthM && at.y <= props.heightM) props.onTap(at.x, at.y, p.at);
  }

  function onWheel(e: React.WheelEvent) {
    const v = viewRef.current;
    if (!v) return;
    const p = {
      x: e.clientX - box.current!.getBoundingClientRect().left,
      y: e.clientY - box.current!.getBoundingClientRect().top,
    };
    byHand(zoomAbout(v, stagePoint(p.x, p.y), Math.exp(-e.deltaY / 400), WALK_ZOOM));
  }

  // Buttons as well as pinching: a gloved hand cannot always pinch. Zoom about the reading on
  // the keypad when there is one, else about the middle of the screen.
  function zoomBy(factor: number) {
    const v = viewRef.current;
    if (!v) return;
    const f = focusRef.current;
    const c = f ? planToStage(planPoint(f.x, f.y), METRE_BASE, v) : stagePoint(w / 2, h / 2);
    byHand(zoomAbout(v, c, factor, WALK_ZOOM));
  }

  const ink = props.highContrast ? "#000000" : "#1c2529";
  const px = (n: number) => (view ? n / view.zoom : n);

  return (
    <div
      ref={box}
      data-testid="walk-plan"
      data-view={view ? `${view.zoom} ${view.panX} ${view.panY}` : ""}
      data-fitted={fitted.current ? "yes" : "no"}
      className="relative h-full w-full touch-none select-none overflow-hidden bg-paper"
      onPointerDown={onPointerDown}
      onPointerMove={onPointerMove}
      onPointerUp={onPointerUp}
      onPointerCancel={onPointerUp}
      onWheel={onWheel}
      role="application"
      aria-label="Store plan: tap where the probe is to record a reading"
    >
      {view && w > 0 ? (
        <Stage width={w} height={h} listening={false}>
          <Layer listening={false}>
            <Group x={view.panX} y={view.panY} scaleX={view.zoom} scaleY={view.zoom}>
              {img ? (
                <KonvaImage
                  image={img}
                  width={props.widthM}
                  height={props.heightM}
                  opacity={props.highContrast ? 0.45 : 0.8}
                />
              ) : null}
              <Line
                points={[0, 0, props.widthM, 0, props.widthM, props.heightM, 0, props.heightM]}
                closed
                stroke={ink}
                strokeWidth={1}
                strokeScaleEnabled={false}
              />
              <Fixtures
                fixtures={props.fixtures}
                unsampled={props.unsampled}
                ink={ink}
                highContrast={props.highContrast}
                pointR={px(5)}
              />
            </Group>
          </Layer>
          <Layer listening={false}>
            <Group x={view.panX} y={view.panY} scaleX={view.zoom} scaleY={view.zoom}>
              <ReadingsShape
                readings={props.readings}
                alarmPpm={props.alarmPpm}
                scale={view.zoom}
                selectedId={props.selectedId}
                highContrast={props.highContrast}
              />
              {props.lagHint ? <LagMarks hint={props.lagHint} readings={props.readings} scale={view.zoom} /> : null}
              {props.overlay?.(view.zoom)}
            </Group>
          </Layer>
        </Stage>
      ) : null}
      <PlanLegend highContrast={props.highContrast} />
      {/* One row in the top-right corner, sized as model/walk-fit.ts expects: the fit keeps the plan clear of it. */}
      <div
        className="absolute right-2 top-2 flex flex-row gap-2"
        data-testid="walk-zoom"
        onPointerDown={(e) => e.stopPropagation()}
        onPointerUp={(e) => e.stopPropagation()}
      >
        <button type="button" className={ZOOM} aria-label="Zoom in" onClick={() => zoomBy(1.6)}>
          +
        </button>
        <button type="button" className={ZOOM} aria-label="Zoom out" onClick={() => zoomBy(1 / 1.6)}>
          −
        </button>
        <button type="button" className={`${ZOOM} text-sm`} aria-label="Show the whole plan" onClick={() => fit()}>
          All
        </button>
      </div>
    </div>
  );
}

const ZOOM =
  "flex h-12 w-12 items-center justify-center rounded-md bg-surface text-2xl font-bold edge shadow active:opacity-70";

function Fixtures({
  fixtures,
  unsampled,
  ink,
  highContrast,
  pointR,
}: {
  fixtures: readonly Fixture[];
  unsampled: ReadonlySet<string>;
  ink: string;
  highContrast: boolean;
  pointR: number;
}) {
  const shapes = useMemo(() => {
    const look = markLooks(highContrast);
    return fixtures.map((f) => {
      const open = unsampled.has(f.id);
      // Not yet sampled: a thick dashed outline (shape, not just colour, tells it apart).
      const stroke = open ? look.unsampledFixture.stroke : look.sampledFixture.stroke;
      if ("point" in f) {
        const d = pointR;
        return (
          <Line
            key={f.id}
            points={[
              f.point.x - d,
              f.point.y,
              f.point.x,
              f.point.y - d,
              f.point.x + d,
              f.point.y,
              f.point.x,
              f.point.y + d,
            ]}
            closed
            stroke={stroke}
            strokeWidth={1.5}
            strokeScaleEnabled={false}
            fill={open ? look.unsampledPoint.fill : look.sampledPoint.fill}
          />
        );
      }
      return (
        <Line
          key={f.id}
          points={f.polygon.flat()}
          closed
          stroke={stroke}
          strokeWidth={open ? 3 : 1}
          dash={open ? [8, 5] : undefined}
          strokeScaleEnabled={false}
          fill={backdropOf(f.kind) === "ink" ? ink : open ? look.unsampledFixture.fill : look.sampledFixture.fill}
        />
      );
    });
  }, [fixtures, unsampled, ink, highContrast, pointR]);
  return <>{shapes}</>;
}

/**
 * The path and all readings as ONE canvas shape: a sweep of thousands of readings stays one
 * node, so a tap redraws without reconciling thousands of React elements.
 */
function ReadingsShape({
  readings,
  alarmPpm,
  scale,
  selectedId,
  highContrast,
}: {
  readings: readonly LocalReading[];
  alarmPpm: number;
  scale: number;
  selectedId: string | null;
  highContrast: boolean;
}) {
  return (
    <Shape
      listening={false}
      perfectDrawEnabled={false}
      sceneFunc={(ctx: Context) => {
        const started = performance.now();
        const c = ctx._context;
        const look = markLooks(highContrast);
        // Sized by zoom, so neighbours stay apart at the whole-store view (plan-marks.ts).
        const r = readingDotRadiusPx(scale) / scale;
        c.lineJoin = "round";
        c.lineWidth = pathWidthPx(scale, highContrast) / scale;
        c.strokeStyle = look.path.stroke;
        c.beginPath();
        readings.forEach((p, i) => (i === 0 ? c.moveTo(p.x, p.y) : c.lineTo(p.x, p.y)));
        c.stroke();
        for (const p of readings) {
          const alarm = p.ppm >= alarmPpm;
          c.beginPath();
          const selected = p.id === selectedId;
          const dot = alarm ? look.readingAlarm : p.ppm > 0 ? look.readingTrace : look.readingZero;
          c.arc(
            p.x,
            p.y,
            (alarm ? r * ALARM_DOT_FACTOR : p.ppm > 0 ? r * TRACE_DOT_FACTOR : r) * (selected ? 1.5 : 1),
            0,
            Math.PI * 2,
          );
          c.fillStyle = dot.fill;
          c.fill();
          c.lineWidth = (selected ? 4 : r * scale < 4 ? 1 : 2) / scale;
          c.setLineDash(p.sync.kind === "refused" ? [3 / scale, 2 / scale] : []);
          c.strokeStyle = selected ? look.openReading.stroke : dot.stroke;
          c.stroke();
        }
        c.setLineDash([]);
        // Tells whoever listens (the Walk benchmark times tap-to-drawn with it) what was drawn and when.
        const at = performance.now();
        window.dispatchEvent(
          new CustomEvent("plumeline:walk-drawn", { detail: { count: readings.length, at, drawMs: at - started } }),
        );
      }}
    />
  );
}

/** Where the alarm's air really was (a diamond) and the suggested closer re-check spots (rings). */
function LagMarks({ hint, readings, scale }: { hint: LagHint; readings: readonly LocalReading[]; scale: number }) {
  const tap = readings[hint.index];
  const look = markLooks(false);
  const d = 10 / scale;
  return (
    <>
      {tap ? (
        <Line
          points={[tap.x, tap.y, hint.x, hint.y]}
          stroke={look.recheck.stroke}
          strokeWidth={2}
          dash={[6, 4]}
          strokeScaleEnabled={false}
        />
      ) : null}
      {hint.recheck.map((p, i) => (
        <Line
          key={i}
          points={circlePoints(p.x, p.y, 5 / scale)}
          closed
          stroke={look.recheck.stroke}
          strokeWidth={2}
          strokeScaleEnabled={false}
        />
      ))}
      <Line
        points={[hint.x - d, hint.y, hint.x, hint.y - d, hint.x + d, hint.y, hint.x, hint.y + d]}
        closed
        fill={look.sampledAt.fill}
        stroke={look.sampledAt.stroke}
        strokeWidth={3}
        strokeScaleEnabled={false}
      />
    </>
  );
}

function circlePoints(x: number, y: number, r: number): number[] {
  const out: number[] = [];
  for (let k = 0; k < 16; k++)
    out.push(x + r * Math.cos((k / 16) * Math.PI * 2), y + r * Math.sin((k / 16) * Math.PI * 2));
  return out;
}
