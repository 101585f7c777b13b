import type { LiveSuspect } from "#core/analysis/guide/live-guide";
import type { LocalReading } from "./local-types";

/** Where the supply-air check of a settled suspect stands: to ask for, or read (the latest such reading). */
export type SupplyCheck =
  | { kind: "none" }
  | { kind: "ask"; suspect: LiveSuspect }
  | { kind: "read"; suspect: LiveSuspect; reading: LocalReading };

/**
 * A settled suspect asks for its supply-air check until a committed supply-air reading lies within its
 * radius; that reading is then shown as the check made.
 */
export function supplyCheckOf(settled: LiveSuspect | null, committed: readonly LocalReading[]): SupplyCheck {
  if (!settled) return { kind: "none" };
  for (let i = committed.length - 1; i >= 0; i--) {
    const r = committed[i];
    if (r.samplePoint === "supply" && Math.hypot(r.x - settled.x, r.y - settled.y) <= settled.radius)
      return { kind: "read", suspect: settled, reading: r };
  }
  return { kind: "ask", suspect: settled };
}
