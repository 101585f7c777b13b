/**
 * A detector without a ppm display shows levels (e.g. LEDs or bars); its level scale says which ppm
 * band each level stands for. Checked across bands here (each band's own fields are checked by the
 * contract): levels go up, bands do not overlap (one may start where the one below ends), only the
 * top level may be open-ended, and no level name repeats. Pure, shared by the API and the form.
 */
export interface LevelBand {
  level: string;
  minPpm: number;
  maxPpm: number | null;
}

/** Problems by field path ("1.minPpm"), each a reason in plain words; empty when the scale is sound. */
export function levelScaleProblems(bands: readonly LevelBand[]): Record<string, string> {
  const out: Record<string, string> = {};
  const seen = new Map<string, number>();
  bands.forEach((b, i) => {
    const name = b.level.trim().toLowerCase();
    const first = seen.get(name);
    if (name && first !== undefined) out[`${i}.level`] ??= `must differ from level ${first + 1}'s name`;
    else seen.set(name, i);
    if (i === 0) return;
    const below = bands[i - 1];
    if (below.maxPpm === null) {
      out[`${i - 1}.maxPpm`] ??= "is needed: only the top level may be open-ended";
      return;
    }
    if (!(b.minPpm > below.minPpm))
      out[`${i}.minPpm`] ??=
        `must be above level ${i}'s lower bound (${below.minPpm} ppm): list the levels from low to high`;
    else if (b.minPpm < below.maxPpm)
      out[`${i}.minPpm`] ??=
        `must not overlap level ${i} (up to ${below.maxPpm} ppm): start at ${below.maxPpm} ppm or above`;
  });
  return out;
}
