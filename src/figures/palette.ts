/**
 * The series palette of the figures ("dusk to apricot", this project's own design).
 *
 * Series (inhibitor levels, or substrate levels in the Dixon and Cornish-Bowden replots) are told
 * apart three ways at once: marker shape (markers.ts), hue and lightness. The colours are points
 * on a path through the OKLab colour space (Ottosson, B. (2020) "A perceptual color space for
 * image processing", bottosson.github.io/posts/oklab), written in its polar form (L, C, h):
 *
 *   L  rises linearly from 0.30 (dark) to 0.76 (light)         -> grayscale order is kept
 *   h  turns from 300 deg (indigo) through blue, teal and green to 60 deg (apricot)
 *   C  is 0.10 at the ends and up to 0.17 in the middle of the path
 *
 * The first series (usually [I] = 0, the control) is the darkest; lightness grows with the
 * concentration, so a grayscale print still orders the series. test/figures/palette.test.ts
 * checks, for 2 to 8 series, that relative luminance (WCAG 2.x definition) rises monotonically by
 * a clear step, and that neighbouring colours stay apart in CIELAB after a simulation of
 * deuteranopia (Machado, G. M., Oliveira, M. M. and Fernandes, L. A. F. (2009) IEEE Trans. Vis.
 * Comput. Graph. 15, 1291-1298, severity 1.0).
 */

/** Ink colours shared by all figures. */
export const INK = {
  text: '#1f2328',
  axis: '#3d434a',
  faint: '#8a9097',
  grid: '#e3e6e9',
  /** reference lines (zero lines, cutoffs) */
  reference: '#6b7178',
  /** accent for the verdict model in the evidence chart */
  accent: '#1d3782',
  /** bars of the other models */
  muted: '#a9b0b7',
  /** joint region fill */
  regionFill: '#cfdcef',
} as const;

const L_DARK = 0.3;
const L_LIGHT = 0.76;
const HUE_START = 300;
const HUE_END = 60;
const CHROMA_END = 0.1;
const CHROMA_BULGE = 0.07;

/** One colour of the path at position t in [0, 1], as '#rrggbb'. */
export function paletteColourAt(t: number): string {
  const u = Math.min(1, Math.max(0, t));
  const l = L_DARK + (L_LIGHT - L_DARK) * u;
  const c = CHROMA_END + CHROMA_BULGE * Math.sin(Math.PI * u);
  const h = HUE_START + (HUE_END - HUE_START) * u;
  return rgbHex(oklchToSrgb(l, c, h));
}

/**
 * Colours for n series, darkest first. With one series the darkest colour is used; with more,
 * the colours are spread evenly along the whole path so neighbours are as far apart as possible.
 */
export function seriesColours(n: number): string[] {
  if (n <= 1) return [paletteColourAt(0)];
  return Array.from({ length: n }, (_, k) => paletteColourAt(k / (n - 1)));
}

/**
 * OKLCH to gamma-encoded sRGB in [0, 1], clipped to the gamut (Ottosson 2020: the OKLab to
 * linear sRGB matrices; IEC 61966-2-1 for the sRGB transfer curve).
 */
export function oklchToSrgb(l: number, c: number, hDeg: number): [number, number, number] {
  const a = c * Math.cos((hDeg * Math.PI) / 180);
  const b = c * Math.sin((hDeg * Math.PI) / 180);
  const l1 = (l + 0.3963377774 * a + 0.2158037573 * b) ** 3;
  const m1 = (l - 0.1055613458 * a - 0.0638541728 * b) ** 3;
  const s1 = (l - 0.0894841775 * a - 1.291485548 * b) ** 3;
  const r = 4.0767416621 * l1 - 3.3077115913 * m1 + 0.2309699292 * s1;
  const g = -1.2684380046 * l1 + 2.6097574011 * m1 - 0.3413193965 * s1;
  const bl = -0.0041960863 * l1 - 0.7034186147 * m1 + 1.707614701 * s1;
  return [encodeSrgb(r), encodeSrgb(g), encodeSrgb(bl)];
}

function encodeSrgb(linear: number): number {
  const x = Math.min(1, Math.max(0, linear));
  return x <= 0.0031308 ? 12.92 * x : 1.055 * x ** (1 / 2.4) - 0.055;
}

function rgbHex(rgb: [number, number, number]): string {
  return '#' + rgb.map((x) => Math.round(x * 255).toString(16).padStart(2, '0')).join('');
}
