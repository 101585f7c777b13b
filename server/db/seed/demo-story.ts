/** The demo's leak story as data: one sweep a month, days counted back from the seeding day. */
import type { DemoLeak } from "./demo-plume";
import type { RecheckLeg } from "./demo-walk";

export interface DemoMonth {
  dayOffset: number;
  fans: "running" | "stopped";
  detector: "diode" | "infrared";
  reviewed: boolean;
  leaks: DemoLeak[];
  rechecks?: RecheckLeg[];
  finding?: { fixtureLabel: string; x: number; y: number; component: "brazed-joint"; note: string; confirmNote: string; repairNote: string };
}

/** The joint behind Dairy 3 (cases of 3.66 m from x = 2 m, so Dairy 3 spans 9.32–12.98 m). */
const DAIRY_JOINT = { x: 11.7, y: 8.8 };
/** A flare at the back of Meat 2 (35.66–39.32 m). */
const MEAT_FLARE = { x: 37.6, y: 8.8 };

export const DEMO_LEAK_STORY: DemoMonth[] = [
  { dayOffset: -152, fans: "running", detector: "diode", reviewed: true, leaks: [] },
  { dayOffset: -123, fans: "running", detector: "infrared", reviewed: true, leaks: [{ ...DAIRY_JOINT, peakPpm: 7 }] },
  { dayOffset: -93, fans: "running", detector: "diode", reviewed: true, leaks: [{ ...DAIRY_JOINT, peakPpm: 24 }] },
  {
    dayOffset: -62,
    fans: "stopped",
    detector: "diode",
    reviewed: true,
    leaks: [{ ...DAIRY_JOINT, peakPpm: 70 }],
    // after the alarm at Dairy 3: every 0.6 m along the case front, then along the aisle edge
    rechecks: [
      { from: [8.5, 9.7], to: [15.5, 9.7], spacingM: 0.6 },
      { from: [15.5, 10.4], to: [8.5, 10.4], spacingM: 0.6 },
    ],
    finding: {
      fixtureLabel: "Dairy 3",
      ...DAIRY_JOINT,
      component: "brazed-joint",
      note: "Suspect spot 1 behind Dairy 3, near drop D1.",
      confirmNote: "Bubble solution foamed at the suction-line brazed joint behind Dairy 3.",
      repairNote: "Joint cleaned and re-brazed; pressure tested with nitrogen, no drop over 30 minutes.",
    },
  },
  { dayOffset: -33, fans: "running", detector: "diode", reviewed: true, leaks: [] },
  { dayOffset: -4, fans: "running", detector: "diode", reviewed: false, leaks: [{ ...MEAT_FLARE, peakPpm: 14 }] },
];
