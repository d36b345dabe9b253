/**
 * The reproducibility footer: tool version, input and its SHA-256, options, seed and date. The
 * date sits in a single <time id="report-date"> element, the only part of the page that changes
 * between two runs on the same input (the committed demo report is checked on that basis).
 */
import type { AnalysisResult } from '../../../analysis/types.js';
import { TOOL_NAME, TOOL_VERSION } from '../../../version.js';
import { escapeHtml } from '../escape.js';
import type { ReportProvenance } from '../provenance.js';

const DATE_ELEMENT_ID = 'report-date';

/** Matches the date element, for tests that compare two reports. */
export const DATE_ELEMENT_PATTERN = /<time id="report-date"[^>]*>[^<]*<\/time>/g;

export function provenanceFooter(result: AnalysisResult, provenance: ReportProvenance = {}): string {
  const date = provenance.generatedAt === undefined ? new Date() : provenance.generatedAt;
  const made =
    date === null
      ? `<time id="${DATE_ELEMENT_ID}">not recorded (kept out so that rerunning gives the same file)</time>`
      : `<time id="${DATE_ELEMENT_ID}" datetime="${escapeHtml(date.toISOString())}">${escapeHtml(date.toISOString().replace('T', ' ').replace(/\.\d+Z$/, ' UTC'))}</time>`;
  const options: Array<[string, string]> = [
    ['error model', result.errorModel],
    ['confidence level', String(result.level)],
    ['mechanisms compared', result.models.map((m) => m.mechanism).join(', ')],
    ...Object.entries(provenance.options ?? {}),
  ];
  const given = provenance.seed ?? result.bootstrap?.seed ?? null;
  const seed = given === null ? 'none used (no random resampling in this analysis)' : `${given}${result.bootstrap ? ` (bootstrap, ${result.bootstrap.resamples} resamples)` : ''}`;
  const rows: Array<[string, string]> = [
    ['tool', `${TOOL_NAME} ${TOOL_VERSION}`],
    ...(provenance.command ? ([['command', provenance.command]] as Array<[string, string]>) : []),
    ['input', `${result.input.source}${result.input.compound !== undefined ? ` (compound ${result.input.compound})` : ''}`],
    ['input SHA-256', provenance.inputSha256 ?? 'not recorded (the caller did not pass the input bytes)'],
    ...options.map(([k, v]) => [k, v] as [string, string]),
    ['random seed', seed],
  ];
  return `<footer id="provenance">
<h2>Reproducibility</h2>
<dl>${rows.map(([k, v]) => `<dt>${escapeHtml(k)}</dt><dd>${k === 'input SHA-256' ? `<code>${escapeHtml(v)}</code>` : escapeHtml(v)}</dd>`).join('')}<dt>made</dt><dd>${made}</dd></dl>
</footer>`;
}
