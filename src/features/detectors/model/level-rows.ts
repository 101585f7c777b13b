import { levelScaleProblems, type LevelBand } from "#core/domain/detectors/level-scale";

/** One row of the level-scale editor as typed (text, so a half-typed number is kept). */
export interface LevelRow {
  level: string;
  minPpm: string;
  /** Blank: open-ended (the top level only). */
  maxPpm: string;
}

export function toRows(bands: readonly LevelBand[] | null): LevelRow[] {
  return (bands ?? []).map((b) => ({
    level: b.level,
    minPpm: String(b.minPpm),
    maxPpm: b.maxPpm === null ? "" : String(b.maxPpm),
  }));
}

function ppm(text: string): number | null {
  const t = text.trim().replace(",", ".");
  if (t === "" || !/^\d+(\.\d+)?$/.test(t)) return null;
  return Number(t);
}

/**
 * The typed rows as bands, or the problems by row and field ("1.minPpm"), with the same cross-band
 * rules the server applies (core/domain/detectors/level-scale.ts).
 */
export function parseRows(rows: readonly LevelRow[]): { bands: LevelBand[]; problems: Record<string, string> } {
  const problems: Record<string, string> = {};
  const bands: LevelBand[] = rows.map((r, i) => {
    const min = ppm(r.minPpm);
    const max = r.maxPpm.trim() === "" ? null : ppm(r.maxPpm);
    if (!r.level.trim()) problems[`${i}.level`] = "is required";
    if (min === null) problems[`${i}.minPpm`] = "must be a number of ppm, 0 or more";
    if (r.maxPpm.trim() !== "" && max === null)
      problems[`${i}.maxPpm`] = "must be a number of ppm, or blank for the top level";
    else if (min !== null && max !== null && !(max > min)) problems[`${i}.maxPpm`] = "must be above the lower bound";
    return { level: r.level.trim(), minPpm: min ?? 0, maxPpm: max };
  });
  if (Object.keys(problems).length === 0) Object.assign(problems, levelScaleProblems(bands));
  return { bands, problems };
}
