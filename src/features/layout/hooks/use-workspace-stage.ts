import { useCallback, useEffect, useMemo, useRef, useState, type RefObject } from "react";
import { fitView, IMAGE_ZOOM, type View } from "../../../lib/plan-view/coordinates";
import { workspaceStageSize } from "../model/workspace-size";

const FIT_MARGIN_PX = 16;

/**
 * Sizes the stage as a workspace (model/workspace-size.ts) from the window, the tools above it
 * and the drawing, and keeps the whole drawing fitted until the person moves the view. When the
 * editor opens, the page scrolls so the tools sit at the window's top and the plan fills the
 * rest: the tools scroll with the page (never pinned over the plan).
 */
export function useWorkspaceStage(
  box: RefObject<HTMLDivElement | null>,
  bar: RefObject<HTMLDivElement | null>,
  content: { widthPx: number; heightPx: number },
  view: View,
  setView: (view: View) => void,
): { width: number; height: number; fit: () => void } {
  const [size, setSize] = useState({ width: 800, height: 560 });
  const viewRef = useRef(view);
  viewRef.current = view;
  /** The view the last fit set; while the view is still that one, a new size fits again. */
  const fitted = useRef<View | null>(null);
  const docked = useRef(false);

  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const measure = () => {
      const top = bar.current?.getBoundingClientRect().top ?? el.getBoundingClientRect().top;
      const next = workspaceStageSize({
        boxWidth: el.clientWidth,
        windowHeight: window.innerHeight,
        aboveStage: el.getBoundingClientRect().top - top,
        contentWidth: content.widthPx,
        contentHeight: content.heightPx,
        marginPx: FIT_MARGIN_PX,
      });
      setSize((s) => (s.width === next.width && s.height === next.height ? s : next));
      if (fitted.current === null || fitted.current === viewRef.current) {
        fitted.current = fitView(content.widthPx, content.heightPx, next.width, next.height, FIT_MARGIN_PX, IMAGE_ZOOM);
        setView(fitted.current);
      }
      if (!docked.current) {
        docked.current = true;
        // After this render lays the stage out at its size, so the page is long enough to scroll.
        requestAnimationFrame(() => bar.current?.scrollIntoView?.({ block: "start" }));
      }
    };
    measure();
    const ro = new ResizeObserver(measure);
    ro.observe(el);
    if (bar.current) ro.observe(bar.current);
    window.addEventListener("resize", measure);
    return () => {
      ro.disconnect();
      window.removeEventListener("resize", measure);
    };
  }, [box, bar, content.widthPx, content.heightPx, setView]);

  const fit = useCallback(() => {
    fitted.current = fitView(content.widthPx, content.heightPx, size.width, size.height, FIT_MARGIN_PX, IMAGE_ZOOM);
    setView(fitted.current);
  }, [content.widthPx, content.heightPx, size, setView]);
  return useMemo(() => ({ ...size, fit }), [size, fit]);
}
