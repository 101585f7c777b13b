import { describe, expect, it } from "vitest";
import { createRandom } from "./random";
import { Sensor, type SensorSettings } from "./sensor";

const quiet: SensorSettings = {
  dt: 0.01,
  transportDelayS: 4,
  timeConstantS: 2,
  sigma: 0,
  slowShare: 0.5,
  slowCorrelationS: 2,
  displayNoisePpm: 0,
  rangePpm: 1000,
};

describe("instrument model", () => {
  it("a first-order step response reaches 63.2% at one time constant after the delay", () => {
    // 1 - e^-1 = 0.632 for a first-order system (Doebelin, Measurement Systems, first-order instruments).
    const sensor = new Sensor(quiet, createRandom(1));
    let out = 0;
    const steps = Math.round((quiet.transportDelayS + quiet.timeConstantS) / quiet.dt);
    for (let k = 0; k < steps; k++) out = sensor.push(10, 0);
    expect(out / 10).toBeCloseTo(1 - Math.exp(-1), 2);
  });

  it("nothing reaches the cell before one transport delay", () => {
    const sensor = new Sensor(quiet, createRandom(1));
    let out = 0;
    for (let k = 0; k < Math.round(3.9 / quiet.dt); k++) out = sensor.push(10, 0);
    expect(out).toBe(0);
  });

  it("the log-normal multiplier has mean 1 and the stated log spread", () => {
    // E[exp(sigma Z - sigma^2/2)] = 1 for standard normal Z (log-normal mean, Johnson, Kotz & Balakrishnan ch. 14).
    const settings = { ...quiet, transportDelayS: 0, timeConstantS: 1e-6, sigma: 0.3, slowCorrelationS: 0.05 };
    const sensor = new Sensor(settings, createRandom(7));
    const logs: number[] = [];
    let sum = 0;
    const n = 40000;
    for (let k = 0; k < n; k++) {
      const y = sensor.push(1, 0);
      sum += y;
      logs.push(Math.log(y));
    }
    const mean = logs.reduce((a, b) => a + b, 0) / n;
    const sd = Math.sqrt(logs.reduce((a, b) => a + (b - mean) ** 2, 0) / n);
    expect(sum / n).toBeCloseTo(1, 1);
    expect(sd).toBeGreaterThan(0.27);
    expect(sd).toBeLessThan(0.33);
  });

  it("rounds to whole ppm and flags over-range as at least the range", () => {
    const sensor = new Sensor({ ...quiet, transportDelayS: 0, timeConstantS: 1e-6, rangePpm: 50 }, createRandom(3));
    sensor.push(2.4, 0.3);
    expect(sensor.read()).toEqual({ ppm: 3, atLeast: false });
    sensor.push(80, 0);
    expect(sensor.read()).toEqual({ ppm: 50, atLeast: true });
  });
});
