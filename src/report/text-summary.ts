/** The plain-text summary printed by `mechanist analyze` (without --json). */
import { unitOfParameter } from '../models/registry.js';
import type { AnalysisResult, ModelResult } from '../analysis/types.js';
import { interval, sig } from '../text/format-number.js';
import { diagnosticLines } from './diagnostic-lines.js';
import { describeTable } from '../input/describe-table.js';
import { distinctAdvice } from './distinct-advice.js';
import { undetectedText } from './undetected-text.js';
import { wordVerdict } from '../wording/verdict-words.js';

function pad(s: string, w: number): string {
  return s.length >= w ? s : s + ' '.repeat(w - s.length);
}
function padLeft(s: string, w: number): string {
  return s.length >= w ? s : ' '.repeat(w - s.length) + s;
}

function modelTable(models: readonly ModelResult[]): string[] {
  const head = `  ${pad('rank', 5)}${pad('mechanism', 16)}${padLeft('AICc', 11)}${padLeft('ΔAICc', 9)}${padLeft('weight', 9)}${padLeft('SSE', 12)}  converged`;
  const rows = models.map(
    (m, r) =>
      `  ${pad(String(r + 1), 5)}${pad(m.mechanism, 16)}${padLeft(sig(m.aicc, 6), 11)}${padLeft(m.deltaAicc.toFixed(2), 9)}${padLeft(m.weight.toFixed(3), 9)}${padLeft(sig(m.sse, 5), 12)}  ${m.converged ? 'yes' : 'NO: ' + m.message}`,
  );
  return [head, ...rows];
}

function parameterLines(model: ModelResult, result: AnalysisResult): string[] {
  const pct = `${Math.round(result.level * 100)}%`;
  return model.estimates.map((e) => {
    const unit = unitOfParameter(e.name, result.input.units);
    const profile = e.profile ? profileText(e.name, e.profile, unit, pct) : '';
    if (!e.detected || e.value === null) return `  ${pad(e.name, 6)}${undetectedText(e, unit)}${profile ? `; ${profile}` : ''}`;
    const wald = e.wald ? `Wald ${pct} ${interval(e.wald[0], e.wald[1])}` : 'no interval';
    const line = `  ${pad(e.name, 6)}${padLeft(sig(e.value), 10)} ${pad(unit, 6)} SE ${pad(sig(e.se, 3), 9)} ${profile ? `${profile}  ` : ''}${wald}`;
    const boot = e.bootstrapPercentile
      ? `\n        bootstrap ${pct} percentile ${interval(e.bootstrapPercentile[0], e.bootstrapPercentile[1])}${e.bootstrapBca ? `, BCa ${interval(e.bootstrapBca[0], e.bootstrapBca[1])}` : ''}`
      : '';
    return line + boot;
  });
}

/** A profile interval; an open end is written as a one-sided bound, e.g. "Kiu > 40 uM". */
export function profileText(name: string, ends: [number | null, number | null], unit: string, pct: string): string {
  const [lo, hi] = ends;
  const u = unit ? ` ${unit}` : '';
  if (lo !== null && hi !== null) return `profile ${pct} ${interval(lo, hi)}`;
  if (lo !== null) return `profile ${pct}: ${name} > ${sig(lo)}${u}`;
  if (hi !== null) return `profile ${pct}: ${name} < ${sig(hi)}${u}`;
  return `profile ${pct}: not bounded by these data`;
}

/** pKi, pKiu and IC50 of a model, and the bootstrap selection frequencies. */
function derivedLines(model: ModelResult, result: AnalysisResult): string[] {
  const pct = `${Math.round(result.level * 100)}%`;
  const lines: string[] = [];
  for (const d of model.derived ?? []) {
    if (d.name !== 'pKi' && d.name !== 'pKiu' && d.name !== 'IC50') continue;
    const sUnit = result.input.units.substrate;
    const label = d.name === 'IC50' ? `IC50 at [S] = ${sig(d.substrate)}${sUnit ? ` ${sUnit}` : ''}` : d.name;
    if (d.value === null) {
      lines.push(`  ${label}: ${d.note ?? 'not determined'}${d.profile ? `; ${profileText(d.name, d.profile, d.unit ?? '', pct)}` : ''}`);
      continue;
    }
    const parts = [`${sig(d.value)}${d.unit ? ` ${d.unit}` : ''}`];
    if (d.profile) parts.push(profileText(d.name, d.profile, d.unit ?? '', pct));
    if (d.wald) parts.push(`Wald ${pct} ${interval(d.wald[0], d.wald[1])}`);
    if (d.bootstrapBca) parts.push(`BCa ${interval(d.bootstrapBca[0], d.bootstrapBca[1])}`);
    lines.push(`  ${label}: ${parts.join('  ')}`);
  }
  const b = result.bootstrap;
  if (b) {
    const ranked = Object.entries(b.selection).sort((x, y) => y[1] - x[1]).filter(([, f]) => f > 0);
    lines.push(`  bootstrap (${b.resamples} resamples, seed ${b.seed}, ${b.scheme}): ranked first by AICc: ${ranked.map(([m, f]) => `${m} ${(100 * f).toFixed(1)}%`).join(', ')}`);
  }
  return lines;
}

/** The family notes (tight-binding, partial, the hint to give [E]t), when there are any. */
function familyLines(result: AnalysisResult): string[] {
  if (!result.family) return [];
  const f = { family: result.family.family, ...wordVerdict(result.family) };
  if (f.family === 'classic' && f.reasons.length === 0 && f.suggestions.length === 0) return [];
  const out = [`  Family: ${f.family}${result.enzyme === 'fitted' ? ' ([E]t fitted)' : result.enzyme ? ` ([E]t = ${result.enzyme.value} ${result.enzyme.unit ?? ''}`.trimEnd() + ')' : ''}`];
  if (f.family === 'classic') {
    for (const r of f.reasons) out.push(`  - ${r}`);
    for (const s of f.suggestions) out.push(`  * ${s}`);
  }
  return out;
}

export function textSummary(result: AnalysisResult): string {
  const inp = result.input;
  const v = { ...result.verdict, ...wordVerdict(result.verdict) };
  const best = result.models.find((m) => m.mechanism === v.mechanism) ?? result.models[0];
  const lines: string[] = [];
  lines.push(result.table.detection ? describeTable(result.table) : `${inp.source}: ${inp.rowsRead} read, ${inp.rowsUsed} used`);
  lines.push(`Error model: ${result.errorModel}${result.errorModelChoice?.automatic ? ' (chosen automatically)' : ''}; intervals at ${Math.round(result.level * 100)}%`);
  lines.push('');
  lines.push(`Verdict: ${v.headline} (${v.decisive ? 'decisive' : 'not decisive'})`);
  for (const r of v.reasons) lines.push(`  - ${r}`);
  const advice = distinctAdvice(v.suggestions, v.reasons);
  if (advice.length) {
    lines.push('  To settle it:');
    for (const s of advice) lines.push(`  * ${s}`);
  }
  lines.push(...familyLines(result));
  lines.push('');
  lines.push('Models, ranked by AICc:');
  lines.push(...modelTable(result.models));
  const familyModel = result.family && result.family.family !== 'classic' ? result.familyModels?.find((m) => m.modelId === result.family.model) : undefined;
  if (result.familyModels?.length) {
    lines.push('');
    lines.push('Other families (each ranked by AICc within itself):');
    lines.push(...modelTable(result.familyModels.map((m) => ({ ...m, mechanism: (m.modelId ?? m.mechanism) as typeof m.mechanism }))));
  }
  lines.push('');
  if (familyModel) {
    lines.push(`Parameters of ${familyModel.modelId} (global fit):`);
    lines.push(...parameterLines(familyModel, result));
  } else {
    lines.push(`Parameters of ${best.mechanism} (global fit):`);
    lines.push(...parameterLines(best, result));
    lines.push(...derivedLines(best, result));
  }
  const checks = diagnosticLines(result);
  if (checks.length) {
    lines.push('');
    lines.push(`Checks on ${v.mechanism ?? best.mechanism}:`);
    lines.push(...checks);
  }
  if (inp.excluded.length) {
    lines.push('');
    lines.push(`Excluded rows (${inp.excluded.length}):`);
    for (const x of inp.excluded) lines.push(`  line ${x.line}: ${x.reason}`);
  }
  if (inp.warnings.length) {
    lines.push('');
    lines.push('Warnings:');
    for (const w of inp.warnings) lines.push(`  ! ${w.message}`);
  }
  lines.push('');
  lines.push('Research use only: check the model assumptions (initial rates, reversible binding, [E] well below Ki).');
  return lines.join('\n') + '\n';
}
