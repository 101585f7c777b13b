// The oracle's forward model and likelihood (scripts/bench/oracle-along-case.ts): the simulated sensor's
// mean response to a field sampled along the probe's path, and the likelihood of whole-ppm readings
// under the simulator's noise. Kept apart so the tests can hold it to the simulator's own sensor.

// Standard normal CDF (Abramowitz & Stegun 7.1.26 via erf, |error| < 1.5e-7).
export function phi(z: number): number {
  const x = Math.abs(z) / Math.SQRT2;
  const t = 1 / (1 + 0.3275911 * x);
  const y =
    1 -
    ((((1.061405429 * t - 1.453152027) * t + 1.421413741) * t - 0.284496735) * t + 0.254829592) * t * Math.exp(-x * x);
  return z >= 0 ? 0.5 * (1 + y) : 0.5 * (1 - y);
}

/** The sensor's mean response at each tap to a field sampled along the path (delay and first-order lag as simulated). */
export function responseAtTaps(air: Float64Array, delaySamples: number, gain: number, taps: number[]): Float64Array {
  const out = new Float64Array(taps.length);
  let r = 0;
  let k = 0;
  for (let i = 0; i < air.length && k < taps.length; i++) {
    const idx = i - delaySamples;
    r += gain * ((idx >= 0 ? air[idx] : 0) - r);
    while (k < taps.length && taps[k] === i + 1) out[k++] = r;
  }
  return out;
}

export interface Obs {
  ppm: number;
  atLeast: boolean;
}

function logLik(obs: Obs[], base: Float64Array, unit: Float64Array, q: number, fluct: number, display: number): number {
  let sum = 0;
  for (let k = 0; k < obs.length; k++) {
    const signal = q * unit[k];
    const mu = base[k] + signal;
    const s = Math.sqrt(fluct * signal * signal + display * display);
    const y = obs[k].ppm;
    const p = obs[k].atLeast
      ? 1 - phi((y - 0.5 - mu) / s)
      : y <= 0
        ? phi((0.5 - mu) / s)
        : phi((y + 0.5 - mu) / s) - phi((y - 0.5 - mu) / s);
    sum += Math.log(Math.max(p, 1e-300));
  }
  return sum;
}

/** The strength that maximises the likelihood (golden section on log q around a least-squares start). */
export function profile(obs: Obs[], base: Float64Array, unit: Float64Array, fluct: number, display: number) {
  let num = 0;
  let den = 0;
  for (let k = 0; k < obs.length; k++) {
    num += unit[k] * (obs[k].ppm - base[k]);
    den += unit[k] * unit[k];
  }
  if (den === 0) return { q: 0, ll: logLik(obs, base, unit, 0, fluct, display) };
  const q0 = Math.max(num / den, 1e-12);
  let [a, b] = [Math.log(q0) - 4, Math.log(q0) + 4];
  const g = (Math.sqrt(5) - 1) / 2;
  const f = (lq: number) => -logLik(obs, base, unit, Math.exp(lq), fluct, display);
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = f(c);
  let fd = f(d);
  for (let it = 0; it < 40; it++) {
    if (fc < fd) {
      [b, d, fd] = [d, c, fc];
      c = b - g * (b - a);
      fc = f(c);
    } else {
      [a, c, fc] = [c, d, fd];
      d = a + g * (b - a);
      fd = f(d);
    }
  }
  const lq = (a + b) / 2;
  return { q: Math.exp(lq), ll: -f(lq) };
}

/** The likelihood with the slid leak's strength and every other leak's (at its true place) fitted in turn. */
export function profileWith(
  obs: Obs[],
  base: Float64Array,
  unit: Float64Array,
  others: Float64Array[],
  fluct: number,
  display: number,
) {
  if (others.length === 0) return profile(obs, base, unit, fluct, display);
  const q = others.map(() => 0);
  const plus = (skip: number, extra: { u: Float64Array; q: number } | null) => {
    const out = Float64Array.from(base);
    others.forEach((u, j) => {
      if (j !== skip) for (let k = 0; k < out.length; k++) out[k] += q[j] * u[k];
    });
    if (extra) for (let k = 0; k < out.length; k++) out[k] += extra.q * extra.u[k];
    return out;
  };
  let mine = profile(obs, plus(-1, null), unit, fluct, display);
  for (let round = 0; round < 3; round++) {
    others.forEach((u, j) => {
      q[j] = profile(obs, plus(j, { u: unit, q: mine.q }), u, fluct, display).q;
    });
    mine = profile(obs, plus(-1, null), unit, fluct, display);
  }
  return mine;
}
