/**
 * The axes are written as text (src/figures/axes.ts, axisMarkup) instead of being drawn by
 * d3-axis on jsdom: the markup must be byte for byte what d3.axisBottom / d3.axisLeft (tick size 3,
 * padding 2) gave once restyled for print, the way the figures drew them before
 * (docs/decisions/analysis-cost.md). The reference here is built with d3-axis itself.
 */
import { describe, expect, it } from 'vitest';
import * as d3 from 'd3';
import { createScale, drawAxes, ticksOf, tickLabel, type AxisSpec } from '../../src/figures/axes.js';
import { createSvg, serialiseSvg, type Group } from '../../src/figures/svg-document.js';
import { FONT } from '../../src/figures/text-metrics.js';
import { INK } from '../../src/figures/palette.js';

/** The former drawing: d3-axis on the DOM, then the print styling. */
function d3Axes(g: Group, x: ReturnType<typeof createScale>, y: ReturnType<typeof createScale>, xSpec: AxisSpec, ySpec: AxisSpec, h: number, yLabels: boolean): void {
  const style = (a: Group) => {
    a.attr('font-size', FONT.tick).attr('font-family', null).attr('color', INK.axis);
    a.selectAll('text').attr('fill', INK.text);
    a.selectAll('.domain').attr('stroke-width', 0.6);
    a.selectAll('.tick line').attr('stroke-width', 0.5);
  };
  const gx = g.append('g').attr('class', 'axis x').attr('transform', `translate(0,${h})`);
  gx.call(d3.axisBottom(x).tickValues(ticksOf(x, xSpec)).tickFormat((d) => tickLabel(Number(d))).tickSizeOuter(0).tickSize(3).tickPadding(2));
  style(gx);
  const gy = g.append('g').attr('class', 'axis y');
  gy.call(d3.axisLeft(y).tickValues(ticksOf(y, ySpec)).tickFormat((d) => (yLabels ? tickLabel(Number(d)) : '')).tickSizeOuter(0).tickSize(3).tickPadding(2));
  style(gy);
}

function axesOnly(draw: (g: Group) => void): string {
  const svg = createSvg({ id: 'axes', width: 200, height: 150, title: 't', desc: 'd' });
  draw(svg.append('g') as unknown as Group);
  return serialiseSvg(svg);
}

const cases: Array<{ name: string; x: AxisSpec; y: AxisSpec; yLabels: boolean }> = [
  { name: 'linear, nice', x: { title: 'x', domain: [-3.7, 812.2], nice: true }, y: { title: 'y', domain: [0.013, 0.41], ticks: 4 }, yLabels: true },
  { name: 'log x, negative y', x: { title: 'x', domain: [0.0021, 380], kind: 'log' }, y: { title: 'y', domain: [-2.5e-6, 7.1e-6] }, yLabels: true },
  { name: 'narrow log, no y labels', x: { title: 'x', domain: [3, 5.5], kind: 'log' }, y: { title: 'y', domain: [-4, 4], ticks: 4 }, yLabels: false },
  { name: 'symlog, given ticks', x: { title: 'x', domain: [0, 3000], kind: 'symlog', tickValues: [0, 2, 10, 100, 1000] }, y: { title: 'y', domain: [1e5, 3e7] }, yLabels: true },
];

describe('axes written as text', () => {
  for (const c of cases) {
    it(`${c.name}: the same bytes as d3-axis on jsdom`, () => {
      const x = createScale(c.x, [0, 171.3]);
      const y = createScale(c.y, [118.25, 0]);
      const ours = axesOnly((g) => drawAxes(g, x, y, c.x, c.y, 171.3, 118.25, { xTitle: false, yTitle: false, yLabels: c.yLabels }));
      const reference = axesOnly((g) => d3Axes(g, x, y, c.x, c.y, 118.25, c.yLabels));
      expect(ours).toContain('class="tick"');
      expect(ours).toBe(reference);
    });
  }
});
