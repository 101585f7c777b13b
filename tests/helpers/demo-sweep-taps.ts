import { DEMO_LEAK_STORY } from "../../server/db/seed/demo-story";
import { mulberry32, simulateDemoWalk, type DemoTap } from "../../server/db/seed/demo-walk";

/**
 * The taps of the demo's latest sweep (the Dairy 3 leak), made the way the demo seed makes them: the
 * same generator, seeded alike and run through the months before it, with the figures of the test
 * detector (5 s delay, 1.5 s time constant) that the Walk tests' store carries.
 */
export function latestDemoTaps(): DemoTap[] {
  const rand = mulberry32(20261);
  let taps: DemoTap[] = [];
  for (const month of DEMO_LEAK_STORY) {
    taps = simulateDemoWalk(
      { leaks: month.leaks, fansRunning: month.fans === "running" },
      { transportDelayS: 5, timeConstantS: 1.5, ceilingPpm: 500 },
      rand,
      month.rechecks,
    );
  }
  return taps;
}
