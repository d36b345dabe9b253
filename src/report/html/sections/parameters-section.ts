/**
 * The constants of the drawn model with every interval the analysis produced (Wald always;
 * profile and bootstrap when computed), then the constants of the other mechanisms.
 */
import type { AnalysisResult, ModelResult } from '../../../analysis/types.js';
import type { ParameterEstimate } from '../../../evidence/intervals/wald-estimates.js';
import { escapeHtml } from '../escape.js';
import { undetectedText } from '../../undetected-text.js';
import { interval, sig } from '../../../text/format-number.js';
import { cell, htmlTable, type Cell } from '../html-table.js';
import { parameterUnit } from '../units-text.js';
import { drawnModel } from '../../../figures/figure-context.js';

interface IntervalColumn {
  header: string;
  get(e: ParameterEstimate): [number | null, number | null] | null | undefined;
}

function intervalColumns(models: readonly ModelResult[], pct: number): IntervalColumn[] {
  const all = models.flatMap((m) => m.estimates);
  const cols: IntervalColumn[] = [{ header: `Wald ${pct}%`, get: (e) => e.wald }];
  if (all.some((e) => e.profile)) cols.push({ header: `profile ${pct}%`, get: (e) => e.profile });
  if (all.some((e) => e.bootstrapPercentile)) cols.push({ header: `bootstrap ${pct}% (percentile)`, get: (e) => e.bootstrapPercentile });
  if (all.some((e) => e.bootstrapBca)) cols.push({ header: `bootstrap ${pct}% (BCa)`, get: (e) => e.bootstrapBca });
  return cols;
}

function estimateRow(e: ParameterEstimate, result: AnalysisResult, cols: IntervalColumn[]): Cell[] {
  const unit = parameterUnit(e.name, result);
  if (!e.detected || e.value === null) {
    return [cell(escapeHtml(e.name)), cell('not detected', false, 'undetected'), cell(escapeHtml(unit)), cell('–', true), ...cols.map(() => cell('–', true)), cell(escapeHtml(e.note ? undetectedText(e, unit) : ''))];
  }
  return [
    cell(escapeHtml(e.name)),
    cell(escapeHtml(sig(e.value, 4)), true),
    cell(escapeHtml(unit)),
    cell(escapeHtml(sig(e.se, 3)), true),
    ...cols.map((c) => {
      const iv = c.get(e);
      return cell(iv ? escapeHtml(interval(iv[0], iv[1], 4)) : '–', true);
    }),
    cell(escapeHtml(e.note ?? '')),
  ];
}

function headers(cols: IntervalColumn[]): Cell[] {
  return [cell('constant'), cell('estimate', true), cell('unit'), cell('SE', true), ...cols.map((c) => cell(escapeHtml(c.header), true)), cell('note')];
}

export function parametersSection(result: AnalysisResult): string {
  const pct = Math.round(result.level * 100);
  const model = drawnModel(result);
  const all = [...result.models, ...(result.familyModels ?? [])];
  const cols = intervalColumns(all, pct);
  const main = htmlTable(headers(cols), model.estimates.map((e) => estimateRow(e, result, cols)));
  const others = all
    .filter((m) => m !== model)
    .map(
      (m) => `<h4>${escapeHtml(m.modelId ?? m.mechanism)} <span class="muted">(ΔAICc ${escapeHtml(Number.isFinite(m.deltaAicc) ? m.deltaAicc.toFixed(1) : '–')})</span></h4>
${htmlTable(headers(cols), m.estimates.map((e) => estimateRow(e, result, cols)))}`,
    )
    .join('\n');
  const openEnds = model.estimates.some((e) => e.profile && (e.profile[0] === null || e.profile[1] === null));
  return `<section id="constants">
<h2>Constants of the ${escapeHtml(model.modelId ?? model.mechanism)} model</h2>
<p class="lead">Global fit of all inhibitor series at once (${escapeHtml(model.equation)}). Intervals at ${pct}%; the Wald interval is symmetric on the log scale, where the fit is done${cols.length > 1 ? '; the profile and bootstrap intervals follow the data and need not be symmetric on any scale' : ''}.${openEnds ? ' An interval end shown as “…” is open: the data do not bound the constant on that side.' : ''}</p>
${main}
<details class="other-models"><summary>Constants of the other mechanisms</summary>
${others}
</details>
</section>`;
}
