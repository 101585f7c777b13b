/**
 * The colour arithmetic the field-map ramps are checked with. Pure functions on 8-bit sRGB triples.
 * Sources: IEC 61966-2-1:1999 (sRGB transfer curve and the sRGB → XYZ matrix for D65),
 * CIE 15:2004 / CIE 1976 L*a*b* (lightness and the ΔE*ab distance),
 * Machado, Oliveira & Fernandes 2009, "A Physiologically-based Model for Simulation of Color Vision
 * Deficiency", IEEE TVCG 15(6) 1291–1298 (the severity-1.0 deuteranomaly matrix, applied to linear RGB).
 */
export type Rgb = readonly [number, number, number];

/** IEC 61966-2-1: the sRGB decoding curve, 8-bit value → linear 0..1. */
export function srgbToLinear(v8: number): number {
  const v = v8 / 255;
  return v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4;
}

export function linearToSrgb(v: number): number {
  const c = Math.min(1, Math.max(0, v));
  const s = c <= 0.0031308 ? 12.92 * c : 1.055 * c ** (1 / 2.4) - 0.055;
  return Math.round(s * 255);
}

/** IEC 61966-2-1 matrix, linear sRGB → CIE XYZ (D65, Y of white = 1). */
export function rgbToXyz([r, g, b]: Rgb): [number, number, number] {
  const R = srgbToLinear(r);
  const G = srgbToLinear(g);
  const B = srgbToLinear(b);
  return [
    0.4124 * R + 0.3576 * G + 0.1805 * B,
    0.2126 * R + 0.7152 * G + 0.0722 * B,
    0.0193 * R + 0.1192 * G + 0.9505 * B,
  ];
}

// CIE 1976: f(t) = t^(1/3) above (6/29)^3, else t/(3(6/29)^2) + 4/29.
const EPS = (6 / 29) ** 3;
const f = (t: number) => (t > EPS ? Math.cbrt(t) : t / (3 * (6 / 29) ** 2) + 4 / 29);
// D65 reference white (CIE 15:2004), Y normalised to 1.
const WHITE = [0.95047, 1, 1.08883] as const;

/** CIE 1976 L*a*b* of an sRGB colour under D65. */
export function rgbToLab(rgb: Rgb): [number, number, number] {
  const [x, y, z] = rgbToXyz(rgb);
  const fx = f(x / WHITE[0]);
  const fy = f(y / WHITE[1]);
  const fz = f(z / WHITE[2]);
  return [116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)];
}

/** CIE 1976 lightness L* (0 black … 100 white). */
export function lightness(rgb: Rgb): number {
  return rgbToLab(rgb)[0];
}

/** ΔE*ab (CIE 1976): Euclidean distance in L*a*b*. */
export function deltaE76(a: Rgb, b: Rgb): number {
  const [l1, a1, b1] = rgbToLab(a);
  const [l2, a2, b2] = rgbToLab(b);
  return Math.hypot(l1 - l2, a1 - a2, b1 - b2);
}

// Machado, Oliveira & Fernandes 2009, Table 1 (deuteranomaly, severity 1.0 = deuteranopia).
const DEUTERANOPIA = [
  [0.367322, 0.860646, -0.227968],
  [0.280085, 0.672501, 0.047413],
  [-0.01182, 0.04294, 0.968881],
] as const;

/** How a colour looks to a deuteranope (Machado et al. 2009, on linear RGB). */
export function simulateDeuteranopia(rgb: Rgb): [number, number, number] {
  const lin = rgb.map(srgbToLinear);
  const out = DEUTERANOPIA.map((row) => row[0] * lin[0] + row[1] * lin[1] + row[2] * lin[2]);
  return [linearToSrgb(out[0]), linearToSrgb(out[1]), linearToSrgb(out[2])];
}

const fInv = (t: number) => (t > 6 / 29 ? t ** 3 : 3 * (6 / 29) ** 2 * (t - 4 / 29));

/** CIE L*a*b* (D65) → 8-bit sRGB, clamped to the gamut. */
export function labToRgb(l: number, a: number, b: number): [number, number, number] {
  const fy = (l + 16) / 116;
  const x = WHITE[0] * fInv(fy + a / 500);
  const y = WHITE[1] * fInv(fy);
  const z = WHITE[2] * fInv(fy - b / 200);
  // Inverse of the IEC 61966-2-1 matrix.
  const R = 3.2406 * x - 1.5372 * y - 0.4986 * z;
  const G = -0.9689 * x + 1.8758 * y + 0.0415 * z;
  const B = 0.0557 * x - 0.204 * y + 1.057 * z;
  return [linearToSrgb(R), linearToSrgb(G), linearToSrgb(B)];
}

/** Is this L*a*b* colour inside the sRGB gamut (before clamping)? */
export function labInGamut(l: number, a: number, b: number): boolean {
  const fy = (l + 16) / 116;
  const x = WHITE[0] * fInv(fy + a / 500);
  const y = WHITE[1] * fInv(fy);
  const z = WHITE[2] * fInv(fy - b / 200);
  const lin = [
    3.2406 * x - 1.5372 * y - 0.4986 * z,
    -0.9689 * x + 1.8758 * y + 0.0415 * z,
    0.0557 * x - 0.204 * y + 1.057 * z,
  ];
  return lin.every((v) => v >= -0.002 && v <= 1.002);
}

const hex2 = (v: number) => v.toString(16).padStart(2, "0");
export function rgbToHex([r, g, b]: Rgb): string {
  return `#${hex2(r)}${hex2(g)}${hex2(b)}`;
}

/** Parses d3-interpolate's "rgb(r, g, b)" output (and #rrggbb). */
export function parseRgb(text: string): [number, number, number] {
  const m = /^rgb\((\d+),\s*(\d+),\s*(\d+)\)$/.exec(text);
  if (m) return [Number(m[1]), Number(m[2]), Number(m[3])];
  const h = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(text);
  if (h) return [parseInt(h[1], 16), parseInt(h[2], 16), parseInt(h[3], 16)];
  throw new Error(`not an rgb colour: ${text}`);
}
