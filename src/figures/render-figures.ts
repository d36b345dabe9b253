/**
 * All figures of one analysis, in report order. Figures whose inputs are absent (profiles, joint
 * region, per-series fits) are left out, never drawn empty.
 */
import type { AnalysisResult } from '../analysis/types.js';
import { figureContext } from './figure-context.js';
import type { FigureOutput } from './figure-output.js';
import { rateCurvesFigure } from './rate-curves.js';
import { residualsByFittedFigure, residualsBySubstrateFigure } from './residual-figures.js';
import { evidenceFigure } from './evidence-chart.js';
import { lineFamilyReplotFigures } from './replot-figures.js';
import { seriesReplotFigures } from './series-replots.js';
import { uncertaintyFigures } from './uncertainty-figures.js';
import { ic50ShiftFigure } from './ic50-shift-figure.js';
import { fractionalActivityFigures } from './fractional-activity.js';

export function renderFigures(result: AnalysisResult): FigureOutput[] {
  const ctx = figureContext(result);
  return [
    rateCurvesFigure(ctx, false),
    rateCurvesFigure(ctx, true),
    residualsBySubstrateFigure(ctx),
    residualsByFittedFigure(ctx),
    // only for an IC50-shift design (2-3 [S] levels with full [I] series)
    ...[ic50ShiftFigure(ctx)].filter((f): f is FigureOutput => f !== null),
    ...fractionalActivityFigures(ctx),
    evidenceFigure(ctx),
    ...uncertaintyFigures(ctx),
    ...lineFamilyReplotFigures(ctx),
    ...seriesReplotFigures(ctx),
  ];
}
