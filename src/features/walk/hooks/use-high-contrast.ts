import { useEffect, useState } from "react";

/** Follows the shell's high-contrast class on <html>, so the canvas redraws with it. */
export function useHighContrast(): boolean {
  const [on, setOn] = useState(() => document.documentElement.classList.contains("hc"));
  useEffect(() => {
    const mo = new MutationObserver(() => setOn(document.documentElement.classList.contains("hc")));
    mo.observe(document.documentElement, { attributes: true, attributeFilter: ["class"] });
    return () => mo.disconnect();
  }, []);
  return on;
}
