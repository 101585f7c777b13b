import { useEffect, useState } from "react";

export type ImageState = { status: "loading" | "failed"; image: null } | { status: "loaded"; image: HTMLImageElement };

/** Loads an image for a canvas (Konva draws HTMLImageElements); same-origin, so the session cookie goes along. */
export function useHtmlImage(url: string | null): ImageState {
  const [state, setState] = useState<ImageState>({ status: "loading", image: null });
  useEffect(() => {
    if (!url) {
      setState({ status: "failed", image: null });
      return;
    }
    let live = true;
    const img = new window.Image();
    setState({ status: "loading", image: null });
    img.onload = () => live && setState({ status: "loaded", image: img });
    img.onerror = () => live && setState({ status: "failed", image: null });
    img.src = url;
    return () => {
      live = false;
    };
  }, [url]);
  return state;
}
