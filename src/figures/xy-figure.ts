/**
 * The frame of a one-panel figure: optional "qualitative" badge, legends, the plot with its axes,
 * and caption lines inside the SVG, so a standalone file says what it shows. Column width
 * (85 mm); the height follows from the parts.
 */
import type { Group } from './svg-document.js';
import { createSvg, serialiseSvg } from './svg-document.js';
import { INK } from './palette.js';
import { FONT, FONT_FAMILY, textWidth, wrapText } from './text-metrics.js';
import {
  COLUMN_WIDTH,
  bottomGutter,
  createScale,
  drawAxes,
  drawZeroLines,
  leftGutter,
  tickLabel,
  ticksOf,
  type AxisSpec,
  type NumericScale,
} from './axes.js';
import { drawLegend, legendHeight, type LegendItem } from './legend.js';

interface XYFigureSpec {
  id: string;
  title: string;
  desc: string;
  x: AxisSpec;
  y: AxisSpec;
  /** short visible label above the plot, e.g. that a replot is qualitative */
  badge?: string;
  seriesHeading?: string;
  series?: LegendItem[];
  lines?: LegendItem[];
  /** caption lines drawn under the plot */
  notes?: string[];
  plotHeight?: number;
  zeroLines?: boolean;
  draw(plot: Group, x: NumericScale, y: NumericScale, w: number, h: number): void;
}

export const EDGE = 5;
const NOTE_LINE = FONT.note + 2.5;

/** Starts an SVG of column width with the shared font settings; returns it and its root group. */
export function startFigure(spec: { id: string; title: string; desc: string; height: number; width?: number }) {
  const svg = createSvg({ id: spec.id, width: spec.width ?? COLUMN_WIDTH, height: spec.height, title: spec.title, desc: spec.desc });
  svg.attr('font-family', FONT_FAMILY).attr('font-size', FONT.tick);
  svg
    .append('rect')
    .attr('class', 'background')
    .attr('width', spec.width ?? COLUMN_WIDTH)
    .attr('height', spec.height)
    .attr('fill', '#ffffff');
  return svg;
}

/** Height of a badge line. */
const BADGE_HEIGHT = FONT.note + 7;

/** Draws a framed badge (e.g. "qualitative") with its top-left at (x, y). */
function drawBadge(g: Group, text: string, x: number, y: number): void {
  const w = textWidth(text, FONT.note) + 8;
  g.append('rect')
    .attr('class', 'badge')
    .attr('x', x)
    .attr('y', y)
    .attr('width', w)
    .attr('height', FONT.note + 5)
    .attr('rx', 2)
    .attr('fill', '#fff7e0')
    .attr('stroke', '#9a6a00')
    .attr('stroke-width', 0.5);
  g.append('text')
    .attr('class', 'badge-text')
    .attr('x', x + 4)
    .attr('y', y + (FONT.note + 5) / 2)
    .attr('dy', '0.35em')
    .attr('font-size', FONT.note)
    .attr('fill', '#5c3f00')
    .text(text);
}

/** Wrapped caption lines under the plot, from the top y; returns the height used. */
export function drawNotes(g: Group, notes: readonly string[], x: number, y: number, width: number): number {
  let line = 0;
  for (const note of notes) {
    for (const text of wrapText(note, width, FONT.note)) {
      g.append('text')
        .attr('class', 'note')
        .attr('x', x)
        .attr('y', y + line * NOTE_LINE + FONT.note)
        .attr('font-size', FONT.note)
        .attr('fill', INK.text)
        .text(text);
      line++;
    }
  }
  return line * NOTE_LINE;
}

export function notesHeight(notes: readonly string[], width: number): number {
  let lines = 0;
  for (const n of notes) lines += wrapText(n, width, FONT.note).length;
  return lines * NOTE_LINE;
}

/** Room needed right of the plot so the last x tick label is not cut. */
function rightGutter(x: NumericScale, spec: AxisSpec): number {
  const ticks = ticksOf(x, spec);
  const last = ticks.length ? ticks[ticks.length - 1] : 0;
  const [, d1] = x.domain();
  const atEnd = Math.abs(x(last) - x(d1)) < 1;
  return Math.max(8, atEnd ? textWidth(tickLabel(last), FONT.tick) / 2 + 2 : 4);
}

/** Renders a one-panel figure and returns its SVG markup. */
export function renderXYFigure(spec: XYFigureSpec): string {
  const inner = COLUMN_WIDTH - 2 * EDGE;
  const plotHeight = spec.plotHeight ?? 150;
  const yProbe = createScale(spec.y, [plotHeight, 0]);
  const xProbe = createScale(spec.x, [0, 100]);
  const left = EDGE + leftGutter(yProbe, spec.y);
  const right = rightGutter(xProbe, spec.x);
  const plotWidth = COLUMN_WIDTH - left - right;
  let top = EDGE;
  const badgeH = spec.badge ? BADGE_HEIGHT : 0;
  const seriesH = legendHeight(spec.series ?? [], inner, spec.seriesHeading);
  const linesH = legendHeight(spec.lines ?? [], inner);
  const notesH = notesHeight(spec.notes ?? [], inner);
  const height = EDGE + badgeH + seriesH + linesH + 6 + plotHeight + bottomGutter() + (notesH ? notesH + 4 : 0) + EDGE;
  const svg = startFigure({ id: spec.id, title: spec.title, desc: spec.desc, height: Math.ceil(height) });
  const root = svg.append('g');
  if (spec.badge) {
    drawBadge(root, spec.badge, EDGE, top);
    top += badgeH;
  }
  if (seriesH) {
    drawLegend(root.append('g').attr('class', 'legend series').attr('transform', `translate(${EDGE},${top})`), spec.series ?? [], inner, spec.seriesHeading);
    top += seriesH;
  }
  if (linesH) {
    drawLegend(root.append('g').attr('class', 'legend lines').attr('transform', `translate(${EDGE},${top})`), spec.lines ?? [], inner);
    top += linesH;
  }
  top += 6;
  const x = createScale(spec.x, [0, plotWidth]);
  const y = createScale(spec.y, [plotHeight, 0]);
  const plot = root.append('g').attr('class', 'plot').attr('transform', `translate(${left},${top})`);
  const clipId = `${spec.id}-clip`;
  svg
    .append('defs')
    .append('clipPath')
    .attr('id', clipId)
    .append('rect')
    .attr('x', -4)
    .attr('y', -4)
    .attr('width', plotWidth + 8)
    .attr('height', plotHeight + 8);
  if (spec.zeroLines) drawZeroLines(plot, x, y, plotWidth, plotHeight);
  drawAxes(plot, x, y, spec.x, spec.y, plotWidth, plotHeight);
  const content = plot.append('g').attr('class', 'content').attr('clip-path', `url(#${clipId})`);
  spec.draw(content, x, y, plotWidth, plotHeight);
  if (notesH) drawNotes(root, spec.notes ?? [], EDGE, top + plotHeight + bottomGutter() + 4, inner);
  return serialiseSvg(svg);
}
