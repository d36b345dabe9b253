/**
 * Slope and intercept replots: the double-reciprocal slope (Km_app/Vmax_app) and intercept
 * (1/Vmax_app) from a separate Michaelis-Menten fit of each [I] series, against [I]. The points
 * are those per-series diagnostics; the line is the global fit's prediction (replot-geometry.ts),
 * which crosses zero at [I] = -Ki (slope) and [I] = -Kiu (intercept). Drawn only when the
 * analysis carries per-series fits.
 */
import type { SeriesFit } from '../evidence/diagnostics/series-fits.js';
import { concentrationText, type FigureContext } from './figure-context.js';
import type { FigureOutput } from './figure-output.js';
import { renderXYFigure } from './xy-figure.js';
import { paddedExtent } from './axes.js';
import { quotientUnit, reciprocalUnit, withUnit } from './axis-units.js';
import { drawMarkers, drawPolyline, BEST_LINE_WIDTH } from './model-lines.js';
import { INK } from './palette.js';
import { interceptReplotLine, slopeReplotLine, xIntercept, type Line, type RateConstants } from './replot-geometry.js';
import { lineExtent, QUALITATIVE_BADGE } from './replot-figures.js';

interface SeriesReplotSpec {
  id: string;
  file: string;
  title: string;
  yName: string;
  yTitle: string;
  value: (f: SeriesFit) => number;
  line: (c: RateConstants) => Line;
  constant: 'Ki' | 'Kiu';
}

function renderSeriesReplot(ctx: FigureContext, fits: readonly SeriesFit[], spec: SeriesReplotSpec): FigureOutput {
  const used = fits.filter((f) => f.converged && Number.isFinite(spec.value(f)));
  const xs = used.map((f) => f.inhibitor);
  const ys = used.map(spec.value);
  const line = spec.line(ctx.bestConstants);
  const cross = xIntercept(line);
  const extent = lineExtent(xs, cross === null ? null : { x: cross, y: 0 });
  const yAt = (x: number) => line.slope * x + line.intercept;
  const yDomain = paddedExtent([...ys, 0, yAt(extent.lo), yAt(extent.hi)], 0.06);
  const levelIndex = used.map((f) => Math.max(0, ctx.inhibitor.values.indexOf(f.inhibitor)));
  const crossText =
    cross === null
      ? `The global line is flat: ${spec.constant} is not part of the ${ctx.best.mechanism} model.`
      : `The global line crosses zero at [I] = ${concentrationText(cross, ctx.units.inhibitor)} (= -${spec.constant})${extent.meetShown ? '' : ', outside the drawn range'}.`;
  const notes = [`Points: each [I] series fitted alone (diagnostic). Line: global ${ctx.best.mechanism} fit. ${crossText}`];
  const svg = renderXYFigure({
    id: spec.id,
    title: spec.title,
    desc: `${spec.title}: ${spec.yName} from per-series fits against [I]. ${notes[0]}`,
    x: { title: withUnit('[I]', ctx.units.inhibitor), domain: [extent.lo, extent.hi] },
    y: { title: spec.yTitle, domain: yDomain },
    badge: QUALITATIVE_BADGE,
    notes,
    plotHeight: 120,
    zeroLines: true,
    draw(g, x, y) {
      drawPolyline(g, [extent.lo, extent.hi], [yAt(extent.lo), yAt(extent.hi)], x, y, { colour: INK.text, width: BEST_LINE_WIDTH });
      drawMarkers(g, xs, ys, levelIndex, ctx.inhibitor.colours, x, y);
    },
  });
  return {
    id: spec.id,
    file: spec.file,
    group: 'replot',
    title: spec.title,
    caption: `Qualitative. The points are separate fits of each [I] series (diagnostics, not results); the constants come from the global ${ctx.best.mechanism} fit, whose prediction is the line. ${crossText}`,
    svg,
  };
}

export function seriesReplotFigures(ctx: FigureContext): FigureOutput[] {
  const fits = ctx.result.seriesFits;
  if (!fits || fits.filter((f) => f.converged).length < 2) return [];
  const u = ctx.units;
  return [
    renderSeriesReplot(ctx, fits, {
      id: 'fig-slope-replot',
      file: 'slope-replot.svg',
      title: 'Slope replot (Km_app/Vmax_app against [I])',
      yName: 'Km_app/Vmax_app',
      yTitle: withUnit('Km_app/Vmax_app', quotientUnit(u.substrate, u.rate)),
      value: (f) => f.Km / f.Vmax,
      line: slopeReplotLine,
      constant: 'Ki',
    }),
    renderSeriesReplot(ctx, fits, {
      id: 'fig-intercept-replot',
      file: 'intercept-replot.svg',
      title: 'Intercept replot (1/Vmax_app against [I])',
      yName: '1/Vmax_app',
      yTitle: withUnit('1/Vmax_app', reciprocalUnit(u.rate)),
      value: (f) => 1 / f.Vmax,
      line: interceptReplotLine,
      constant: 'Kiu',
    }),
  ];
}
