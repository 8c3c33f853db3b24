import { describe, expect, it } from 'vitest';
import { advisoryPalette, oklabToLinearSrgb, oklchToHex } from '../../src/report/html/index.js';

/**
 * Relative luminance of an sRGB colour, as WCAG 2.1 defines it (W3C, "relative luminance":
 * linearise each channel, then 0.2126 R + 0.7152 G + 0.0722 B). An outside definition of
 * "how light a colour is", independent of the OKLab arithmetic the palette uses.
 */
function luminance(hex: string): number {
  const c = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((v) => (v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
  return 0.2126 * c[0]! + 0.7152 * c[1]! + 0.0722 * c[2]!;
}

/** WCAG 2.1 contrast ratio of two luminances. */
function contrast(a: number, b: number): number {
  return (Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05);
}

describe('oklabToLinearSrgb', () => {
  it('maps the OKLab coordinates of sRGB red back to (1, 0, 0)', () => {
    // OKLab of #ff0000 = (0.62796, 0.22486, 0.12585): from memory, the CSS Color Module Level 4
    // sample values (W3C), which follow Ottosson (2020). Five significant digits in the
    // reference, so 1e-3 per channel.
    const rgb = oklabToLinearSrgb(0.62796, 0.22486, 0.12585);
    expect(Math.abs(rgb[0] - 1)).toBeLessThan(1e-3);
    expect(Math.abs(rgb[1])).toBeLessThan(1e-3);
    expect(Math.abs(rgb[2])).toBeLessThan(1e-3);
  });

  it('maps L = 1 with no chroma to white and L = 0 to black', () => {
    // white and black are fixed points of OKLab by construction (Ottosson 2020)
    expect(oklchToHex(1, 0, 0)).toBe('#ffffff');
    expect(oklchToHex(0, 0, 0)).toBe('#000000');
  });
});

describe('advisoryPalette', () => {
  it('gets strictly darker from the first advisory to the last for every size from 2 to 12', () => {
    for (let k = 2; k <= 12; k++) {
      const lum = advisoryPalette(k).map(luminance);
      for (let i = 1; i < k; i++) expect(lum[i]!, `k=${k}, colour ${i}`).toBeLessThan(lum[i - 1]!);
    }
  });

  it('keeps neighbouring colours apart in greyscale for up to 8 advisories', () => {
    // 1.2:1 luminance contrast between neighbours: common practice, no source (a step readers
    // still see in a greyscale print); 8 advisories is above both demo scenarios (5)
    for (let k = 2; k <= 8; k++) {
      const lum = advisoryPalette(k).map(luminance);
      for (let i = 1; i < k; i++) expect(contrast(lum[i]!, lum[i - 1]!), `k=${k}, colours ${i - 1}/${i}`).toBeGreaterThan(1.2);
    }
  });

  it('gives valid, distinct #rrggbb colours', () => {
    const p = advisoryPalette(10);
    for (const c of p) expect(c).toMatch(/^#[0-9a-f]{6}$/);
    expect(new Set(p).size).toBe(10);
  });
});
