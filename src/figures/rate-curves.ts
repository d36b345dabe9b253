/**
 * The primary plot: measured initial rate against [S], one series per [I], with the curves of the
 * global fit of the drawn model (solid) and of the runner-up (dashed). A log-[S] variant spreads
 * the low concentrations out.
 */
import type { FigureContext } from './figure-context.js';
import { concentrationText } from './figure-context.js';
import type { FigureOutput } from './figure-output.js';
import { renderXYFigure } from './xy-figure.js';
import { paddedExtent } from './axes.js';
import { withUnit } from './axis-units.js';
import { maxSubstrate } from '../fit/fit-data.js';
import { drawMarkers, drawPolyline, grid, modelLineKey, BEST_LINE_WIDTH, RUNNER_UP_DASH, RUNNER_UP_LINE_WIDTH } from './model-lines.js';
import { modelName, ownRate } from './figure-context.js';
import type { LegendItem } from './legend.js';

/** Legend items for the [I] series. */
export function inhibitorSeriesKey(ctx: FigureContext): LegendItem[] {
  return ctx.inhibitor.values.map((v, k) => ({ label: concentrationText(v, ctx.units.inhibitor), colour: ctx.inhibitor.colours[k], marker: k }));
}

export function rateCurvesFigure(ctx: FigureContext, logSubstrate: boolean): FigureOutput {
  const { data } = ctx.result;
  const sMax = maxSubstrate(data);
  const xDomain: [number, number] = logSubstrate ? paddedExtent(data.s, 0.05, true) : [0, sMax * 1.04];
  const yDomain: [number, number] = [0, data.v.reduce((a, b) => Math.max(a, b), 0) * 1.06];
  const xs = logSubstrate ? grid(xDomain[0], xDomain[1], 80, true) : grid(0, xDomain[1], 80);
  const id = logSubstrate ? 'fig-rate-curves-log' : 'fig-rate-curves';
  const title = logSubstrate ? 'Initial rate against substrate, log scale' : 'Initial rate against substrate';
  const levels = ctx.inhibitor.values;
  const desc =
    `Measured initial rates against [S] for ${levels.length} inhibitor levels ` +
    `(${concentrationText(levels[0], ctx.units.inhibitor)} to ${concentrationText(levels[levels.length - 1], ctx.units.inhibitor)}), ` +
    `with the curves of the global ${modelName(ctx.best)} fit` +
    (ctx.runnerUp ? ` (solid) and of ${ctx.runnerUp.mechanism}, the runner-up (dashed).` : '.') +
    (logSubstrate ? ' [S] on a logarithmic axis.' : '');
  const svg = renderXYFigure({
    id,
    title,
    desc,
    x: { title: withUnit('[S]', ctx.units.substrate), domain: xDomain, kind: logSubstrate ? 'log' : 'linear' },
    y: { title: withUnit('v', ctx.units.rate), domain: yDomain, nice: true },
    seriesHeading: '[I]',
    series: inhibitorSeriesKey(ctx),
    lines: modelLineKey(ctx, true),
    draw(g, x, y) {
      levels.forEach((level, k) => {
        const colour = ctx.inhibitor.colours[k];
        // every curve from the model's own rate function (MechanismModel.rate)
        const runnerUp = ctx.runnerUp;
        if (runnerUp) drawPolyline(g, xs, xs.map((s) => ownRate(ctx.result, runnerUp, s, level)), x, y, { colour, width: RUNNER_UP_LINE_WIDTH, dash: RUNNER_UP_DASH, className: 'runner-up-line' });
        drawPolyline(g, xs, xs.map((s) => ownRate(ctx.result, ctx.best, s, level)), x, y, { colour, width: BEST_LINE_WIDTH });
      });
      drawMarkers(g, data.s, data.v, ctx.inhibitor.indexOf, ctx.inhibitor.colours, x, y);
    },
  });
  return {
    id,
    file: `${id.slice(4)}.svg`,
    group: 'fit',
    title,
    caption:
      `Points: measured rates (${data.v.length}), marker and shade per [I]. Lines: global ${modelName(ctx.best)} fit, all series at once` +
      (ctx.runnerUp ? `; dashed: ${ctx.runnerUp.mechanism}, ranked second by AICc.` : '.'),
    svg,
  };
}
