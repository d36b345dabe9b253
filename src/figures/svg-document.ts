/**
 * The element tree every figure is drawn on: a small SVG builder written for the figures, with the
 * three calls of a d3 selection they used (`append`, `attr`, `text`) and a serialiser that writes
 * the bytes jsdom's HTML serialiser gave for the same calls (outerHTML of an SVG element made by
 * d3 on a jsdom document, the way the figures were drawn before; docs/decisions/analysis-cost.md).
 * test/figures/svg-document.test.ts checks this against d3 on jsdom itself: attributes keep the
 * order of their first setting, a null value removes one, numbers print as String() prints them,
 * `text` replaces the children, every element gets an end tag, and text and attribute values are
 * escaped the same way (&, no-break space, <, > and, in attributes, ").
 *
 * Building elements as plain objects and joining strings costs a fraction of creating jsdom
 * nodes, and no DOM has to be loaded (a worker no longer pays jsdom's start-up).
 */

const SVG_NS = 'http://www.w3.org/2000/svg';

/** What an attribute or a text may be set to (d3 converted it to a string the same way). */
type Value = string | number | boolean | null | undefined;

function escapeAttribute(value: string): string {
  return /[&"<>\u00a0]/.test(value)
    ? value.replace(/&/g, '&amp;').replace(/\u00a0/g, '&nbsp;').replace(/"/g, '&quot;').replace(/</g, '&lt;').replace(/>/g, '&gt;')
    : value;
}

/** Text-node escaping of the HTML serialiser (also used for the axes' tick labels, axes.ts). */
export function escapeText(value: string): string {
  return /[&<>\u00a0]/.test(value) ? value.replace(/&/g, '&amp;').replace(/\u00a0/g, '&nbsp;').replace(/</g, '&lt;').replace(/>/g, '&gt;') : value;
}

/** An element of a figure: its name, attributes in order, and children (elements, text or raw markup). */
export class SvgElement {
  private readonly names: string[] = [];
  private readonly values: string[] = [];
  /** elements, and strings that are markup already (escaped text, or raw elements) */
  private children: Array<SvgElement | string> = [];

  constructor(private readonly name: string) {}

  /** A new last child element (d3 `selection.append(name)`). */
  append(name: string): SvgElement {
    const child = new SvgElement(name);
    this.children.push(child);
    return child;
  }

  /** Sets an attribute, or removes it for null or undefined (d3 `selection.attr(name, value)`). */
  attr(name: string, value: Value): this {
    const at = this.names.indexOf(name);
    if (value === null || value === undefined) {
      if (at >= 0) {
        this.names.splice(at, 1);
        this.values.splice(at, 1);
      }
    } else if (at >= 0) this.values[at] = String(value);
    else {
      this.names.push(name);
      this.values.push(String(value));
    }
    return this;
  }

  /** Replaces the children by a text (d3 `selection.text(value)`; null gives an empty element). */
  text(value: Value): this {
    const s = value === null || value === undefined ? '' : String(value);
    this.children = s === '' ? [] : [escapeText(s)];
    return this;
  }

  /**
   * Appends markup written as text (the axes, src/figures/axes.ts): it must be exactly what the
   * element tree would serialise, and may hold only numbers, fixed names and escaped text.
   */
  appendMarkup(markup: string): void {
    this.children.push(markup);
  }

  /** The element's markup (the HTML serialiser's outerHTML of the same element). */
  serialise(): string {
    const out: string[] = [];
    this.write(out);
    return out.join('');
  }

  private write(out: string[]): void {
    let open = `<${this.name}`;
    for (let k = 0; k < this.names.length; k++) open += ` ${this.names[k]}="${escapeAttribute(this.values[k])}"`;
    out.push(open + '>');
    for (const child of this.children) {
      if (typeof child === 'string') out.push(child);
      else child.write(out);
    }
    out.push(`</${this.name}>`);
  }
}

export type Group = SvgElement;

/** A new <svg> element with the given id, size and accessibility text. */
export function createSvg(spec: { id: string; width: number; height: number; title: string; desc: string }): SvgElement {
  const svg = new SvgElement('svg');
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
 * A group of many small, uniform elements (the data markers) written as text. Only numbers and
 * fixed colour and class names go into such markup (callers must not pass user text).
 */
export function appendRawLayer(parent: SvgElement, className: string, markup: string): void {
  parent.appendMarkup(`<g class="${className}">${markup}</g>`);
}

/** A finished figure as standalone SVG markup (the root carries its xmlns attribute, createSvg). */
export function serialiseSvg(svg: SvgElement): string {
  return svg.serialise();
}
