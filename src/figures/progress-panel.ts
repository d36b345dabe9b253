/**
 * One small panel per well for the reads page: the corrected reads against time, the reads of the
 * chosen window filled and the others open, saturated reads as crosses, and the fitted line over
 * the window (solid) carried on to the end of the curve (dashed), or the integrated
 * Michaelis-Menten curve when that gave the rate. Drawn on the figures' element tree
 * (svg-document.ts); the markers go in as one raw layer since a plate has thousands of them.
 */
import * as d3 from 'd3';
import type { WellRate } from '../reads/types.js';
import { productFormed } from '../reads/integrated-michaelis-menten.js';
import { appendRawLayer, createSvg, serialiseSvg } from './svg-document.js';
import { INK, paletteColourAt } from './palette.js';
import { round } from './markers.js';

const PANEL_WIDTH = 110;
const PANEL_HEIGHT = 78;
const MARGIN = { left: 6, right: 6, top: 14, bottom: 12 };
const WINDOW_COLOUR = paletteColourAt(0.1);
const LINE_COLOUR = paletteColourAt(0.55);
const FLAG_COLOUR = '#a8660c';

/** A unique id for the panel of a well. */
function panelId(w: WellRate): string {
  return `well-${(w.plate ? `${w.plate}-` : '') + w.well}`.replace(/[^A-Za-z0-9_-]/g, '_');
}

export function progressPanel(w: WellRate, units: { time: string; value: string }): string {
  const id = panelId(w);
  const label = w.plate ? `${w.plate}/${w.well}` : w.well;
  const svg = createSvg({
    id,
    width: PANEL_WIDTH,
    height: PANEL_HEIGHT,
    title: `Well ${label}`,
    desc: `Reads of well ${label} (${units.value} against time in ${units.time}) with the window used for the rate and the fitted line.`,
  });
  const times = [...w.times, ...w.droppedTimes];
  const values = [...w.values, ...w.droppedValues];
  const x = d3.scaleLinear().domain([0, d3.max(times) ?? 1]).range([MARGIN.left, PANEL_WIDTH - MARGIN.right]);
  const [lo, hi] = d3.extent(values) as [number | undefined, number | undefined];
  const y = d3.scaleLinear().domain([lo ?? 0, hi !== undefined && hi > (lo ?? 0) ? hi : (lo ?? 0) + 1]).nice().range([PANEL_HEIGHT - MARGIN.bottom, MARGIN.top]);
  const flagged = w.excludeReason !== null;
  svg.append('rect').attr('x', 0.5).attr('y', 0.5).attr('width', PANEL_WIDTH - 1).attr('height', PANEL_HEIGHT - 1)
    .attr('fill', 'none').attr('stroke', flagged ? FLAG_COLOUR : INK.grid).attr('stroke-width', flagged ? 1.5 : 1);
  svg.append('text').attr('x', 5).attr('y', 10).attr('font-size', 8).attr('font-weight', 'bold').attr('fill', INK.text).text(label);
  const codes = w.flags.map((f) => f.code).join(', ') || (w.role === 'exclude' ? 'excluded' : '');
  if (codes) svg.append('text').attr('x', PANEL_WIDTH - 5).attr('y', 10).attr('text-anchor', 'end').attr('font-size', 7).attr('fill', FLAG_COLOUR).text(codes);
  svg.append('text').attr('x', PANEL_WIDTH - 5).attr('y', PANEL_HEIGHT - 3).attr('text-anchor', 'end').attr('font-size', 6.5).attr('fill', INK.faint)
    .text(`${d3.max(times) ?? 0} ${units.time}`);

  const first = w.window?.first ?? -1;
  const last = w.window?.last ?? -1;
  let markup = '';
  w.times.forEach((t, k) => {
    const inWindow = k >= first && k <= last;
    markup += `<circle cx="${round(x(t))}" cy="${round(y(w.values[k]))}" r="1.6" fill="${inWindow ? WINDOW_COLOUR : 'none'}" stroke="${WINDOW_COLOUR}" stroke-width="0.6"/>`;
  });
  w.droppedTimes.forEach((t, k) => {
    const cx = round(x(t));
    const cy = round(y(w.droppedValues[k]));
    markup += `<path d="M${cx - 2},${cy - 2}L${cx + 2},${cy + 2}M${cx - 2},${cy + 2}L${cx + 2},${cy - 2}" stroke="${FLAG_COLOUR}" stroke-width="0.8"/>`;
  });
  appendRawLayer(svg.append('g'), 'reads', markup);

  if (w.method === 'integrated' && w.integrated && w.substrate !== null) {
    const fit = w.integrated;
    const grid = d3.range(0, 41).map((k) => (k / 40) * (d3.max(w.times) ?? 1));
    const path = d3.line<number>().x((t) => x(t)).y((t) => y(fit.offset + productFormed(t, fit.vmax, fit.km, w.substrate!)))(grid);
    svg.append('path').attr('d', path ?? '').attr('fill', 'none').attr('stroke', LINE_COLOUR).attr('stroke-width', 1.1);
  } else if (w.window) {
    const win = w.window;
    const tEnd = d3.max(w.times) ?? win.to;
    const at = (t: number) => y(win.intercept + win.slope * t);
    svg.append('line').attr('x1', x(win.from)).attr('y1', at(win.from)).attr('x2', x(win.to)).attr('y2', at(win.to))
      .attr('stroke', LINE_COLOUR).attr('stroke-width', 1.2);
    if (tEnd > win.to) {
      svg.append('line').attr('x1', x(win.to)).attr('y1', at(win.to)).attr('x2', x(tEnd)).attr('y2', at(tEnd))
        .attr('stroke', LINE_COLOUR).attr('stroke-width', 0.7).attr('stroke-dasharray', '2 2');
    }
  }
  return serialiseSvg(svg);
}
