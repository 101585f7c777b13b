import { useEffect } from "react";
import { useLocation } from "react-router";

/**
 * Brings the element named by the URL's #hash into view once the page's data is there, so a
 * link from the Today screen lands on the record a figure comes from (the router does not).
 */
export function useScrollToHash(ready: boolean): void {
  const { hash } = useLocation();
  useEffect(() => {
    if (!ready || hash.length < 2) return;
    const el = document.getElementById(decodeURIComponent(hash.slice(1)));
    if (!el) return;
    el.scrollIntoView?.({ block: "start" });
    if (!el.hasAttribute("tabindex")) el.setAttribute("tabindex", "-1");
    el.focus({ preventScroll: true });
  }, [ready, hash]);
}
