import { useEffect, useRef, useState, type ReactNode } from "react";

/** Theme colours (src/index.css): SVG presentation attributes do not take CSS variables everywhere. */
export const PLOT_COLOURS = { accent: "#1f4e5f", danger: "#9b2c2c", muted: "#4f5d63", ok: "#2f6b3a", grid: "#e3e7e8" };

/** The width the plot may use: its box's, followed as the page resizes. */
function useBoxWidth(): [React.RefObject<HTMLDivElement | null>, number] {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(600);
  useEffect(() => {
    const el = ref.current;
    if (!el || typeof ResizeObserver === "undefined") return;
    const observer = new ResizeObserver(([entry]) => setWidth(Math.max(240, Math.floor(entry.contentRect.width))));
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return [ref, width];
}

/**
 * One plot with its title, a one-sentence summary as its accessible name, and the same figures as a
 * table for screen readers (the drawing itself is hidden from them).
 */
export function Plot({
  title,
  summary,
  table,
  children,
}: {
  title: string;
  summary: string;
  table: { head: string[]; rows: (string | number)[][] };
  children: (width: number) => ReactNode;
}) {
  const [ref, width] = useBoxWidth();
  return (
    // min-w-0: a grid item is at least as wide as its content by default, so a chart drawn wide once (a
    // phone's first layout, a rotated tablet) would hold its box wide and never be measured narrower.
    <figure className="min-w-0 space-y-1 rounded-md bg-surface p-3 edge" aria-label={title}>
      <figcaption className="font-bold">{title}</figcaption>
      <p className="text-sm text-muted">{summary}</p>
      <div ref={ref} aria-hidden="true" data-testid="plot">
        {children(width)}
      </div>
      {/* The data for screen readers. A table does not shrink to sr-only's 1 px: the box around it does. */}
      <div className="sr-only">
        <table>
          <caption>{title}</caption>
          <thead>
            <tr>
              {table.head.map((h) => (
                <th key={h} scope="col">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {table.rows.map((row, i) => (
              <tr key={i}>
                {row.map((c, j) => (
                  <td key={j}>{c}</td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </figure>
  );
}
