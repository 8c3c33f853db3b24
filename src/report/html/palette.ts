/**
 * The advisory palette of the slice plots: colours whose lightness falls monotonically from
 * the first advisory to the last, so that a greyscale print and readers with any common colour
 * vision deficiency still tell the regions apart by lightness alone, while the hue (yellow →
 * green → teal → blue → violet, the axis that red–green deficient readers keep) adds a second
 * cue for everyone else.
 *
 * The colours are points in OKLCH (the polar form of OKLab): lightness from PALETTE_L_LIGHT down
 * to PALETTE_L_DARK in equal steps, hue from PALETTE_HUE_START to PALETTE_HUE_END, chroma
 * PALETTE_CHROMA reduced where needed to stay inside the sRGB gamut (reducing chroma leaves
 * lightness unchanged).
 *
 * OKLab and its conversion matrices: B. Ottosson, "A perceptual color space for image
 * processing", bottosson.github.io/posts/oklab, 2020. The sRGB transfer function: IEC
 * 61966-2-1:1999.
 */

/** OKLab lightness of the first (lightest) advisory: near white, still visible on white paper. */
export const PALETTE_L_LIGHT = 0.95;
/** OKLab lightness of the last (darkest) advisory: dark, but black outlines stay visible on it. */
export const PALETTE_L_DARK = 0.3;
/** Hue (degrees) of the lightest colour: yellow. */
export const PALETTE_HUE_START = 100;
/** Hue (degrees) of the darkest colour: violet. */
export const PALETTE_HUE_END = 305;
/** Target chroma; lowered per colour until the colour fits in sRGB. */
export const PALETTE_CHROMA = 0.13;
/** How far outside [0, 1] a linear sRGB channel may be and still count as in gamut (rounding). */
const GAMUT_SLACK = 1e-9;
/** Chroma step of the gamut search (colours differ by less than one 8-bit level per step). */
const CHROMA_STEP = 0.002;

/** OKLab → linear sRGB (Ottosson 2020, the published matrices). */
export function oklabToLinearSrgb(l: number, a: number, b: number): [number, number, number] {
  const l1 = l + 0.3963377774 * a + 0.2158037573 * b;
  const m1 = l - 0.1055613458 * a - 0.0638541728 * b;
  const s1 = l - 0.0894841775 * a - 1.291485548 * b;
  const L = l1 * l1 * l1;
  const M = m1 * m1 * m1;
  const S = s1 * s1 * s1;
  return [
    4.0767416621 * L - 3.3077115913 * M + 0.2309699292 * S,
    -1.2684380046 * L + 2.6097574011 * M - 0.3413193965 * S,
    -0.0041960863 * L - 0.7034186147 * M + 1.707614701 * S,
  ];
}

/** Linear sRGB channel (0..1) → 8-bit encoded value, by the sRGB transfer function. */
function encode(c: number): number {
  const clipped = Math.min(1, Math.max(0, c));
  const v = clipped <= 0.0031308 ? 12.92 * clipped : 1.055 * Math.pow(clipped, 1 / 2.4) - 0.055;
  return Math.round(255 * v);
}

function hex2(v: number): string {
  return v.toString(16).padStart(2, '0');
}

function inGamut(rgb: readonly number[]): boolean {
  return rgb.every((c) => c >= -GAMUT_SLACK && c <= 1 + GAMUT_SLACK);
}

/** An OKLCH colour as `#rrggbb`, with chroma lowered until it fits in sRGB. */
export function oklchToHex(l: number, chroma: number, hueDeg: number): string {
  const h = (hueDeg * Math.PI) / 180;
  let c = chroma;
  let rgb = oklabToLinearSrgb(l, c * Math.cos(h), c * Math.sin(h));
  while (!inGamut(rgb) && c > 0) {
    c = Math.max(0, c - CHROMA_STEP);
    rgb = oklabToLinearSrgb(l, c * Math.cos(h), c * Math.sin(h));
  }
  return `#${hex2(encode(rgb[0]))}${hex2(encode(rgb[1]))}${hex2(encode(rgb[2]))}`;
}

/**
 * One colour per advisory, in advisory order, lightest first.
 * @param k number of advisories (>= 1)
 * @returns `#rrggbb` strings, lightness strictly decreasing
 */
export function advisoryPalette(k: number): string[] {
  const out: string[] = [];
  for (let i = 0; i < k; i++) {
    const t = k === 1 ? 0 : i / (k - 1);
    const l = PALETTE_L_LIGHT + t * (PALETTE_L_DARK - PALETTE_L_LIGHT);
    const hue = PALETTE_HUE_START + t * (PALETTE_HUE_END - PALETTE_HUE_START);
    out.push(oklchToHex(l, PALETTE_CHROMA, hue));
  }
  return out;
}
