import { useEffect, useMemo, useRef, useState } from "react";
import type { FieldGridLike } from "#core/domain/fieldmap/field-grid";
import { drawFieldLayer, paintFieldCanvas, type FieldPaint } from "../model/draw-field-layer";
import {
  drawFixtures,
  drawPath,
  drawRiskPoints,
  drawSpots,
  drawTaps,
  type OverlayFixture,
  type OverlayReading,
  type OverlaySpot,
} from "../model/draw-overlays";
import type { LayerState } from "../model/layers";
import type { View } from "../../../lib/plan-view/coordinates";
import { fitView, focusView, spotAt } from "../model/view";

export interface FieldCanvasProps {
  label: string;
  widthM: number;
  heightM: number;
  planImageUrl: string | null;
  field: FieldGridLike | null;
  paint: FieldPaint;
  layers: LayerState;
  fixtures: readonly OverlayFixture[];
  readings: readonly OverlayReading[];
  spots: readonly OverlaySpot[];
  selected: number | null;
  /** Canvas width in CSS pixels; the height follows the plan's aspect. */
  width: number;
  /** Clicking a suspect spot on the map selects (and zooms to) it. */
  onSelect?: (rank: number | null) => void;
}

/** The plan with the field and the vector layers; a plain canvas redrawn from props (no retained scene). */
export function FieldCanvas(p: FieldCanvasProps) {
  const ref = useRef<HTMLCanvasElement>(null);
  const [plan, setPlan] = useState<HTMLImageElement | null>(null);
  const height = Math.round((p.width * p.heightM) / p.widthM);

  useEffect(() => {
    if (!p.planImageUrl) return setPlan(null);
    const img = new Image();
    img.onload = () => setPlan(img);
    img.src = p.planImageUrl;
    return () => {
      img.onload = null;
    };
  }, [p.planImageUrl]);

  const painted = useMemo(() => (p.field ? paintFieldCanvas(p.field, p.paint) : null), [p.field, p.paint]);

  const view: View = useMemo(() => {
    const base = fitView(p.widthM, p.heightM, p.width, height, 0);
    const s = p.selected === null ? null : p.spots.find((x) => x.rank === p.selected);
    return s ? focusView(s.x, s.y, s.radius, p.width, height, base) : base;
  }, [p.widthM, p.heightM, p.width, height, p.selected, p.spots]);

  useEffect(() => {
    const canvas = ref.current;
    if (!canvas) return;
    const dpr = window.devicePixelRatio || 1;
    canvas.width = Math.round(p.width * dpr);
    canvas.height = Math.round(height * dpr);
    const ctx = canvas.getContext("2d");
    if (!ctx) return;
    ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
    ctx.fillStyle = "#f3f2ee";
    ctx.fillRect(0, 0, p.width, height);
    if (plan) ctx.drawImage(plan, view.panX, view.panY, p.widthM * view.zoom, p.heightM * view.zoom);
    if (p.layers.field && painted && p.field) drawFieldLayer(ctx, painted, p.field, view);
    if (p.layers.fixtures) drawFixtures(ctx, view, p.fixtures);
    if (p.layers.path) drawPath(ctx, view, p.readings);
    if (p.layers.taps) drawTaps(ctx, view, p.readings, "raw", false);
    if (p.layers.corrected) drawTaps(ctx, view, p.readings, "corrected", p.layers.taps);
    if (p.layers.riskPoints) drawRiskPoints(ctx, view, p.fixtures);
    if (p.layers.suspects) drawSpots(ctx, view, p.spots, p.selected);
  }, [
    plan,
    painted,
    view,
    p.layers,
    p.fixtures,
    p.readings,
    p.spots,
    p.selected,
    p.width,
    height,
    p.widthM,
    p.heightM,
    p.field,
  ]);

  return (
    <canvas
      ref={ref}
      role="img"
      aria-label={p.label}
      data-testid="field-canvas"
      data-suspects={p.layers.suspects ? p.spots.length : 0}
      style={{ width: p.width, height, cursor: p.onSelect && p.spots.length ? "pointer" : undefined }}
      onClick={(e) => {
        if (!p.onSelect || !p.layers.suspects) return;
        const box = e.currentTarget.getBoundingClientRect();
        const rank = spotAt(view, e.clientX - box.left, e.clientY - box.top, p.spots);
        if (rank !== null) p.onSelect(rank === p.selected ? null : rank);
      }}
      className="block max-w-full rounded-md edge bg-surface"
    />
  );
}
