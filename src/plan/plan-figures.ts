/**
 * Figures of the plan page, in the style of the analysis report (src/figures: column width, the
 * shared palette, markers and axes): the designs on [S] x [I] axes, and the chance of a firm call
 * against the number of wells.
 */
import type { FigureOutput } from '../figures/figure-output.js';
import { renderXYFigure } from '../figures/xy-figure.js';
import { paddedExtent } from '../figures/axes.js';
import { INK, seriesColours } from '../figures/palette.js';
import { markerPath, markerTransform } from '../figures/markers.js';
import type { DesignPoint } from './design-types.js';
import type { PlanCandidate, PlanResult } from './plan-experiment.js';

/** A point of the wells curve: budget, expected chance (information) for the best grid and the common grid. */
export interface WellsCurvePoint {
  wells: number;
  recommended: number;
  common: number;
}

function gridFigure(plan: PlanResult): FigureOutput {
  const units = plan.request.units;
  const shown = plan.candidates.filter((c) => c.role === 'recommended' || c.role === 'common-grid');
  const all: DesignPoint[] = shown.flatMap((c) => c.points);
  const sExtent = paddedExtent(all.map((p) => p.substrate), 0.08, true);
  const iPositive = all.filter((p) => p.inhibitor > 0).map((p) => p.inhibitor);
  const iHigh = Math.max(...iPositive, 1e-12) * 1.6;
  const colours = seriesColours(2);
  const maxWells = Math.max(...all.map((p) => p.replicates));
  const svg = renderXYFigure({
    id: 'fig-plan-grid',
    title: 'The recommended design and the common grid',
    desc: 'Design points on [S] and [I] axes; the marker area grows with the wells at the point.',
    x: { title: `[S] (${units.substrate})`, domain: sExtent, kind: 'log' },
    y: { title: `[I] (${units.inhibitor})`, domain: [0, iHigh], kind: 'symlog' },
    series: shown.map((c, k) => ({ label: `${c.name} (${c.wellCount} wells)`, colour: colours[k], marker: k })),
    notes: [`marker area proportional to the wells at the point (largest: ${maxWells}); [I] axis symmetric-log so that [I] = 0 is shown`],
    draw(plot, x, y) {
      shown.forEach((c, k) => {
        for (const p of c.points) {
          const scale = Math.sqrt(p.replicates / maxWells) * 2.2 + 0.5;
          plot
            .append('path')
            .attr('d', markerPath(k, 17 * scale * scale))
            .attr('transform', markerTransform(k, x(p.substrate), y(p.inhibitor)))
            .attr('fill', k === 0 ? colours[k] : 'none')
            .attr('fill-opacity', 0.75)
            .attr('stroke', colours[k])
            .attr('stroke-width', 0.8);
        }
      });
    },
  });
  return { id: 'fig-plan-grid', file: 'plan-grid.svg', group: 'fit', title: 'The recommended design and the common grid', caption: 'Each marker is one ([S], [I]) point; its area grows with the number of wells there.', svg };
}

function wellsFigure(curve: readonly WellsCurvePoint[], plan: PlanResult): FigureOutput {
  const colours = seriesColours(2);
  const simulated = plan.candidates.filter((c) => c.predicted && (c.role === 'recommended' || c.role === 'common-grid'));
  const meanCorrect = (c: PlanCandidate) => {
    const xs = Object.values(c.predicted ?? {}).map((p) => p!.decisiveCorrect);
    return xs.reduce((s, x) => s + x, 0) / Math.max(1, xs.length);
  };
  const wells = curve.map((p) => p.wells);
  const svg = renderXYFigure({
    id: 'fig-plan-wells',
    title: 'Chance of a firm, correct call against the number of wells',
    desc: 'Lines: rough chance from the expected information (ranking heuristic). Markers: Monte Carlo through the analysis at the planned budget.',
    x: { title: 'wells', domain: [Math.min(...wells) * 0.9, Math.max(...wells) * 1.05] },
    y: { title: 'firm and correct (mean over mechanisms)', domain: [0, 1] },
    lines: [
      { label: 'best grid (information)', colour: colours[0], line: true },
      { label: 'common grid (information)', colour: colours[1], line: true, dash: '4 2' },
    ],
    series: simulated.map((c) => ({ label: `${c.name}, simulated`, colour: c.role === 'recommended' ? colours[0] : colours[1], marker: c.role === 'recommended' ? 0 : 1 })),
    notes: ['the lines are the ranking heuristic of the search (T-criterion noncentralities); only the markers come from simulated analyses'],
    draw(plot, x, y) {
      const line = (key: 'recommended' | 'common', colour: string, dash?: string) => {
        const d = curve.map((p, k) => `${k ? 'L' : 'M'}${x(p.wells).toFixed(2)},${y(p[key]).toFixed(2)}`).join('');
        const path = plot.append('path').attr('d', d).attr('fill', 'none').attr('stroke', colour).attr('stroke-width', 1.2);
        if (dash) path.attr('stroke-dasharray', dash);
      };
      line('recommended', colours[0]);
      line('common', colours[1], '4 2');
      simulated.forEach((c) => {
        const k = c.role === 'recommended' ? 0 : 1;
        plot.append('path').attr('d', markerPath(k)).attr('transform', markerTransform(k, x(c.wellCount), y(meanCorrect(c)))).attr('fill', colours[k]).attr('stroke', INK.text).attr('stroke-width', 0.4);
      });
    },
  });
  return { id: 'fig-plan-wells', file: 'plan-wells.svg', group: 'evidence', title: 'Chance of a firm, correct call against the number of wells', caption: 'Lines from the expected information (the search heuristic), markers from the Monte Carlo check through the analysis.', svg };
}

export function planFigures(plan: PlanResult, curve: readonly WellsCurvePoint[]): FigureOutput[] {
  return [gridFigure(plan), wellsFigure(curve, plan)];
}
