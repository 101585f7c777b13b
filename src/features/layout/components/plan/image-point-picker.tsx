import { useEffect, useRef, useState } from "react";
import type Konva from "konva";
import { Circle, Image as KonvaImage, Layer, Line, Stage, Text } from "react-konva";
import {
  fitView,
  imagePoint,
  stagePoint,
  stageToImage,
  zoomAbout,
  IMAGE_ZOOM,
  type ImagePoint,
  type View,
} from "../../../../lib/plan-view/coordinates";
import { useHtmlImage } from "../../../../lib/use-html-image";
import { applyPinch } from "../../../../lib/plan-view/pinch";
import { useTwoFingerPinch } from "../../../../lib/plan-view/use-two-finger-pinch";
import { Spinner } from "../../../../components/ui/spinner";
import { Alert } from "../../../../components/ui/alert";
import { Button } from "../../../../components/ui/button";

export interface PickerProps {
  imageUrl: string;
  widthPx: number;
  heightPx: number;
  points: readonly ImagePoint[];
  onChange: (points: ImagePoint[]) => void;
  /** Names of the points, in order (e.g. "A", "B"). */
  names: readonly string[];
  /** Draw a line between the two points (calibration) or not (alignment). */
  joined?: boolean;
  label: string;
  height?: number;
}

/**
 * Picks up to `names.length` points on a plan image by clicking or tapping; wheel or pinch zooms
 * about the cursor or the fingers, dragging pans, a later click replaces the oldest point.
 * Points are display-image pixels.
 */
export function ImagePointPicker({
  imageUrl,
  widthPx,
  heightPx,
  points,
  onChange,
  names,
  joined = true,
  label,
  height = 420,
}: PickerProps) {
  const image = useHtmlImage(imageUrl);
  const box = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(640);
  const [view, setView] = useState<View>({ panX: 0, panY: 0, zoom: 1 });
  const stageRef = useRef<Konva.Stage>(null);
  /** This touch gesture was a pinch: the finger lifted last is no tap. */
  const pinched = useRef(false);
  const loaded = image.status === "loaded";

  // Pinch to zoom (and two-finger pan) on a tablet, where there is no wheel; the first finger has
  // started dragging the stage by the time the second lands.
  const pinchNow = useRef(false);
  useTwoFingerPinch(
    () => stageRef.current?.container(),
    pinchNow,
    {
      onStart: () => {
        pinched.current = true;
        const stage = stageRef.current;
        if (stage?.isDragging()) stage.stopDrag();
        stage?.draggable(false);
      },
      onEnd: () => stageRef.current?.draggable(true),
      onPinch: (step) => setView((v) => applyPinch(v, step, IMAGE_ZOOM)),
    },
    [loaded],
  );

  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const fit = () => {
      const w = Math.max(240, el.clientWidth);
      setWidth(w);
      setView(fitView(widthPx, heightPx, w, height, 16, IMAGE_ZOOM));
    };
    fit();
    const ro = new ResizeObserver(fit);
    ro.observe(el);
    return () => ro.disconnect();
  }, [widthPx, heightPx, height]);

  function handleClick(e: Konva.KonvaEventObject<MouseEvent | TouchEvent>) {
    const pos = e.target.getStage()?.getPointerPosition();
    if (!pos) return;
    // The finger lifted last after a pinch is no tap.
    if (e.type === "tap" && pinched.current) return;
    const p = stageToImage(stagePoint(pos.x, pos.y), view);
    if (p.x < 0 || p.y < 0 || p.x > widthPx || p.y > heightPx) return;
    const rounded = imagePoint(Math.round(p.x * 10) / 10, Math.round(p.y * 10) / 10);
    onChange(points.length >= names.length ? [...points.slice(1), rounded] : [...points, rounded]);
  }

  function handleWheel(e: Konva.KonvaEventObject<WheelEvent>) {
    e.evt.preventDefault();
    const pos = e.target.getStage()?.getPointerPosition();
    if (!pos) return;
    setView((v) => zoomAbout(v, stagePoint(pos.x, pos.y), e.evt.deltaY < 0 ? 1.2 : 1 / 1.2));
  }

  const r = 7 / view.zoom;
  return (
    <div className="space-y-2">
      <div ref={box} className="overflow-hidden rounded-md bg-paper edge" aria-label={label} role="group">
        {image.status === "loading" ? <Spinner label="Loading the drawing…" /> : null}
        {image.status === "failed" ? <Alert tone="error">The drawing could not be loaded.</Alert> : null}
        {image.status === "loaded" ? (
          <Stage
            ref={stageRef}
            style={{ touchAction: "none" }}
            width={width}
            height={height}
            x={view.panX}
            y={view.panY}
            scaleX={view.zoom}
            scaleY={view.zoom}
            draggable
            onDragEnd={(e) => {
              if (e.target === e.target.getStage()) setView((v) => ({ ...v, panX: e.target.x(), panY: e.target.y() }));
            }}
            onPointerDown={() => {
              pinched.current = pinchNow.current; // a new gesture
            }}
            onClick={handleClick}
            onTap={handleClick}
            onWheel={handleWheel}
            data-testid="point-picker"
          >
            <Layer listening>
              <KonvaImage image={image.image} width={widthPx} height={heightPx} />
            </Layer>
            <Layer listening={false}>
              {joined && points.length === 2 ? (
                <Line
                  points={[points[0].x, points[0].y, points[1].x, points[1].y]}
                  stroke="#b3261e"
                  strokeWidth={3 / view.zoom}
                  dash={[10 / view.zoom, 6 / view.zoom]}
                />
              ) : null}
              {points.map((p, i) => (
                <Circle
                  key={i}
                  x={p.x}
                  y={p.y}
                  radius={r}
                  stroke="#b3261e"
                  strokeWidth={3 / view.zoom}
                  fill="rgba(255,255,255,0.6)"
                />
              ))}
              {points.map((p, i) => (
                <Text
                  key={`t${i}`}
                  x={p.x + r * 1.4}
                  y={p.y - r * 2.6}
                  text={names[i]}
                  fontSize={18 / view.zoom}
                  fontStyle="bold"
                  fill="#b3261e"
                  fontFamily="Atkinson Hyperlegible"
                />
              ))}
            </Layer>
          </Stage>
        ) : null}
      </div>
      <div className="flex flex-wrap items-center gap-2 text-sm text-muted">
        <span>Tap or click to place {names.join(" and ")}; pinch or scroll to zoom, drag to pan.</span>
        <Button variant="secondary" onClick={() => setView(fitView(widthPx, heightPx, width, height, 16, IMAGE_ZOOM))}>
          Fit drawing
        </Button>
        <Button
          variant="secondary"
          onClick={() => setView((v) => zoomAbout(v, stagePoint(width / 2, height / 2), 1.5))}
          aria-label="Zoom in"
        >
          +
        </Button>
        <Button
          variant="secondary"
          onClick={() => setView((v) => zoomAbout(v, stagePoint(width / 2, height / 2), 1 / 1.5))}
          aria-label="Zoom out"
        >
          −
        </Button>
        {points.length > 0 ? (
          <Button variant="quiet" onClick={() => onChange([])}>
            Clear points
          </Button>
        ) : null}
      </div>
      {/* The stage's view, for the browser test to turn screen positions into image pixels. */}
      <output hidden data-testid="picker-view" data-zoom={view.zoom} data-pan-x={view.panX} data-pan-y={view.panY} />
    </div>
  );
}
