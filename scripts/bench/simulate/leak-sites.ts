// Where the benchmark's leaks are: at case backs (the rear wall or an island's spine, 0.1–0.2 m in),
// at line-set drops and at coils, which is where service experience finds them (joints, brazed
// returns, evaporator coils; common practice, no published source). A family fixes how many and where.
import { cellOf, type Grid } from "./grid";
import type { Random } from "./random";
import type { Family, FixtureSpec, StoreLayout } from "./store-types";

export interface TrueLeak {
  x: number;
  y: number;
  kind: "case-back" | "line-set" | "coil";
  fixtureId: string;
}

const r2 = (v: number) => Math.round(v * 100) / 100;

function caseBack(f: FixtureSpec, random: Random): [number, number] {
  const { x0, y0, x1, y1 } = f.rect;
  const inset = random.uniform(0.1, 0.2);
  const alongX = random.uniform(x0 + 0.3, x1 - 0.3),
    alongY = random.uniform(y0 + 0.3, y1 - 0.3);
  switch (f.back) {
    case "x0":
      return [x0 + inset, alongY];
    case "x1":
      return [x1 - inset, alongY];
    case "y0":
      return [alongX, y0 + inset];
    case "y1":
      return [alongX, y1 - inset];
    case "centre-y":
      return [alongX, (y0 + y1) / 2 + random.uniform(-0.1, 0.1)];
    case "centre-x":
      return [(x0 + x1) / 2 + random.uniform(-0.1, 0.1), alongY];
  }
}

function leakIn(f: FixtureSpec, layout: StoreLayout, random: Random, kinds: TrueLeak["kind"][]): TrueLeak {
  const kind = random.pick(kinds);
  if (kind !== "case-back") {
    const points = layout.riskPoints.filter((p) => p.fixtureId === f.id && p.kind === kind);
    if (points.length > 0) {
      const p = random.pick(points);
      return { x: p.x, y: p.y, kind, fixtureId: f.id };
    }
  }
  const [x, y] = caseBack(f, random);
  return { x: r2(x), y: r2(y), kind: "case-back", fixtureId: f.id };
}

/** The leaks of one store; every leak sits on open air (never on a solid cell of the grid). */
export function chooseLeaks(family: Family, layout: StoreLayout, grid: Grid, random: Random): TrueLeak[] {
  const cases = layout.fixtures.filter(
    (f) => f.kind === "open-case" || f.kind === "door-case" || f.kind === "island-case",
  );
  const walkins = layout.fixtures.filter((f) => f.kind === "walk-in");
  const onAir = (l: TrueLeak) => !grid.solid[cellOf(grid, l.x, l.y)];
  const draw = (pool: FixtureSpec[], kinds: TrueLeak["kind"][], ok: (l: TrueLeak) => boolean): TrueLeak => {
    for (let k = 0; k < 200; k++) {
      const leak = leakIn(random.pick(pool), layout, random, kinds);
      if (onAir(leak) && ok(leak)) return leak;
    }
    throw new Error("leak sites: no open-air leak position found");
  };
  const anyKind: TrueLeak["kind"][] = ["case-back", "case-back", "line-set", "coil"];
  switch (family) {
    case "no-leak":
    case "bg-zone":
      return [];
    case "single-fans":
    case "single-still":
    case "pinpoint-pass":
      return [draw(cases, anyKind, () => true)];
    case "walkin-fans":
      return [draw(walkins, ["coil", "coil", "line-set"], () => true)];
    case "two-leaks": {
      const first = draw(cases, anyKind, () => true);
      const second = draw([...cases, ...walkins], anyKind, (l) => Math.hypot(l.x - first.x, l.y - first.y) >= 8);
      return [first, second];
    }
  }
}
