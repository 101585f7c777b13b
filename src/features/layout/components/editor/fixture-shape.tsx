import { memo } from "react";
import type Konva from "konva";
import { Circle, Group, Line, Rect, Text } from "react-konva";
import type { Fixture } from "#core/contracts/fixtures";
import { polygonBounds } from "#core/analysis/geometry/bounds";
import { fixtureCentroid } from "../../model/fixture-geometry";
import { doorGap, doorTicks, wallWithDoorGap } from "../../model/fixture-drawing";
import {
  lookOf,
  PATTERN_SCALE,
  patternTile,
  POINT_COLOURS,
  SELECTION_STROKE,
} from "../../../../lib/plan-view/fixture-look";

/** Average glyph width of Atkinson Hyperlegible in em, for guessing whether a label fits. */
const LABEL_CHAR_EM = 0.56;
/** Point labels crowd a zoomed-out plan: they show from about 50 screen px per metre, or when selected. */
const POINT_LABEL_UNIT = 0.021;

/** Callbacks shared by every shape; the editor passes one stable object so memo holds. */
export interface ShapeHandlers {
  register: (id: string, node: Konva.Group | null) => void;
  onPress: (id: string, e: Konva.KonvaEventObject<PointerEvent>) => void;
  onDragStart: (id: string, e: Konva.KonvaEventObject<DragEvent>) => void;
  onDragMove: (id: string, e: Konva.KonvaEventObject<DragEvent>) => void;
  onDragEnd: (id: string, e: Konva.KonvaEventObject<DragEvent>) => void;
  onTransformEnd: (id: string, node: Konva.Group) => void;
}

export interface FixtureShapeProps {
  fixture: Fixture;
  selected: boolean;
  draggable: boolean;
  /** Metres per screen pixel, in coarse steps: sizes labels and glyphs without re-rendering on every zoom. */
  unit: number;
  handlers: ShapeHandlers;
}

/**
 * One fixture as a Konva group in plan metres. React re-renders it only when its own props
 * change (memo): a drag moves the Konva node alone and writes back once, on drag end.
 */
export const FixtureShape = memo(function FixtureShape({
  fixture: f,
  selected,
  draggable,
  unit,
  handlers,
}: FixtureShapeProps) {
  const common = {
    ref: (node: Konva.Group | null) => handlers.register(f.id, node),
    draggable,
    onPointerDown: (e: Konva.KonvaEventObject<PointerEvent>) => handlers.onPress(f.id, e),
    onDragStart: (e: Konva.KonvaEventObject<DragEvent>) => handlers.onDragStart(f.id, e),
    onDragMove: (e: Konva.KonvaEventObject<DragEvent>) => handlers.onDragMove(f.id, e),
    onDragEnd: (e: Konva.KonvaEventObject<DragEvent>) => handlers.onDragEnd(f.id, e),
    onTransformEnd: (e: Konva.KonvaEventObject<Event>) =>
      handlers.onTransformEnd(f.id, e.currentTarget as unknown as Konva.Group),
  };
  let fontSize = 13 * unit;
  if ("point" in f) {
    const colour = POINT_COLOURS[f.kind];
    const r = 8 * unit;
    return (
      <Group {...common} name="fixture">
        <Group x={f.point.x} y={f.point.y}>
          {selected ? (
            <Circle radius={r * 1.7} stroke={SELECTION_STROKE} strokeWidth={3} strokeScaleEnabled={false} />
          ) : null}
          <PointGlyph kind={f.kind} r={r} colour={colour} />
          {f.label && (selected || unit <= POINT_LABEL_UNIT) ? (
            <Text
              x={r * 1.3}
              y={-fontSize / 2}
              text={f.label}
              fontSize={fontSize}
              fontFamily="Atkinson Hyperlegible"
              fill="#111"
              listening={false}
            />
          ) : null}
        </Group>
      </Group>
    );
  }
  const look = lookOf(f.kind);
  const flat = f.polygon.flatMap(([x, y]) => [x, y]);
  const tile = patternTile(look.pattern);
  const [cx, cy] = fixtureCentroid(f);
  const b = polygonBounds(f.polygon);
  const wall = "door" in f && look.wall ? wallWithDoorGap(f.polygon, f.door) : null;
  const gap = "door" in f && f.door ? doorGap(f.polygon, f.door) : null;
  const ticks = f.kind === "door-case" ? doorTicks(f.polygon, f.doorCount) : [];
  // A label is drawn only where it fits inside the outline, shrunk to 10 px if it must be;
  // the list view always has it.
  const boxWidth = b.maxX - b.minX;
  if (f.label.length * fontSize * LABEL_CHAR_EM > boxWidth)
    fontSize = Math.max(10 * unit, boxWidth / (f.label.length * LABEL_CHAR_EM));
  const labelWidth = f.label.length * fontSize * LABEL_CHAR_EM;
  const showLabel = f.label !== "" && (labelWidth <= b.maxX - b.minX || selected) && fontSize <= b.maxY - b.minY;
  return (
    <Group {...common} name="fixture">
      <Line
        points={flat}
        closed
        fill={tile ? undefined : look.fill}
        fillPatternImage={tile as unknown as HTMLImageElement | undefined}
        fillPatternScale={tile ? { x: PATTERN_SCALE, y: PATTERN_SCALE } : undefined}
        stroke={wall ? undefined : look.stroke}
        strokeWidth={look.strokeWidth}
        strokeScaleEnabled={false}
        dash={look.dash ?? undefined}
        hitStrokeWidth={12}
        perfectDrawEnabled={false}
      />
      {tile ? <Line points={flat} closed fill={look.fill} listening={false} /> : null}
      {wall ? (
        <Line
          points={wall.points}
          closed={wall.closed}
          stroke={look.stroke}
          strokeWidth={look.strokeWidth}
          strokeScaleEnabled={false}
          lineJoin="miter"
          listening={false}
        />
      ) : null}
      {gap ? (
        <Line
          points={[gap[0][0], gap[0][1], gap[1][0], gap[1][1]]}
          stroke={look.stroke}
          strokeWidth={1.5}
          dash={[3, 3]}
          strokeScaleEnabled={false}
          listening={false}
        />
      ) : null}
      {ticks.map(([p, q], i) => (
        <Line
          key={i}
          points={[p[0], p[1], q[0], q[1]]}
          stroke={look.stroke}
          strokeWidth={1.5}
          strokeScaleEnabled={false}
          listening={false}
        />
      ))}
      {"hasFans" in f &&
      f.hasFans &&
      look.wall === false &&
      f.kind !== "benign-zone" &&
      b.maxX - b.minX > fontSize * 3 ? (
        <FanMark x={b.maxX - fontSize * 0.9} y={b.minY + fontSize * 0.9} r={fontSize * 0.45} colour={look.stroke} />
      ) : null}
      {selected ? (
        <Line
          points={flat}
          closed
          stroke={SELECTION_STROKE}
          strokeWidth={3}
          dash={[6, 3]}
          strokeScaleEnabled={false}
          listening={false}
        />
      ) : null}
      {showLabel ? (
        <Text
          x={cx}
          y={cy}
          offsetX={labelWidth / 2}
          offsetY={fontSize / 2}
          text={f.label}
          fontSize={fontSize}
          fontFamily="Atkinson Hyperlegible"
          fontStyle="bold"
          fill="#111"
          listening={false}
        />
      ) : null}
    </Group>
  );
});

/** Fans: a small ring with three blades, so "has fans" reads on the plan without the panel. */
function FanMark({ x, y, r, colour }: { x: number; y: number; r: number; colour: string }) {
  const blades = [0, 120, 240].map((deg) => {
    const a = (deg * Math.PI) / 180;
    return [x, y, x + Math.cos(a) * r, y + Math.sin(a) * r];
  });
  return (
    <Group listening={false}>
      <Circle
        x={x}
        y={y}
        radius={r}
        stroke={colour}
        strokeWidth={1.2}
        strokeScaleEnabled={false}
        fill="rgba(255,255,255,0.8)"
      />
      {blades.map((p, i) => (
        <Line key={i} points={p} stroke={colour} strokeWidth={1.5} strokeScaleEnabled={false} />
      ))}
    </Group>
  );
}

function PointGlyph({ kind, r, colour }: { kind: "line-set-drop" | "valve" | "coil"; r: number; colour: string }) {
  if (kind === "line-set-drop") {
    // A circle with a cross: the pipe run coming down through the ceiling.
    return (
      <Group>
        <Circle radius={r} fill="#ffffff" stroke={colour} strokeWidth={2.5} strokeScaleEnabled={false} />
        <Line
          points={[-r * 0.7, -r * 0.7, r * 0.7, r * 0.7]}
          stroke={colour}
          strokeWidth={2}
          strokeScaleEnabled={false}
        />
        <Line
          points={[-r * 0.7, r * 0.7, r * 0.7, -r * 0.7]}
          stroke={colour}
          strokeWidth={2}
          strokeScaleEnabled={false}
        />
      </Group>
    );
  }
  if (kind === "valve") {
    // A bow-tie: two triangles meeting at a point.
    return (
      <Group>
        <Circle radius={r * 1.1} fill="rgba(255,255,255,0.85)" />
        <Line
          points={[-r, -r * 0.7, r, r * 0.7, r, -r * 0.7, -r, r * 0.7]}
          closed
          fill={colour}
          stroke="#000"
          strokeWidth={1}
          strokeScaleEnabled={false}
        />
      </Group>
    );
  }
  // A coil: a zig-zag inside a square.
  return (
    <Group>
      <Rect
        x={-r}
        y={-r}
        width={2 * r}
        height={2 * r}
        fill="#ffffff"
        stroke={colour}
        strokeWidth={2.5}
        strokeScaleEnabled={false}
      />
      <Line
        points={[-r * 0.7, r * 0.5, -r * 0.35, -r * 0.5, 0, r * 0.5, r * 0.35, -r * 0.5, r * 0.7, r * 0.5]}
        stroke={colour}
        strokeWidth={2}
        strokeScaleEnabled={false}
      />
    </Group>
  );
}
