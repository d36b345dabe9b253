/**
 * Residual panels of the drawn model: scaled residuals against [S] in one small panel per [I]
 * (a wrong mechanism leaves a pattern that changes with [I]), and against the fitted rate (a
 * wrong error model leaves a funnel). Scaled residual = sqrt(w)·(v - f) / s, with w the error
 * model's weight and s the residual SD of the fit, so about 95% of points of a correct model fall
 * within ±2 (common practice).
 */
import type { FigureContext } from './figure-context.js';
import { concentrationText, modelName } from './figure-context.js';
import type { FigureOutput } from './figure-output.js';
import type { Group } from './svg-document.js';
import { serialiseSvg } from './svg-document.js';
import { renderXYFigure, startFigure, drawNotes, notesHeight, EDGE } from './xy-figure.js';
import { COLUMN_WIDTH, createScale, drawAxes, leftGutter, paddedExtent, type AxisSpec, type NumericScale } from './axes.js';
import { withUnit } from './axis-units.js';
import { drawMarkers, drawPolyline } from './model-lines.js';
import { INK } from './palette.js';
import { FONT } from './text-metrics.js';
import { inhibitorSeriesKey } from './rate-curves.js';
import { distinctLevels } from '../input/distinct-levels.js';

/** Scaled residuals of the drawn model, one per fitted point. */
function scaledResiduals(ctx: FigureContext): Float64Array {
  const s = Math.sqrt(ctx.best.residualVariance);
  const wr = ctx.best.fit.weightedResiduals;
  return Float64Array.from(wr, (r) => (s > 0 ? r / s : NaN));
}

function residualDomain(r: Float64Array): [number, number] {
  let m = 2.5;
  for (const x of r) if (Number.isFinite(x)) m = Math.max(m, Math.abs(x) * 1.12);
  return [-m, m];
}

const RESIDUAL_TITLE = 'scaled residual';

function drawBands(g: Group, y: NumericScale, w: number): void {
  g.append('line').attr('class', 'zero').attr('x1', 0).attr('x2', w).attr('y1', y(0)).attr('y2', y(0)).attr('stroke', INK.reference).attr('stroke-width', 0.6);
  for (const b of [-2, 2]) {
    g.append('line').attr('class', 'band').attr('x1', 0).attr('x2', w).attr('y1', y(b)).attr('y2', y(b)).attr('stroke', INK.faint).attr('stroke-width', 0.5).attr('stroke-dasharray', '2 2');
  }
}

/** Powers of ten inside a log domain; 1-3-10 steps when that leaves fewer than two. */
function decadeTicks(domain: number[]): number[] {
  const [a, b] = domain;
  const pick = (mult: number[]) => {
    const out: number[] = [];
    for (let e = Math.floor(Math.log10(a)); e <= Math.ceil(Math.log10(b)); e++) for (const m of mult) {
      const t = m * 10 ** e;
      if (t >= a && t <= b) out.push(t);
    }
    return out;
  };
  const tens = pick([1]);
  return tens.length >= 2 ? tens : pick([1, 3]);
}

export function residualsBySubstrateFigure(ctx: FigureContext): FigureOutput {
  const id = 'fig-residuals-substrate';
  const title = 'Scaled residuals against substrate, per inhibitor level';
  const { data } = ctx.result;
  const r = scaledResiduals(ctx);
  const levels = ctx.inhibitor.values;
  const cols = Math.min(3, levels.length);
  const rows = Math.ceil(levels.length / cols);
  const yDomain = residualDomain(r);
  const xDomain = paddedExtent(data.s, 0.04, true);
  const ySpec: AxisSpec = { title: RESIDUAL_TITLE, domain: yDomain, ticks: 4 };
  const xSpec: AxisSpec = { title: withUnit('[S]', ctx.units.substrate), domain: xDomain, kind: 'log' };
  xSpec.tickValues = decadeTicks(createScale(xSpec, [0, 1]).domain());
  const facetH = 58;
  const titleH = FONT.panelTitle + 4;
  const gapX = 9;
  const probeY = createScale(ySpec, [facetH, 0]);
  const left = EDGE + leftGutter(probeY, ySpec);
  const facetW = (COLUMN_WIDTH - left - EDGE - 4 - gapX * (cols - 1)) / cols;
  const rowH = titleH + facetH + FONT.tick + 10;
  const notes = [
    `Model: global ${modelName(ctx.best)} fit. Dashed lines at ±2; the thin line joins the mean residual at each [S].`,
  ];
  const inner = COLUMN_WIDTH - 2 * EDGE;
  const height = EDGE + rows * rowH + FONT.axisTitle + 6 + notesHeight(notes, inner) + 4 + EDGE;
  const desc =
    `Scaled residuals of the global ${modelName(ctx.best)} fit against [S] (log axis), one panel per inhibitor level ` +
    `(${levels.map((v) => concentrationText(v, ctx.units.inhibitor)).join(', ')}). A systematic run of positive or negative residuals within a panel points to a missed mechanism.`;
  const svg = startFigure({ id, title, desc, height: Math.ceil(height) });
  const root = svg.append('g');
  const defs = svg.append('defs');
  levels.forEach((level, k) => {
    const row = Math.floor(k / cols);
    const col = k % cols;
    const gx = left + col * (facetW + gapX);
    const gy = EDGE + row * rowH;
    const facet = root.append('g').attr('class', 'facet').attr('transform', `translate(${gx},${gy})`);
    facet
      .append('text')
      .attr('class', 'panel-title')
      .attr('x', facetW / 2)
      .attr('y', FONT.panelTitle)
      .attr('text-anchor', 'middle')
      .attr('font-size', FONT.panelTitle)
      .attr('fill', INK.text)
      .text(`[I] = ${concentrationText(level, ctx.units.inhibitor)}`);
    const plot = facet.append('g').attr('transform', `translate(0,${titleH})`);
    const x = createScale(xSpec, [0, facetW]);
    const y = createScale(ySpec, [facetH, 0]);
    drawBands(plot, y, facetW);
    drawAxes(plot, x, y, xSpec, ySpec, facetW, facetH, { xTitle: false, yTitle: col === 0 && row === Math.floor((rows - 1) / 2), yLabels: col === 0 });
    const clipId = `${id}-clip-${k}`;
    defs.append('clipPath').attr('id', clipId).append('rect').attr('x', -4).attr('y', -4).attr('width', facetW + 8).attr('height', facetH + 8);
    const content = plot.append('g').attr('clip-path', `url(#${clipId})`);
    const idx: number[] = [];
    for (let p = 0; p < data.s.length; p++) if (ctx.inhibitor.indexOf[p] === k) idx.push(p);
    const sLevels = distinctLevels(idx.map((p) => data.s[p]));
    const means = sLevels.map((sv) => {
      const rs = idx.filter((p) => data.s[p] === sv).map((p) => r[p]);
      return rs.reduce((a, b) => a + b, 0) / rs.length;
    });
    drawPolyline(content, sLevels, means, x, y, { colour: ctx.inhibitor.colours[k], width: 0.7, className: 'mean-line' });
    drawMarkers(
      content,
      idx.map((p) => data.s[p]),
      idx.map((p) => r[p]),
      idx.map(() => k),
      ctx.inhibitor.colours,
      x,
      y,
    );
  });
  const axisTitleY = EDGE + rows * rowH + FONT.axisTitle - 2;
  root
    .append('text')
    .attr('class', 'axis-title')
    .attr('x', left + (COLUMN_WIDTH - left - EDGE) / 2)
    .attr('y', axisTitleY)
    .attr('text-anchor', 'middle')
    .attr('font-size', FONT.axisTitle)
    .attr('fill', INK.text)
    .text(xSpec.title);
  drawNotes(root, notes, EDGE, axisTitleY + 6, inner);
  return {
    id,
    file: 'residuals-substrate.svg',
    group: 'fit',
    title,
    caption: `Residuals of the global ${modelName(ctx.best)} fit, scaled by the error model and the residual SD. A correct model scatters about zero in every panel; a run of same-signed residuals at high [S] or high [I] is the usual sign of a missed mechanism.`,
    svg: serialiseSvg(svg),
  };
}

export function residualsByFittedFigure(ctx: FigureContext): FigureOutput {
  const id = 'fig-residuals-fitted';
  const title = 'Scaled residuals against fitted rate';
  const r = scaledResiduals(ctx);
  const f = ctx.best.fit.fitted;
  const svg = renderXYFigure({
    id,
    title,
    desc: `Scaled residuals of the global ${modelName(ctx.best)} fit against the fitted rate, marker and shade per inhibitor level. A funnel shape suggests a different error model.`,
    x: { title: withUnit('fitted v', ctx.units.rate), domain: paddedExtent(f, 0.05) },
    y: { title: RESIDUAL_TITLE, domain: residualDomain(r), ticks: 5 },
    seriesHeading: '[I]',
    series: inhibitorSeriesKey(ctx),
    plotHeight: 120,
    draw(g, x, y, w) {
      drawBands(g, y, w);
      drawMarkers(g, f, r, ctx.inhibitor.indexOf, ctx.inhibitor.colours, x, y);
    },
  });
  return {
    id,
    file: 'residuals-fitted.svg',
    group: 'fit',
    title,
    caption: `Error model: ${ctx.result.errorModel}. Residuals that spread out (or close in) as the rate grows mean the weights do not match the scatter; compare error models.`,
    svg,
  };
}
