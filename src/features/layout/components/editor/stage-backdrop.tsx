import { memo } from "react";
import { Group, Image as KonvaImage, Layer, Line, Rect } from "react-konva";
import type { PlanBounds } from "#core/contracts/fixtures";

export interface Backdrop {
  /** The plan's display image, or null for a blank plan. */
  image: HTMLImageElement | null;
  widthPx: number;
  heightPx: number;
  /** Metres per image pixel (a blank plan gets a virtual one). */
  metresPerPixel: number;
}

const GRID_STEPS = [0.25, 0.5, 1, 2, 5, 10, 20, 50];

/** The grid line spacing whose lines lie at least `minPx` screen pixels apart. */
export function gridSpacing(metresPerScreenPixel: number, minPx = 14): number {
  return GRID_STEPS.find((s) => s / metresPerScreenPixel >= minPx) ?? GRID_STEPS[GRID_STEPS.length - 1];
}

/** The drawing and the grid, on a layer that never listens to events (react-konva's advice for backgrounds). */
export const StageBackdrop = memo(function StageBackdrop({
  backdrop,
  plan,
  gridM,
}: {
  backdrop: Backdrop;
  plan: PlanBounds;
  gridM: number | null;
}) {
  const k = 1 / backdrop.metresPerPixel;
  const lines: number[][] = [];
  if (gridM) {
    for (let x = gridM; x < plan.width; x += gridM) lines.push([x, 0, x, plan.height]);
    for (let y = gridM; y < plan.height; y += gridM) lines.push([0, y, plan.width, y]);
  }
  return (
    <Layer listening={false}>
      {backdrop.image ? (
        <KonvaImage image={backdrop.image} width={backdrop.widthPx} height={backdrop.heightPx} />
      ) : null}
      <Group scaleX={k} scaleY={k}>
        {backdrop.image ? null : <Rect width={plan.width} height={plan.height} fill="#ffffff" />}
        {lines.map((p, i) => (
          <Line key={i} points={p} stroke="rgba(31,78,95,0.16)" strokeWidth={1} strokeScaleEnabled={false} />
        ))}
        <Rect width={plan.width} height={plan.height} stroke="#1f4e5f" strokeWidth={1.5} strokeScaleEnabled={false} />
      </Group>
    </Layer>
  );
});
