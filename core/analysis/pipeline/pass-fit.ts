import type { LocatorInput } from "../../contracts/locator-input";
import type { PlanGrid } from "../grid/plan-grid";
import { mixedLevel } from "../locator/mixed-level";
import { passWeighing, type ReadingAir } from "../locator/pass-air";
import { passExplained } from "../locator/pass-explained";
import { createSourceKernel } from "../locator/source-kernel";
import type { LocatorSettings } from "../locator/settings";
import type { OtherAir } from "./field-stage";
import type { LagResult } from "./lag-stage";
import type { PassFit } from "./retry-screen";
import type { ZonesResult } from "./zones-stage";
import { readingWeights } from "./numbers";

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

/** How well each air model's own readings are explained by one source in that air (model 0: 1). */
function passesExplained(
  grid: PlanGrid,
  lag: { xs: Float64Array; ys: Float64Array; ppm: Float64Array; censored: Uint8Array },
  zoneOfReading: Int32Array,
  air: ReadingAir,
  other: Pick<OtherAir, "models">,
  settings: Pick<LocatorSettings, "kernel" | "noise">,
): number[] {
  const k = settings.kernel;
  const weights = readingWeights(lag.ppm, settings.noise);
  return air.models.map((_, m) => {
    if (m === 0) return 1;
    const model = other.models[m - 1];
    const own: number[] = [];
    for (let i = 0; i < lag.ppm.length; i++)
      if (air.modelOfReading[i] === m && !lag.censored[i] && zoneOfReading[i] < 0) own.push(i);
    const pick = (v: Float64Array) => Float64Array.from(own, (i) => v[i]);
    const kernel = createSourceKernel(
      k.screeningLengthM,
      k.nearCutoffM,
      k.truncationM,
      model.fansStir && k.farShare > 0 ? { lengthM: k.farScreeningLengthM, share: k.farShare } : null,
    );
    return passExplained(
      grid,
      { xs: pick(lag.xs), ys: pick(lag.ys), ppm: pick(lag.ppm), w: pick(weights) },
      kernel,
      k.mapSigmaM,
      model.stepScale,
    );
  });
}
