import { besselK0 } from "./bessel-k0";

/**
 * The decay of a steady point source's excess concentration with obstacle-aware distance d.
 * Air in a store is mixed vertically by case fans and removed by air exchange, so the far field is the
 * 2-D screened-diffusion Green's function K0(d/L)/(2πK·H) with screening length L = √(K/λ)
 * (docs/reference/locator-methods.md §1d). Only Q/K is identifiable, so the kernel is normalised to 1 at the near-field
 * cut-off d0 and the fitted Q is "excess ppm at d0". It is shifted to reach 0 at the truncation radius
 * so truncated per-reading searches add no step.
 */
export interface SourceKernel {
  screeningLengthM: number;
  /** Far-field part: a second, longer screening length and its share of the kernel at d0 (0 = none). */
  farLengthM: number;
  farShare: number;
  nearCutoffM: number;
  truncationM: number;
  /** g(d), 0..1; 0 beyond the truncation radius. */
  at(d: number): number;
}

const TABLE_STEP_M = 0.01;

/**
 * With `far`, the kernel is (1 − share)·near + share·far, both normalised the same way: readings a few
 * metres off still carry gas the short kernel has already dropped (eddies of several sizes in a store),
 * and left unexplained that gas draws a second, "mop-up" source beside a real one.
 */
export function createSourceKernel(
  screeningLengthM: number,
  nearCutoffM: number,
  truncationM: number,
  far: { lengthM: number; share: number } | null = null,
): SourceKernel {
  if (!(screeningLengthM > 0)) throw new Error(`screening length must be positive, got ${screeningLengthM}`);
  if (far && (!(far.lengthM > 0) || !(far.share >= 0 && far.share < 1))) {
    throw new Error(
      `far field: need a positive screening length and a share in [0, 1), got ${far.lengthM} and ${far.share}`,
    );
  }
  if (!(nearCutoffM > 0) || !(truncationM > nearCutoffM)) {
    throw new Error(`need 0 < near cut-off < truncation radius, got ${nearCutoffM} and ${truncationM}`);
  }
  const part = (L: number) => {
    const k0 = (d: number) => besselK0(Math.max(d, nearCutoffM) / L);
    const top = k0(nearCutoffM);
    const floor = k0(truncationM);
    return (d: number) => Math.max(0, (k0(d) - floor) / (top - floor));
  };
  const nearPart = part(screeningLengthM);
  const share = far ? far.share : 0;
  const farPart = far && share > 0 ? part(far.lengthM) : () => 0;
  const n = Math.ceil(truncationM / TABLE_STEP_M) + 2;
  const table = new Float64Array(n);
  for (let s = 0; s < n; s++) table[s] = (1 - share) * nearPart(s * TABLE_STEP_M) + share * farPart(s * TABLE_STEP_M);
  return {
    screeningLengthM,
    farLengthM: far ? far.lengthM : 0,
    farShare: share,
    nearCutoffM,
    truncationM,
    at(d: number): number {
      if (d >= truncationM) return 0;
      const u = d / TABLE_STEP_M;
      const s = Math.floor(u);
      const f = u - s;
      return table[s] * (1 - f) + table[s + 1] * f;
    },
  };
}

/** ∫ over the plane of the untruncated kernel: 2πL²/K0(d0/L), in m² (∫₀^∞ K0(r/L) 2πr dr = 2πL²). */
export function kernelArea(kernel: SourceKernel): number {
  const area = (L: number) => (2 * Math.PI * L * L) / besselK0(kernel.nearCutoffM / L);
  const near = area(kernel.screeningLengthM);
  return kernel.farShare > 0 ? (1 - kernel.farShare) * near + kernel.farShare * area(kernel.farLengthM) : near;
}
