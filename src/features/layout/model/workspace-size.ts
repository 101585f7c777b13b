/**
 * How big the editor's stage is: the plan is a workspace that fills the window under the tools
 * (the tools scroll with it, so they never cover the plan), and no taller than the drawing
 * needs at the stage's width, so a wide plan on a portrait tablet leaves no empty band above
 * and below it (the selection's panel rises into that room instead).
 */

/** Below this the stage is too small to draw on; the page scrolls instead. */
export const MIN_STAGE_HEIGHT_PX = 320;
export const MIN_STAGE_WIDTH_PX = 320;
/** Room kept under the stage so its edge shows where the plan ends. */
export const STAGE_BOTTOM_GAP_PX = 8;

export interface WorkspaceInput {
  /** Width the stage's box has on the page. */
  boxWidth: number;
  windowHeight: number;
  /** From the top of the tools to the top of the stage (the tools, the gap and any notice between). */
  aboveStage: number;
  /** The drawing's size in its own pixels (the editor's view base). */
  contentWidth: number;
  contentHeight: number;
  /** The margin the fit keeps round the drawing (fitView's). */
  marginPx: number;
}

export function workspaceStageSize(p: WorkspaceInput): { width: number; height: number } {
  for (const [name, v] of Object.entries(p))
    if (!Number.isFinite(v)) throw new RangeError(`workspaceStageSize: ${name} must be a finite number (got ${v})`);
  if (!(p.contentWidth > 0 && p.contentHeight > 0))
    throw new RangeError("workspaceStageSize: the drawing's width and height must be above 0");
  const width = Math.max(MIN_STAGE_WIDTH_PX, Math.floor(p.boxWidth));
  const available = p.windowHeight - p.aboveStage - STAGE_BOTTOM_GAP_PX;
  const fitted = ((width - 2 * p.marginPx) * p.contentHeight) / p.contentWidth + 2 * p.marginPx;
  const height = Math.max(MIN_STAGE_HEIGHT_PX, Math.floor(Math.min(available, fitted)));
  return { width, height };
}
