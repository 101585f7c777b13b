// The instrument between the air and the display: a hose whose transport delay shifts the signal,
// a sensing cell with a first-order response (dy/dt = (s - y)/tau, Doebelin, Measurement Systems, first-order instruments),
// turbulent fluctuation of the sampled air as a log-normal multiplier that is partly correlated over
// seconds (two Ornstein–Uhlenbeck processes, Gillespie 1996 exact update), and display noise plus
// whole-ppm rounding. It runs sample by sample so the walking technician can react to alarms.
import type { Random } from "./random";

export interface SensorSettings {
  dt: number;
  transportDelayS: number;
  timeConstantS: number;
  /** Standard deviation of ln(multiplier); about 0.3 in aisle air. */
  sigma: number;
  /** Share of the log-variance in the slow (seconds) component; the rest decorrelates in ~0.3 s. */
  slowShare: number;
  slowCorrelationS: number;
  /** Display noise (ppm, standard deviation). */
  displayNoisePpm: number;
  /** Upper end of the display; readings above show "at least" this. */
  rangePpm: number;
}

export interface SensorReading {
  ppm: number;
  atLeast: boolean;
}

export class Sensor {
  private readonly air: number[] = [];
  private response = 0;
  private slow = 0;
  private fast = 0;
  private readonly delaySamples: number;
  private readonly gain: number;

  constructor(
    private readonly settings: SensorSettings,
    private readonly random: Random,
  ) {
    const { dt, transportDelayS, timeConstantS } = settings;
    if (!(dt > 0)) throw new Error(`sensor: dt must be positive, got ${dt}`);
    if (!(transportDelayS >= 0)) throw new Error(`sensor: transport delay must be >= 0 s, got ${transportDelayS}`);
    if (!(timeConstantS > 0)) throw new Error(`sensor: time constant must be positive, got ${timeConstantS}`);
    this.delaySamples = Math.round(transportDelayS / dt);
    // Exact zero-order-hold discretisation of the first-order lag.
    this.gain = 1 - Math.exp(-dt / timeConstantS);
  }

  /** The noise settings as drawn (for a diagnostic ceiling that knows the physics). */
  get noise(): { sigma: number; slowShare: number; slowCorrelationS: number; displayNoisePpm: number } {
    const { sigma, slowShare, slowCorrelationS, displayNoisePpm } = this.settings;
    return { sigma, slowShare, slowCorrelationS, displayNoisePpm };
  }

  /** The multiplier applied to the air's mean concentration at this instant (mean 1). */
  private fluctuation(): number {
    const { dt, sigma, slowShare, slowCorrelationS } = this.settings;
    const step = (state: number, tc: number) => {
      const a = Math.exp(-dt / tc);
      return a * state + Math.sqrt(1 - a * a) * this.random.normal();
    };
    this.slow = step(this.slow, slowCorrelationS);
    this.fast = step(this.fast, 0.3);
    const z = Math.sqrt(slowShare) * this.slow + Math.sqrt(1 - slowShare) * this.fast;
    return Math.exp(sigma * z - (sigma * sigma) / 2);
  }

  /**
   * Feeds one dt of air at the probe tip: `mean` is the turbulent-mean concentration there and
   * `ambient` the steady background, which does not fluctuate. Returns the cell's output (ppm, unrounded).
   */
  push(mean: number, ambient: number): number {
    this.air.push(ambient + mean * this.fluctuation());
    const idx = this.air.length - 1 - this.delaySamples;
    const arriving = idx >= 0 ? this.air[idx] : 0;
    this.response += this.gain * (arriving - this.response);
    return this.response;
  }

  /** What the display shows now: the cell's output plus display noise, rounded to whole ppm. */
  read(): SensorReading {
    const { displayNoisePpm, rangePpm } = this.settings;
    const raw = Math.max(0, Math.round(this.response + displayNoisePpm * this.random.normal()));
    return raw >= rangePpm ? { ppm: rangePpm, atLeast: true } : { ppm: raw, atLeast: false };
  }
}
