/**
 * The words of the family comparison (src/evidence/selection/family-comparison.ts): why [E]t does or does
 * not matter, why a partial call is made or not, and the headline of a tight-binding or partial
 * call. Used by src/wording/verdict-words.ts.
 */
import type { Advice, ConstantFinding, FamilyReason, VerdictHeadline } from '../evidence/verdict/verdict-findings.js';

/** Three significant digits, trailing zeros dropped; '?' for a missing value. */
function fmt(x: number | null | undefined): string {
  return x === null || x === undefined || !Number.isFinite(x) ? '?' : Number(x.toPrecision(3)).toString();
}

/** "Ki = 2.1 nM [1.8, 2.5]" from the best interval computed. */
function constantPhrase(e: ConstantFinding | null, unit: string): string {
  if (!e || e.value === null) return e ? `${e.name} not detected` : '';
  const u = unit ? ` ${unit}` : '';
  return `${e.name} = ${fmt(e.value)}${u}${e.interval ? ` [${fmt(e.interval[0])}, ${fmt(e.interval[1])}]` : ''}`;
}

const withUnit = (x: number, unit: string) => `${fmt(x)}${unit ? ` ${unit}` : ''}`;
const boundaryP = (p: number) => `p ${p < 0.001 ? '< 0.001' : `= ${fmt(p)}`}, boundary test`;
/** beta of a partial call; null stands for partial competitive, where beta is 1. */
const betaPhrase = (beta: ConstantFinding | null) => (beta === null ? 'beta = 1 (the complex turns over at full speed)' : constantPhrase(beta, ''));

export function familyReason(r: FamilyReason): string {
  switch (r.code) {
    case 'tight-no-inhibition':
      return 'tight-binding family: no inhibition detected, so the enzyme concentration does not matter';
    case 'enzyme-near-constant':
      return `[E]t (${withUnit(r.enzyme, r.unit)}) is within ${r.ratio}-fold of ${r.name}: the inhibitor bound depletes the free inhibitor, so the tight-binding (Morrison) equations apply`;
    case 'enzyme-negligible':
      return `[E]t (${withUnit(r.enzyme, r.unit)}) is below 1/${r.ratio} of the tight-binding ${constantPhrase(r.constant, r.unit)}: depletion of free inhibitor is negligible and the classic equations stand`;
    case 'enzyme-identified':
      return `[E]t is identified (${constantPhrase(r.et, r.unit)}) and the tight-binding fit improves on the classic ${r.mechanism} model (${boundaryP(r.p)})`;
    case 'enzyme-not-identifiable':
      return `[E]t is not identifiable from these data (${r.intervalClosed ? 'the tight-binding fit does not improve on the classic one' : 'its profile interval is open'}): measure the active-site concentration, or extend [I] around [E]t; the classic call stands`;
    case 'partial-improves':
      return `partial ${r.mechanism} improves on full ${r.mechanism} inhibition (${boundaryP(r.p)}) and on the best model so far (AICc lower by ${r.aiccGain.toFixed(1)}); the rate levels off at a residual activity, ${betaPhrase(r.beta)}`;
    case 'partial-mixed-beats-simpler':
      return `partial mixed improves on each simpler partial model at p < ${r.level}`;
    case 'partial-rival':
      return `${r.rival} stays within ${r.delta} AICc units: the partial mechanism is not settled`;
    case 'partial-mixed-not-better':
      return `partial mixed does not improve on ${r.model} at p < ${r.level}`;
    case 'partial-not-supported': {
      const why =
        r.why === 'no-improvement'
          ? `the best partial model (${r.model}) does not improve on full inhibition at p < ${r.level}`
          : r.why === 'residual-zero'
            ? 'the residual activity is consistent with zero'
            : `its AICc is not lower by ${r.margin} than that of the best model so far`;
      return `partial inhibition is not supported: ${why}`;
    }
  }
}

export function familyAdvice(a: Advice & { code: 'give-enzyme' | 'partial-plateau' }): string {
  if (a.code === 'partial-plateau') return 'extend [I] to well above Ki to measure the plateau of the residual activity, and replicate';
  const k = a.constant;
  return `${k.name} (${withUnit(k.value!, a.unit)}) lies below the lowest [I] tested: if the enzyme concentration is within tenfold of it, tight binding biases ${k.name}; give [E]t (--enzyme CONC, an enzyme column, or --enzyme fit)`;
}

export function familyHeadline(h: VerdictHeadline & { code: 'tight-binding' | 'partial' }): string {
  const lead = h.decisive ? 'The data support' : 'Best supported, not firm:';
  if (h.code === 'tight-binding') return `${lead} tight-binding ${h.lean ? `mixed, leaning ${h.lean}` : h.mechanism} inhibition, ${constantPhrase(h.constant, h.unit)}.`;
  return `${lead} partial ${h.mechanism} inhibition, ${constantPhrase(h.constant, h.unit)}${h.mechanism === 'competitive' ? '' : `, residual activity ${betaPhrase(h.beta)}`}.`;
}
