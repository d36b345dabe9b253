/** Design and data warnings collected while reading the table and after the fit. */
import type { AnalysisResult } from '../../../analysis/types.js';
import { escapeHtml } from '../escape.js';

export function warningsSection(result: AnalysisResult): string {
  const warnings = result.input.warnings;
  const body = warnings.length
    ? `<ul class="warnings">${warnings
        .map((w) => `<li><span class="code">${escapeHtml(w.code)}</span> ${escapeHtml(w.message)}${w.lines && w.lines.length ? ` <span class="muted">(lines ${escapeHtml(w.lines.join(', '))})</span>` : ''}</li>`)
        .join('')}</ul>`
    : '<p>No design or data warnings were raised.</p>';
  return `<section id="warnings">
<h2>Design and data warnings</h2>
${body}
</section>`;
}
