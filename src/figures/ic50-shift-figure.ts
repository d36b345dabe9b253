/**
 * IC50 against [S] for an IC50-shift design (src/analysis/ic50-shift.ts): one point per [S]
 * series, the IC50 of that series fitted alone as a dose-response curve, with its interval; and
 * the IC50 the global fit of the drawn mechanism implies at each [S] (closed forms of Cheng and
 * Prusoff 1973, src/evidence/constants/cheng-prusoff.ts). Log-log axes. Drawn only for that design.
 */
import { ic50ShiftSeries } from '../analysis/ic50-shift.js';
import { ic50AtSubstrate } from '../evidence/constants/cheng-prusoff.js';
import type { FigureContext } from './figure-context.js';
import type { FigureOutput } from './figure-output.js';
import { renderXYFigure } from './xy-figure.js';
import { paddedExtent } from './axes.js';
import { withUnit } from './axis-units.js';
import { drawPolyline, grid } from './model-lines.js';
import { INK } from './palette.js';

export function ic50ShiftFigure(ctx: FigureContext): FigureOutput | null {
  const series = ic50ShiftSeries(ctx.result.table, ctx.result.level);
  if (series.length < 2) return null;
  const model = ctx.best;
  const fit = model.fit;
  const pct = Math.round(ctx.result.level * 100);
  const sLo = series[0].substrate;
  const sHi = series[series.length - 1].substrate;
  const sGrid = grid(sLo / 1.5, sHi * 1.5, 40, true);
  const implied = model.mechanism === 'none' ? [] : sGrid.map((s) => ic50AtSubstrate(model.mechanism, fit.model.params, fit.params, s));
  const drawsImplied = implied.length > 0 && implied.every((v) => Number.isFinite(v) && v > 0);
  const ys = [...series.flatMap((p) => [p.ic50, p.interval[0] ?? p.ic50, p.interval[1] ?? p.ic50]), ...(drawsImplied ? implied : [])].filter((v) => v > 0);
  const id = 'fig-ic50-shift';
  const title = 'IC50 against [S] (each [S] series fitted alone)';
  const notes = [
    `Dots: the IC50 of each [S] series fitted alone (dose-response curve), bars: its ${pct}% interval.${drawsImplied ? ` Line: the IC50 the global ${model.mechanism} fit implies at each [S].` : ''}`,
  ];
  const svg = renderXYFigure({
    id,
    title,
    desc: `${title}. ${notes[0]}`,
    x: { title: withUnit('[S]', ctx.units.substrate), domain: paddedExtent(sGrid, 0.02, true), kind: 'log' },
    y: { title: withUnit('IC50', ctx.units.inhibitor), domain: paddedExtent(ys, 0.1, true), kind: 'log' },
    lines: [
      { label: 'series IC50', colour: INK.text, marker: 0 },
      ...(drawsImplied ? [{ label: `${model.mechanism} global fit`, colour: INK.accent, line: true }] : []),
    ],
    notes,
    plotHeight: 120,
    draw(g, x, y) {
      if (drawsImplied) drawPolyline(g, sGrid, implied, x, y, { colour: INK.accent, width: 1.1, className: 'implied-ic50' });
      for (const p of series) {
        const [lo, hi] = p.interval;
        const [y0, y1] = y.domain();
        g.append('line').attr('class', 'ic50-interval').attr('x1', x(p.substrate).toFixed(2)).attr('x2', x(p.substrate).toFixed(2))
          .attr('y1', y(lo ?? y0).toFixed(2)).attr('y2', y(hi ?? y1).toFixed(2)).attr('stroke', INK.text).attr('stroke-width', 0.7);
        g.append('circle').attr('class', 'series-ic50').attr('cx', x(p.substrate).toFixed(2)).attr('cy', y(p.ic50).toFixed(2)).attr('r', 2.2).attr('fill', INK.text);
      }
    },
  });
  return {
    id,
    file: 'ic50-shift.svg',
    group: 'fit',
    title,
    caption: 'How the IC50 moves with [S] is the reading of an IC50-shift design: it rises with [S] for a competitive inhibitor, falls for an uncompetitive one and stays flat for a noncompetitive one. The call itself comes from the global fit.',
    svg,
  };
}
