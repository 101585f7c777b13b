// A small reproducible pseudo-random stream, so every benchmark store can be rebuilt bit for bit.
// mulberry32 (Tommy Ettinger's 32-bit generator, public domain): fast, good enough for simulation noise.

export interface Random {
  /** Uniform on [0, 1). */
  next(): number;
  uniform(lo: number, hi: number): number;
  int(lo: number, hiInclusive: number): number;
  normal(): number;
  pick<T>(items: readonly T[]): T;
  chance(p: number): boolean;
}

export function createRandom(key: number): Random {
  if (!Number.isInteger(key)) throw new Error(`random stream key must be an integer, got ${key}`);
  let state = key >>> 0;
  let spare: number | null = null;
  const next = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  // Box–Muller, keeping the second variate for the next call.
  const normal = () => {
    if (spare !== null) {
      const s = spare;
      spare = null;
      return s;
    }
    let u = next();
    while (u <= 1e-12) u = next();
    const v = next();
    const r = Math.sqrt(-2 * Math.log(u));
    spare = r * Math.sin(2 * Math.PI * v);
    return r * Math.cos(2 * Math.PI * v);
  };
  return {
    next,
    uniform: (lo, hi) => lo + (hi - lo) * next(),
    int: (lo, hi) => lo + Math.floor(next() * (hi - lo + 1)),
    normal,
    pick: (items) => {
      if (items.length === 0) throw new Error("pick: empty list");
      return items[Math.floor(next() * items.length)];
    },
    chance: (p) => next() < p,
  };
}

/** Log-uniform on [lo, hi]: for quantities whose scale, not size, is uncertain (leak strength). */
export function logUniform(random: Random, lo: number, hi: number): number {
  return Math.exp(random.uniform(Math.log(lo), Math.log(hi)));
}
