/**
 * The Walk plan's marks in one table: the canvas draws with it and the legend shows it, so the two
 * cannot drift apart. Shape tells the marks apart as well as colour (dashed outline, diamond, ring,
 * size), for colour-blind eyes and the high-contrast mode. Our own colours.
 */
export interface MarkLook {
  fill: string;
  stroke: string;
}

export function markLooks(highContrast: boolean) {
  return {
    unsampledFixture: { fill: "rgba(179,92,0,0.08)", stroke: highContrast ? "#000000" : "#b35c00" },
    sampledFixture: { fill: "rgba(31,78,95,0.06)", stroke: highContrast ? "#000000" : "#6b7a80" },
    unsampledPoint: { fill: highContrast ? "#ffd600" : "#f0b45a", stroke: highContrast ? "#000000" : "#b35c00" },
    sampledPoint: { fill: "#ffffff", stroke: highContrast ? "#000000" : "#6b7a80" },
    readingZero: { fill: "#ffffff", stroke: "#1c2529" },
    readingTrace: { fill: highContrast ? "#ffd600" : "#e0a100", stroke: "#1c2529" },
    readingAlarm: { fill: highContrast ? "#000000" : "#9b2c2c", stroke: "#1c2529" },
    openReading: { fill: "#ffffff", stroke: "#d98e04" },
    path: { fill: "none", stroke: highContrast ? "#000000" : "#1f4e5f" },
    sampledAt: { fill: "#ffd600", stroke: "#000000" },
    recheck: { fill: "none", stroke: "#9b2c2c" },
    liveSuspect: { fill: "rgba(91,45,140,0.10)", stroke: highContrast ? "#000000" : "#5b2d8c" },
    // no fill and no radius: a lead is not a suspect spot, only where the gas is strongest so far
    liveLead: { fill: "none", stroke: highContrast ? "#000000" : "#5b2d8c" },
    nextProbe: { fill: highContrast ? "#ffffff" : "#e8f3ee", stroke: highContrast ? "#000000" : "#1d6b4f" },
  } satisfies Record<string, MarkLook>;
}

/**
 * The provisional lead's crosshair on screen, px: a fixed size at every zoom (it has no radius to draw),
 * a thumb's width, so it reads as a place to probe around and never as a suspect's circle.
 */
export const LEAD_MARK_PX = 14;

/** How much bigger an alarm's dot is than a plain reading's: the eye finds it first. */
export const ALARM_DOT_FACTOR = 1.4;
/** A reading above zero but below the alarm. */
export const TRACE_DOT_FACTOR = 1.15;

/**
 * A reading's dot radius on screen, px, at a view zoom (px per metre): a fixed size in metres
 * (0.3 m) kept between 2.5 px (still a dot at a whole-store view) and 7 px (a thumb's mark when
 * zoomed in). Readings a normal sniffing spacing apart (about 1.3 m; common practice, no published
 * source) stay apart at the whole-store view of a phone instead of merging into a blob.
 */
export function readingDotRadiusPx(zoom: number): number {
  return Math.min(7, Math.max(2.5, 0.3 * zoom));
}

/** The walked path's line width on screen, px: thinner at a whole-store view. */
export function pathWidthPx(zoom: number, highContrast: boolean): number {
  const base = zoom < 15 ? 1.5 : 2;
  return highContrast ? base + 1 : base;
}
