import { useCallback, useEffect, useState } from "react";

/**
 * The content width of an element, following resizes. A callback ref, so an element that appears
 * only after loading (pages show a spinner first) is still observed.
 */
export function useWidth<T extends HTMLElement>(initial = 800) {
  const [el, setEl] = useState<T | null>(null);
  const [width, setWidth] = useState(initial);
  const ref = useCallback((node: T | null) => setEl(node), []);
  useEffect(() => {
    if (!el) return;
    setWidth(Math.max(240, Math.floor(el.getBoundingClientRect().width)));
    const ro = new ResizeObserver(([e]) => setWidth(Math.max(240, Math.floor(e.contentRect.width))));
    ro.observe(el);
    return () => ro.disconnect();
  }, [el]);
  return [ref, width] as const;
}
