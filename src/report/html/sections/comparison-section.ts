/** How the mechanisms compare: the ranking table, the nested tests and the evidence chart. */
import type { AnalysisResult } from '../../../analysis/types.js';
import { escapeHtml } from '../escape.js';
import { pValue, sig } from '../../../text/format-number.js';
import { cell, htmlTable } from '../html-table.js';

function fixed(x: number, digits: number): string {
  return Number.isFinite(x) ? x.toFixed(digits) : '–';
}

function weightText(w: number): string {
  if (!Number.isFinite(w)) return '–';
  if (w > 0.999) return '> 0.999';
  if (w < 0.001) return '< 0.001';
  return w.toFixed(3);
}

export function comparisonSection(result: AnalysisResult, evidenceFigure: string): string {
  const ranking = htmlTable(
    [
      cell('rank', true),
      cell('mechanism'),
      cell('rate law'),
      cell('k', true),
      cell('weighted SSE', true),
      cell('log L', true),
      cell('AICc', true),
      cell('ΔAICc', true),
      cell('Akaike weight', true),
      cell('BIC', true),
      cell('BIC weight', true),
      cell('fit'),
    ],
    result.models.map((m, r) => [
      cell(String(r + 1), true),
      cell(`<strong>${escapeHtml(m.mechanism)}</strong>`),
      cell(`<code>${escapeHtml(m.equation)}</code>`),
      cell(String(m.k), true),
      cell(escapeHtml(sig(m.sse, 5)), true),
      cell(escapeHtml(fixed(m.logLik, 2)), true),
      cell(escapeHtml(fixed(m.aicc, 2)), true),
      cell(escapeHtml(fixed(m.deltaAicc, 2)), true),
      cell(escapeHtml(weightText(m.weight)), true),
      cell(escapeHtml(fixed(m.bic, 2)), true),
      cell(escapeHtml(weightText(m.bicWeight)), true),
      cell(m.converged ? 'converged' : `<span class="warn">not converged: ${escapeHtml(m.message)}</span>`),
    ]),
  );
  const nested = result.nested.length
    ? htmlTable(
        [cell('simpler'), cell('fuller'), cell('F', true), cell('df', true), cell('p (F)', true), cell('LR', true), cell('p (LR)', true), cell('test read', true)],
        result.nested.map((c) => [
          cell(escapeHtml(c.simpler)),
          cell(escapeHtml(c.fuller)),
          cell(escapeHtml(sig(c.f, 4)), true),
          cell(escapeHtml(`${c.fDf[0]}, ${c.fDf[1]}`), true),
          cell(escapeHtml(pValue(c.fP)), true),
          cell(escapeHtml(sig(c.lr, 4)), true),
          cell(escapeHtml(pValue(c.lrP)), true),
          cell(escapeHtml(`${c.primary}: ${pValue(c.p)}`), true),
        ]),
      )
    : '<p>No nested comparisons were made.</p>';
  return `<section id="comparison">
<h2>How the mechanisms compare</h2>
<div class="side-by-side">
<div>${evidenceFigure}</div>
<div>
<p>k counts the fitted constants plus the error variance. Weights are relative: they compare the mechanisms listed here and say nothing about mechanisms not fitted.</p>
</div>
</div>
${ranking}
<h3>Nested tests</h3>
<p>Each inhibited model against no inhibition, and each three-constant model against mixed. With fixed weights the F test is read; when the weights follow the fitted rates, the likelihood-ratio test is. The simpler models sit on the edge of mixed (a constant at infinity), where these p values are conservative.</p>
${nested}
</section>`;
}
