/**
 * The series palette survives grayscale printing and deuteranopia.
 *  - Relative luminance by the WCAG 2.x definition (sRGB linearisation of IEC 61966-2-1 and the
 *    Rec. 709 luminance weights 0.2126, 0.7152, 0.0722) must rise monotonically, by at least
 *    0.02 between neighbours, and by at least 0.3 from first to last: a grayscale print keeps
 *    the order of the series.
 *  - Deuteranopia simulated with the Machado, Oliveira & Fernandes (2009, IEEE TVCG 15, 1291-1298)
 *    matrix for severity 1.0 (applied to linear RGB); neighbouring colours must stay at least 10
 *    CIELAB units apart (CIE 1976 Delta E; D65 white). 10 is this project's threshold: about
 *    five times the just-noticeable difference of 2.3 often quoted (Sharma 2003, from memory).
 */
import { describe, expect, it } from 'vitest';
import { oklchToSrgb, paletteColourAt, seriesColours } from '../../src/figures/palette.js';

function rgb(hex: string): [number, number, number] {
  return [1, 3, 5].map((k) => parseInt(hex.slice(k, k + 2), 16) / 255) as [number, number, number];
}
const linear = (x: number) => (x <= 0.04045 ? x / 12.92 : ((x + 0.055) / 1.055) ** 2.4);
const encode = (x: number) => (x <= 0.0031308 ? 12.92 * x : 1.055 * x ** (1 / 2.4) - 0.055);

function luminance(hex: string): number {
  const [r, g, b] = rgb(hex).map(linear);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

const MACHADO_DEUTERANOPIA = [
  [0.367322, 0.860646, -0.227968],
  [0.280085, 0.672501, 0.047413],
  [-0.01182, 0.04294, 0.968881],
];

function deuteranope(c: [number, number, number]): [number, number, number] {
  const l = c.map(linear);
  return MACHADO_DEUTERANOPIA.map((row) => encode(Math.min(1, Math.max(0, row[0] * l[0] + row[1] * l[1] + row[2] * l[2])))) as [number, number, number];
}

function lab(c: [number, number, number]): [number, number, number] {
  const [r, g, b] = c.map(linear);
  const x = (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047;
  const y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  const z = (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883;
  const f = (t: number) => (t > 216 / 24389 ? Math.cbrt(t) : ((24389 / 27) * t + 16) / 116);
  return [116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))];
}

function deltaE(a: [number, number, number], b: [number, number, number]): number {
  const la = lab(a);
  const lb = lab(b);
  return Math.hypot(la[0] - lb[0], la[1] - lb[1], la[2] - lb[2]);
}

describe('series palette', () => {
  for (let n = 2; n <= 8; n++) {
    it(`${n} series: luminance rises monotonically (grayscale keeps the order)`, () => {
      const lum = seriesColours(n).map(luminance);
      for (let k = 1; k < n; k++) expect(lum[k] - lum[k - 1]).toBeGreaterThan(0.02);
      expect(lum[n - 1] - lum[0]).toBeGreaterThan(0.3);
    });
    it(`${n} series: neighbours stay apart under simulated deuteranopia`, () => {
      const cols = seriesColours(n).map(rgb);
      for (let k = 1; k < n; k++) expect(deltaE(deuteranope(cols[k - 1]), deuteranope(cols[k]))).toBeGreaterThan(10);
    });
  }

  it('the lightest colour still shows on white paper (luminance contrast at least 2:1, WCAG formula)', () => {
    const l = luminance(paletteColourAt(1));
    expect((1 + 0.05) / (l + 0.05)).toBeGreaterThan(2);
  });

  it('OKLab conversion: L = 1 with no chroma is white, L = 0 black (Ottosson 2020 matrices)', () => {
    expect(oklchToSrgb(1, 0, 0).map((x) => Math.round(x * 255))).toEqual([255, 255, 255]);
    expect(oklchToSrgb(0, 0, 0)).toEqual([0, 0, 0]);
  });

  it('gives valid hex colours for one series and for many', () => {
    expect(seriesColours(1)).toHaveLength(1);
    for (const c of seriesColours(12)) expect(c).toMatch(/^#[0-9a-f]{6}$/);
  });
});
