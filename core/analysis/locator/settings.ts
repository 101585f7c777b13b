// The locator's calibrated model settings, grouped by the stage that uses them. They are constants of the
// method, not caller options: each was measured on the scenario benchmark (npm run bench:locate) and the
// measured reasons are in docs/locator/pipeline.md. Callers may set only `LocatorOptions` (locator-options.ts).

export interface KernelSettings {
  /** Screening length L = √(K/λ), m: K ≈ 0.01–0.05 m²/s in aisles and λ = 1.5–4 air changes/h give 3–11 m. */
  readonly screeningLengthM: number;
  /** Far-field part (fans' stirring): a second screening length and its share, used only where most cases run their fans. */
  readonly farScreeningLengthM: number;
  readonly farShare: number;
  /** Near-field cut-off d0, m (about two cells; tap jitter is about 0.3 m). */
  readonly nearCutoffM: number;
  /** Truncation radius of each per-reading search, m (docs/reference/locator-methods.md §1d: 12–25 m; cost grows with R²). */
  readonly truncationM: number;
  /** Distance scale inside fan-stirred walk-ins and machine rooms: √(K_aisle/K_fans) ≈ 0.2–0.7 (docs/locator/design-ranges.md). */
  readonly fanMixingScale: number;
  /** Gaussian width of the field map, m (about half a tap spacing of 1.2–1.5 m plus jitter). */
  readonly mapSigmaM: number;
}

export interface NoiseSettings {
  /** w = 1/(a + β·y)²: floor a ≈ √(0.5² + 1/12) ppm and lognormal share β (docs/locator/design-ranges.md). */
  readonly floorPpm: number;
  readonly fraction: number;
}

export interface ZoneSettings {
  /** Screening length of a benign-source zone's kernel, m (its gas is fitted out to twice this plus the margin). */
  readonly screeningLengthM: number;
  /** What an active zone can cause by default, in alarm levels (no published source). */
  readonly typicalAlarms: number;
  /** No suspect spot within this distance of an active zone, m. */
  readonly marginM: number;
}

export interface SourceSettings {
  /** Drift strengths a = u/(2K) tried per candidate cell in still air, 1/m, and the bar a drift must clear. */
  readonly driftStrengths: readonly number[];
  /**
   * The same where most cases run their fans: their stirring raises K, so a is smaller; and a higher bar,
   * since the air curtains also spread gas evenly along a lineup, which a drift can mimic from the
   * neighbouring case (decision 0062).
   */
  readonly fansDriftStrengths: readonly number[];
  readonly fansDriftPenalty: number;
  readonly driftPenalty: number;
  /** Leaks fitted at once, and spots listed at most. */
  readonly maxLeaks: number;
  /**
   * The first spot is the strongest source of these greedy rounds: the later rounds are there to reach
   * a weaker second leak past the sources that mop up a strong plume, and their strengths are the
   * least certain (the spots after the first go by the peak each explains, greedy-sources.ts).
   */
  readonly rankedRounds: number;
  readonly maxCandidates: number;
  /** Fitted leaks at least this far apart, m; listed spots at least `separationM` apart. */
  readonly sourceSeparationM: number;
  readonly separationM: number;
  /** A weaker fitted source within this distance of a stronger one is listed after the others, m. */
  readonly tailReachM: number;
  /** An alternative spot must reach this share of the best spot's Δχ². */
  readonly alternateFraction: number;
  /** Credibility: minimum Δχ², and `minSupport` readings within `supportRadiusM` at least `elevatedPpm` over background. */
  readonly minDeltaChi2: number;
  readonly supportRadiusM: number;
  readonly minSupport: number;
  readonly elevatedPpm: number;
  /**
   * Whether there is any leak: a first spot with Δχ² under `broadRiseDeltaChi2` must also save
   * `minPeakOverBroad` of χ² over a broad bump (a Gaussian of width `diffuseSigmaM`) at the same place,
   * so a gentle rise spread by fans (a benign source's gas, uneven background) is no leak (decision 0063).
   */
  readonly diffuseSigmaM: number;
  readonly minPeakOverBroad: number;
  readonly broadRiseDeltaChi2: number;
  /** Equipment mask margin for drawing error, m. */
  readonly equipmentMarginM: number;
  /** Log prior odds of a leak within 0.5 m of a risk point (common practice, no published source). */
  readonly riskPointLogOdds: number;
  /** No suspect spot farther than this from every reading, m. */
  readonly maxReachM: number;
}

export interface PlacementSettings {
  /** Local refinement radius, m, and the tempering of Δχ² (times the residual variance). */
  readonly refineRadiusM: number;
  readonly refineInflation: number;
  /**
   * Radius = max(minRadiusM, radiusScale · the radius holding `radiusShare` of the posterior tempered by
   * `radiusInflation` times the residual variance, within `radiusReachM`), calibrated for 80–95 % coverage
   * (docs/locator/benchmark-baseline.md, "Fourth round").
   */
  readonly minRadiusM: number;
  readonly radiusScale: number;
  readonly radiusInflation: number;
  readonly radiusShare: number;
  readonly radiusReachM: number;
  /**
   * The radius of a spot from one reading, m: the tempered posterior of one reading is flat over every
   * cell it sees, so the radius is the reach of its air instead (twice the kernel's screening length).
   */
  readonly oneReadingRadiusM: number;
  /**
   * Where most cases run their fans, the first spot is placed again within `upwindWindowM` of where the
   * greedy fit put it, each cell taking one of these drift strengths (1/m) when it beats none by
   * `upwindPenalty` times the residual variance (upwind-replace.ts, decision 0128); none = off.
   */
  readonly upwindStrengths: readonly number[];
  readonly upwindPenalty: number;
  readonly upwindWindowM: number;
  readonly upwindMinMoveM: number;
  readonly upwindMinGain: number;
  /**
   * In still air the first spot is the fitted source that explains the highest reading, not the
   * strongest (first-spot.ts); off = the strongest.
   */
  readonly stillFirstByPeak: boolean;
  /** A spot inside a display case, off the risk-point prior, is moved across to the case's back line (case-back.ts). */
  readonly toCaseBack: boolean;
  /**
   * A spot placed in a fan-stirred walk-in or machine room is named at the fitting within this reach of
   * its cell's centre (at-fitting.ts): the prior's 0.5 m plus half a 0.25 m cell; 0 = off.
   */
  readonly fittingReachM: number;
  /**
   * Where most display cases run their fans, the spots after the first take turns with those of a
   * second fit whose geodesic steps inside each such case count this share of their length
   * (case-unit-scale.ts, later-spots.ts, decision 0157): the fans mix the case, so a second leak is
   * placed on its case, not on the plume's downwind stretch. The first spot stays the plain fit's. 0 = off.
   */
  readonly laterSpotsCaseScale: number;
}

export interface ReportSettings {
  /** Tap gaps longer than this are reported as sparse coverage, m (common practice, no published source). */
  readonly coverageGapM: number;
  /** The well-mixed assumption behind the strength per year (the refrigerant is chosen when it is worded). */
  readonly airChangesPerH: number;
  readonly mixingHeightM: number;
}

export interface LocatorSettings {
  readonly kernel: KernelSettings;
  readonly noise: NoiseSettings;
  readonly zones: ZoneSettings;
  readonly sources: SourceSettings;
  readonly placement: PlacementSettings;
  readonly report: ReportSettings;
}

export const LOCATOR_SETTINGS: LocatorSettings = {
  kernel: {
    screeningLengthM: 1.5,
    farScreeningLengthM: 4,
    farShare: 0.3,
    nearCutoffM: 0.3,
    truncationM: 6,
    fanMixingScale: 0.35,
    mapSigmaM: 0.75,
  },
  noise: { floorPpm: 0.6, fraction: 0.15 },
  zones: { screeningLengthM: 12, typicalAlarms: 3, marginM: 1.5 },
  sources: {
    driftStrengths: [0.4, 0.8],
    fansDriftStrengths: [0.4],
    fansDriftPenalty: 25,
    driftPenalty: 3,
    maxLeaks: 8,
    rankedRounds: 3,
    maxCandidates: 5,
    sourceSeparationM: 4,
    separationM: 2,
    tailReachM: 6,
    alternateFraction: 0.3,
    minDeltaChi2: 25,
    supportRadiusM: 3,
    minSupport: 2,
    elevatedPpm: 1.5,
    diffuseSigmaM: 5,
    minPeakOverBroad: 5,
    broadRiseDeltaChi2: 70,
    equipmentMarginM: 0.3,
    riskPointLogOdds: 3,
    maxReachM: 4,
  },
  placement: {
    refineRadiusM: 1.5,
    refineInflation: 200,
    minRadiusM: 2,
    radiusScale: 1.75,
    radiusInflation: 25,
    radiusShare: 0.5,
    radiusReachM: 8,
    oneReadingRadiusM: 3,
    upwindStrengths: [0.4, 1, 2],
    upwindPenalty: 3,
    upwindWindowM: 6,
    upwindMinMoveM: 1.5,
    upwindMinGain: 8,
    stillFirstByPeak: true,
    toCaseBack: true,
    fittingReachM: 0.625,
    laterSpotsCaseScale: 0.5,
  },
  report: {
    coverageGapM: 3,
    airChangesPerH: 2,
    mixingHeightM: 3,
  },
};
