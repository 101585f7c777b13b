import type { LocatorInput } from "../../contracts/locator-input";
import type { CorrectedReading } from "../../contracts/locator-output";
import { pointInPolygon } from "../geometry/point-in-polygon";
import type { DriftChoice, DriftKernel } from "./drift-kernels";
import type { Hypothesis, Kernel, ProbeSuggestion } from "./next-probes";
import { nextProbes } from "./next-probes";
import { isOpenFloor, probePlaces, roomWithin, type ProbePlace } from "./probe-places";

// Before the locator finds a credible spot (a weak plume, a few readings), the readings near an alarm
// still say where along a case the gas is strongest. Here the places a leak could be near where the
// alarm's air was drawn in are each weighed by how well one source there explains those readings, and
// the next probe goes where a reading best tells the likely places apart: it brackets the peak along
// the case at the spacing the expected information justifies. The best place is a provisional mark,
// not a suspect spot: the locator has not found it credible.

type Plan = LocatorInput["plan"];

/** A reading at the place whose air it describes (lag-corrected, or where a held probe stood). */
export interface EvidenceReading {
  x: number;
  y: number;
  ppm: number;
}

/**
 * The readings as evidence: each at the place whose air it describes. The lag model takes a tap as made
 * on arrival after walking from the last one; a technician who stood at a probe place long enough for
 * its own air to reach the display (the time since the last tap, less the walk between them at
 * `walkSpeedMps`, covers the delay and the time constant) read the air where they stood.
 */
export function evidenceOf(
  readings: readonly CorrectedReading[],
  instrument: LocatorInput["instrument"],
  walkSpeedMps = 1,
): EvidenceReading[] {
  const lagS = instrument.transportDelayS + instrument.timeConstantS;
  return readings.map((r, i) => {
    const prev = readings[i - 1];
    const walkS = prev ? Math.hypot(r.raw.x - prev.raw.x, r.raw.y - prev.raw.y) / walkSpeedMps : 0;
    const held = prev !== undefined && r.t - prev.t - walkS >= lagS;
    return held ? { x: r.raw.x, y: r.raw.y, ppm: r.ppm } : { x: r.corrected.x, y: r.corrected.y, ppm: r.ppm };
  });
}

/** A place the leak could be: on a case's back (or spine), at a risk point, in a room. */
export interface LeakSite {
  x: number;
  y: number;
  fixtureId: string | null;
  /** Prior odds against the other sites (risk points are favoured, as the locator's prior does). */
  prior: number;
}

/** Leak sites are this far apart along a case's back, m (half the trade's re-check spacing). */
const SITE_SPACING_M = 0.3;
/** How far inside a case's back a leak sits (joints, brazed returns at the rear wall), m. */
const BACK_INSET_M = 0.15;
/** Prior odds of a risk point against a point on a case back (the locator's log odds 3 is about 20:1). */
const RISK_POINT_ODDS = 3;
const ROOMS = new Set(["walk-in", "machine-room"]);

/**
 * The places within `reachM` of `near` where a leak could be (common practice, no published source:
 * leaks are found at case backs, joints, coils and line-set drops): every SITE_SPACING_M along each
 * case side that no probe can reach (against a wall, a spine or another case), BACK_INSET_M inside;
 * for a case open on every side (an island), along its middle; each risk point; the middle and the
 * risk points of a walk-in or machine room whose walls come within `roomReachM`.
 */
export function leakSites(plan: Plan, near: { x: number; y: number }, reachM: number, roomReachM = reachM): LeakSite[] {
  const within = (x: number, y: number) => Math.hypot(x - near.x, y - near.y) <= reachM;
  const open = isOpenFloor(plan);
  const out: LeakSite[] = [];
  for (const f of plan.fixtures) {
    const ring = f.polygon;
    if (ROOMS.has(f.kind)) {
      // A room whose walls come within reach: its middle, and its risk points (coils, drops) below.
      if (!roomWithin(ring, near, roomReachM)) continue;
      const [cx, cy] = centroid(ring);
      out.push({ x: cx, y: cy, fixtureId: f.id, prior: 1 });
      for (const p of plan.riskPoints)
        if (!within(p.x, p.y) && pointInPolygon([p.x, p.y], ring))
          out.push({ x: p.x, y: p.y, fixtureId: f.id, prior: RISK_POINT_ODDS });
      continue;
    }
    const backs: { ax: number; ay: number; bx: number; by: number; nx: number; ny: number }[] = [];
    let longest = { len: 0, k: 0 };
    for (let k = 0; k < ring.length; k++) {
      const [ax, ay] = ring[k];
      const [bx, by] = ring[(k + 1) % ring.length];
      const len = Math.hypot(bx - ax, by - ay);
      if (len === 0) continue;
      if (len > longest.len) longest = { len, k };
      // Inward normal of this side, whichever way the outline runs.
      let [nx, ny] = [(ay - by) / len, (bx - ax) / len];
      const mx = (ax + bx) / 2;
      const my = (ay + by) / 2;
      if (!pointInPolygon([mx + nx * 0.05, my + ny * 0.05], ring)) [nx, ny] = [-nx, -ny];
      if (len >= 2 * SITE_SPACING_M && !open(mx - nx * 0.15, my - ny * 0.15)) backs.push({ ax, ay, bx, by, nx, ny });
    }
    if (backs.length === 0 && longest.len > 0) {
      // Open all round: the spine runs along the middle, parallel to the longest side.
      const [cx, cy] = centroid(ring);
      const [ax, ay] = ring[longest.k];
      const [bx, by] = ring[(longest.k + 1) % ring.length];
      const [ux, uy] = [(bx - ax) / longest.len, (by - ay) / longest.len];
      const half = longest.len / 2;
      backs.push({ ax: cx - ux * half, ay: cy - uy * half, bx: cx + ux * half, by: cy + uy * half, nx: 0, ny: 0 });
    }
    for (const b of backs) {
      const len = Math.hypot(b.bx - b.ax, b.by - b.ay);
      const steps = Math.max(1, Math.round(len / SITE_SPACING_M));
      for (let s = 0; s < steps; s++) {
        const t = (s + 0.5) / steps;
        const x = b.ax + (b.bx - b.ax) * t + b.nx * BACK_INSET_M;
        const y = b.ay + (b.by - b.ay) * t + b.ny * BACK_INSET_M;
        if (within(x, y)) out.push({ x, y, fixtureId: f.id, prior: 1 });
      }
    }
  }
  for (const p of plan.riskPoints) {
    if (!within(p.x, p.y)) continue;
    const host = plan.fixtures.find((f) => pointInPolygon([p.x, p.y], f.polygon));
    out.push({ x: p.x, y: p.y, fixtureId: host?.id ?? null, prior: RISK_POINT_ODDS });
  }
  return out;
}

/**
 * Each site weighed by the readings: one source there, with the non-negative amplitude that best
 * fits the readings' excess over `background` (least squares), scored by the Gaussian misfit with the
 * reading spread of next-probes.ts, tempered by `temper` (neighbouring readings share the same gusts),
 * times the site's prior. With `drift`, a case site also tries each drifted kernel and keeps the one
 * that fits best when it beats the plain kernel by `drift.penalty` (decision 0149): a plume carried
 * along a lineup then favours the site at its upwind edge, not the middle of its plateau. Weights sum
 * to 1; a site no reading reaches keeps its prior share.
 */
export function weighSites(
  sites: readonly LeakSite[],
  evidence: readonly EvidenceReading[],
  background: number,
  kernel: Kernel,
  temper = 0.5,
  drift?: DriftChoice,
  rooms: ReadonlySet<string> = new Set(),
): Hypothesis[] {
  const excess = evidence.map((r) => r.ppm - background);
  const fitWith = (gs: number[]) => {
    let num = 0;
    let den = 0;
    for (let i = 0; i < gs.length; i++) {
      num += gs[i] * excess[i];
      den += gs[i] * gs[i];
    }
    const amplitude = den > 0 ? Math.max(0, num / den) : 0;
    let chi2 = 0;
    for (let i = 0; i < gs.length; i++) {
      const predicted = background + amplitude * gs[i];
      chi2 += (evidence[i].ppm - predicted) ** 2 / readingVariance(predicted);
    }
    return { amplitude, chi2 };
  };
  const fits = sites.map((s) => {
    const ds = evidence.map((r) => Math.hypot(r.x - s.x, r.y - s.y));
    // score: the misfit, plus the penalty for a drift's two more parameters
    let best: { amplitude: number; chi2: number; score: number; shape?: DriftKernel } = (() => {
      const f = fitWith(ds.map((d) => kernel(d)));
      return { ...f, score: f.chi2 };
    })();
    // A room's air is stirred level by its own fans: no drift there (as the locator's 0128).
    if (drift && evidence.length > 0 && !(s.fixtureId && rooms.has(s.fixtureId))) {
      for (const k of drift.kernels) {
        const f = fitWith(evidence.map((r, i) => k.at(ds[i], r.x - s.x, r.y - s.y)));
        if (f.chi2 + drift.penalty < best.score) best = { ...f, score: f.chi2 + drift.penalty, shape: k };
      }
    }
    const log = Math.log(s.prior) - 0.5 * temper * best.score;
    return { ...best, log };
  });
  const top = Math.max(...fits.map((l) => l.log));
  const raw = fits.map((l) => Math.exp(l.log - top));
  const total = raw.reduce((a, b) => a + b, 0);
  return sites.map((s, i) => {
    const shape = fits[i].shape;
    return {
      x: s.x,
      y: s.y,
      weight: raw[i] / total,
      amplitude: fits[i].amplitude,
      rank: 1,
      fixtureId: s.fixtureId,
      ...(shape ? { shape: (dx: number, dy: number) => shape.at(Math.hypot(dx, dy), dx, dy), drift: shape.a } : {}),
    };
  });
}

/** Spread of one reading about a prediction: 30 % fluctuation plus about 1 ppm (next-probes.ts). */
const readingVariance = (ppm: number) => (0.3 * Math.max(ppm, 0)) ** 2 + 1;

/** The background under a plume: the lower quartile of the readings around it (ppm). */
export function backgroundOf(evidence: readonly EvidenceReading[]): number {
  if (evidence.length === 0) return 0;
  const s = evidence.map((r) => r.ppm).sort((a, b) => a - b);
  return s[Math.floor((s.length - 1) / 4)];
}

/** The provisional mark: the likeliest site, with the share of the weight within `withinM` of it. */
export function provisionalMark(hypotheses: readonly Hypothesis[], withinM = 0.6) {
  if (hypotheses.length === 0) return null;
  const best = hypotheses.reduce((a, b) => (b.weight > a.weight ? b : a));
  const share = hypotheses
    .filter((h) => Math.hypot(h.x - best.x, h.y - best.y) <= withinM)
    .reduce((s, h) => s + h.weight, 0);
  return { x: best.x, y: best.y, fixtureId: best.fixtureId, share };
}

/**
 * Up to `n` probe places that best tell the weighed sites apart (nextProbes' expected separation), each
 * with the reason "traces": it finds where along that fixture the alarm's gas is strongest.
 */
export function evidenceProbes(
  hypotheses: readonly Hypothesis[],
  places: readonly ProbePlace[],
  kernel: Kernel,
  from: { x: number; y: number },
  n = 3,
): ProbeSuggestion[] {
  return nextProbes(hypotheses, places, kernel, from, n).map((p) => ({
    ...p,
    reason: { kind: "traces", fixtureId: p.reason.kind === "narrows" ? p.reason.fixtureId : p.fixtureId },
  }));
}

function centroid(ring: readonly (readonly number[])[]): [number, number] {
  const n = ring.length;
  return [ring.reduce((s, p) => s + p[0], 0) / n, ring.reduce((s, p) => s + p[1], 0) / n];
}

/** Sites and probe places are looked for this far around the stretch from the alarm's origin to the alarm (m). */
export const ALARM_REACH_M = 3;
/** Readings this far beyond the sites' reach still weigh them (the kernel's reach, about twice its screening length; m). */
const EVIDENCE_REACH_M = 3;
/** Rooms (walk-ins, machine rooms) are searched this much farther out than cases (m; tried on stores 6001-6010). */
const ROOM_EXTRA_M = 2;
/** How many times a stronger reading near the strongest one moves the search on (each at most 6 m; tried on stores 6001-6010). */
const STRONGEST_HOPS = 3;
/** How far upwind of the strongest reading the search's next disc is centred (m; its reach is ALARM_REACH_M). */
const UPWIND_M = 3;
/** The readings' rise says a way once the strongest reading lies this far from the alarm (m). */
const RISE_MIN_M = 1.5;
/** A probe place this close to a place already read is not offered again (m). */
const READ_WITHIN_M = 0.3;

export interface AlarmSearch {
  /** The likeliest site and the share of the weight within 0.6 m of it; null before any evidence. */
  mark: ReturnType<typeof provisionalMark>;
  probes: ProbeSuggestion[];
}

/**
 * The search while no suspect is credible: the gas may have come from anywhere between where the
 * alarm's air was drawn in (`origin`, the alarm moved back by the lag) and a little past where the
 * alarm was read (a plume spreads both ways along a case), so the sites and probe places are those
 * within ALARM_REACH_M of that stretch; `read` are the places already probed.
 */
export function searchAroundAlarm(args: {
  plan: Plan;
  origin: { x: number; y: number };
  alarm: { x: number; y: number };
  evidence: readonly EvidenceReading[];
  read: readonly { x: number; y: number }[];
  from: { x: number; y: number };
  kernel: Kernel;
  n?: number;
  /** More places to search around (a credible suspect spot and its radius). */
  also?: readonly { x: number; y: number; reach: number }[];
  /** The drifts a case site may take (drift-kernels.ts driftChoiceFor); none = a plain kernel. */
  drift?: DriftChoice;
  /** Reach on upwind of the strongest reading too (upwindOf; decision 0162; the live guide does). */
  upwind?: boolean;
}): AlarmSearch {
  const { plan, origin, alarm, evidence, read, from, kernel } = args;
  const centre = { x: (origin.x + alarm.x) / 2, y: (origin.y + alarm.y) / 2 };
  const reach = Math.hypot(alarm.x - origin.x, alarm.y - origin.y) / 2 + ALARM_REACH_M;
  // Readings farther out than a plume carries say nothing about these sites.
  const nearTo = (ds: readonly Disc[]) =>
    evidence.filter((r) => ds.some((d) => Math.hypot(r.x - d.at.x, r.y - d.at.y) <= d.reach + EVIDENCE_REACH_M));
  // Where the gas is strongest so far, the search reaches on past the stretch: a plume mixed along
  // a case reads alike for metres, and its source may lie beyond. A stronger reading around it moves
  // it on, so the search follows the readings' rise (decision 0162).
  let strongest = strongestOf(nearTo([{ at: centre, reach }]));
  for (let hop = 0; strongest && hop < STRONGEST_HOPS; hop++) {
    const next = strongestOf(nearTo([{ at: strongest, reach: ALARM_REACH_M }]));
    if (!next || next.ppm <= strongest.ppm) break;
    strongest = next;
  }
  const discs: Disc[] = [{ at: centre, reach }];
  if (strongest) discs.push({ at: strongest, reach: ALARM_REACH_M });
  let near = nearTo(discs);
  for (const a of args.also ?? []) discs.push({ at: a, reach: a.reach });
  // A room's gas leaves by its door and spreads along the corridor: rooms count from farther off.
  const sitesOf = (ds: readonly Disc[]) =>
    unique(ds.flatMap((d) => leakSites(plan, d.at, d.reach, d.reach + ROOM_EXTRA_M)));
  const rooms = new Set(plan.fixtures.filter((f) => ROOMS.has(f.kind)).map((f) => f.id));
  let hypotheses = weighSites(sitesOf(discs), near, backgroundOf(near), kernel, 0.5, args.drift, rooms);
  const ahead = args.upwind && strongest ? upwindOf(hypotheses, centre, strongest) : null;
  if (ahead) {
    discs.push({ at: ahead, reach: ALARM_REACH_M });
    near = nearTo(discs);
    hypotheses = weighSites(sitesOf(discs), near, backgroundOf(near), kernel, 0.5, args.drift, rooms);
  }
  const places = unique(discs.flatMap((d) => probePlaces(plan, d.at, d.reach, 0.6, d.reach + ROOM_EXTRA_M))).filter(
    (p) => !read.some((r) => Math.hypot(r.x - p.x, r.y - p.y) < READ_WITHIN_M),
  );
  return {
    mark: provisionalMark(hypotheses),
    probes: evidenceProbes(hypotheses, places, kernel, from, args.n ?? 3),
  };
}

interface Disc {
  at: { x: number; y: number };
  reach: number;
}

const strongestOf = (rs: readonly EvidenceReading[]) =>
  rs.reduce<EvidenceReading | null>((a, r) => (!a || r.ppm > a.ppm ? r : a), null);

/**
 * Where the search reaches on upwind of the strongest reading (decision 0162): UPWIND_M against the
 * likeliest site's drift when it took one, else on along the way the readings rose from the alarm to
 * the strongest one when that lies RISE_MIN_M or more from the alarm; null when neither says a way.
 */
function upwindOf(
  hypotheses: readonly Hypothesis[],
  centre: { x: number; y: number },
  strongest: { x: number; y: number },
): { x: number; y: number } | null {
  const lead = hypotheses.reduce<Hypothesis | null>((a, h) => (!a || h.weight > a.weight ? h : a), null);
  const [dx, dy] = lead?.drift ? [-lead.drift[0], -lead.drift[1]] : [strongest.x - centre.x, strongest.y - centre.y];
  const length = Math.hypot(dx, dy);
  if (length === 0 || (!lead?.drift && length < RISE_MIN_M)) return null;
  return { x: strongest.x + (dx / length) * UPWIND_M, y: strongest.y + (dy / length) * UPWIND_M };
}

/** The same place found from two discs once. */
function unique<T extends { x: number; y: number }>(items: T[]): T[] {
  const seen = new Set<string>();
  return items.filter((p) => {
    const key = `${p.x.toFixed(3)},${p.y.toFixed(3)}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}
