import { useEffect } from "react";

/** Each page names itself in the tab and to screen readers after a route change. */
export function useDocumentTitle(title: string): void {
  useEffect(() => {
    document.title = title ? `${title} · Plumeline` : "Plumeline";
  }, [title]);
}
