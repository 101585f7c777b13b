/**
 * The demo's leak story as data: one sweep a month, days counted back from the seeding day, in step
 * with the demo's leak records (demo-compliance.ts): a flare at Meat 2 starts leaking, grows, is
 * pinpointed on a fans-stopped re-sweep about 89 days ago, repaired and gone from the next months'
 * maps; the latest sweep shows the new brazed-joint leak at Dairy 3 found 13 days ago.
 */
import type { DemoLeak } from "./demo-plume";
import type { RecheckLeg } from "./demo-walk";

export interface DemoMonth {
  dayOffset: number;
  fans: "running" | "stopped";
  detector: "heated-diode" | "infrared";
  reviewed: boolean;
  leaks: DemoLeak[];
  rechecks?: RecheckLeg[];
  /** The finding made on this sweep: linked when the records already hold it, made otherwise. */
  finding?: {
    fixtureLabel: string;
    x: number;
    y: number;
    component: "flare" | "brazed-joint";
    note: string;
    status: "suspected" | "repaired";
  };
}

/** A flare at the back of Meat 2 (cases of 3.66 m from x = 32 m, so Meat 2 spans 35.66–39.32 m). */
const MEAT_FLARE = { x: 37.6, y: 8.8 };
/** A brazed joint behind Dairy 3 (9.32–12.98 m). */
const DAIRY_JOINT = { x: 11.7, y: 8.8 };

export const DEMO_LEAK_STORY: DemoMonth[] = [
  { dayOffset: -151, fans: "running", detector: "heated-diode", reviewed: true, leaks: [] },
  { dayOffset: -120, fans: "running", detector: "infrared", reviewed: true, leaks: [{ ...MEAT_FLARE, peakPpm: 8 }] },
  {
    dayOffset: -89,
    fans: "stopped",
    detector: "heated-diode",
    reviewed: true,
    leaks: [{ ...MEAT_FLARE, peakPpm: 70 }],
    // after the alarm at Meat 2: every 0.6 m along the case front, then along the aisle edge
    rechecks: [
      { from: [34.5, 9.7], to: [41.5, 9.7], spacingM: 0.6 },
      { from: [41.5, 10.4], to: [34.5, 10.4], spacingM: 0.6 },
    ],
    finding: {
      fixtureLabel: "Meat 2",
      ...MEAT_FLARE,
      component: "flare",
      note: "Suspect spot 1 at the back of Meat 2, by drop M1.",
      status: "repaired",
    },
  },
  { dayOffset: -60, fans: "running", detector: "heated-diode", reviewed: true, leaks: [] },
  { dayOffset: -41, fans: "running", detector: "infrared", reviewed: true, leaks: [] },
  {
    dayOffset: -13,
    fans: "running",
    detector: "heated-diode",
    reviewed: false,
    leaks: [{ ...DAIRY_JOINT, peakPpm: 16 }],
    finding: {
      fixtureLabel: "Dairy 3",
      ...DAIRY_JOINT,
      component: "brazed-joint",
      note: "Suspect spot 1 behind Dairy 3.",
      status: "suspected",
    },
  },
];
