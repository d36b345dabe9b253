/** A figure placed in the page: the inline SVG, its caption, and a link to the standalone file. */
import type { FigureOutput } from '../../../figures/figure-output.js';
import { escapeHtml } from '../escape.js';

/** The SVG markup without the XML namespace clutter is still valid inline in HTML5. */
export function figureBlock(figure: FigureOutput, className = ''): string {
  return `<figure class="plot${className ? ' ' + className : ''}" id="${escapeHtml(figure.id)}-block">
${figure.svg}
<figcaption><strong>${escapeHtml(figure.title)}.</strong> ${escapeHtml(figure.caption)} <a class="svg-link" href="figures/${escapeHtml(figure.file)}">SVG</a></figcaption>
</figure>`;
}
