import type { LocatorInput } from "../../contracts/locator-input";
import type { PlanGrid } from "../grid/plan-grid";
import { mixedLevel } from "../locator/mixed-level";
import { passesExplained, passWeighing, type ReadingAir } from "../locator/pass-air";
import type { LocatorSettings } from "../locator/settings";
import type { OtherAir } from "./field-stage";
import type { LagResult } from "./lag-stage";
import type { PassFit } from "./retry-screen";
import type { ZonesResult } from "./zones-stage";

/**
 * Each pass in its own air, weighed by how well that air explains it (decision 0152), and a stilled
 * fixture's mixed readings as its level where its pass explains itself well enough to place the leak
 * (decision 0111). They depend on the lag, so the full run and the retry screen build them alike.
 */
export function passFitOf(
  plan: LocatorInput["plan"],
  grid: PlanGrid,
  air: ReadingAir,
  other: OtherAir | null,
  lag: LagResult,
  zones: Pick<ZonesResult, "zoneOfReading">,
  alarmPpm: number,
  settings: Pick<LocatorSettings, "kernel" | "noise">,
): PassFit {
  if (!other) return { otherAir: null, levelColumns: [] };
  const { trusted, weightOfModel } = passWeighing(
    passesExplained(grid, lag, zones.zoneOfReading, air, other, settings),
  );
  const level = mixedLevel(plan, air, lag, zones.zoneOfReading, alarmPpm, trusted);
  return {
    otherAir: { ...other, weightOfModel, ...(level ? { levelOnly: level.levelOnly } : {}) },
    levelColumns: level?.columns ?? [],
  };
}
