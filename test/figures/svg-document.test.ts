/**
 * The figures are built on a small element tree (src/figures/svg-document.ts, SvgElement) instead
 * of d3 on a jsdom document. The claim is that, for the calls the figures make (append, attr, text
 * and markup written as text), it writes the bytes jsdom's outerHTML gave for the same d3 calls.
 * The reference here is d3-selection on jsdom itself: random call sequences (fast-check) with the
 * awkward values (markup characters, a no-break space, -0, 1e21, NaN, null to remove, attributes
 * set twice, text replacing children, element names the HTML serialiser treats specially), and
 * the model lines against d3.line().
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { JSDOM } from 'jsdom';
import * as d3 from 'd3';
import { SvgElement, createSvg, serialiseSvg } from '../../src/figures/svg-document.js';
import { drawPolyline } from '../../src/figures/model-lines.js';
import { round, roundedText } from '../../src/figures/markers.js';

const SVG_NS = 'http://www.w3.org/2000/svg';
const doc = new JSDOM('<!DOCTYPE html><html><body></body></html>').window.document;

type Sel = d3.Selection<Element, unknown, null, undefined>;
type Value = string | number | boolean | null | undefined;
type Op =
  | { kind: 'append'; target: number; name: string }
  | { kind: 'attr'; target: number; name: string; value: Value }
  | { kind: 'text'; target: number; value: Value };

const names = ['g', 'text', 'path', 'rect', 'clipPath', 'title', 'desc', 'defs', 'style', 'script', 'br', 'foreignObject', 'tspan'];
const attrNames = ['class', 'x', 'y', 'd', 'transform', 'fill', 'stroke-dasharray', 'font-weight', 'clip-path', 'id'];
const strings = fc.oneof(
  fc.constantFrom('', 'a', 'x<y>', 'A & B', '"quoted"', "it's", '\u00a0', '60 µM', 'ΔAICc', '</text>', '&amp;', 'a\nb\tc'),
  fc.string({ maxLength: 12 }),
  fc.string({ unit: fc.constantFrom('&', '<', '>', '"', "'", '\u00a0', 'a', ' ', 'é'), maxLength: 10 }),
);
const numbers = fc.oneof(
  fc.constantFrom(0, -0, 1e21, 1e-7, 0.1 + 0.2, NaN, Infinity, -Infinity, 68.81920000000001, -12.5),
  fc.double({ noNaN: false }),
  fc.integer({ min: -1e6, max: 1e6 }),
);
const values: fc.Arbitrary<Value> = fc.oneof(strings, numbers, fc.constantFrom(null, undefined, true, false));
const op: fc.Arbitrary<Op> = fc.oneof(
  fc.record({ kind: fc.constant('append' as const), target: fc.nat(), name: fc.constantFrom(...names) }),
  fc.record({ kind: fc.constant('attr' as const), target: fc.nat(), name: fc.constantFrom(...attrNames), value: values }),
  fc.record({ kind: fc.constant('text' as const), target: fc.nat(), value: values }),
);

/** The same calls on both trees; returns both serialisations. */
function run(ops: readonly Op[]): { ours: string; reference: string } {
  const root = new SvgElement('svg');
  const rootNode = doc.createElementNS(SVG_NS, 'svg');
  const ourNodes: SvgElement[] = [root];
  const refNodes: Sel[] = [d3.select(rootNode) as unknown as Sel];
  for (const o of ops) {
    const t = o.target % ourNodes.length;
    if (o.kind === 'append') {
      ourNodes.push(ourNodes[t].append(o.name));
      refNodes.push(refNodes[t].append(o.name) as unknown as Sel);
    } else if (o.kind === 'attr') {
      ourNodes[t].attr(o.name, o.value);
      refNodes[t].attr(o.name, o.value as string);
    } else {
      ourNodes[t].text(o.value);
      refNodes[t].text(o.value as string);
    }
  }
  return { ours: root.serialise(), reference: rootNode.outerHTML };
}

describe('SvgElement writes what d3 on jsdom wrote', () => {
  it('for random sequences of append, attr and text calls', () => {
    fc.assert(
      fc.property(fc.array(op, { maxLength: 40 }), (ops) => {
        const { ours, reference } = run(ops);
        expect(ours).toBe(reference);
      }),
      { numRuns: 400, seed: 20261202 },
    );
  });

  it('for a figure frame as createSvg builds it (xmlns attribute, title and description with user text)', () => {
    const spec = { id: 'fig-x', width: 241, height: 180.5, title: 'Rates of <compound> & "friends"', desc: 'no\u00a0break, a > b' };
    const ours = createSvg(spec);
    ours.append('g').attr('class', 'plot').append('text').attr('x', 3).text('[I] = 60 µM');
    const node = doc.createElementNS(SVG_NS, 'svg');
    const svg = d3.select(node);
    svg
      .attr('xmlns', SVG_NS)
      .attr('id', spec.id)
      .attr('viewBox', `0 0 ${spec.width} ${spec.height}`)
      .attr('width', `${spec.width}pt`)
      .attr('height', `${spec.height}pt`)
      .attr('role', 'img')
      .attr('aria-labelledby', `${spec.id}-title ${spec.id}-desc`);
    svg.append('title').attr('id', `${spec.id}-title`).text(spec.title);
    svg.append('desc').attr('id', `${spec.id}-desc`).text(spec.desc);
    svg.append('g').attr('class', 'plot').append('text').attr('x', 3).text('[I] = 60 µM');
    expect(serialiseSvg(ours)).toBe(node.outerHTML);
    expect(node.outerHTML).toContain('&lt;compound&gt; &amp; "friends"');
  });

  it('can fail: a differing attribute order is seen', () => {
    const a = new SvgElement('g').attr('x', 1).attr('y', 2).serialise();
    const b = new SvgElement('g').attr('y', 2).attr('x', 1).serialise();
    expect(a).not.toBe(b);
  });
});

describe('model lines written as text', () => {
  /** The former drawing: d3.line() on the rounded finite points, appended with d3 on jsdom. */
  function d3Polyline(xs: number[], ys: number[], x: d3.ScaleLinear<number, number>, y: d3.ScaleLinear<number, number>, dash: string | undefined): string {
    const g = doc.createElementNS(SVG_NS, 'g');
    const pts: Array<[number, number]> = [];
    for (let k = 0; k < xs.length; k++) if (Number.isFinite(ys[k]) && Number.isFinite(xs[k])) pts.push([round(x(xs[k])), round(y(ys[k]))]);
    if (pts.length >= 2) {
      d3.select(g)
        .append('path')
        .attr('class', 'model-line')
        .attr('d', d3.line()(pts) ?? '')
        .attr('fill', 'none')
        .attr('stroke', '#123456')
        .attr('stroke-width', 1.1)
        .attr('stroke-dasharray', dash ?? null)
        .attr('stroke-linejoin', 'round');
    }
    return g.outerHTML;
  }

  const coordinate = fc.oneof(fc.double({ min: -1e7, max: 1e7, noNaN: true }), fc.constantFrom(NaN, Infinity, 0, -0, 1e-9, 123.456789));
  it('give the path data of d3.line() for the same points', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(coordinate, coordinate), { maxLength: 30 }),
        fc.tuple(fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: 1e-3, max: 1e4, noNaN: true })),
        fc.option(fc.constantFrom('3.5 2', '1 1.5')),
        (points, [lo, span], dash) => {
          const x = d3.scaleLinear().domain([lo, lo + span]).range([0, 171.3]);
          const y = d3.scaleLinear().domain([lo, lo + 2 * span]).range([118.25, 0]);
          const xs = points.map((p) => p[0]);
          const ys = points.map((p) => p[1]);
          const ours = new SvgElement('g');
          drawPolyline(ours, xs, ys, x, y, { colour: '#123456', width: 1.1, dash: dash ?? undefined });
          expect(ours.serialise()).toBe(d3Polyline(xs, ys, x, y, dash ?? undefined));
        },
      ),
      { numRuns: 300, seed: 7 },
    );
  });
});

describe('coordinates written from their hundredths', () => {
  it('are String(round(x)) for any x', () => {
    const awkward = [0, -0, 0.005, -0.005, 0.015, 1.005, -1.005, 0.1 + 0.2, 99.995, 999999999.99, 1e9, -1e9, 1e21, 1e-9, NaN, Infinity, -Infinity, 2 ** 53];
    for (const x of awkward) expect(roundedText(x), String(x)).toBe(String(round(x)));
    fc.assert(
      fc.property(fc.oneof(fc.double(), fc.double({ min: -1000, max: 1000 }), fc.integer({ min: -1e11, max: 1e11 }).map((n) => n / 100)), (x) => {
        expect(roundedText(x)).toBe(String(round(x)));
      }),
      { numRuns: 20000, seed: 11 },
    );
  });
});
