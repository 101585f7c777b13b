import type { LocatorInput } from "../../contracts/locator-input";
import { cellsInside, type PlanGrid } from "../grid/plan-grid";

const DISPLAY_CASES = new Set(["open-case", "door-case", "island-case"]);

/**
 * The geodesic step scale with every display case whose fans run drawn as one mixed unit too: steps
 * inside such a case count `caseScale` of their length (as walk-ins' and machine rooms' do in `base`),
 * so a source anywhere in the case reaches its whole front about equally. A case's fans stir its own
 * unit; the end frames between units keep neighbours apart, and the gas leaves by the front. Null when
 * no display case runs its fans.
 */
export function caseUnitStepScale(
  grid: PlanGrid,
  plan: Pick<LocatorInput["plan"], "fixtures">,
  base: Float32Array | null,
  caseScale: number,
): Float32Array | null {
  if (!(caseScale > 0 && caseScale <= 1)) throw new Error(`case scale must be in (0, 1], got ${caseScale}`);
  const cases = plan.fixtures.filter((f) => f.fans && DISPLAY_CASES.has(f.kind));
  if (cases.length === 0) return null;
  const out = base ? Float32Array.from(base) : new Float32Array(grid.width * grid.height).fill(1);
  for (const f of cases) for (const c of cellsInside(grid, f.polygon)) out[c] = Math.min(out[c], caseScale);
  return out;
}
