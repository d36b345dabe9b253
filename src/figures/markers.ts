/**
 * Marker shapes: the second way (besides colour) that series are told apart, so the figures
 * read in grayscale and for colour-blind readers. Shapes cycle after eight series.
 */
import * as d3 from 'd3';

interface MarkerShape {
  name: string;
  symbol: d3.SymbolType;
  /** degrees; the down-pointing triangle is the up-pointing one turned over */
  rotate: number;
}

const MARKER_SHAPES: readonly MarkerShape[] = [
  { name: 'circle', symbol: d3.symbolCircle, rotate: 0 },
  { name: 'square', symbol: d3.symbolSquare, rotate: 0 },
  { name: 'triangle up', symbol: d3.symbolTriangle, rotate: 0 },
  { name: 'diamond', symbol: d3.symbolDiamond, rotate: 0 },
  { name: 'triangle down', symbol: d3.symbolTriangle, rotate: 180 },
  { name: 'cross', symbol: d3.symbolCross, rotate: 0 },
  { name: 'star', symbol: d3.symbolStar, rotate: 0 },
  { name: 'wye', symbol: d3.symbolWye, rotate: 0 },
];

/** Marker area in square user units (1 unit = 1 pt at print size): about 4.5 pt across. */
const MARKER_AREA = 17;

/** Marker paths made so far, by shape and area (every figure draws the same few). */
const pathCache = new Map<string, string>();

/** The SVG path data of the marker for series k, centred on the origin. */
export function markerPath(k: number, area = MARKER_AREA): string {
  const shape = MARKER_SHAPES[k % MARKER_SHAPES.length];
  const key = `${shape.name}:${area}`;
  let d = pathCache.get(key);
  if (d === undefined) {
    d = d3.symbol(shape.symbol, area)() ?? '';
    pathCache.set(key, d);
  }
  return d;
}

/** The transform that puts marker k at (x, y). */
export function markerTransform(k: number, x: number, y: number): string {
  const shape = MARKER_SHAPES[k % MARKER_SHAPES.length];
  const at = `translate(${roundedText(x)},${roundedText(y)})`;
  return shape.rotate ? `${at} rotate(${shape.rotate})` : at;
}

/** Coordinates rounded to 0.01 pt: keeps the SVG small and the output byte-stable. */
export function round(x: number): number {
  return Math.round(x * 100) / 100;
}

/**
 * `String(round(x))`, the text of a coordinate, written from the integer number of hundredths
 * (about a third of the time of printing the double: a figure holds thousands of coordinates).
 * Below 1e9 in magnitude the shortest decimal that gives back round(x) is that number of
 * hundredths itself, with trailing zeros dropped (doubles there are far closer together than
 * 0.01); anything else (larger, infinite, NaN) is printed by String. test/figures/svg-document.test.ts
 * compares the two.
 */
export function roundedText(x: number): string {
  if (!(Math.abs(x) < 1e9)) return String(round(x));
  const n = Math.round(x * 100);
  if (n === 0) return '0';
  const a = n < 0 ? -n : n;
  const whole = Math.floor(a / 100);
  const hundredths = a - whole * 100;
  const text = hundredths === 0 ? String(whole) : hundredths % 10 === 0 ? `${whole}.${hundredths / 10}` : hundredths < 10 ? `${whole}.0${hundredths}` : `${whole}.${hundredths}`;
  return n < 0 ? `-${text}` : text;
}
