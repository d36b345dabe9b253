/**
 * Which family describes the data: the classic rapid-equilibrium equations, tight binding
 * (Morrison 1969) or partial (hyperbolic) inhibition (Segel 1975, ch. 4). It takes the classic
 * verdict (src/evidence/verdict.ts, unchanged) and the fits of the other families, and returns
 * the family with its reasons. The classic call is returned untouched unless another family wins.
 *
 * Rule (docs/decisions/family-selection.md; the thresholds are the constants below):
 *  - tight binding, [E]t given: the tight-binding family is the physically right model whenever
 *    [E]t is known, but it changes the answer only when [E]t is within a factor
 *    TIGHT_BINDING_RATIO of the inhibition constant (Ki_app <= [E]t / TIGHT_BINDING_RATIO, the
 *    "within about tenfold" of Copeland 2013, ch. 7). Then the call is the tight-binding verdict
 *    (the same rule as the classic one, on the tight-binding models); otherwise the classic call
 *    stands and the reason says the correction is negligible.
 *  - tight binding, [E]t fitted: as above, and [E]t must be identified: its profile interval closed
 *    on both sides, and the fitted model better than its classic counterpart (the limit Et -> 0, a
 *    boundary) by the chi-bar-square test at FAMILY_LEVEL. Otherwise the reason says that [E]t is
 *    not identifiable from these data and the classic call stands.
 *  - partial: the best partial model (by AICc) must beat its full-inhibition counterpart (beta -> 0,
 *    or Kiu -> infinity for partial competitive, a boundary: p = 1/2 P(chi2_1 > LR), Self & Liang
 *    1987, case 5) at FAMILY_LEVEL, have an AICc lower by at least PARTIAL_AICC_MARGIN than the best
 *    model of the family chosen so far, and a beta interval that excludes full inhibition
 *    (profile low end above BETA_FLOOR).
 */
import type { Mechanism, ModelFamily } from '../models/types.js';
import type { Verdict } from './verdict.js';
import type { Advice, VerdictHeadline, VerdictReason } from './verdict-findings.js';
import type { Caveat } from './caveat.js';
import type { ParameterEstimate } from './wald-estimates.js';
import { chisqSurvival } from '../stats/distributions.js';
import { BETA_FLOOR } from './profile-support.js';

export const TIGHT_BINDING_RATIO = 10;
export const FAMILY_LEVEL = 0.01;
export const PARTIAL_AICC_MARGIN = 2;

/** The view of one fitted model this module needs. */
export interface FamilyModelEvidence {
  id: string;
  family: ModelFamily;
  mechanism: Mechanism;
  aicc: number;
  logLik: number;
  converged: boolean;
  estimates: readonly ParameterEstimate[];
}

export interface TightBindingEvidence {
  enzyme: 'given' | 'fitted';
  /** the largest [E]t of the table (given), in inhibitor units */
  enzymeLevel?: number;
  models: readonly FamilyModelEvidence[];
  /** the verdict of the tight-binding models (classic rule applied to them) */
  verdict: Verdict;
  /** boundary test of each Et-fitted model against its classic counterpart, by mechanism */
  againstClassic?: Partial<Record<Mechanism, BoundaryTest>>;
}

export interface PartialEvidence {
  models: readonly FamilyModelEvidence[];
  /** boundary test of each partial model against its full-inhibition counterpart, by partial model id */
  againstFull: Record<string, BoundaryTest>;
  /** interior tests inside the family: partial noncompetitive and partial competitive in partial mixed */
  withinFamily: Record<string, BoundaryTest>;
  /** blocking caveats on the best partial model's own fit (residual checks, design) */
  blocking: readonly Caveat[];
}

export interface BoundaryTest {
  lr: number;
  p: number;
  /** true: the restriction is at the edge of the parameter space (chi-bar-square); false: interior (chi2_1) */
  boundary: boolean;
}

/** LR test of a one-parameter restriction; at a boundary the 50:50 chi-bar-square (Self & Liang 1987). */
export function oneParameterTest(logLikRestricted: number, logLikFull: number, boundary: boolean): BoundaryTest {
  const lr = Math.max(0, 2 * (logLikFull - logLikRestricted));
  const tail = chisqSurvival(lr, 1);
  return { lr, p: boundary ? (lr > 0 ? 0.5 * tail : 1) : tail, boundary };
}

export interface FamilyCall {
  family: ModelFamily;
  /** registry id of the model whose constants are reported */
  model: string;
  mechanism: Mechanism | null;
  decisive: boolean;
  /** the comparison's reasons (its own still worded here: `family-note`) */
  reasons: VerdictReason[];
  suggestions: Advice[];
  /** the headline when another family wins (the classic headline otherwise) */
  headline: VerdictHeadline;
}

const note = (text: string): { code: 'family-note'; text: string } => ({ code: 'family-note', text });

interface FamilyInput {
  classic: Verdict;
  classicModels: readonly FamilyModelEvidence[];
  tight?: TightBindingEvidence;
  partial?: PartialEvidence;
  /** lowest non-zero [I] tested, and its unit, for the hint to give [E]t */
  lowestInhibitor: number;
  inhibitorUnit: string;
}

function estimate(m: FamilyModelEvidence | undefined, name: string): ParameterEstimate | undefined {
  return m?.estimates.find((e) => e.name === name);
}

function fmt(x: number | null | undefined): string {
  return x === null || x === undefined || !Number.isFinite(x) ? '?' : Number(x.toPrecision(3)).toString();
}

/** "Ki = 2.1 nM [1.8, 2.5]" from the best interval computed. */
function constantPhrase(e: ParameterEstimate | undefined, unit: string): string {
  if (!e || e.value === null) return e ? `${e.name} not detected` : '';
  const ci = e.profile ?? e.wald;
  const u = unit ? ` ${unit}` : '';
  return `${e.name} = ${fmt(e.value)}${u}${ci ? ` [${fmt(ci[0])}, ${fmt(ci[1])}]` : ''}`;
}

function leadConstant(m: FamilyModelEvidence | undefined): ParameterEstimate | undefined {
  return estimate(m, 'Ki')?.detected ? estimate(m, 'Ki') : estimate(m, 'Kiu');
}

const idOfClassic = (m: Mechanism | null) => m ?? 'none';

export function compareFamilies(input: FamilyInput): FamilyCall {
  const classicModel = input.classicModels.find((m) => m.mechanism === input.classic.mechanism);
  let call: FamilyCall = {
    family: 'classic',
    model: idOfClassic(input.classic.mechanism),
    mechanism: input.classic.mechanism,
    decisive: input.classic.decisive,
    reasons: [],
    suggestions: [],
    headline: input.classic.headline,
  };
  let bestAicc = Math.min(...input.classicModels.filter((m) => m.converged).map((m) => m.aicc));
  const u = input.inhibitorUnit;

  if (!input.tight && input.classic.mechanism && input.classic.mechanism !== 'none') {
    const k = leadConstant(classicModel);
    if (k && k.value !== null && k.value < input.lowestInhibitor)
      call.suggestions.push(note(
        `${k.name} (${fmt(k.value)}${u ? ` ${u}` : ''}) lies below the lowest [I] tested: if the enzyme concentration is within tenfold of it, tight binding biases ${k.name}; give [E]t (--enzyme CONC, an enzyme column, or --enzyme fit)`,
      ));
  }

  const tight = input.tight;
  if (tight) {
    const v = tight.verdict;
    const winner = tight.models.find((m) => m.mechanism === v.mechanism);
    const k = leadConstant(winner);
    if (v.outcome === 'no-inhibition' || !winner || !k || k.value === null) {
      call.reasons.push(note('tight-binding family: no inhibition detected, so the enzyme concentration does not matter'));
    } else if (tight.enzyme === 'given') {
      const e = tight.enzymeLevel ?? 0;
      if (e * TIGHT_BINDING_RATIO >= k.value) {
        call = tightCall(v, winner, k, u, `[E]t (${fmt(e)}${u ? ` ${u}` : ''}) is within ${TIGHT_BINDING_RATIO}-fold of ${k.name}: the inhibitor bound depletes the free inhibitor, so the tight-binding (Morrison) equations apply`);
        bestAicc = winner.aicc;
      } else {
        call.reasons.push(note(
          `[E]t (${fmt(e)}${u ? ` ${u}` : ''}) is below 1/${TIGHT_BINDING_RATIO} of the tight-binding ${constantPhrase(k, u)}: depletion of free inhibitor is negligible and the classic equations stand`,
        ));
      }
    } else {
      const et = estimate(winner, 'Et');
      const test = tight.againstClassic?.[winner.mechanism];
      const etInterval = et?.profile ?? et?.wald;
      const closed = !!etInterval && etInterval[0] !== null && etInterval[1] !== null && etInterval[0] > 0;
      if (closed && test && test.p < FAMILY_LEVEL) {
        call = tightCall(v, winner, k, u, `[E]t is identified (${constantPhrase(et, u)}) and the tight-binding fit improves on the classic ${winner.mechanism} model (p ${test.p < 0.001 ? '< 0.001' : `= ${fmt(test.p)}`}, boundary test)`);
        bestAicc = winner.aicc;
      } else {
        call.reasons.push(note(
          `[E]t is not identifiable from these data (${closed ? 'the tight-binding fit does not improve on the classic one' : 'its profile interval is open'}): measure the active-site concentration, or extend [I] around [E]t; the classic call stands`,
        ));
      }
    }
  }

  const partial = input.partial;
  if (partial) {
    const ranked = partial.models.filter((m) => m.converged && Number.isFinite(m.aicc)).sort((a, b) => a.aicc - b.aicc);
    const pick = ranked.length ? partialWinner(ranked, partial) : undefined;
    const best = pick?.model;
    const full = best ? partial.againstFull[best.id] : undefined;
    const beta = estimate(best, 'beta');
    // the parameter that separates partial from full inhibition must be pinned down by its profile:
    // beta's lower end above BETA_FLOOR, or (partial competitive) Kiu's upper end below the detection bound
    // (the Wald interval stands in when profiles are switched off)
    const kiuEstimate = estimate(best, 'Kiu');
    const kiuInterval = kiuEstimate?.profile ?? (kiuEstimate?.detected ? kiuEstimate.wald : null);
    const betaInterval = beta?.profile ?? beta?.wald;
    const betaExcludesZero =
      best?.mechanism === 'competitive' ? !!kiuInterval && kiuInterval[1] !== null : betaInterval ? betaInterval[0] !== null && betaInterval[0] > BETA_FLOOR : false;
    if (best && pick && full && full.p < FAMILY_LEVEL && best.aicc <= bestAicc - PARTIAL_AICC_MARGIN && betaExcludesZero) {
      const k = leadConstant(best);
      const betaText = best.mechanism === 'competitive' ? 'beta = 1 (the complex turns over at full speed)' : constantPhrase(beta, '');
      const decisive = pick.decisive && partial.blocking.length === 0;
      call = {
        family: 'partial',
        model: best.id,
        mechanism: best.mechanism,
        decisive,
        reasons: [
          note(`partial ${best.mechanism} improves on full ${best.mechanism} inhibition (p ${full.p < 0.001 ? '< 0.001' : `= ${fmt(full.p)}`}, boundary test) and on the best model so far (AICc lower by ${(bestAicc - best.aicc).toFixed(1)}); the rate levels off at a residual activity, ${betaText}`),
          ...pick.reasons.map(note),
          ...partial.blocking.map((caveat) => ({ code: 'caveat' as const, caveat })),
        ],
        suggestions: decisive ? [] : [note('extend [I] to well above Ki to measure the plateau of the residual activity, and replicate')],
        headline: note(`${decisive ? 'The data support' : 'Best supported, not firm:'} partial ${best.mechanism} inhibition, ${constantPhrase(k, u)}${best.mechanism === 'competitive' ? '' : `, residual activity ${betaText}`}.`),
      };
    } else if (best) {
      call.reasons.push(note(
        `partial inhibition is not supported: ${!full || !(full.p < FAMILY_LEVEL) ? `the best partial model (${best.id}) does not improve on full inhibition at p < ${FAMILY_LEVEL}` : !betaExcludesZero ? 'the residual activity is consistent with zero' : `its AICc is not lower by ${PARTIAL_AICC_MARGIN} than that of the best model so far`}`,
      ));
    }
  }
  return call;
}

function tightCall(v: Verdict, winner: FamilyModelEvidence, k: ParameterEstimate, u: string, why: string): FamilyCall {
  const what = v.outcome === 'mixed-lean' ? `mixed, leaning ${v.lean}` : v.mechanism;
  return {
    family: 'tight-binding',
    model: winner.id,
    mechanism: v.mechanism,
    decisive: v.decisive,
    reasons: [note(why), ...v.reasons.map((reason) => ({ code: 'within-family' as const, models: 'tight-binding' as const, reason }))],
    suggestions: [...v.suggestions],
    headline: note(`${v.decisive ? 'The data support' : 'Best supported, not firm:'} tight-binding ${what} inhibition, ${constantPhrase(k, u)}.`),
  };
}

/**
 * The mechanism inside the partial family, by the classic parsimony rule: partial mixed only when it
 * has the lowest AICc and rejects each simpler partial model (partial noncompetitive: Kiu = Ki;
 * partial competitive: beta = 1) at FAMILY_LEVEL; otherwise the better simpler model, not decisive
 * when the other simpler one stays within 4 AICc units (Burnham & Anderson 2002, sec. 2.6).
 */
export function partialWinner(ranked: readonly FamilyModelEvidence[], partial: PartialEvidence): { model: FamilyModelEvidence; decisive: boolean; reasons: string[] } {
  const simpler = ranked.filter((m) => m.mechanism !== 'mixed');
  const mixed = ranked.find((m) => m.mechanism === 'mixed');
  const kept = simpler.filter((m) => !(mixed && mixed.aicc < m.aicc && (partial.withinFamily[m.id]?.p ?? 1) < FAMILY_LEVEL));
  if (kept.length === 0 && mixed) return { model: mixed, decisive: true, reasons: [`partial mixed improves on each simpler partial model at p < ${FAMILY_LEVEL}`] };
  const model = kept[0] ?? ranked[0];
  const rival = kept.find((m) => m !== model && m.aicc - model.aicc < 4);
  if (rival) return { model, decisive: false, reasons: [`${rival.id} stays within 4 AICc units: the partial mechanism is not settled`] };
  return { model, decisive: true, reasons: mixed && model !== mixed ? [`partial mixed does not improve on ${model.id} at p < ${FAMILY_LEVEL}`] : [] };
}

/**
 * The verdict with the family call applied: the classic verdict itself (same object) when the
 * family is classic; otherwise the other family's mechanism, headline and reasons, the classic
 * reasons kept after them for comparison.
 */
export function verdictWithFamily(classic: Verdict, call: FamilyCall, familyVerdict?: Verdict): Verdict {
  if (call.family === 'classic') return classic;
  const base = familyVerdict ?? classic;
  const outcome = call.family === 'partial' ? (call.decisive ? 'decisive' : 'undecided') : base.outcome;
  return {
    ...base,
    outcome,
    mechanism: call.mechanism,
    decisive: call.decisive,
    candidates: call.mechanism ? [call.mechanism, ...base.candidates.filter((m) => m !== call.mechanism)] : base.candidates,
    headline: call.headline,
    reasons: [...call.reasons, ...classic.reasons.map((reason) => ({ code: 'within-family' as const, models: 'classic' as const, reason }))],
    suggestions: [...call.suggestions],
    ...(call.family === 'partial' ? { lean: undefined } : {}),
  };
}
