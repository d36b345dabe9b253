/** The text summary of a plan: assumptions, the recommended grid as a table, the candidates side by side. */
import type { Mechanism } from '../models/types.js';
import { modelFor } from '../models/index.js';
import type { DesignPoint } from './design-types.js';
import type { PlanCandidate, PlanResult } from './plan-experiment.js';
import { distinctLevels } from '../input/distinct-levels.js';

function num(x: number): string {
  return String(Number(x.toPrecision(4)));
}

function pct(x: number | null | undefined): string {
  return x === null || x === undefined ? '-' : `${Math.round(100 * x)}%`;
}

function fold(x: number | null | undefined): string {
  return x === null || x === undefined || !Number.isFinite(x) ? 'open' : `${x.toFixed(2)}x`;
}

function pad(s: string, n: number): string {
  return s.length >= n ? s : s + ' '.repeat(n - s.length);
}

/** [S] rows x [I] columns, each cell the number of wells (blank: not used). */
export function gridTable(points: readonly DesignPoint[], units: { substrate: string; inhibitor: string }): string[] {
  const s = distinctLevels(points.map((p) => p.substrate));
  const i = distinctLevels(points.map((p) => p.inhibitor));
  const cell = (a: number, b: number) => String(points.filter((p) => p.substrate === a && p.inhibitor === b).reduce((t, p) => t + p.replicates, 0) || '');
  const width = Math.max(8, ...i.map((x) => num(x).length + 1));
  const head = pad(`[S] ${units.substrate} \\ [I] ${units.inhibitor}`, 18) + i.map((x) => pad(num(x), width)).join('');
  return [head, ...s.map((a) => pad(num(a), 18) + i.map((b) => pad(cell(a, b), width)).join(''))];
}

function predictionLines(c: PlanCandidate, mechanisms: readonly Mechanism[]): string[] {
  return mechanisms.map((m) => {
    const p = c.predicted?.[m];
    const e = c.expected[m];
    const names = modelFor(m).params;
    const k = (name: 'Ki' | 'Kiu', x: number | null | undefined) => (names.includes(name) ? fold(x) : '-');
    const cols = [
      p ? pct(p.decisiveCorrect) : '-',
      p ? pct(p.decisiveWrong) : '-',
      p ? k('Ki', p.kiFoldWidth) : '-',
      p ? k('Kiu', p.kiuFoldWidth) : '-',
      k('Ki', e?.kiFoldWidth),
      k('Kiu', e?.kiuFoldWidth),
    ];
    return `    ${pad(m, 16)}${cols.map((x) => pad(x, 10)).join('')}`.trimEnd();
  });
}

export function planText(plan: PlanResult): string {
  const r = plan.request;
  const units = r.units;
  const lines: string[] = [];
  lines.push(`Plan for ${r.constraints.wells} wells (${r.constraints.replicates} replicates per point, ${r.constraints.plate}-well plate); mechanisms in play: ${r.mechanisms.join(', ')}`);
  lines.push(`Concentrations: substrate in ${units.substrate}, inhibitor in ${units.inhibitor}`);
  const measured = (r.fixedPoints ?? []).reduce((t, p) => t + p.replicates, 0);
  if (measured > 0) lines.push(`Follow-up: the ${r.constraints.wells} wells are added to the ${measured} already measured; the tables below list the added wells only, the predictions cover both`);
  lines.push('');
  lines.push(`Recommended design (${plan.recommended.wellCount} wells, ${plan.recommended.points.length} distinct points): ${plan.recommended.description}`);
  lines.push('  wells per ([S], [I]):');
  for (const l of gridTable(plan.recommended.points, units)) lines.push(`  ${l}`);
  lines.push('');
  const simulated = plan.candidates.some((c) => c.predicted);
  lines.push(
    simulated
      ? `Candidates (Monte Carlo through the analysis, ${r.simulations} simulations per design and mechanism, seed ${r.seed}):`
      : 'Candidates (expected information only; run without --no-simulate for predicted calls):',
  );
  lines.push(`    ${pad('true mechanism', 16)}${['correct', 'wrong', 'Ki fold', 'Kiu fold', 'Ki fold', 'Kiu fold'].map((x) => pad(x, 10)).join('')}`.trimEnd());
  lines.push(`    ${pad('', 16)}${['(firm)', '(firm)', '(sim.)', '(sim.)', '(info.)', '(info.)'].map((x) => pad(x, 10)).join('')}`.trimEnd());
  for (const c of plan.candidates) {
    if (c.role === 'ds-optimum') continue;
    lines.push(`  ${c.name} (${c.wellCount} wells): ${c.description}`);
    lines.push(...predictionLines(c, r.mechanisms));
  }
  const ds = plan.candidates.find((c) => c.role === 'ds-optimum');
  if (ds)
    lines.push(`  for reference, the Ds-optimum has ${ds.points.length} distinct points (not recommended: too few levels to check the model)`);
  lines.push('');
  lines.push('"correct"/"wrong": share of simulations with a firm call of the true / of another mechanism (for none: the no-inhibition outcome); "Ki fold", "Kiu fold": high/low of the 95% interval (median over the simulations, or expected from the information); "-": the mechanism has no such constant.');
  lines.push('');
  lines.push('The plan rests on these assumptions:');
  for (const a of plan.assumptions) lines.push(`  - ${a}`);
  for (const n of plan.notes) lines.push(`Note: ${n}`);
  lines.push('Research use only: a plan supports, and does not replace, expert judgement.');
  return lines.join('\n') + '\n';
}
