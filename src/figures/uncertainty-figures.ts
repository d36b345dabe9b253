/**
 * Uncertainty figures, drawn when the analysis carries them:
 *  - profile-likelihood curves of Ki and Kiu: the profile t statistic tau against the parameter,
 *    with the cutoffs ±t that define the profile interval (Bates, D. M. and Watts, D. G. (1988)
 *    Nonlinear Regression Analysis and Its Applications, Wiley, sec. 6.1). The straight dotted line
 *    is the Wald (linear) approximation tau = (p - estimate)/SE: where the curve bends away from
 *    it the Wald interval misleads.
 *  - the joint (Ki, Kiu) region of the mixed model, with the line Ki = Kiu (alpha = 1, pure
 *    noncompetitive) for reference.
 */
import type { ModelResult } from '../analysis/types.js';
import type { ProfileCurve } from '../evidence/intervals/profile-likelihood.js';
import type { FigureContext } from './figure-context.js';
import type { FigureOutput } from './figure-output.js';
import { renderXYFigure } from './xy-figure.js';
import { paddedExtent } from './axes.js';
import { withUnit } from './axis-units.js';
import { drawPolyline } from './model-lines.js';
import { INK } from './palette.js';
import { sig, interval } from '../text/format-number.js';
import { DRAWN_PROFILES } from '../analysis/stage-intervals.js';

function profileFigure(ctx: FigureContext, model: ModelResult, curve: ProfileCurve): FigureOutput {
  const name = curve.parameter;
  const id = `fig-profile-${name.toLowerCase()}`;
  const title = `Profile likelihood of ${name} (${model.mechanism})`;
  const est = model.estimates.find((e) => e.name === name);
  const pairs = curve.values.map((v, k) => [v, curve.tau[k]] as const).filter(([v, t]) => Number.isFinite(v) && Number.isFinite(t) && v > 0);
  pairs.sort((a, b) => a[0] - b[0]);
  const xs = pairs.map((p) => p[0]);
  const ts = pairs.map((p) => p[1]);
  const log = xs.length > 1 && xs[xs.length - 1] / xs[0] > 20;
  const unit = ctx.units.inhibitor;
  const level = Math.round(ctx.result.level * 100);
  const prof = est?.profile;
  const intervalText = prof ? `profile ${level}% interval ${interval(prof[0], prof[1], 3)}${prof[0] === null || prof[1] === null ? ' (open end: not reached in the searched range)' : ''}` : 'no profile interval recorded';
  const tMax = Math.max(curve.cutoff * 1.4, ...ts.map((t) => Math.abs(t)));
  const notes = [`Dashed: ±${sig(curve.cutoff, 3)} (the ${level}% cutoff); dotted: Wald approximation. ${name} ${intervalText}.`];
  const svg = renderXYFigure({
    id,
    title,
    desc: `Profile t statistic tau against ${name} for the ${model.mechanism} model. ${notes[0]}`,
    x: { title: withUnit(name, unit), domain: paddedExtent(xs, 0.03, log), kind: log ? 'log' : 'linear' },
    y: { title: 'τ (profile t)', domain: [-tMax, tMax] },
    lines: [
      { label: 'profile', colour: INK.accent, line: true },
      { label: 'Wald approximation', colour: INK.faint, line: true, dash: '1 1.5' },
    ],
    notes,
    plotHeight: 120,
    draw(g, x, y, w) {
      for (const c of [-curve.cutoff, curve.cutoff]) {
        g.append('line').attr('class', 'cutoff').attr('x1', 0).attr('x2', w).attr('y1', y(c)).attr('y2', y(c)).attr('stroke', INK.reference).attr('stroke-width', 0.6).attr('stroke-dasharray', '3 2');
      }
      g.append('line').attr('class', 'zero').attr('x1', 0).attr('x2', w).attr('y1', y(0)).attr('y2', y(0)).attr('stroke', INK.grid).attr('stroke-width', 0.6);
      if (est && est.value !== null && est.se !== null && est.se > 0) {
        const value = est.value;
        const se = est.se;
        const [d0, d1] = x.domain();
        const wx = [d0, d1];
        drawPolyline(g, wx, wx.map((p) => (p - value) / se), x, y, { colour: INK.faint, width: 0.8, dash: '1 1.5', className: 'wald-line' });
      }
      drawPolyline(g, xs, ts, x, y, { colour: INK.accent, width: 1.2, className: 'profile-line' });
      if (prof) {
        for (const [end, t] of [[prof[0], -curve.cutoff], [prof[1], curve.cutoff]] as const) {
          if (end === null || !(end > 0)) continue;
          g.append('line').attr('class', 'interval-end').attr('x1', x(end)).attr('x2', x(end)).attr('y1', y(t)).attr('y2', y(0)).attr('stroke', INK.accent).attr('stroke-width', 0.5);
        }
      }
    },
  });
  return {
    id,
    file: `profile-${name.toLowerCase()}.svg`,
    group: 'uncertainty',
    title,
    caption: `The profile interval is where the curve crosses the dashed cutoffs. A curve that flattens before reaching a cutoff means the interval is open on that side: the data do not bound ${name} there.`,
    svg,
  };
}

/** True when an outline point lies on the edge of the searched box (relative tolerance in the log). */
function onBoxEdge(v: number, box: { low: number; high: number } | undefined): boolean {
  if (!box) return false;
  const near = (a: number, b: number) => Math.abs(Math.log(a) - Math.log(b)) < 1e-9;
  return near(v, box.low) || near(v, box.high);
}

/**
 * The outline split into runs: `edge` runs lie on the searched box (the region goes on beyond
 * them: they are not part of the likelihood contour), the other runs are the contour itself.
 */
function outlineRuns(region: NonNullable<ModelResult['jointRegion']>): Array<{ edge: boolean; ki: number[]; kiu: number[] }> {
  const runs: Array<{ edge: boolean; ki: number[]; kiu: number[] }> = [];
  const n = region.ki.length;
  for (let k = 0; k + 1 < n; k++) {
    const a = onBoxEdge(region.ki[k], region.box) || onBoxEdge(region.kiu[k], region.box);
    const b = onBoxEdge(region.ki[k + 1], region.box) || onBoxEdge(region.kiu[k + 1], region.box);
    const edge = a && b;
    const last = runs[runs.length - 1];
    if (last && last.edge === edge) {
      last.ki.push(region.ki[k + 1]);
      last.kiu.push(region.kiu[k + 1]);
    } else runs.push({ edge, ki: [region.ki[k], region.ki[k + 1]], kiu: [region.kiu[k], region.kiu[k + 1]] });
  }
  return runs;
}

function jointRegionFigure(ctx: FigureContext, model: ModelResult): FigureOutput | null {
  const region = model.jointRegion;
  if (!region || region.ki.length < 3) return null;
  const id = 'fig-joint-ki-kiu';
  const pct = Math.round(region.level * 100);
  const title = `Joint ${pct}% region of Ki and Kiu (mixed)`;
  const ki = model.estimates.find((e) => e.name === 'Ki')?.value ?? null;
  const kiu = model.estimates.find((e) => e.name === 'Kiu')?.value ?? null;
  const xsAll = [...region.ki, ...(ki !== null ? [ki] : [])];
  const ysAll = [...region.kiu, ...(kiu !== null ? [kiu] : [])];
  const unit = ctx.units.inhibitor;
  // Ki and Kiu are ratios to a concentration: log axes, always, so a factor reads the same everywhere
  const xDomain = paddedExtent(xsAll, 0.08, true);
  const yDomain = paddedExtent(ysAll, 0.08, true);
  const runs = outlineRuns(region);
  const hasEdge = runs.some((r) => r.edge);
  const lo = Math.max(xDomain[0], yDomain[0]);
  const hi = Math.min(xDomain[1], yDomain[1]);
  const drawsAlphaOne = hi > lo;
  const drawsEstimate = ki !== null && kiu !== null;
  const notes = [
    `Shaded: the likelihood region at ${pct}%.`,
    ...(hasEdge ? [`Dotted orange: the edge of the searched range${region.box ? ` (${sig(region.box.low, 2)} to ${sig(region.box.high, 2)}${unit ? ` ${unit}` : ''})` : ''}; the region goes on beyond it.`] : []),
    ...(drawsAlphaOne ? ['Dashed: Ki = Kiu (alpha = 1, noncompetitive).'] : []),
    ...(drawsEstimate ? ['Dot: the estimate.'] : []),
  ];
  const svg = renderXYFigure({
    id,
    title,
    desc: `Joint confidence region of Ki and Kiu for the mixed model${drawsEstimate ? `, estimate Ki = ${sig(ki, 3)}, Kiu = ${sig(kiu, 3)}` : ''}. ${notes.join(' ')}`,
    x: { title: withUnit('Ki', unit), domain: xDomain, kind: 'log' },
    y: { title: withUnit('Kiu', unit), domain: yDomain, kind: 'log' },
    notes: [notes.join(' ')],
    plotHeight: 140,
    draw(g, x, y) {
      const pts = region.ki.map((v, k) => `${x(v).toFixed(2)},${y(region.kiu[k]).toFixed(2)}`).join(' ');
      g.append('polygon').attr('class', 'region').attr('points', pts).attr('fill', INK.regionFill).attr('stroke', 'none');
      for (const run of runs) {
        drawPolyline(g, run.ki, run.kiu, x, y, run.edge
          ? { colour: EDGE_COLOUR, width: 1.1, dash: '1 1.6', className: 'region-edge' }
          : { colour: INK.accent, width: 0.9, className: 'region-contour' });
      }
      if (drawsAlphaOne) drawPolyline(g, [lo, hi], [lo, hi], x, y, { colour: INK.reference, width: 0.7, dash: '3 2', className: 'alpha-one' });
      if (drawsEstimate) {
        g.append('circle').attr('class', 'estimate').attr('cx', x(ki).toFixed(2)).attr('cy', y(kiu).toFixed(2)).attr('r', 2.2).attr('fill', INK.text);
      }
      if (hasEdge) {
        const edge = runs.find((r) => r.edge)!;
        const mid = Math.floor(edge.ki.length / 2);
        g.append('text').attr('class', 'edge-label').attr('x', (x(edge.ki[mid]) + 3).toFixed(2)).attr('y', (y(edge.kiu[mid]) - 3).toFixed(2))
          .attr('font-size', 8).attr('fill', EDGE_COLOUR).text('edge of searched range');
      }
    },
  });
  return {
    id,
    file: 'joint-ki-kiu.svg',
    group: 'uncertainty',
    title,
    caption: `The (Ki, Kiu) pairs the data allow at ${pct}%, on log axes.${hasEdge ? ' Where the outline is dotted the region is cut by the searched range, not closed by the data: the constant is not bounded on that side.' : ''}${drawsAlphaOne ? ' Where the region crosses the dashed line, noncompetitive (Ki = Kiu) is not excluded.' : ''}`,
    svg,
  };
}

/** The colour of the searched-range edge: apricot, the light end of the project's series path. */
const EDGE_COLOUR = '#c8742c';

export function uncertaintyFigures(ctx: FigureContext): FigureOutput[] {
  const out: FigureOutput[] = [];
  for (const name of DRAWN_PROFILES) {
    const curve = ctx.best.profiles?.find((p) => p.parameter === name);
    if (curve && curve.values.length >= 3) out.push(profileFigure(ctx, ctx.best, curve));
  }
  const mixed = ctx.result.models.find((m) => m.mechanism === 'mixed');
  if (mixed) {
    const joint = jointRegionFigure(ctx, mixed);
    if (joint) out.push(joint);
  }
  return out;
}
