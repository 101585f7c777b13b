import { describe, expect, it } from "vitest";
import { fitNonnegative } from "./nonnegative-fit";
import { localOptima, scanSources } from "./source-scan";

// The closed-form 2 x 2 fit per cell is checked against an independent solver (cyclic coordinate descent)
// and against the normal equations solved by hand for a case with an exact answer.
describe("per-cell source fit", () => {
  const y = Float64Array.from([1, 1.2, 3.9, 7.1, 2.8, 1.1]);
  const w = Float64Array.from([1, 2, 1, 0.5, 1, 1]);
  const g = Float64Array.from([0, 0.1, 0.6, 1, 0.4, 0]);
  const sums = (col: Float64Array) => {
    let sw = 0,
      swr = 0,
      swrr = 0,
      swg = 0,
      swgg = 0,
      swgr = 0;
    for (let i = 0; i < y.length; i++) {
      sw += w[i];
      swr += w[i] * y[i];
      swrr += w[i] * y[i] * y[i];
      swg += w[i] * col[i];
      swgg += w[i] * col[i] * col[i];
      swgr += w[i] * col[i] * y[i];
    }
    return { totals: { sumW: sw, sumWR: swr, sumWRR: swrr }, swg, swgg, swgr };
  };

  it("recovers an exact b + Q·g (normal equations)", () => {
    const exact = Float64Array.from(g, (v) => 0.7 + 5 * v);
    let sw = 0,
      swr = 0,
      swrr = 0,
      swg = 0,
      swgg = 0,
      swgr = 0;
    for (let i = 0; i < g.length; i++) {
      sw += w[i];
      swr += w[i] * exact[i];
      swrr += w[i] * exact[i] ** 2;
      swg += w[i] * g[i];
      swgg += w[i] * g[i] ** 2;
      swgr += w[i] * g[i] * exact[i];
    }
    const r = scanSources(
      Float64Array.of(swg),
      Float64Array.of(swgg),
      Float64Array.of(swgr),
      { sumW: sw, sumWR: swr, sumWRR: swrr },
      Uint8Array.of(1),
    );
    expect(r.q[0]).toBeCloseTo(5, 9);
    expect(r.b[0]).toBeCloseTo(0.7, 9);
    expect(r.delta[0]).toBeCloseTo(r.chi2Background, 9); // the source explains all the variation
  });

  it("agrees with coordinate descent on noisy data, including the χ² improvement", () => {
    const s = sums(g);
    const r = scanSources(
      Float64Array.of(s.swg),
      Float64Array.of(s.swgg),
      Float64Array.of(s.swgr),
      s.totals,
      Uint8Array.of(1),
    );
    const cd = fitNonnegative(y, w, [g], new Uint8Array(y.length), 2000);
    expect(r.q[0]).toBeCloseTo(cd.q[0], 6);
    expect(r.b[0]).toBeCloseTo(cd.b, 6);
    const bg = fitNonnegative(y, w, [], new Uint8Array(y.length));
    expect(r.delta[0]).toBeCloseTo(bg.chi2 - cd.chi2, 6);
  });

  it("scores no source where the fit wants a negative strength, and skips cells not allowed", () => {
    const neg = Float64Array.from(g, (v) => 1 - v);
    const s = sums(neg);
    const r = scanSources(
      Float64Array.of(s.swg, s.swg),
      Float64Array.of(s.swgg, s.swgg),
      Float64Array.of(s.swgr, s.swgr),
      s.totals,
      Uint8Array.of(1, 0),
    );
    expect(r.delta[0]).toBe(0);
    const t = sums(g);
    const r2 = scanSources(
      Float64Array.of(t.swg),
      Float64Array.of(t.swgg),
      Float64Array.of(t.swgr),
      t.totals,
      Uint8Array.of(0),
    );
    expect(r2.delta[0]).toBe(0);
  });

  it("visits only the span of allowed cells and gives it as [from, to)", () => {
    const t = sums(g);
    const five = (v: number) => Float64Array.of(v, v, v, v, v);
    const r = scanSources(five(t.swg), five(t.swgg), five(t.swgr), t.totals, Uint8Array.of(0, 1, 0, 1, 0));
    expect([r.from, r.to]).toEqual([1, 4]);
    expect(Array.from(r.delta, (d) => d > 0)).toEqual([false, true, false, true, false]);
    // the same fit in every allowed cell as with that cell alone allowed
    const one = scanSources(five(t.swg), five(t.swgg), five(t.swgr), t.totals, Uint8Array.of(0, 0, 0, 1, 0));
    expect(r.delta[3]).toBe(one.delta[3]);
    const none = scanSources(five(t.swg), five(t.swgg), five(t.swgr), t.totals, new Uint8Array(5));
    expect([none.from, none.to]).toEqual([0, 0]);
    expect(Array.from(none.delta)).toEqual([0, 0, 0, 0, 0]);
  });

  it("counts censored readings only while the prediction falls short of them", () => {
    // the peak reading saturated at 3 ppm ("at least 3") while its neighbours read 6 and 4
    const yc = Float64Array.from([0, 0, 6, 3, 4, 0]);
    const ones = Float64Array.from(yc, () => 1);
    const plain = fitNonnegative(yc, ones, [g], new Uint8Array(6));
    const cens = fitNonnegative(yc, ones, [g], Uint8Array.of(0, 0, 0, 1, 0, 0));
    expect(cens.q[0]).toBeGreaterThan(plain.q[0] + 1);
    expect(cens.b + cens.q[0] * g[3]).toBeGreaterThanOrEqual(3);
  });
});

describe("local optima", () => {
  it("keeps the best cell of each neighbourhood, best first", () => {
    // 5 x 1 grid, 1 m cells: peaks at 0 and 4 with a shoulder at 1
    const score = Float64Array.of(5, 4, 0, 1, 3);
    expect(localOptima(score, 5, 1, 2, 10)).toEqual([0, 4]);
    expect(localOptima(score, 5, 1, 2, 1)).toEqual([0]);
  });
});
