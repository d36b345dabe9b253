/**
 * Legends: series keys (marker + colour + label) and line keys (solid or dashed model lines),
 * laid out in rows that wrap at the figure width.
 */
import type { Group } from './svg-document.js';
import { INK } from './palette.js';
import { markerPath, markerTransform, round } from './markers.js';
import { FONT, textWidth } from './text-metrics.js';

export interface LegendItem {
  label: string;
  colour: string;
  /** marker shape index, for a series key */
  marker?: number;
  /** draw a line sample; with `dash` for a dashed line */
  line?: boolean;
  dash?: string;
  /** a filled square swatch (bars, regions) */
  swatch?: boolean;
}

const LINE_SAMPLE = 14;
const MARKER_SAMPLE = 7;
const GAP = 3;
const ITEM_SPACE = 7;
const ROW = FONT.legend + 4;

function sampleWidth(item: LegendItem): number {
  return item.line ? LINE_SAMPLE : MARKER_SAMPLE;
}

function itemWidth(item: LegendItem): number {
  return sampleWidth(item) + GAP + textWidth(item.label, FONT.legend) + ITEM_SPACE;
}

/** Rows the legend needs at this width (for layout before drawing). */
function legendRows(items: readonly LegendItem[], width: number, heading?: string): LegendItem[][] {
  const rows: LegendItem[][] = [];
  let row: LegendItem[] = [];
  let used = heading ? textWidth(heading, FONT.legend) + GAP : 0;
  for (const item of items) {
    const w = itemWidth(item);
    if (row.length > 0 && used + w > width) {
      rows.push(row);
      row = [];
      used = heading ? textWidth(heading, FONT.legend) + GAP : 0;
    }
    row.push(item);
    used += w;
  }
  if (row.length) rows.push(row);
  return rows;
}

export function legendHeight(items: readonly LegendItem[], width: number, heading?: string): number {
  return items.length ? legendRows(items, width, heading).length * ROW : 0;
}

/** Draws the legend with its top-left corner at (0, 0) of `g`; returns the height used. */
export function drawLegend(g: Group, items: readonly LegendItem[], width: number, heading?: string): number {
  if (!items.length) return 0;
  const rows = legendRows(items, width, heading);
  const indent = heading ? textWidth(heading, FONT.legend) + GAP : 0;
  rows.forEach((row, r) => {
    const cy = r * ROW + ROW / 2;
    if (heading) {
      g.append('text')
        .attr('x', 0)
        .attr('y', cy)
        .attr('dy', '0.35em')
        .attr('font-size', FONT.legend)
        .attr('fill', INK.text)
        .text(r === 0 ? heading : '');
    }
    let x = indent;
    for (const item of row) {
      const sample = sampleWidth(item);
      const key = g.append('g').attr('class', 'legend-item');
      if (item.line) {
        key
          .append('line')
          .attr('x1', x)
          .attr('x2', x + sample)
          .attr('y1', cy)
          .attr('y2', cy)
          .attr('stroke', item.colour)
          .attr('stroke-width', 1.2)
          .attr('stroke-dasharray', item.dash ?? null);
      }
      if (item.swatch) {
        key.append('rect').attr('x', x).attr('y', cy - 3.5).attr('width', 7).attr('height', 7).attr('fill', item.colour).attr('stroke', INK.axis).attr('stroke-width', 0.4);
      }
      if (item.marker !== undefined) {
        key
          .append('path')
          .attr('d', markerPath(item.marker))
          .attr('transform', markerTransform(item.marker, x + sample / 2, cy))
          .attr('fill', item.colour)
          .attr('stroke', INK.text)
          .attr('stroke-width', 0.4);
      }
      key
        .append('text')
        .attr('x', round(x + sample + GAP))
        .attr('y', cy)
        .attr('dy', '0.35em')
        .attr('font-size', FONT.legend)
        .attr('fill', INK.text)
        .text(item.label);
      x += itemWidth(item);
    }
  });
  return rows.length * ROW;
}
