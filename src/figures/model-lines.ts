/** Line keys and drawing helpers for global-fit model lines (best solid, runner-up dashed). */
import { appendRawLayer, type Group } from './svg-document.js';
import type { FigureContext } from './figure-context.js';
import type { LegendItem } from './legend.js';
import { INK } from './palette.js';
import { markerPath, markerTransform, roundedText } from './markers.js';
import type { NumericScale } from './axes.js';

export const BEST_LINE_WIDTH = 1.1;
export const RUNNER_UP_LINE_WIDTH = 0.8;
export const RUNNER_UP_DASH = '3.5 2';

/** Key for the model lines of a figure. */
export function modelLineKey(ctx: FigureContext, withRunnerUp: boolean): LegendItem[] {
  const items: LegendItem[] = [{ label: `${ctx.best.modelId ?? ctx.best.mechanism} (global fit)`, colour: INK.text, line: true }];
  if (withRunnerUp && ctx.runnerUp) items.push({ label: `${ctx.runnerUp.mechanism} (runner-up)`, colour: INK.text, line: true, dash: RUNNER_UP_DASH });
  return items;
}

/**
 * A polyline through points given in data coordinates, rounded to 0.01 pt. The path data is the
 * string d3.line() gave for the same points ("M" then "L" before each later point, x and y as
 * String() prints them, no spaces); test/figures/svg-document.test.ts compares the two.
 */
export function drawPolyline(
  g: Group,
  xs: readonly number[],
  ys: readonly number[],
  x: NumericScale,
  y: NumericScale,
  style: { colour: string; width: number; dash?: string; className?: string },
): void {
  let d = '';
  let n = 0;
  for (let k = 0; k < xs.length; k++) {
    if (!(Number.isFinite(ys[k]) && Number.isFinite(xs[k]))) continue;
    d += `${n++ === 0 ? 'M' : 'L'}${roundedText(x(xs[k]))},${roundedText(y(ys[k]))}`;
  }
  if (n < 2) return;
  g.append('path')
    .attr('class', style.className ?? 'model-line')
    .attr('d', d)
    .attr('fill', 'none')
    .attr('stroke', style.colour)
    .attr('stroke-width', style.width)
    .attr('stroke-dasharray', style.dash ?? null)
    .attr('stroke-linejoin', 'round');
}

/** Markers for points (data coordinates), series index k per point (written as raw markup, see svg-document.ts). */
export function drawMarkers(
  g: Group,
  px: ArrayLike<number>,
  py: ArrayLike<number>,
  series: ArrayLike<number>,
  colours: readonly string[],
  x: NumericScale,
  y: NumericScale,
): void {
  // the markup before and after the transform is the same for every point of a series
  const before: string[] = [];
  const after: string[] = [];
  const parts: string[] = [];
  for (let k = 0; k < px.length; k++) {
    if (!Number.isFinite(px[k]) || !Number.isFinite(py[k])) continue;
    const s = series[k];
    if (before[s] === undefined) {
      before[s] = `<path d="${markerPath(s)}" transform="`;
      after[s] = `" fill="${colours[s]}" stroke="${INK.text}" stroke-width="0.4"></path>`;
    }
    parts.push(before[s] + markerTransform(s, x(px[k]), y(py[k])) + after[s]);
  }
  appendRawLayer(g, 'points', parts.join(''));
}

/** n + 1 points evenly spaced (or geometrically, for log axes) from a to b. */
export function grid(a: number, b: number, n: number, geometric = false): number[] {
  const out: number[] = [];
  for (let k = 0; k <= n; k++) {
    const t = k / n;
    out.push(geometric ? a * Math.pow(b / a, t) : a + (b - a) * t);
  }
  return out;
}
