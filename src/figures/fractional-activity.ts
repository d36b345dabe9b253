/**
 * Fractional activity v/v0 against [I], one series per [S], with the curves of the called model
 * and of the classic model of the same mechanism, both computed from each model's own rate
 * function (MechanismModel.rate) and divided by that model's own rate at [I] = 0. What tells the
 * families apart shows here: a plateau at the residual activity for partial inhibition, the
 * titration-like fall (nearly linear until [I] reaches [E]t) for tight binding. Drawn only when a
 * tight-binding or partial family was fitted.
 */
import type { FigureContext } from './figure-context.js';
import { concentrationText } from './figure-context.js';
import type { FigureOutput } from './figure-output.js';
import { renderXYFigure } from './xy-figure.js';
import { withUnit } from './axis-units.js';
import { drawMarkers, drawPolyline, grid, BEST_LINE_WIDTH, RUNNER_UP_DASH, RUNNER_UP_LINE_WIDTH } from './model-lines.js';
import { INK } from './palette.js';
import { maxInhibitor } from '../fit/fit-data.js';
import type { ModelResult } from '../analysis/types.js';

/** v/v0 of a fitted model at (S, I), both from its own rate function; e is [E]t for models that read it. */
export function fractionalActivity(m: ModelResult, s: number, i: number, e: number | undefined): number {
  const p = m.fit.params;
  return m.fit.model.rate(p, s, i, e) / m.fit.model.rate(p, s, 0, e);
}

export function fractionalActivityFigures(ctx: FigureContext): FigureOutput[] {
  const r = ctx.result;
  if (!r.familyModels?.length) return [];
  const called = r.family.family !== 'classic' ? r.familyModels.find((m) => m.modelId === r.family.model) : undefined;
  const classic = r.models.find((m) => m.mechanism === r.verdict.mechanism) ?? r.models[0];
  const drawn = called ?? r.familyModels[0];
  const e = r.enzyme && r.enzyme !== 'fitted' ? r.enzyme.value : undefined;
  const data = r.data;
  const iMax = maxInhibitor(data);
  const xs = grid(0, iMax * 1.04, 120);
  const ratio = Float64Array.from(data.v, (v, k) => v / drawn.fit.model.rate(drawn.fit.params, data.s[k], 0, data.e?.[k] ?? e));
  const yTop = ratio.reduce((top, x) => (Number.isFinite(x) ? Math.max(top, x) : top), 1.15) * 1.04;
  const levels = ctx.substrate.values;
  const id = 'fig-fractional-activity';
  const title = 'Fractional activity against inhibitor';
  const name = (m: ModelResult) => m.modelId ?? m.mechanism;
  const svg = renderXYFigure({
    id,
    title,
    desc: `Measured rates divided by the fitted uninhibited rate at the same [S], against [I], for ${levels.length} substrate levels, with the curves of ${name(drawn)} (solid) and of classic ${classic.mechanism} (dashed), each from its own rate equation.`,
    x: { title: withUnit('[I]', ctx.units.inhibitor), domain: [0, iMax * 1.04] },
    y: { title: 'v / v0', domain: [0, yTop], nice: true },
    seriesHeading: '[S]',
    series: levels.map((v, k) => ({ label: concentrationText(v, ctx.units.substrate), colour: ctx.substrate.colours[k], marker: k })),
    lines: [
      { label: `${name(drawn)}`, colour: INK.text, line: true },
      { label: `classic ${classic.mechanism}`, colour: INK.text, line: true, dash: RUNNER_UP_DASH },
    ],
    draw(g, x, y) {
      levels.forEach((s, k) => {
        const colour = ctx.substrate.colours[k];
        drawPolyline(g, xs, xs.map((i) => fractionalActivity(classic, s, i, undefined)), x, y, { colour, width: RUNNER_UP_LINE_WIDTH, dash: RUNNER_UP_DASH, className: 'runner-up-line' });
        drawPolyline(g, xs, xs.map((i) => fractionalActivity(drawn, s, i, e)), x, y, { colour, width: BEST_LINE_WIDTH });
      });
      drawMarkers(g, data.i, ratio, ctx.substrate.indexOf, ctx.substrate.colours, x, y);
    },
  });
  return [
    {
      id,
      file: 'fractional-activity.svg',
      group: 'fit',
      title,
      caption: `Points: measured rate / fitted uninhibited rate of ${name(drawn)} at the same [S]. Solid: ${name(drawn)}; dashed: classic ${classic.mechanism}. A plateau above zero is partial inhibition; a near-linear fall until [I] reaches [E]t is tight binding.`,
      svg,
    },
  ];
}
