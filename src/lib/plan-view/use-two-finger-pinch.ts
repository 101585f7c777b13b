import { useEffect, useRef, type RefObject } from "react";

export interface PinchStep {
  /** Ratio of the fingers' spread to the last step's. */
  factor: number;
  /** Midpoint between the fingers, in the element's pixels. */
  centre: { x: number; y: number };
  /** How far the midpoint moved since the last step (two-finger pan). */
  dx: number;
  dy: number;
}

interface Handlers {
  /** The second finger landed: whatever the first one started must give way. */
  onStart: () => void;
  onPinch: (step: PinchStep) => void;
  /** The last finger of a pinch lifted. */
  onEnd?: () => void;
}

/**
 * Pinch to zoom and two-finger pan on a Konva stage's container. Native listeners, in the
 * capture phase: Konva holds back its own touch events while a node is being dragged, and the
 * first finger of a pinch has often started a drag. `pinching` is set from the second finger
 * until the last one lifts, so the finger left behind draws nothing.
 */
export function useTwoFingerPinch(
  element: () => HTMLElement | null | undefined,
  pinching: RefObject<boolean>,
  handlers: Handlers,
  deps: readonly unknown[] = [],
): void {
  const h = useRef(handlers);
  h.current = handlers;
  useEffect(() => {
    const el = element();
    if (!el) return;
    let last: { distance: number; x: number; y: number } | null = null;
    const read = (t: TouchList) => {
      const box = el.getBoundingClientRect();
      const [a, b] = [t[0], t[1]];
      return {
        distance: Math.hypot(a.clientX - b.clientX, a.clientY - b.clientY),
        x: (a.clientX + b.clientX) / 2 - box.left,
        y: (a.clientY + b.clientY) / 2 - box.top,
      };
    };
    const start = (e: TouchEvent) => {
      if (e.touches.length < 2) return;
      e.preventDefault();
      pinching.current = true;
      last = read(e.touches);
      h.current.onStart();
    };
    const move = (e: TouchEvent) => {
      if (e.touches.length < 2 || !last) return;
      e.preventDefault();
      const prev = last;
      const next = read(e.touches);
      last = next;
      if (prev.distance === 0) return;
      h.current.onPinch({
        factor: next.distance / prev.distance,
        centre: { x: next.x, y: next.y },
        dx: next.x - prev.x,
        dy: next.y - prev.y,
      });
    };
    const end = (e: TouchEvent) => {
      if (e.touches.length === 0) {
        const was = pinching.current;
        pinching.current = false;
        last = null;
        if (was) h.current.onEnd?.();
      } else if (e.touches.length === 1 && last) last = { ...last, distance: 0 };
    };
    const opts = { passive: false, capture: true } as const;
    el.addEventListener("touchstart", start, opts);
    el.addEventListener("touchmove", move, opts);
    el.addEventListener("touchend", end, opts);
    el.addEventListener("touchcancel", end, opts);
    return () => {
      el.removeEventListener("touchstart", start, opts);
      el.removeEventListener("touchmove", move, opts);
      el.removeEventListener("touchend", end, opts);
      el.removeEventListener("touchcancel", end, opts);
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, deps);
}
