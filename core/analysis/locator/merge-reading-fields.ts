import type { ReadingFields } from "./reading-fields";

/** The reading fields of one subset of the readings, and which readings (by index in the whole) it holds. */
export interface FieldsPart {
  readonly fields: ReadingFields;
  readonly readings: Int32Array;
}

/**
 * Joins the reading fields of disjoint subsets of the readings (each searched with its own kernel and
 * step scale) into the fields of all of them: a group is a sampled cell within one subset, so two
 * readings in one cell but different air keep their own kernel values. The per-cell sums add, the
 * nearest reading is the nearer of the parts'.
 */
export function mergeReadingFields(parts: readonly FieldsPart[], readings: number, cells: number): ReadingFields {
  if (parts.length === 1 && parts[0].readings.length === readings) {
    const only = parts[0].readings;
    if (only.every((r, i) => r === i)) return parts[0].fields;
  }
  let groups = 0;
  let entries = 0;
  for (const p of parts) {
    groups += p.fields.groupCell.length;
    entries += p.fields.cell.length;
  }
  const out: ReadingFields = {
    groupCell: new Int32Array(groups),
    groupOfReading: new Int32Array(readings).fill(-1),
    start: new Int32Array(groups + 1),
    cell: new Int32Array(entries),
    kernel: new Float32Array(entries),
    dist: new Float32Array(entries),
    groupX: new Float64Array(groups),
    groupY: new Float64Array(groups),
    sumWG: new Float64Array(cells),
    sumWGG: new Float64Array(cells),
    omega: new Float64Array(cells),
    omegaY: new Float64Array(cells),
    nearestReading: new Float32Array(cells).fill(Infinity),
    // every part was searched with the same focus
    reach: parts[0]?.fields.reach ?? null,
  };
  let g0 = 0;
  let e0 = 0;
  for (const { fields: f, readings: which } of parts) {
    const pg = f.groupCell.length;
    out.groupCell.set(f.groupCell, g0);
    out.groupX.set(f.groupX, g0);
    out.groupY.set(f.groupY, g0);
    for (let g = 0; g < pg; g++) out.start[g0 + g] = f.start[g] + e0;
    which.forEach((r, k) => {
      out.groupOfReading[r] = f.groupOfReading[k] + g0;
    });
    out.cell.set(f.cell, e0);
    out.kernel.set(f.kernel, e0);
    out.dist.set(f.dist, e0);
    for (let c = 0; c < cells; c++) {
      out.sumWG[c] += f.sumWG[c];
      out.sumWGG[c] += f.sumWGG[c];
      out.omega[c] += f.omega[c];
      out.omegaY[c] += f.omegaY[c];
      if (f.nearestReading[c] < out.nearestReading[c]) out.nearestReading[c] = f.nearestReading[c];
    }
    g0 += pg;
    e0 += f.cell.length;
  }
  out.start[groups] = entries;
  if (out.groupOfReading.some((g) => g < 0)) throw new Error("merged reading fields: a reading is in no part");
  return out;
}
