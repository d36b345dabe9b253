/**
 * The one jsdom document every figure is drawn on (server-side d3 needs a DOM). Creating a jsdom
 * window costs a few hundred milliseconds, drawing on an existing one a few; so the window is
 * made once per process and each figure is detached and serialised when it is finished.
 */
import { JSDOM } from 'jsdom';
import * as d3 from 'd3';

const SVG_NS = 'http://www.w3.org/2000/svg';

let shared: JSDOM | null = null;

function sharedDom(): JSDOM {
  if (!shared) shared = new JSDOM('<!DOCTYPE html><html><body></body></html>');
  return shared;
}

type Svg = d3.Selection<SVGSVGElement, unknown, null, undefined>;
export type Group = d3.Selection<SVGGElement, unknown, null, undefined>;

/** A detached <svg> element with the given id, size and accessibility text. */
export function createSvg(spec: { id: string; width: number; height: number; title: string; desc: string }): Svg {
  const doc = sharedDom().window.document;
  const node = doc.createElementNS(SVG_NS, 'svg') as SVGSVGElement;
  const svg = d3.select(node) as Svg;
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
  return svg;
}

/**
 * Markup of many small, uniform elements (the data markers) is written as text rather than built
 * node by node: jsdom spends most of a figure's time creating and serialising elements. The
 * parent gets an empty placeholder group; serialiseSvg swaps in the text. Only numbers and fixed
 * colour and class names go into such markup (callers must not pass user text).
 */
export function appendRawLayer(parent: d3.Selection<SVGGElement, unknown, null, undefined>, className: string, markup: string): void {
  appendRawElement(parent, `<g class="${className}">${markup}</g>`);
}

/**
 * A whole element written as text (the axes, src/figures/axes.ts; a layer of markers above): the
 * parent gets an empty placeholder, which serialiseSvg replaces by `markup` itself. The markup must
 * be exactly what the DOM would have serialised, and may hold only numbers, fixed names and escaped
 * text.
 */
const rawElements = new Map<string, string>();
let rawCounter = 0;

export function appendRawElement(parent: d3.Selection<SVGGElement, unknown, null, undefined>, markup: string): void {
  const key = `raw${++rawCounter}`;
  rawElements.set(key, markup);
  parent.append('g').attr('data-raw-element', key);
}

/**
 * Serialises a finished figure as standalone SVG markup. The HTML serialiser of jsdom is used
 * (several times faster than XMLSerializer); for SVG content it writes well-formed XML as long as
 * no attribute value holds '<' (none does: user text only ever goes into text nodes, which are
 * escaped), and the root carries its xmlns attribute explicitly (createSvg).
 */
export function serialiseSvg(svg: Svg): string {
  return (svg.node() as SVGSVGElement).outerHTML.replace(/<g data-raw-element="(raw\d+)"><\/g>/g, (_m, key: string) => {
    const element = rawElements.get(key) ?? '';
    rawElements.delete(key);
    return element;
  });
}
