import { useEffect, useMemo, useRef, useState } from "react";
import { Group, Image as KonvaImage, Layer, Line, Shape, Stage } from "react-konva";
import type { Context } from "konva/lib/Context";
import type { Fixture } from "#core/contracts/fixtures";
import type { LocalReading } from "../model/local-types";
import type { LagHint } from "../model/lag-hint";
import {
  fitView,
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
  useEffect(() => {
    if (w <= 0 || h <= 0) return;
    const v = viewRef.current;
    if (!v) {
      setView(fitView(props.widthM, props.heightM, w, h, 12, WALK_ZOOM));
      return;
    }
    // The keypad opening or closing resizes the box. The plan stays put under the finger; only
    // when the reading being entered would be hidden does it slide just enough to show it.
    const f = focusRef.current;
    if (!f) return;
    const margin = 40;
    const { x: sx, y: sy } = planToStage(planPoint(f.x, f.y), METRE_BASE, v);
    const dx = sx > w - margin ? w - margin - sx : sx < margin ? margin - sx : 0;
    const dy = sy > h - margin ? h - margin - sy : sy < margin ? margin - sy : 0;
    if (dx || dy) setView(panBy(v, dx, dy));
  }, [w, h, props.widthM, props.heightM]);

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
      setView(panBy(v, p.x - prev.x, p.y - prev.y));
    } else if (pointers.current.size === 2) {
      const other = [...pointers.current.entries()].find(([id]) => id !== e.pointerId)![1];
      setView(applyPinch(v, pinchStep([prev, other], [p, other]), WALK_ZOOM));
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
    setView(zoomAbout(v, stagePoint(p.x, p.y), Math.exp(-e.deltaY / 400), WALK_ZOOM));
  }

  // Buttons as well as pinching: a gloved hand cannot always pinch. Zoom about the reading on
  // the keypad when there is one, else about the middle of the screen.
  function zoomBy(factor: number) {
    const v = viewRef.current;
    if (!v) return;
    const f = focusRef.current;
    const c = f ? planToStage(planPoint(f.x, f.y), METRE_BASE, v) : stagePoint(w / 2, h / 2);
    setView(zoomAbout(v, c, factor, WALK_ZOOM));
  }

  const ink = props.highContrast ? "#000000" : "#1c2529";
  const px = (n: number) => (view ? n / view.zoom : n);

  return (
    <div
      ref={box}
      data-testid="walk-plan"
      data-view={view ? `${view.zoom} ${view.panX} ${view.panY}` : ""}
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
            </Group>
          </Layer>
        </Stage>
      ) : null}
      <div
        className="absolute right-2 top-2 flex flex-col gap-2"
        onPointerDown={(e) => e.stopPropagation()}
        onPointerUp={(e) => e.stopPropagation()}
      >
        <button type="button" className={ZOOM} aria-label="Zoom in" onClick={() => zoomBy(1.6)}>
          +
        </button>
        <button type="button" className={ZOOM} aria-label="Zoom out" onClick={() => zoomBy(1 / 1.6)}>
          −
        </button>
        <button
          type="button"
          className={`${ZOOM} text-sm`}
          aria-label="Show the whole plan"
          onClick={() => setView(fitView(props.widthM, props.heightM, w, h, 12, WALK_ZOOM))}
        >
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
  const shapes = useMemo(
    () =>
      fixtures.map((f) => {
        const open = unsampled.has(f.id);
        // Not yet sampled: a thick dashed outline (shape, not just colour, tells it apart).
        const stroke = open ? (highContrast ? "#000000" : "#b35c00") : highContrast ? "#000000" : "#6b7a80";
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
              fill={open ? (highContrast ? "#ffd600" : "#f0b45a") : "#ffffff"}
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
            fill={backdropOf(f.kind) === "ink" ? ink : open ? "rgba(179,92,0,0.08)" : "rgba(31,78,95,0.06)"}
          />
        );
      }),
    [fixtures, unsampled, ink, highContrast, pointR],
  );
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
        const r = 7 / scale;
        c.lineJoin = "round";
        c.lineWidth = (highContrast ? 3 : 2) / scale;
        c.strokeStyle = highContrast ? "#000000" : "#1f4e5f";
        c.beginPath();
        readings.forEach((p, i) => (i === 0 ? c.moveTo(p.x, p.y) : c.lineTo(p.x, p.y)));
        c.stroke();
        for (const p of readings) {
          const alarm = p.ppm >= alarmPpm;
          c.beginPath();
          c.arc(p.x, p.y, alarm ? r * 1.5 : p.ppm > 0 ? r * 1.15 : r, 0, Math.PI * 2);
          c.fillStyle = alarm
            ? highContrast
              ? "#000000"
              : "#9b2c2c"
            : p.ppm > 0
              ? highContrast
                ? "#ffd600"
                : "#e0a100"
              : "#ffffff";
          c.fill();
          c.lineWidth = (p.id === selectedId ? 4 : 2) / scale;
          c.setLineDash(p.sync.kind === "refused" ? [3 / scale, 2 / scale] : []);
          c.strokeStyle = p.id === selectedId ? "#d98e04" : "#1c2529";
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
  const d = 10 / scale;
  return (
    <>
      {tap ? (
        <Line
          points={[tap.x, tap.y, hint.x, hint.y]}
          stroke="#9b2c2c"
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
          stroke="#9b2c2c"
          strokeWidth={2}
          strokeScaleEnabled={false}
        />
      ))}
      <Line
        points={[hint.x - d, hint.y, hint.x, hint.y - d, hint.x + d, hint.y, hint.x, hint.y + d]}
        closed
        fill="#ffd600"
        stroke="#000000"
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
