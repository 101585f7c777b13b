import type { ZoomLimits } from "../../../lib/plan-view/coordinates";

/** The Walk screen draws in metres: from a whole store on a phone to a hand's width across it. */
export const WALK_ZOOM: ZoomLimits = { min: 2, max: 400 };
