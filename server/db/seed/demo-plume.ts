/**
 * The demo's own picture of the air in the store, deliberately unlike the locator's kernel: gas from a
 * leak in a case lineup is carried along the lineup by the cases' air curtains (a Gaussian spread along
 * the line, wider when the fans run), falls off exponentially across the aisle, and is nudged a little
 * east by the store's weak drift. The bakery's aerosols add a plateau of about 3 ppm around their
 * corner. Everything sits on a 0.3 ppm ambient.
 */
export interface DemoLeak {
  x: number;
  y: number;
  /** ppm at the leak's own case front. */
  peakPpm: number;
}

export interface DemoAir {
  leaks: readonly DemoLeak[];
  fansRunning: boolean;
}

const AMBIENT_PPM = 0.3;
const DRIFT_SHIFT_M = 0.4;
const BAKERY = { x0: 50, y0: 24, x1: 58, y1: 30, ppm: 3.2, fallM: 0.8 };

export function demoConcentration(air: DemoAir, x: number, y: number): number {
  // along-line spread and cross-aisle fall-off, m: fans mix a lineup over metres; with fans stopped the gas stays local
  const alongM = air.fansRunning ? 3 : 1.3;
  const acrossM = air.fansRunning ? 1.2 : 0.75;
  let c = AMBIENT_PPM;
  for (const l of air.leaks) {
    const dx = x - l.x - DRIFT_SHIFT_M;
    const dy = Math.max(0, Math.abs(y - l.y) - 0.25);
    c += l.peakPpm * Math.exp(-(dx * dx) / (2 * alongM * alongM)) * Math.exp(-dy / acrossM);
  }
  const ox = Math.max(BAKERY.x0 - x, 0, x - BAKERY.x1);
  const oy = Math.max(BAKERY.y0 - y, 0, y - BAKERY.y1);
  c += BAKERY.ppm * Math.exp(-Math.hypot(ox, oy) / BAKERY.fallM);
  return c;
}
