/**
 * Quantities derived from the drawn model's constants (src/evidence/intervals/derived-quantities.ts): alpha,
 * pKi, pKiu, the IC50 at the chosen [S] with its closed form (Cheng, Y. and Prusoff, W. H. (1973)
 * Biochem. Pharmacol. 22, 3099-3108), the apparent Vmax and Km at each tested [I], and, when a
 * bootstrap ran, how often each mechanism ranked first across the resamples. Every interval the
 * analysis produced is shown; none is made up here.
 */
import type { AnalysisResult, ModelResult } from '../../../analysis/types.js';
import type { DerivedQuantity } from '../../../evidence/intervals/derived-quantities.js';
import type { Mechanism } from '../../../models/types.js';
import { drawnModel } from '../../../figures/figure-context.js';
import { displayUnit } from '../../../figures/axis-units.js';
import { escapeHtml } from '../escape.js';
import { interval, sig } from '../../../text/format-number.js';
import { cell, htmlTable, type Cell } from '../html-table.js';
import { distinctLevels } from '../../../input/distinct-levels.js';

type Interval = [number | null, number | null];

/** The interval fields shared by derived quantities and parameter estimates. */
interface WithIntervals {
  wald: [number, number] | null;
  profile?: Interval;
  bootstrapPercentile?: [number, number];
  bootstrapBca?: [number, number];
}

interface IntervalKind {
  header: string;
  get(q: WithIntervals): Interval | null | undefined;
}

function intervalKinds(quantities: readonly WithIntervals[], pct: number): IntervalKind[] {
  const kinds: IntervalKind[] = [{ header: `Wald ${pct}%`, get: (q) => q.wald }];
  if (quantities.some((q) => q.profile)) kinds.push({ header: `profile ${pct}%`, get: (q) => q.profile });
  if (quantities.some((q) => q.bootstrapPercentile)) kinds.push({ header: `bootstrap ${pct}% (percentile)`, get: (q) => q.bootstrapPercentile });
  if (quantities.some((q) => q.bootstrapBca)) kinds.push({ header: `bootstrap ${pct}% (BCa)`, get: (q) => q.bootstrapBca });
  return kinds;
}

function intervalCells(q: WithIntervals, kinds: readonly IntervalKind[], digits: number): Cell[] {
  return kinds.map((k) => {
    const iv = k.get(q);
    return cell(iv ? escapeHtml(interval(iv[0], iv[1], digits)) : '–', true);
  });
}

function label(q: DerivedQuantity, result: AnalysisResult): string {
  const su = displayUnit(result.input.units.substrate);
  switch (q.name) {
    case 'pKi':
      return 'pKi (−log₁₀ Ki, Ki in mol/L)';
    case 'pKiu':
      return 'pKiu (−log₁₀ Kiu, Kiu in mol/L)';
    case 'IC50':
      return `IC50 at [S] = ${sig(q.substrate, 4)}${su ? ' ' + su : ''}`;
    default:
      return q.name;
  }
}

/** The closed form of the IC50 for a mechanism, in words a reader can check by hand. */
const IC50_FORMULA: Partial<Record<Mechanism, string>> = {
  competitive: 'IC50 = Ki (1 + [S]/Km)',
  uncompetitive: 'IC50 = Kiu (1 + Km/[S])',
  noncompetitive: 'IC50 = Ki, whatever [S]',
  mixed: 'IC50 = (Km + [S]) / (Km/Ki + [S]/Kiu)',
};

function constant(model: ModelResult, name: string): number | null {
  const e = model.estimates.find((x) => x.name === name);
  return e && e.detected && e.value !== null ? e.value : null;
}

/** The formula with this fit's numbers put in, when every constant it needs was determined. */
function ic50Worked(model: ModelResult, q: DerivedQuantity): string | null {
  const s = q.substrate;
  const km = constant(model, 'Km');
  const ki = constant(model, 'Ki');
  const kiu = constant(model, 'Kiu');
  if (s === undefined || q.value === null) return null;
  const n = (x: number) => sig(x, 4);
  switch (model.mechanism) {
    case 'competitive':
      return km !== null && ki !== null ? `${n(ki)} × (1 + ${n(s)}/${n(km)})` : null;
    case 'uncompetitive':
      return km !== null && kiu !== null ? `${n(kiu)} × (1 + ${n(km)}/${n(s)})` : null;
    case 'noncompetitive':
      return ki !== null ? n(ki) : null;
    case 'mixed':
      return km !== null && ki !== null && kiu !== null ? `(${n(km)} + ${n(s)}) / (${n(km)}/${n(ki)} + ${n(s)}/${n(kiu)})` : null;
    default:
      return null;
  }
}

function ic50Note(model: ModelResult, result: AnalysisResult): string {
  const q = model.derived?.find((d) => d.name === 'IC50');
  const formula = IC50_FORMULA[model.mechanism];
  if (!q || !formula) return '';
  const worked = ic50Worked(model, q);
  const iu = displayUnit(q.unit);
  const value = q.value !== null ? `${sig(q.value, 4)}${iu ? ' ' + iu : ''}` : null;
  const text = worked && value ? `${formula} = ${worked} = ${value}` : formula;
  return `<p class="formula">${escapeHtml(`The IC50 is the [I] that halves the uninhibited rate at the chosen [S]. For the ${model.mechanism} model, in closed form (Cheng & Prusoff 1973): `)}<code>${escapeHtml(text)}</code>${escapeHtml('. It is a property of this assay at this [S], not of the compound alone.')}</p>`;
}

function scalarTable(model: ModelResult, result: AnalysisResult, pct: number): string {
  const quantities = (model.derived ?? []).filter((q) => q.name === 'pKi' || q.name === 'pKiu' || q.name === 'IC50');
  const alpha = model.estimates.find((e) => e.name === 'alpha');
  const kinds = intervalKinds(alpha ? [...quantities, alpha] : quantities, pct);
  const rows: Cell[][] = [];
  if (alpha) {
    rows.push(
      alpha.detected && alpha.value !== null
        ? [cell('alpha = Kiu/Ki'), cell(escapeHtml(sig(alpha.value, 4)), true), cell(''), cell(escapeHtml(sig(alpha.se, 3)), true), ...intervalCells(alpha, kinds, 4), cell(escapeHtml(alpha.note ?? ''))]
        : [cell('alpha = Kiu/Ki'), cell('not determined', false, 'undetected'), cell(''), cell('–', true), ...kinds.map(() => cell('–', true)), cell(escapeHtml(alpha.note ?? ''))],
    );
  }
  for (const q of quantities) {
    const unit = escapeHtml(displayUnit(q.unit) ?? '');
    rows.push(
      q.value === null
        ? [cell(escapeHtml(label(q, result))), cell('not determined', false, 'undetected'), cell(unit), cell('–', true), ...kinds.map(() => cell('–', true)), cell(escapeHtml(q.note ?? ''))]
        : [cell(escapeHtml(label(q, result))), cell(escapeHtml(sig(q.value, 4)), true), cell(unit), cell(escapeHtml(sig(q.se, 3)), true), ...intervalCells(q, kinds, 4), cell(escapeHtml(q.note ?? ''))],
    );
  }
  if (rows.length === 0) return '';
  const notes = [...quantities, ...(alpha ? [alpha] : [])].some((q) => q.note);
  return htmlTable(
    [cell('quantity'), cell('value', true), cell('unit'), cell('SE', true), ...kinds.map((k) => cell(escapeHtml(k.header), true)), ...(notes ? [cell('note')] : [])],
    notes ? rows : rows.map((r) => r.slice(0, -1)),
    'data derived',
  );
}

/** True when every value is the same to 1e-12 relative (the model leaves it unchanged by [I]). */
function unchanging(values: readonly (number | null)[]): boolean {
  const xs = values.filter((v): v is number => v !== null);
  if (xs.length !== values.length || xs.length === 0) return false;
  return xs.every((v) => Math.abs(v - xs[0]) <= 1e-12 * Math.abs(xs[0]));
}

/**
 * One row per tested [I] and apparent constant that changes with [I] (its unit with its name, so no
 * unit column of equal cells), the intervals computed in columns. A constant the model leaves
 * unchanged at every [I] (Vmax_app of a competitive fit, Km_app of a noncompetitive one) is said in
 * one sentence instead of rows of equal numbers.
 */
function apparentTable(model: ModelResult, result: AnalysisResult, pct: number): string {
  const apparent = (model.derived ?? []).filter((q) => q.name === 'Vmax_app' || q.name === 'Km_app');
  if (apparent.length === 0) return '';
  const levels = distinctLevels(apparent.map((q) => q.inhibitor!));
  const iu = displayUnit(result.input.units.inhibitor);
  const names = (['Vmax_app', 'Km_app'] as const).filter((n) => apparent.some((q) => q.name === n));
  const of = (name: string, level: number) => apparent.find((q) => q.name === name && q.inhibitor === level) ?? null;
  const fixedNames = names.filter((n) => unchanging(levels.map((l) => of(n, l)?.value ?? null)));
  const fixedText = fixedNames.map((n) => {
    const q = of(n, levels[0])!;
    const unit = displayUnit(q.unit);
    return `${n} = ${sig(q.value, 4)}${unit ? ' ' + unit : ''} at every [I]: the ${model.mechanism} model leaves it unchanged.`;
  });
  const shown = apparent.filter((q) => !fixedNames.includes(q.name as 'Vmax_app' | 'Km_app'));
  // by [I], Vmax_app before Km_app
  const order = [...shown].sort((a, b) => a.inhibitor! - b.inhibitor! || (a.name === 'Vmax_app' ? -1 : 1));
  const kinds = intervalKinds(order, pct);
  const rows = order.map((q, k) => {
    const first = k === 0 || order[k - 1].inhibitor !== q.inhibitor;
    const unit = displayUnit(q.unit);
    return [
      cell(first ? escapeHtml(sig(q.inhibitor, 4)) : '', true),
      cell(escapeHtml(unit ? `${q.name} (${unit})` : q.name)),
      ...(q.value === null
        ? [cell('not determined', false, 'undetected'), ...kinds.map(() => cell('–', true))]
        : [cell(escapeHtml(sig(q.value, 4)), true), ...intervalCells(q, kinds, 4)]),
    ];
  });
  const table = order.length
    ? htmlTable([cell(escapeHtml(iu ? `[I] (${iu})` : '[I]'), true), cell('quantity'), cell('value', true), ...kinds.map((k) => cell(escapeHtml(k.header), true))], rows, 'data apparent')
    : '';
  return `<h3>Apparent constants at each tested [I]</h3>
<p>${escapeHtml(`The Michaelis-Menten constants of the ${model.mechanism} curve at each [I]: Vmax_app = Vmax / (1 + [I]/Kiu), Km_app = Km (1 + [I]/Ki) / (1 + [I]/Kiu), with an absent arm at infinity (Segel 1975).${fixedText.length ? ' ' + fixedText.join(' ') : ''}`)}</p>
${table}`;
}

function selectionBlock(result: AnalysisResult): string {
  const b = result.bootstrap;
  if (!b) return '';
  const mechanisms = result.models.map((m) => m.mechanism as string);
  for (const name of Object.keys(b.selection)) if (!mechanisms.includes(name)) mechanisms.push(name);
  const share = (x: number | undefined) => (x === undefined ? '–' : `${(100 * x).toFixed(1)}%`);
  const rows = mechanisms
    .map((name) => ({ name, share: b.selection[name] ?? 0, failures: b.failures[name] ?? 0 }))
    .sort((x, y) => y.share - x.share)
    .map((r) => [cell(escapeHtml(r.name)), cell(escapeHtml(share(r.share)), true), cell(escapeHtml(String(r.failures)), true)]);
  return `<h3>How often each mechanism ranked first</h3>
<p>${escapeHtml(`${b.resamples} bootstrap resamples (seed ${b.seed}; ${b.scheme}), each refitted with all mechanisms and ranked by AICc. A share near 100% means the ranking does not hinge on the particular noise in these rates; it is not the probability that a mechanism is true.`)}</p>
${htmlTable([cell('mechanism'), cell('ranked first', true), cell('failed refits', true)], rows, 'data selection')}`;
}

/** The section, or '' when there is nothing to derive and no bootstrap ran. */
export function derivedSection(result: AnalysisResult): string {
  const model = drawnModel(result);
  const pct = Math.round(result.level * 100);
  const scalars = scalarTable(model, result, pct);
  const apparent = apparentTable(model, result, pct);
  const selection = selectionBlock(result);
  if (!scalars && !apparent && !selection) return '';
  const body = scalars || apparent
    ? `<p class="lead">${escapeHtml(`Computed from the constants of the global ${model.mechanism} fit. Wald intervals by the delta method; profile intervals where the quantity is a function of one constant; bootstrap intervals when a bootstrap ran.`)}</p>
${scalars}
${ic50Note(model, result)}
${apparent}`
    : `<p>${escapeHtml(`The ${model.mechanism} model has no inhibition constant to derive from.`)}</p>`;
  return `<section id="derived">
<h2>Derived quantities</h2>
${body}
${selection}
</section>`;
}
