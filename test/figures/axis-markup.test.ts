/**
 * The axes are written as text (src/figures/axes.ts, axisMarkup) instead of being drawn by
 * d3-axis on jsdom: the markup must be byte for byte what d3.axisBottom / d3.axisLeft (tick size 3,
 * padding 2) gave once restyled for print, the way the figures drew them before
 * (docs/decisions/analysis-cost.md). The reference here is built with d3-axis itself, on a jsdom
 * document; ours on the figures' element tree (src/figures/svg-document.ts). The evidence chart's
 * panel axes (no outer ticks, d3's default padding, no print line widths) are checked the same way.
 */
import { describe, expect, it } from 'vitest';
import * as d3 from 'd3';
import { JSDOM } from 'jsdom';
import { axisMarkup, createScale, drawAxes, ticksOf, tickLabel, type AxisSpec, type NumericScale } from '../../src/figures/axes.js';
import { SvgElement } from '../../src/figures/svg-document.js';
import { FONT } from '../../src/figures/text-metrics.js';
import { INK } from '../../src/figures/palette.js';

const SVG_NS = 'http://www.w3.org/2000/svg';
const doc = new JSDOM('<!DOCTYPE html><html><body></body></html>').window.document;
type Group = d3.Selection<SVGGElement, unknown, null, undefined>;

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

/** A group drawn by d3 on jsdom, as jsdom serialises it. */
function d3Group(draw: (g: Group) => void): string {
  const node = doc.createElementNS(SVG_NS, 'g') as SVGGElement;
  draw(d3.select(node) as Group);
  return node.outerHTML;
}

function oursGroup(draw: (g: SvgElement) => void): string {
  const g = new SvgElement('g');
  draw(g);
  return g.serialise();
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
      const ours = oursGroup((g) => drawAxes(g, x, y, c.x, c.y, 171.3, 118.25, { xTitle: false, yTitle: false, yLabels: c.yLabels }));
      const reference = d3Group((g) => d3Axes(g, x, y, c.x, c.y, 118.25, c.yLabels));
      expect(ours).toContain('class="tick"');
      expect(ours).toBe(reference);
    });
  }
});

describe("the evidence chart's panel axes written as text", () => {
  const panels: Array<{ name: string; scale: NumericScale; values: number[] }> = [
    { name: 'Akaike weight, linear', scale: d3.scaleLinear().domain([0, 1]).range([0, 63.495936]), values: [0, 0.5, 1] },
    { name: 'ΔAICc, symlog', scale: d3.scaleSymlog().constant(1).domain([0, 599.1]).range([0, 81.684864]) as unknown as NumericScale, values: [0, 2, 10, 100] },
    { name: 'ΔAICc, symlog, narrow', scale: d3.scaleSymlog().constant(1).domain([0, 13.8]).range([0, 70.25]) as unknown as NumericScale, values: [0, 2, 10] },
  ];
  for (const p of panels) {
    it(`${p.name}: the same bytes as d3.axisBottom on jsdom (tick size 3, no outer ticks)`, () => {
      const ours = oursGroup((g) =>
        g.appendMarkup(axisMarkup('bottom', p.scale, p.values, tickLabel, 'transform="translate(0,75)"', { tickSizeOuter: 0, tickPadding: 3, printWidths: false })),
      );
      const reference = d3Group((g) => {
        const axis = g.append('g').attr('transform', 'translate(0,75)');
        axis.call(d3.axisBottom(p.scale).tickValues(p.values).tickFormat((d) => tickLabel(Number(d))).tickSize(3).tickSizeOuter(0));
        axis.attr('font-size', FONT.tick).attr('font-family', null).attr('color', INK.axis);
        axis.selectAll('text').attr('fill', INK.text);
      });
      expect(ours).toContain('class="tick"');
      expect(ours).toBe(reference);
    });
  }
});
