import type { LocatorInput } from "../../contracts/locator-input";
import { pointInPolygon } from "../geometry/point-in-polygon";
import { distanceToPolygonEdge } from "../geometry/segments";
import { estimateBackground } from "./background";
import { fansMixing, MIXING_REACH_M } from "./diagnostics";
import { readingsWithFansOn, stilledByAPass, type ReadingAir } from "./pass-air";

/** Fixtures whose mixed readings the joint fit takes as a level only, and those readings. */
export interface MixedLevel {
  /** One fixed column per such fixture: 1 at its level readings, 0 elsewhere. */
  readonly columns: readonly Float64Array[];
  /** 1 for a reading that only says the fixture's level: no point source is fitted to it. */
  readonly levelOnly: Uint8Array;
}

/**
 * The joint fit's account of a fixture whose fans mixed the gas and which a pinpoint pass then stilled:
 * its readings taken while the fans ran are level across it (the fans-mixing test,
 * locator/diagnostics.ts), so they say how much gas the fixture holds but not where in it the leak is.
 * Each such fixture gets one fixed column (its level), fitted with the benign-source zones, and its
 * level readings get no point-source kernel: the still-air readings place the leak, and a level line
 * no longer draws sources along the fixture or argues against the spot the still air shows. Without a
 * pass that stills a fixture nothing changes (null).
 */
export function mixedLevel(
  plan: Pick<LocatorInput["plan"], "fixtures">,
  air: ReadingAir,
  lag: { xs: Float64Array; ys: Float64Array; ppm: Float64Array; censored: Uint8Array },
  zoneOfReading: Int32Array,
  alarmPpm: number,
  /** Per air model: whether its readings may take over placing the leak (pass-explained.ts); all when absent. */
  trusted: readonly boolean[] | null = null,
): MixedLevel | null {
  if (air.models.length < 2) return null;
  const { xs, ys, ppm: y } = lag;
  const n = y.length;
  const usable = new Uint8Array(n);
  for (let i = 0; i < n; i++) usable[i] = !lag.censored[i] && zoneOfReading[i] < 0 ? 1 : 0;
  // the field stage's background (the same estimate of the same readings)
  const background = estimateBackground(y, usable).ppm;
  const columns: Float64Array[] = [];
  const levelOnly = new Uint8Array(n);
  plan.fixtures.forEach((f, k) => {
    if (!stilledByAPass(air, k, trusted)) return;
    const keep = readingsWithFansOn(air, k);
    const pick = (v: Float64Array) => Float64Array.from(keep, (i) => v[i]);
    if (!fansMixing(f, pick(xs), pick(ys), pick(y), background, alarmPpm)) return;
    const column = new Float64Array(n);
    for (const i of keep) {
      const p = [xs[i], ys[i]] as const;
      if (pointInPolygon(p, f.polygon) || distanceToPolygonEdge(p, f.polygon) <= MIXING_REACH_M) {
        column[i] = 1;
        levelOnly[i] = 1;
      }
    }
    columns.push(column);
  });
  return columns.length ? { columns, levelOnly } : null;
}
