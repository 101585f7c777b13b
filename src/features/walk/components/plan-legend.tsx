import { useState } from "react";
import { ALARM_DOT_FACTOR, markLooks, TRACE_DOT_FACTOR, type MarkLook } from "../model/plan-marks";

type Swatch =
  | "area"
  | "area-dashed"
  | "diamond"
  | "dot"
  | "ring"
  | "dashed-dot"
  | "dashed-ring"
  | "square"
  | "crosshair";

function SwatchIcon({ kind, look, scale = 1 }: { kind: Swatch; look: MarkLook; scale?: number }) {
  const r = 5 * scale;
  return (
    <svg width="28" height="20" viewBox="0 0 28 20" aria-hidden="true" className="shrink-0">
      {kind === "area" || kind === "area-dashed" ? (
        <rect
          x="2"
          y="3"
          width="24"
          height="14"
          fill={look.fill}
          stroke={look.stroke}
          strokeWidth={kind === "area-dashed" ? 3 : 1}
          strokeDasharray={kind === "area-dashed" ? "6 4" : undefined}
        />
      ) : null}
      {kind === "diamond" ? (
        <polygon points="14,3 21,10 14,17 7,10" fill={look.fill} stroke={look.stroke} strokeWidth="2" />
      ) : null}
      {kind === "dot" || kind === "dashed-dot" ? (
        <circle
          cx="14"
          cy="10"
          r={r}
          fill={look.fill}
          stroke={look.stroke}
          strokeWidth="1.5"
          strokeDasharray={kind === "dashed-dot" ? "3 2" : undefined}
        />
      ) : null}
      {kind === "ring" ? <circle cx="14" cy="10" r={r} fill="none" stroke={look.stroke} strokeWidth="3" /> : null}
      {kind === "dashed-ring" ? (
        <circle cx="14" cy="10" r="8" fill={look.fill} stroke={look.stroke} strokeWidth="2" strokeDasharray="4 3" />
      ) : null}
      {kind === "crosshair" ? (
        <g stroke={look.stroke} fill="none">
          <circle cx="14" cy="10" r="6" strokeWidth="2" strokeDasharray="2 2" />
          <path d="M4 10h20M14 1v18" strokeWidth="1.5" />
        </g>
      ) : null}
      {kind === "square" ? (
        <rect x="8" y="4" width="12" height="12" fill={look.fill} stroke={look.stroke} strokeWidth="2" />
      ) : null}
    </svg>
  );
}

/**
 * What the plan's marks mean, one tap away on the plan itself: fixtures not yet sampled, risk
 * points, readings by level, the open reading, refused readings and the alarm's marks.
 */
export function PlanLegend({ highContrast }: { highContrast: boolean }) {
  const [open, setOpen] = useState(false);
  const look = markLooks(highContrast);
  const rows: [Swatch, MarkLook, string, number?][] = [
    ["area-dashed", look.unsampledFixture, "Case or room not sampled yet"],
    ["area", look.sampledFixture, "Sampled"],
    ["diamond", look.unsampledPoint, "Risk point (valve, joint, line drop) not sampled yet"],
    ["diamond", look.sampledPoint, "Risk point sampled"],
    ["dot", look.readingZero, "Reading: 0 ppm"],
    ["dot", look.readingTrace, "Reading above 0, below the alarm", TRACE_DOT_FACTOR],
    ["dot", look.readingAlarm, "Reading at or above the alarm", ALARM_DOT_FACTOR],
    ["ring", look.openReading, "The reading on the keypad"],
    ["dashed-dot", look.readingZero, "Refused by the server: fix it"],
    ["diamond", look.sampledAt, "Where the peak's air was sampled"],
    ["ring", look.recheck, "Re-check here"],
    ["dashed-ring", look.liveSuspect, "Live suspect and its radius (an estimate on this device)"],
    ["crosshair", look.liveLead, "No credible spot yet: where the gas is strongest so far"],
    ["square", look.nextProbe, "Next probe point (numbered in walking order)"],
  ];
  return (
    <div
      className="absolute left-2 top-2 max-w-[calc(100%-5rem)]"
      onPointerDown={(e) => e.stopPropagation()}
      onPointerUp={(e) => e.stopPropagation()}
    >
      <button
        type="button"
        className="flex h-12 items-center justify-center rounded-md bg-surface px-3 font-bold edge shadow active:opacity-70"
        aria-expanded={open}
        aria-controls="plan-legend"
        onClick={() => setOpen(!open)}
      >
        {open ? "Hide key" : "Key"}
      </button>
      {open ? (
        <ul
          id="plan-legend"
          aria-label="What the marks on the plan mean"
          data-testid="plan-legend"
          className="mt-2 flex max-h-[60vh] flex-col gap-1 overflow-y-auto rounded-md bg-surface p-2 text-sm edge shadow"
        >
          {rows.map(([kind, l, label, scale]) => (
            <li key={label} className="flex items-center gap-2">
              <SwatchIcon kind={kind} look={l} scale={scale} />
              <span>{label}</span>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
