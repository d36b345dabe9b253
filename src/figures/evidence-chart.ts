/**
 * The evidence chart: Akaike weight (from AICc) of each mechanism as a bar, and its AICc
 * difference from the best as a dot on a square-root-like (symlog) axis with marks at 2, 4 and 10,
 * the rule-of-thumb steps of Burnham, K. P. and Anderson, D. R. (2002) Model Selection and
 * Multimodel Inference, 2nd ed., Springer, sec. 2.6.
 */
import * as d3 from 'd3';
import type { FigureContext } from './figure-context.js';
import type { FigureOutput } from './figure-output.js';
import type { Group } from './svg-document.js';
import { serialiseSvg } from './svg-document.js';
import { startFigure, drawNotes, notesHeight, EDGE } from './xy-figure.js';
import { COLUMN_WIDTH, axisMarkup, tickLabel, type NumericScale } from './axes.js';
import { INK } from './palette.js';
import { FONT, textWidth } from './text-metrics.js';
import { markerPath, round } from './markers.js';

const ROW = 15;
const DELTA_MARKS = [2, 4, 10];

function weightText(w: number): string {
  if (!Number.isFinite(w)) return '–';
  if (w > 0.999) return '> 0.999';
  if (w < 0.001) return '< 0.001';
  return w.toFixed(3);
}

/**
 * The bottom axis of a panel, written as text (axes.ts, axisMarkup): what d3.axisBottom gave with
 * tick size 3, no outer ticks and the default padding of 3, restyled (tick font size, no font
 * family, the axis colour, label ink) without the plots' thin line widths.
 */
function panelAxis(panel: Group, scale: NumericScale, values: readonly number[], y: number): void {
  panel.appendMarkup(axisMarkup('bottom', scale, values, tickLabel, `transform="translate(0,${y})"`, { tickSizeOuter: 0, tickPadding: 3, printWidths: false }));
}

export function evidenceFigure(ctx: FigureContext): FigureOutput {
  const id = 'fig-evidence';
  const title = 'Evidence per mechanism';
  const models = ctx.result.models;
  const labelW = Math.max(...models.map((m) => textWidth(m.mechanism, FONT.tick))) + 6;
  const inner = COLUMN_WIDTH - 2 * EDGE;
  const headH = FONT.panelTitle + 6;
  const plotH = models.length * ROW;
  const axisH = FONT.tick + 8;
  const notes = [`Dashed marks at ΔAICc = 2, 4 and 10. Filled bar: the mechanism the verdict names (${ctx.best.mechanism}).`];
  const height = EDGE + headH + plotH + axisH + 4 + notesHeight(notes, inner) + EDGE;
  const desc =
    'Akaike weight and AICc difference of each mechanism: ' +
    models.map((m) => `${m.mechanism} weight ${weightText(m.weight)}, ΔAICc ${Number.isFinite(m.deltaAicc) ? m.deltaAicc.toFixed(1) : 'not available'}`).join('; ') +
    '.';
  const svg = startFigure({ id, title, desc, height: Math.ceil(height) });
  const root = svg.append('g');
  const gap = 12;
  const panelsW = inner - labelW - gap;
  const weightW = panelsW * 0.42;
  const deltaW = panelsW - weightW - 6;
  const x0 = EDGE + labelW;
  const top = EDGE + headH;

  // row labels
  models.forEach((m, k) => {
    root
      .append('text')
      .attr('x', x0 - 4)
      .attr('y', top + k * ROW + ROW / 2)
      .attr('dy', '0.35em')
      .attr('text-anchor', 'end')
      .attr('font-size', FONT.tick)
      .attr('fill', INK.text)
      .attr('font-weight', m === ctx.best ? 'bold' : null)
      .text(m.mechanism);
  });

  // weight panel
  const wScale = d3.scaleLinear().domain([0, 1]).range([0, weightW]);
  const wp = root.append('g').attr('class', 'panel weight').attr('transform', `translate(${x0},${top})`);
  wp.append('text').attr('x', 0).attr('y', -5).attr('font-size', FONT.panelTitle).attr('fill', INK.text).text('Akaike weight');
  models.forEach((m, k) => {
    const w = Number.isFinite(m.weight) ? m.weight : 0;
    wp.append('rect')
      .attr('class', 'bar')
      .attr('x', 0)
      .attr('y', k * ROW + 3)
      .attr('width', round(Math.max(0.6, wScale(w))))
      .attr('height', ROW - 6)
      .attr('fill', m === ctx.best ? INK.accent : INK.muted);
    const label = weightText(m.weight);
    const inside = wScale(w) > textWidth(label, FONT.tick) + 6;
    wp.append('text')
      .attr('x', round(inside ? wScale(w) - 3 : wScale(w) + 3))
      .attr('y', k * ROW + ROW / 2)
      .attr('dy', '0.35em')
      .attr('text-anchor', inside ? 'end' : 'start')
      .attr('font-size', FONT.tick)
      .attr('fill', inside ? '#ffffff' : INK.text)
      .text(label);
  });
  panelAxis(wp, wScale, [0, 0.5, 1], plotH);

  // delta panel
  const finite = models.map((m) => m.deltaAicc).filter((d) => Number.isFinite(d));
  const maxD = Math.max(12, ...finite) * 1.15;
  const dScale = d3.scaleSymlog().constant(1).domain([0, maxD]).range([0, deltaW]);
  const dx0 = x0 + weightW + gap;
  const dp = root.append('g').attr('class', 'panel delta').attr('transform', `translate(${dx0},${top})`);
  dp.append('text').attr('x', 0).attr('y', -5).attr('font-size', FONT.panelTitle).attr('fill', INK.text).text('ΔAICc');
  for (const mark of DELTA_MARKS) {
    dp.append('line').attr('class', 'delta-mark').attr('x1', round(dScale(mark))).attr('x2', round(dScale(mark))).attr('y1', 0).attr('y2', plotH).attr('stroke', INK.faint).attr('stroke-width', 0.5).attr('stroke-dasharray', '2 2');
  }
  models.forEach((m, k) => {
    const cy = k * ROW + ROW / 2;
    if (!Number.isFinite(m.deltaAicc)) {
      dp.append('text').attr('x', 2).attr('y', cy).attr('dy', '0.35em').attr('font-size', FONT.tick).attr('fill', INK.text).text('not fitted');
      return;
    }
    dp.append('line').attr('x1', 0).attr('x2', round(dScale(m.deltaAicc))).attr('y1', cy).attr('y2', cy).attr('stroke', INK.muted).attr('stroke-width', 0.6);
    dp.append('path')
      .attr('d', markerPath(0, 20))
      .attr('transform', `translate(${round(dScale(m.deltaAicc))},${cy})`)
      .attr('fill', m === ctx.best ? INK.accent : '#ffffff')
      .attr('stroke', INK.text)
      .attr('stroke-width', 0.6);
  });
  const ticks = [0, 2, 10, 100, 1000, 10000].filter((t) => t <= maxD);
  panelAxis(dp, dScale, ticks, plotH);
  drawNotes(root, notes, EDGE, top + plotH + axisH + 4, inner);
  return {
    id,
    file: 'evidence.svg',
    group: 'evidence',
    title,
    caption:
      'Akaike weights are the relative support of each mechanism given the five compared (Burnham & Anderson 2002). A ΔAICc under 2 means substantial support for both models, 4 to 7 considerably less, over 10 essentially none.',
    svg: serialiseSvg(svg),
  };
}
