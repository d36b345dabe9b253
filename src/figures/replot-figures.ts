/**
 * The linear replots: the measured points transformed, and the GLOBAL fit transformed the same
 * way (never a line fitted to the transformed points), one line per level of the concentration
 * held fixed. Each carries a visible "qualitative" badge. The lines are extended past the data,
 * across the axis if need be, far enough to show where they meet (replot-geometry.ts), unless they
 * meet so far out that the data would be squeezed into a corner; the caption then says where.
 */
import type { FigureContext, SeriesLevels } from './figure-context.js';
import { concentrationText } from './figure-context.js';
import type { FigureOutput } from './figure-output.js';
import { renderXYFigure } from './xy-figure.js';
import { paddedExtent } from './axes.js';
import { quotientUnit, reciprocalUnit, withUnit } from './axis-units.js';
import { drawMarkers, drawPolyline, BEST_LINE_WIDTH } from './model-lines.js';
import { INK } from './palette.js';
import { markerPath } from './markers.js';
import {
  cornishBowdenLine,
  dixonLine,
  doubleReciprocalLine,
  eadieHofsteeLine,
  hanesWoolfLine,
  meetingPoint,
  REPLOT_TRANSFORMS,
  type Line,
  type Point,
  type RateConstants,
} from './replot-geometry.js';
import { sig } from '../text/format-number.js';

/** The badge every replot shows. */
export const QUALITATIVE_BADGE = 'Qualitative: a visual check only';

/** How far past the data (as a multiple of the data's x span) a meeting point may be drawn. */
const MEETING_REACH = 1.5;

interface LineFamilyReplot {
  id: string;
  file: string;
  title: string;
  /** which concentration is held fixed along each line */
  per: 'inhibitor' | 'substrate';
  transform: (s: number, i: number, v: number) => Point;
  line: (c: RateConstants, level: number) => Line;
  xTitle: string;
  yTitle: string;
  /** x/y names used in the caption, e.g. "1/[S]" */
  xName: string;
  yName: string;
  source: string;
  /** what the meeting point means, for the caption */
  reading: string;
}

/**
 * Where the lines of a family meet, from the lines of the lowest and highest level (the most
 * separated pair); null when they are parallel or coincide.
 */
export function familyMeetingPoint(c: RateConstants, levels: readonly number[], line: (c: RateConstants, level: number) => Line): Point | null {
  if (levels.length < 2) return null;
  const p = meetingPoint(line(c, levels[0]), line(c, levels[levels.length - 1]));
  return p && Number.isFinite(p.x) && Number.isFinite(p.y) ? p : null;
}

/**
 * The x range the model lines span: the data's range, widened to include x = 0 and the meeting
 * point when it lies within MEETING_REACH data spans of the data.
 */
export function lineExtent(dataX: readonly number[], meet: Point | null): { lo: number; hi: number; meetShown: boolean } {
  // no spread: the data can hold a million points
  let lo = dataX.reduce((a, b) => Math.min(a, b), 0);
  let hi = dataX.reduce((a, b) => Math.max(a, b), -Infinity);
  const span = hi - lo || 1;
  let meetShown = false;
  if (meet && meet.x >= lo - MEETING_REACH * span && meet.x <= hi + MEETING_REACH * span) {
    meetShown = true;
    if (meet.x < lo) lo = meet.x - 0.12 * span;
    if (meet.x > hi) hi = meet.x + 0.12 * span;
  }
  return { lo, hi: hi + 0.04 * span, meetShown };
}

/**
 * The x interval each model line is drawn over: from the left end of the drawn range (where the
 * lines meet, or x = 0) to a little past the last point of its own series, or to the meeting point
 * when that lies to the right. Lines are not run on through empty space where they would leave
 * the region the data describe (e.g. negative rates in the Eadie-Hofstee plot).
 */
export function lineEnds(
  px: readonly number[],
  seriesIndex: ArrayLike<number>,
  nSeries: number,
  extent: { lo: number; hi: number; meetShown: boolean },
  meet: Point | null,
): Array<[number, number]> {
  const span = extent.hi - extent.lo || 1;
  const last = new Array<number>(nSeries).fill(-Infinity);
  for (let k = 0; k < px.length; k++) if (Number.isFinite(px[k])) last[seriesIndex[k]] = Math.max(last[seriesIndex[k]], px[k]);
  const meetRight = meet !== null && extent.meetShown && meet.x > px.reduce((top, x) => (Number.isFinite(x) ? Math.max(top, x) : top), -Infinity);
  return last.map((hi) => [extent.lo, meetRight || !Number.isFinite(hi) ? extent.hi : Math.min(extent.hi, hi + 0.04 * span)]);
}

function seriesOf(ctx: FigureContext, per: LineFamilyReplot['per']): SeriesLevels {
  return per === 'inhibitor' ? ctx.inhibitor : ctx.substrate;
}

function renderLineFamilyReplot(ctx: FigureContext, spec: LineFamilyReplot): FigureOutput {
  const { data } = ctx.result;
  const c = ctx.bestConstants;
  const series = seriesOf(ctx, spec.per);
  const unit = spec.per === 'inhibitor' ? ctx.units.inhibitor : ctx.units.substrate;
  const px: number[] = [];
  const py: number[] = [];
  for (let k = 0; k < data.v.length; k++) {
    const p = spec.transform(data.s[k], data.i[k], data.v[k]);
    px.push(p.x);
    py.push(p.y);
  }
  const finiteX = px.filter((x) => Number.isFinite(x));
  const meet = familyMeetingPoint(c, series.values, spec.line);
  const extent = lineExtent(finiteX, meet);
  const lines = series.values.map((level) => spec.line(c, level));
  const ends = lineEnds(px, series.indexOf, series.values.length, extent, meet);
  const yCandidates = [...py, 0];
  lines.forEach((l, k) => yCandidates.push(l.slope * ends[k][0] + l.intercept, l.slope * ends[k][1] + l.intercept));
  if (meet && extent.meetShown) yCandidates.push(meet.y);
  const yDomain = paddedExtent(yCandidates, 0.05);
  const xDomain: [number, number] = [extent.lo, extent.hi];
  const heading = spec.per === 'inhibitor' ? '[I]' : '[S]';
  const meetText = meet
    ? `Lines meet at ${spec.xName} = ${sig(meet.x, 3)}, ${spec.yName} = ${sig(meet.y, 3)}${extent.meetShown ? '' : ' (outside the drawn range)'}.`
    : 'Lines are parallel (or coincide): they do not meet.';
  const notes = [
    `Lines: the global ${ctx.best.mechanism} fit redrawn in these coordinates, not a fit to these points. ${meetText}`,
  ];
  const svg = renderXYFigure({
    id: spec.id,
    title: spec.title,
    desc: `${spec.title}: ${spec.yName} against ${spec.xName}, one line per ${heading} level. ${notes[0]} ${spec.source}.`,
    x: { title: spec.xTitle, domain: xDomain },
    y: { title: spec.yTitle, domain: yDomain },
    badge: QUALITATIVE_BADGE,
    seriesHeading: heading,
    series: series.values.map((v, k) => ({ label: concentrationText(v, unit), colour: series.colours[k], marker: k })),
    notes,
    plotHeight: 135,
    zeroLines: true,
    draw(g, x, y) {
      lines.forEach((l, k) => {
        const [a, b] = ends[k];
        drawPolyline(g, [a, b], [l.slope * a + l.intercept, l.slope * b + l.intercept], x, y, {
          colour: series.colours[k],
          width: BEST_LINE_WIDTH * 0.85,
        });
      });
      drawMarkers(g, px, py, series.indexOf, series.colours, x, y);
      if (meet && extent.meetShown) {
        g.append('path')
          .attr('class', 'meeting-point')
          .attr('d', markerPath(0, 30))
          .attr('transform', `translate(${x(meet.x)},${y(meet.y)})`)
          .attr('fill', 'none')
          .attr('stroke', INK.text)
          .attr('stroke-width', 0.8);
      }
    },
  });
  return {
    id: spec.id,
    file: spec.file,
    group: 'replot',
    title: spec.title,
    caption: `Qualitative. The constants come from the global ${ctx.best.mechanism} fit; the lines are that fit transformed, not a regression of the transformed points. ${spec.reading} ${spec.source}.`,
    svg,
  };
}

/** The five line-family replots of the brief, with their axis titles in the table's units. */
function lineFamilyReplots(ctx: FigureContext): LineFamilyReplot[] {
  const u = ctx.units;
  const invV = reciprocalUnit(u.rate);
  const sOverV = quotientUnit(u.substrate, u.rate);
  const vOverS = quotientUnit(u.rate, u.substrate);
  return [
    {
      id: 'fig-double-reciprocal',
      file: 'double-reciprocal.svg',
      title: 'Double-reciprocal (Lineweaver-Burk) replot',
      per: 'inhibitor',
      transform: REPLOT_TRANSFORMS.doubleReciprocal,
      line: doubleReciprocalLine,
      xTitle: withUnit('1/[S]', reciprocalUnit(u.substrate)),
      yTitle: withUnit('1/v', invV),
      xName: '1/[S]',
      yName: '1/v',
      source: 'Lineweaver & Burk (1934)',
      reading: 'Competitive lines meet on the 1/v axis, noncompetitive on the 1/[S] axis, uncompetitive lines are parallel; mixed lines meet at 1/[S] = -1/(alpha·Km).',
    },
    {
      id: 'fig-dixon',
      file: 'dixon.svg',
      title: 'Dixon replot',
      per: 'substrate',
      transform: REPLOT_TRANSFORMS.dixon,
      line: dixonLine,
      xTitle: withUnit('[I]', u.inhibitor),
      yTitle: withUnit('1/v', invV),
      xName: '[I]',
      yName: '1/v',
      source: 'Dixon (1953)',
      reading: 'The lines meet at [I] = -Ki; they are parallel for uncompetitive inhibition.',
    },
    {
      id: 'fig-cornish-bowden',
      file: 'cornish-bowden.svg',
      title: 'Cornish-Bowden replot',
      per: 'substrate',
      transform: REPLOT_TRANSFORMS.cornishBowden,
      line: cornishBowdenLine,
      xTitle: withUnit('[I]', u.inhibitor),
      yTitle: withUnit('[S]/v', sOverV),
      xName: '[I]',
      yName: '[S]/v',
      source: 'Cornish-Bowden (1974)',
      reading: 'The lines meet at [I] = -Kiu; they are parallel for competitive inhibition.',
    },
    {
      id: 'fig-hanes-woolf',
      file: 'hanes-woolf.svg',
      title: 'Hanes-Woolf replot',
      per: 'inhibitor',
      transform: REPLOT_TRANSFORMS.hanesWoolf,
      line: hanesWoolfLine,
      xTitle: withUnit('[S]', u.substrate),
      yTitle: withUnit('[S]/v', sOverV),
      xName: '[S]',
      yName: '[S]/v',
      source: 'Hanes-Woolf plot, see Cornish-Bowden (2012)',
      reading: 'Competitive lines are parallel; the slope of each line is 1/Vmax at that [I].',
    },
    {
      id: 'fig-eadie-hofstee',
      file: 'eadie-hofstee.svg',
      title: 'Eadie-Hofstee replot',
      per: 'inhibitor',
      transform: REPLOT_TRANSFORMS.eadieHofstee,
      line: eadieHofsteeLine,
      xTitle: withUnit('v/[S]', vOverS),
      yTitle: withUnit('v', u.rate),
      xName: 'v/[S]',
      yName: 'v',
      source: 'Eadie-Hofstee plot, see Cornish-Bowden (2012)',
      reading: 'Each line has slope -Km and intercept Vmax at that [I]; competitive lines meet on the v axis.',
    },
  ];
}

export function lineFamilyReplotFigures(ctx: FigureContext): FigureOutput[] {
  return lineFamilyReplots(ctx).map((spec) => renderLineFamilyReplot(ctx, spec));
}
