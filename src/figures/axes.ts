/**
 * Scales and axes shared by the figures: d3-scale for the mapping, the markup of d3-axis written
 * as text (axisMarkup), styled for print (8 pt tick labels, thin dark lines) with attributes only,
 * so every SVG stands alone.
 */
import * as d3 from 'd3';
import { escapeText, type Group } from './svg-document.js';
import { INK } from './palette.js';
import { FONT, textWidth } from './text-metrics.js';

export type AxisKind = 'linear' | 'log' | 'symlog';

export interface AxisSpec {
  title: string;
  /** data extent to show (before rounding to nice ends) */
  domain: [number, number];
  kind?: AxisKind;
  ticks?: number;
  /** round the domain outward to nice tick values (default: keep the given domain) */
  nice?: boolean;
  /** explicit tick values (e.g. the evidence chart's 0, 2, 4, 10 ...) */
  tickValues?: number[];
}

export type NumericScale = d3.ScaleContinuousNumeric<number, number>;

/** The figure width: 85 mm (one journal column) in pt, the user unit of every figure. */
export const COLUMN_WIDTH = 241;

/** A scale for the spec, with the given range in pt. */
export function createScale(spec: AxisSpec, range: [number, number]): NumericScale {
  const [lo, hi] = safeDomain(spec);
  const ticks = spec.ticks ?? 5;
  if (spec.kind === 'log') {
    const scale = d3.scaleLog().domain([lo, hi]).range(range);
    return (spec.nice ? scale.nice() : scale) as unknown as NumericScale;
  }
  if (spec.kind === 'symlog') {
    return d3.scaleSymlog().domain([lo, hi]).range(range) as unknown as NumericScale;
  }
  const scale = d3.scaleLinear().domain([lo, hi]).range(range);
  return spec.nice ? scale.nice(ticks) : scale;
}

/** A domain that a scale can take: positive for log, and never empty. */
function safeDomain(spec: AxisSpec): [number, number] {
  let [lo, hi] = spec.domain;
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) [lo, hi] = [0, 1];
  if (spec.kind === 'log') {
    if (!(lo > 0)) lo = hi > 0 ? hi / 10 : 1;
    if (!(hi > lo)) hi = lo * 10;
    return [lo, hi];
  }
  if (hi === lo) {
    const pad = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    return [lo - pad, hi + pad];
  }
  return lo < hi ? [lo, hi] : [hi, lo];
}

/** Extent of finite values, widened by `pad` of the span on each side. */
export function paddedExtent(values: Iterable<number>, pad = 0.04, log = false): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (!Number.isFinite(v) || (log && !(v > 0))) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (lo > hi) return log ? [1, 10] : [0, 1];
  if (log) {
    const f = Math.pow(hi / lo, pad) || 1.1;
    return [lo / f, hi * f];
  }
  const span = hi - lo || Math.abs(hi) || 1;
  return [lo - pad * span, hi + pad * span];
}

/** The tick values an axis will show. */
export function ticksOf(scale: NumericScale, spec: AxisSpec): number[] {
  if (spec.tickValues) return spec.tickValues;
  if (spec.kind === 'log') return logTicks(scale);
  return scale.ticks(spec.ticks ?? 5);
}

/**
 * Powers of ten, with 2 and 5 between them when the axis spans less than three decades; an axis
 * too narrow to hold two of those (less than a factor of about 2.5) gets plain linear ticks, so it
 * is never left without labels.
 */
function logTicks(scale: NumericScale): number[] {
  const found = logTicksOf(scale);
  if (found.length >= 2) return found;
  const [a, b] = scale.domain();
  return d3.scaleLinear().domain([a, b]).ticks(4).filter((t) => t > 0);
}

function logTicksOf(scale: NumericScale): number[] {
  const [a, b] = scale.domain();
  const decades = Math.log10(b / a);
  const mult = decades < 1.2 ? [1, 2, 5] : decades < 3 ? [1, 3] : [1];
  const out: number[] = [];
  for (let e = Math.floor(Math.log10(a)); e <= Math.ceil(Math.log10(b)); e++) {
    for (const m of mult) {
      const t = m * Math.pow(10, e);
      if (t >= a * 0.999 && t <= b * 1.001) out.push(t);
    }
  }
  return out;
}

/** Tick labels: plain short numbers (0.5, 20, 1e-5), never trailing zeros. */
export function tickLabel(x: number): string {
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e-3 && a < 1e5) return String(Number(x.toPrecision(4)));
  return d3.format('.1~e')(x).replace('e+', 'e');
}

/** Width the y axis needs left of the plot: tick labels plus the rotated title. */
export function leftGutter(scale: NumericScale, spec: AxisSpec, withTitle = true): number {
  const widest = Math.max(0, ...ticksOf(scale, spec).map((t) => textWidth(tickLabel(t), FONT.tick)));
  return widest + 6 + (withTitle ? FONT.axisTitle + 5 : 0);
}

/** Height the x axis needs below the plot: tick labels plus the title. */
export function bottomGutter(withTitle = true): number {
  return FONT.tick + 8 + (withTitle ? FONT.axisTitle + 5 : 0);
}

/** d3-axis's half-unit offset for crisp lines (its value when no browser window is present). */
const AXIS_OFFSET = 0.5;
const TICK_SIZE = 3;
const TICK_PADDING = 2;

/** How an axis is drawn: d3-axis's tick sizes and padding, and whether its lines get the print widths. */
interface AxisStyle {
  tickSizeOuter: number;
  tickPadding: number;
  /** 0.6 on the domain line and 0.5 on the tick lines (the plots' axes); false leaves the default */
  printWidths: boolean;
}

const PLOT_AXIS: AxisStyle = { tickSizeOuter: TICK_SIZE, tickPadding: TICK_PADDING, printWidths: true };

/**
 * The markup of a bottom or left axis, written as text: the bytes d3.axisBottom / d3.axisLeft
 * (tick size 3, the given outer size and padding) produce on jsdom once restyled for print (tick
 * font size, no font family, the axis colour, label ink, and for the plots thin lines), built
 * without a DOM. Drawing the axes node by node on jsdom was about 40% of a report's figure time
 * (docs/decisions/analysis-cost.md); test/figures/axis-markup.test.ts compares the output with
 * d3-axis's.
 */
export function axisMarkup(
  orient: 'bottom' | 'left',
  scale: NumericScale,
  values: readonly number[],
  label: (d: number) => string,
  attributes: string,
  style: AxisStyle = PLOT_AXIS,
): string {
  const range = scale.range();
  const range0 = +range[0] + AXIS_OFFSET;
  const range1 = +range[range.length - 1] + AXIS_OFFSET;
  const bottom = orient === 'bottom';
  const k = bottom ? 1 : -1;
  const outer = style.tickSizeOuter;
  const d = bottom
    ? outer ? `M${range0},${k * outer}V${AXIS_OFFSET}H${range1}V${k * outer}` : `M${range0},${AXIS_OFFSET}H${range1}`
    : outer ? `M${k * outer},${range0}H${AXIS_OFFSET}V${range1}H${k * outer}` : `M${AXIS_OFFSET},${range0}V${range1}`;
  const domainWidth = style.printWidths ? ' stroke-width="0.6"' : '';
  const tickWidth = style.printWidths ? ' stroke-width="0.5"' : '';
  const parts = [
    `<g ${attributes} fill="none" font-size="${FONT.tick}" text-anchor="${bottom ? 'middle' : 'end'}" color="${INK.axis}">`,
    `<path class="domain" stroke="currentColor" d="${d}"${domainWidth}></path>`,
  ];
  const spacing = TICK_SIZE + style.tickPadding;
  for (const value of values) {
    const p = +scale(value) + AXIS_OFFSET;
    parts.push(
      `<g class="tick" opacity="1" transform="${bottom ? `translate(${p},0)` : `translate(0,${p})`}">`,
      `<line stroke="currentColor" ${bottom ? 'y2' : 'x2'}="${k * TICK_SIZE}"${tickWidth}></line>`,
      `<text fill="${INK.text}" ${bottom ? 'y' : 'x'}="${k * spacing}" dy="${bottom ? '0.71em' : '0.32em'}">${escapeText(label(value))}</text></g>`,
    );
  }
  parts.push('</g>');
  return parts.join('');
}

interface AxesOptions {
  /** draw the title of the x (y) axis; default true */
  xTitle?: boolean;
  yTitle?: boolean;
  /** draw tick labels of the y axis; default true */
  yLabels?: boolean;
}

/** Draws the x axis at the bottom and the y axis on the left of a plot area of size (w, h). */
export function drawAxes(g: Group, x: NumericScale, y: NumericScale, xSpec: AxisSpec, ySpec: AxisSpec, w: number, h: number, options: AxesOptions = {}): void {
  g.appendMarkup(axisMarkup('bottom', x, ticksOf(x, xSpec), (d) => tickLabel(Number(d)), `class="axis x" transform="translate(0,${h})"`));
  const showYLabels = options.yLabels ?? true;
  g.appendMarkup(axisMarkup('left', y, ticksOf(y, ySpec), (d) => (showYLabels ? tickLabel(Number(d)) : ''), 'class="axis y"'));
  if (options.xTitle ?? true) {
    g.append('text')
      .attr('class', 'axis-title')
      .attr('x', w / 2)
      .attr('y', h + FONT.tick + 8 + FONT.axisTitle)
      .attr('text-anchor', 'middle')
      .attr('font-size', FONT.axisTitle)
      .attr('fill', INK.text)
      .text(xSpec.title);
  }
  if (options.yTitle ?? true) {
    const gutter = leftGutter(y, ySpec, true);
    g.append('text')
      .attr('class', 'axis-title')
      .attr('transform', `translate(${-gutter + FONT.axisTitle},${h / 2}) rotate(-90)`)
      .attr('text-anchor', 'middle')
      .attr('font-size', FONT.axisTitle)
      .attr('fill', INK.text)
      .text(ySpec.title);
  }
}

/** Thin reference lines at x = 0 and y = 0 where they fall inside the plot. */
export function drawZeroLines(g: Group, x: NumericScale, y: NumericScale, w: number, h: number, which: { x?: boolean; y?: boolean } = { x: true, y: true }): void {
  const [x0, x1] = x.domain();
  const [y0, y1] = y.domain();
  if (which.x && x0 < 0 && x1 > 0) {
    g.append('line').attr('class', 'zero').attr('x1', x(0)).attr('x2', x(0)).attr('y1', 0).attr('y2', h).attr('stroke', INK.reference).attr('stroke-width', 0.5);
  }
  if (which.y && Math.min(y0, y1) < 0 && Math.max(y0, y1) > 0) {
    g.append('line').attr('class', 'zero').attr('x1', 0).attr('x2', w).attr('y1', y(0)).attr('y2', y(0)).attr('stroke', INK.reference).attr('stroke-width', 0.5);
  }
}
