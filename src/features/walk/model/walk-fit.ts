/**
 * Where the whole-plan fit puts the plan on the Walk screen: never under the buttons that sit over
 * it (the Key button top left, the zoom row top right), so the plan's edges can always be tapped.
 */
import { fitView, type View } from "../../../lib/plan-view/coordinates";
import { WALK_ZOOM } from "./walk-view";

/** The buttons' geometry in CSS px; plan-stage.tsx and plan-legend.tsx draw them to these sizes. */
export const WALK_CONTROLS = {
  /** Distance of every corner button from the box's edges (Tailwind `top-2`, `left-2`, `right-2`). */
  insetPx: 8,
  /** Every button is 48 px tall (`h-12`), the zoom buttons 48 px wide (`w-12`) with 8 px gaps (`gap-2`). */
  buttonPx: 48,
  gapPx: 8,
  zoomButtons: 3,
  /** The Key button with its longest label ("Hide key"), generously. */
  keyWidthPx: 96,
} as const;

/** Room kept between the plan and the box's edges or the buttons. */
const MARGIN_PX = 12;

interface Area {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** The zoom row's box in the plan's container (CSS px), for tests and for the fit. */
export function zoomRowBox(boxWidth: number): Area {
  const c = WALK_CONTROLS;
  const width = c.zoomButtons * c.buttonPx + (c.zoomButtons - 1) * c.gapPx;
  return { x: boxWidth - c.insetPx - width, y: c.insetPx, width, height: c.buttonPx };
}

function fitInto(widthM: number, heightM: number, a: Area): View {
  const v = fitView(widthM, heightM, Math.max(1, a.width), Math.max(1, a.height), 0, WALK_ZOOM);
  return { ...v, panX: v.panX + a.x, panY: v.panY + a.y };
}

/**
 * The whole plan, as large as fits either below the band of buttons or, for a tall plan in a wide
 * box, between the Key button and the zoom row from top to bottom: whichever draws it larger.
 */
export function fitClearOfControls(widthM: number, heightM: number, boxWidth: number, boxHeight: number): View {
  if (!(widthM > 0 && heightM > 0)) throw new RangeError("fitClearOfControls: the plan needs a width and a height");
  const c = WALK_CONTROLS;
  const band = c.insetPx + c.buttonPx + MARGIN_PX;
  const below: Area = {
    x: MARGIN_PX,
    y: band,
    width: boxWidth - 2 * MARGIN_PX,
    height: boxHeight - band - MARGIN_PX,
  };
  const left = c.insetPx + c.keyWidthPx + MARGIN_PX;
  const row = zoomRowBox(boxWidth);
  const between: Area = {
    x: left,
    y: MARGIN_PX,
    width: row.x - MARGIN_PX - left,
    height: boxHeight - 2 * MARGIN_PX,
  };
  const a = fitInto(widthM, heightM, below);
  const b = fitInto(widthM, heightM, between);
  return b.zoom > a.zoom ? b : a;
}
