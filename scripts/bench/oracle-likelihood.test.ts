import { describe, expect, it } from "vitest";
import { phi, profile, profileWith, responseAtTaps } from "./oracle-likelihood";
import { createRandom } from "./simulate/random";
import { Sensor } from "./simulate/sensor";

describe("the oracle's forward model", () => {
  it("gives the simulated sensor's own output when the sensor is noise-free", () => {
    const dt = 0.05;
    const settings = {
      dt,
      transportDelayS: 4.3,
      timeConstantS: 1.7,
      sigma: 0,
      slowShare: 0.5,
      slowCorrelationS: 2,
      displayNoisePpm: 0,
      rangePpm: 200,
    };
    const sensor = new Sensor(settings, createRandom(7));
    const random = createRandom(11);
    const air = Float64Array.from({ length: 2000 }, (_, i) => 5 + 4 * Math.sin(i / 37) + random.uniform(0, 3));
    const taps = [100, 257, 800, 1203, 1999];
    const seen: number[] = [];
    air.forEach((a, i) => {
      const out = sensor.push(a, 0);
      if (taps.includes(i + 1)) seen.push(out);
    });
    const mean = responseAtTaps(air, Math.round(4.3 / dt), 1 - Math.exp(-dt / 1.7), taps);
    seen.forEach((v, k) => expect(mean[k]).toBeCloseTo(v, 10));
  });

  it("reads the standard normal table", () => {
    // Abramowitz & Stegun, Table 26.1: Φ(0) = 0.5, Φ(1) = 0.8413, Φ(1.96) = 0.9750.
    expect(phi(0)).toBeCloseTo(0.5, 7);
    expect(phi(1)).toBeCloseTo(0.8413, 4);
    expect(phi(-1)).toBeCloseTo(0.1587, 4);
    expect(phi(1.96)).toBeCloseTo(0.975, 4);
  });

  it("fits the strength of readings made from a known one, and prefers the place that made them", () => {
    const unit = Float64Array.from({ length: 40 }, (_, k) => Math.exp(-(((k - 20) / 4) ** 2)));
    const shifted = Float64Array.from({ length: 40 }, (_, k) => Math.exp(-(((k - 23) / 4) ** 2)));
    const base = new Float64Array(40).fill(0.3);
    const obs = Array.from(unit, (u, k) => ({ ppm: Math.round(base[k] + 12 * u), atLeast: false }));
    const here = profile(obs, base, unit, 0.05, 0.5);
    expect(here.q).toBeGreaterThan(11);
    expect(here.q).toBeLessThan(13);
    expect(here.ll).toBeGreaterThan(profile(obs, base, shifted, 0.05, 0.5).ll + 5);
  });

  it("fits a second leak's strength beside the slid one", () => {
    const a = Float64Array.from({ length: 60 }, (_, k) => Math.exp(-(((k - 15) / 4) ** 2)));
    const b = Float64Array.from({ length: 60 }, (_, k) => Math.exp(-(((k - 45) / 4) ** 2)));
    const base = new Float64Array(60);
    const obs = Array.from(a, (u, k) => ({ ppm: Math.round(8 * u + 20 * b[k]), atLeast: false }));
    const alone = profile(obs, base, a, 0.05, 0.5);
    const joint = profileWith(obs, base, a, [b], 0.05, 0.5);
    expect(joint.q).toBeGreaterThan(7);
    expect(joint.q).toBeLessThan(9);
    expect(joint.ll).toBeGreaterThan(alone.ll);
  });
});
