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
import { fractionalActivityFigures } from './fractional-activity.js';

export function renderFigures(result: AnalysisResult): FigureOutput[] {
  const ctx = figureContext(result);
  return [
    rateCurvesFigure(ctx, false),
    rateCurvesFigure(ctx, true),
    residualsBySubstrateFigure(ctx),
    residualsByFittedFigure(ctx),
    ...fractionalActivityFigures(ctx),
    evidenceFigure(ctx),
    ...uncertaintyFigures(ctx),
    ...lineFamilyReplotFigures(ctx),
    ...seriesReplotFigures(ctx),
  ];
}
