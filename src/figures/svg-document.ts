/**
 * The one jsdom document every figure is drawn on (server-side d3 needs a DOM). Creating a jsdom
 * window costs a few hundred milliseconds, drawing on an existing one a few; so the window is
 * made once per process and each figure is detached and serialised when it is finished.
 */
import { JSDOM } from 'jsdom';
import * as d3 from 'd3';

export const SVG_NS = 'http://www.w3.org/2000/svg';

let shared: JSDOM | null = null;

function sharedDom(): JSDOM {
  if (!shared) shared = new JSDOM('<!DOCTYPE html><html><body></body></html>');
  return shared;
}

export type Svg = d3.Selection<SVGSVGElement, unknown, null, undefined>;
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

/** Serialises a finished figure as standalone SVG markup (XML; text and attributes escaped). */
export function serialiseSvg(svg: Svg): string {
  const window = sharedDom().window;
  return new window.XMLSerializer().serializeToString(svg.node() as Node);
}
