/**
 * Which family describes the data: the classic rapid-equilibrium equations, tight binding
 * (Morrison 1969) or partial (hyperbolic) inhibition (Segel 1975, ch. 4). It takes the classic
 * verdict (src/evidence/verdict/verdict.ts, unchanged) and the fits of the other families, and returns
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
import type { Mechanism, ModelFamily } from '../../models/types.js';
import { RIVAL_DELTA, type Verdict } from '../verdict/verdict.js';
import type { Advice, ConstantFinding, VerdictHeadline, VerdictReason } from '../verdict/verdict-findings.js';
import type { Caveat } from '../verdict/caveat.js';
import type { ParameterEstimate } from '../intervals/wald-estimates.js';
import { chisqSurvival } from '../../stats/distributions.js';
import { BETA_FLOOR } from '../intervals/profile-support.js';

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
  reasons: VerdictReason[];
  suggestions: Advice[];
  /** the headline when another family wins (the classic headline otherwise) */
  headline: VerdictHeadline;
}


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

/** The constant as a finding: value and best interval (profile, else Wald); null when not estimated. */
function constantOf(e: ParameterEstimate | undefined): ConstantFinding | null {
  return e ? { name: e.name, value: e.value, interval: e.profile ?? e.wald ?? null } : null;
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
      call.suggestions.push({ code: 'give-enzyme', constant: constantOf(k)!, unit: u });
  }

  const tight = input.tight;
  if (tight) {
    const v = tight.verdict;
    const winner = tight.models.find((m) => m.mechanism === v.mechanism);
    const k = leadConstant(winner);
    if (v.outcome === 'no-inhibition' || !winner || !k || k.value === null) {
      call.reasons.push({ code: 'tight-no-inhibition' });
    } else if (tight.enzyme === 'given') {
      const e = tight.enzymeLevel ?? 0;
      if (e * TIGHT_BINDING_RATIO >= k.value) {
        call = tightCall(v, winner, k, u, { code: 'enzyme-near-constant', enzyme: e, unit: u, ratio: TIGHT_BINDING_RATIO, name: k.name });
        bestAicc = winner.aicc;
      } else {
        call.reasons.push({ code: 'enzyme-negligible', enzyme: e, unit: u, ratio: TIGHT_BINDING_RATIO, constant: constantOf(k) });
      }
    } else {
      const et = estimate(winner, 'Et');
      const test = tight.againstClassic?.[winner.mechanism];
      const etInterval = et?.profile ?? et?.wald;
      const closed = !!etInterval && etInterval[0] !== null && etInterval[1] !== null && etInterval[0] > 0;
      if (closed && test && test.p < FAMILY_LEVEL) {
        call = tightCall(v, winner, k, u, { code: 'enzyme-identified', et: constantOf(et), unit: u, mechanism: winner.mechanism, p: test.p });
        bestAicc = winner.aicc;
      } else {
        call.reasons.push({ code: 'enzyme-not-identifiable', intervalClosed: closed });
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
      const betaFinding = best.mechanism === 'competitive' ? null : constantOf(beta);
      const decisive = pick.decisive && partial.blocking.length === 0;
      call = {
        family: 'partial',
        model: best.id,
        mechanism: best.mechanism,
        decisive,
        reasons: [
          { code: 'partial-improves', mechanism: best.mechanism, p: full.p, aiccGain: bestAicc - best.aicc, beta: betaFinding },
          ...pick.reasons,
          ...partial.blocking.map((caveat) => ({ code: 'caveat' as const, caveat })),
        ],
        suggestions: decisive ? [] : [{ code: 'partial-plateau' }],
        headline: { code: 'partial', decisive, mechanism: best.mechanism, constant: constantOf(k), beta: betaFinding, unit: u },
      };
    } else if (best) {
      const why = !full || !(full.p < FAMILY_LEVEL) ? 'no-improvement' : !betaExcludesZero ? 'residual-zero' : 'aicc-margin';
      call.reasons.push({ code: 'partial-not-supported', why, model: best.id, level: FAMILY_LEVEL, margin: PARTIAL_AICC_MARGIN });
    }
  }
  return call;
}

function tightCall(v: Verdict, winner: FamilyModelEvidence, k: ParameterEstimate, u: string, why: VerdictReason): FamilyCall {
  const lean = v.outcome === 'mixed-lean' ? v.lean : undefined;
  return {
    family: 'tight-binding',
    model: winner.id,
    mechanism: v.mechanism,
    decisive: v.decisive,
    reasons: [why, ...v.reasons.map((reason) => ({ code: 'within-family' as const, models: 'tight-binding' as const, reason }))],
    suggestions: [...v.suggestions],
    headline: { code: 'tight-binding', decisive: v.decisive, mechanism: v.mechanism, ...(lean ? { lean } : {}), constant: constantOf(k), unit: u },
  };
}

/**
 * The mechanism inside the partial family, by the classic parsimony rule: partial mixed only when it
 * has the lowest AICc and rejects each simpler partial model (partial noncompetitive: Kiu = Ki;
 * partial competitive: beta = 1) at FAMILY_LEVEL; otherwise the better simpler model, not decisive
 * when the other simpler one stays within 4 AICc units (Burnham & Anderson 2002, sec. 2.6).
 */
export function partialWinner(ranked: readonly FamilyModelEvidence[], partial: PartialEvidence): { model: FamilyModelEvidence; decisive: boolean; reasons: VerdictReason[] } {
  const simpler = ranked.filter((m) => m.mechanism !== 'mixed');
  const mixed = ranked.find((m) => m.mechanism === 'mixed');
  const kept = simpler.filter((m) => !(mixed && mixed.aicc < m.aicc && (partial.withinFamily[m.id]?.p ?? 1) < FAMILY_LEVEL));
  if (kept.length === 0 && mixed) return { model: mixed, decisive: true, reasons: [{ code: 'partial-mixed-beats-simpler', level: FAMILY_LEVEL }] };
  const model = kept[0] ?? ranked[0];
  // a simpler partial model within RIVAL_DELTA stays a rival, as a classic mechanism does
  const rival = kept.find((m) => m !== model && m.aicc - model.aicc < RIVAL_DELTA);
  if (rival) return { model, decisive: false, reasons: [{ code: 'partial-rival', rival: rival.id, delta: RIVAL_DELTA }] };
  return { model, decisive: true, reasons: mixed && model !== mixed ? [{ code: 'partial-mixed-not-better', model: model.id, level: FAMILY_LEVEL }] : [] };
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
