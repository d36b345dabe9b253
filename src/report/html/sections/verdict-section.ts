/** The verdict, first on the page: the headline, the reasons, what would settle what is open. */
import type { AnalysisResult } from '../../../analysis/types.js';
import { escapeHtml } from '../escape.js';
import { sig, interval } from '../../../text/format-number.js';
import { parameterUnit } from '../units-text.js';
import { drawnModel } from '../../../figures/figure-context.js';
import { distinctAdvice } from '../../distinct-advice.js';
import { undetectedText } from '../../undetected-text.js';
import { wordVerdict } from '../../../wording/verdict-words.js';

const OUTCOME_LABEL: Record<string, string> = {
  decisive: 'firm call',
  'mixed-lean': 'firm call',
  undecided: 'not decided',
  'no-inhibition': 'no inhibition seen',
};

/** Notes on the other families when the call stayed classic (why, or the hint to give [E]t); '' when there are none. */
function familyNotes(result: AnalysisResult): string {
  if (!result.family || result.family.family !== 'classic') return '';
  const f = wordVerdict(result.family);
  if (f.reasons.length === 0 && f.suggestions.length === 0) return '';
  return `\n<h3>Tight binding and partial inhibition</h3><ul class="family-notes">${[...f.reasons, ...f.suggestions].map((t) => `<li>${escapeHtml(t)}</li>`).join('')}</ul>`;
}

export function verdictSection(result: AnalysisResult): string {
  const v = { ...result.verdict, ...wordVerdict(result.verdict) };
  const model = drawnModel(result);
  const pct = Math.round(result.level * 100);
  const keys = model.estimates
    .filter((e) => e.name !== 'Vmax')
    .map((e) => {
      const unit = parameterUnit(e.name, result);
      if (!e.detected || e.value === null) return `<li><span class="key-name">${escapeHtml(e.name)}</span> <span class="key-note">${escapeHtml(undetectedText(e, unit))}</span></li>`;
      const best = e.profile ?? e.wald;
      const kind = e.profile ? 'profile' : 'Wald';
      const range = best ? ` <span class="key-range">${pct}% ${kind} ${escapeHtml(interval(best[0], best[1], 3))}</span>` : '';
      return `<li><span class="key-name">${escapeHtml(e.name)}</span> <span class="key-value">${escapeHtml(sig(e.value, 3))}${unit ? ' ' + escapeHtml(unit) : ''}</span>${range}</li>`;
    })
    .join('');
  const reasons = v.reasons.map((r) => `<li>${escapeHtml(r)}</li>`).join('');
  const advice = distinctAdvice(v.suggestions, v.reasons);
  const suggestions = advice.length
    ? `<h3>What would settle it</h3><ul class="suggestions">${advice.map((s) => `<li>${escapeHtml(s)}</li>`).join('')}</ul>`
    : '';
  return `<section id="verdict" class="verdict outcome-${escapeHtml(v.outcome)}">
<p class="verdict-tag">${escapeHtml(OUTCOME_LABEL[v.outcome] ?? v.outcome)}</p>
<h2 class="headline">${escapeHtml(v.headline)}</h2>
<ul class="key-constants">${keys}</ul>
<h3>Why</h3>
<ul class="reasons">${reasons}</ul>
${suggestions}${familyNotes(result)}
</section>`;
}
