import type { FieldGrid } from "../../contracts/locator-output";
import type { ReadingFields } from "./reading-fields";

/**
 * Kernel DM+V mean map with its confidence (Lilienthal et al. 2009, IROS, "A statistical approach
 * to gas distribution modelling with mobile robots"): Ω = Σω_i, R = Σω_i·y_i with Gaussian ω over the
 * geodesic distance, confidence α = 1 − exp(−Ω²/σ_Ω²) (the paper's Ω², not Ω). Where no reading lies
 * within 3σ the value is NaN: unknown, not filled with a prior mean.
 */
export function fieldMap(
  fields: ReadingFields,
  width: number,
  height: number,
  cellSize: number,
  sigmaOmega = 1,
): FieldGrid {
  const n = width * height;
  const values = new Float32Array(n);
  const confidence = new Float32Array(n);
  const { omega, omegaY } = fields;
  const s2 = sigmaOmega * sigmaOmega;
  for (let c = 0; c < n; c++) {
    const om = omega[c];
    if (om > 1e-9) {
      values[c] = omegaY[c] / om;
      confidence[c] = 1 - Math.exp(-(om * om) / s2);
    } else {
      values[c] = NaN;
      confidence[c] = 0;
    }
  }
  return { width, height, cellSize, values, confidence };
}
