/**
 * The verdict: an honest summary of which mechanism the data support, and how firmly.
 *
 * Rule (documented in DEVELOPERS.md, "The verdict rule"):
 *  1. Inhibition detected? If "no inhibition" ranks first by AICc, or no inhibited model improves
 *     on it by the nested test at p < 0.05, the outcome is `no-inhibition`.
 *  2. Parsimony within the nesting: mixed is preferred over the best three-parameter model only if
 *     it has the lower AICc and the nested test rejects that model at p < MIXED_LEVEL. Otherwise the
 *     best three-parameter model stands.
 *  3. Rivals: a three-parameter model other than the winner whose AICc is within RIVAL_DELTA of the
 *     winner's keeps substantial support (Burnham & Anderson 2002, sec. 2.6: a difference of 4-7
 *     means considerably less support, 0-2 substantial support for both). Any rival makes the
 *     outcome `undecided`, with the rivals named and the experiment that would separate them.
 *  4. Exclusion: a three-parameter winner is firm only when the data reject the nearest mixed
 *     alternative it could hide (src/evidence/selection/alpha-exclusion.ts: for competitive, alpha <= ALPHA_FAR;
 *     for uncompetitive, alpha >= 1 / ALPHA_FAR; for noncompetitive, alpha outside the band of
 *     NONCOMPETITIVE_BAND around 1; one-sided profile tests at EXCLUSION_LEVEL). Failing to reject
 *     mixed is absence of evidence: without the exclusion the outcome is `undecided` and says which
 *     component is not excluded.
 *  5. A mixed winner is described by its alpha interval: entirely above 1, "mixed, leaning
 *     competitive"; entirely below 1, "mixed, leaning uncompetitive"; containing 1 is reported as
 *     undecided (noncompetitive not excluded).
 *  6. Anything that undermines the fit itself (no convergence, systematic residuals, design
 *     shortfalls that bear on the distinction, a clearly better error model) is passed in as a
 *     `Caveat`; a caveat marked `blocking` turns a decisive outcome into `undecided`.
 * The levels were chosen by simulation over sparse and generous designs, well-placed and misplaced
 * [I] ranges and 2-10% noise (bench/verdict-space-bench.mjs; docs/decisions/firm-calls-exclude-alternatives.md).
 * `decisive` is true only for the outcomes `decisive` and `mixed-lean`.
 *
 * The verdict is data: its headline, reasons and advice are codes with their numbers
 * (src/evidence/verdict/verdict-findings.ts), worded by src/wording/verdict-words.ts.
 */
import type { Mechanism } from '../../models/types.js';
import type { NestedComparison } from '../selection/nested-comparisons.js';
export type { Caveat } from './caveat.js';
import { ACTIVATION_CODE, hasHeadline, type Caveat } from './caveat.js';
import type { AlphaExclusions } from '../selection/alpha-exclusion.js';
import type { Advice, ExclusionFinding, MechanismPair, VerdictHeadline, VerdictReason } from './verdict-findings.js';
export type { ExclusionFinding } from './verdict-findings.js';

/** Level of the test for inhibition against no inhibition (common practice). */
export const INHIBITION_LEVEL = 0.05;
/** Level at which mixed must beat the best three-parameter model (chosen by simulation). */
export const MIXED_LEVEL = 0.001;
/** AICc difference below which a rival keeps substantial support (Burnham & Anderson 2002). */
export const RIVAL_DELTA = 4;

export type VerdictOutcome = 'decisive' | 'mixed-lean' | 'undecided' | 'no-inhibition';

export interface RankedModelEvidence {
  mechanism: Mechanism;
  aicc: number;
  weight: number;
  converged: boolean;
}


/** A model that reproduces every rate exactly (src/evidence/checks/exact-fit.ts), fewest parameters first. */
export interface ExactFitEvidence {
  mechanism: Mechanism;
  p: number;
  relativeSse: number;
}

interface VerdictInput {
  models: readonly RankedModelEvidence[];
  nested: readonly NestedComparison[];
  /** interval for alpha of the mixed model (profile if available, else Wald); null if undefined */
  alphaInterval: [number | null, number | null] | null;
  /**
   * one-sided profile tests on alpha of the mixed fit (src/evidence/selection/alpha-exclusion.ts); without
   * them (mixed not fitted) no three-parameter call can be firm
   */
  exclusions?: AlphaExclusions | null | (() => AlphaExclusions | null);
  caveats?: readonly Caveat[];
  /** models that fit the rates exactly (noise-free data), fewest parameters first */
  exactFits?: readonly ExactFitEvidence[];
  /** the point estimate of alpha of the mixed fit (read only for exact data) */
  alphaEstimate?: number | null;
  /** significance level of the test for inhibition against none; default INHIBITION_LEVEL */
  testLevel?: number;
  /** significance level for preferring mixed over a three-parameter model; default MIXED_LEVEL */
  mixedLevel?: number;
  /** AICc difference below which a rival keeps substantial support; default RIVAL_DELTA */
  rivalDelta?: number;
  /** reasons that lead every verdict (how the error model was chosen) */
  leadingReasons?: readonly VerdictReason[];
  /** for a no-inhibition call on noisy data: how far the tested [I] reached (src/evidence/checks/detection-limit.ts) */
  inhibitorReach?: () => VerdictReason;
}

export interface Verdict {
  outcome: VerdictOutcome;
  /** the best-supported mechanism (null only when nothing converged) */
  mechanism: Mechanism | null;
  /** for mixed-lean: which pure mechanism it leans to */
  lean?: 'competitive' | 'uncompetitive';
  decisive: boolean;
  /** mechanisms that remain plausible (the winner first) */
  candidates: Mechanism[];
  /** the one sentence that leads (worded by src/wording/verdict-words.ts) */
  headline: VerdictHeadline;
  reasons: VerdictReason[];
  /** experiments or checks that would settle what is open */
  suggestions: Advice[];
  /** for a three-parameter winner: the test against the mixed alternative it could hide */
  exclusion?: ExclusionFinding;
  /** the caveats the verdict read, by code, and whether each blocked a firm call */
  caveats?: Array<{ code: string; blocking: boolean }>;
}

const THREE_PARAM: Mechanism[] = ['competitive', 'uncompetitive', 'noncompetitive'];

function pairKey(a: Mechanism, b: Mechanism): MechanismPair | undefined {
  const key = [a, b].sort().join('|');
  return SEPARABLE.includes(key as MechanismPair) ? (key as MechanismPair) : undefined;
}

const SEPARABLE: readonly MechanismPair[] = [
  'competitive|noncompetitive',
  'competitive|uncompetitive',
  'noncompetitive|uncompetitive',
  'competitive|mixed',
  'mixed|uncompetitive',
  'mixed|noncompetitive',
];

/** The verdict, built once from all the evidence; the leading reasons (error-model choice) come first. */
export function decideVerdict(input: VerdictInput): Verdict {
  const v = verdictOf(input);
  return input.leadingReasons?.length ? { ...v, reasons: [...input.leadingReasons, ...v.reasons] } : v;
}

function verdictOf(input: VerdictInput): Verdict {
  const level = input.testLevel ?? INHIBITION_LEVEL;
  const mixedLevel = input.mixedLevel ?? MIXED_LEVEL;
  const rivalDelta = input.rivalDelta ?? RIVAL_DELTA;
  const caveats = input.caveats ?? [];
  const by = new Map(input.models.map((m) => [m.mechanism, m]));
  const test = (a: Mechanism, b: Mechanism) => input.nested.find((c) => c.simpler === a && c.fuller === b);
  const reasons: VerdictReason[] = [];
  const suggestions: Advice[] = [];
  const usable = input.models.filter((m) => m.converged && Number.isFinite(m.aicc));
  if (usable.length === 0) {
    return {
      outcome: 'undecided',
      mechanism: null,
      decisive: false,
      candidates: [],
      headline: { code: 'no-fit' },
      reasons: [{ code: 'no-fit-converged' }],
      suggestions: [{ code: 'check-units' }],
    };
  }
  const bestOverall = [...usable].sort((a, b) => a.aicc - b.aicc)[0];
  const exact = (input.exactFits ?? []).filter((e) => usable.some((m) => m.mechanism === e.mechanism));
  if (exact.length > 0) return exactVerdict(exact, caveats, input.alphaEstimate ?? null);

  // 1. Is inhibition detected at all?
  const none = by.get('none');
  const inhibitionTests = input.nested.filter((c) => c.simpler === 'none');
  const strongest = inhibitionTests.reduce<NestedComparison | undefined>((acc, c) => (!acc || c.p < acc.p ? c : acc), undefined);
  if (bestOverall.mechanism === 'none' || (strongest && !(strongest.p < level))) {
    reasons.push(
      bestOverall.mechanism === 'none' ? { code: 'none-ranks-first' } : { code: 'inhibition-not-significant', best: strongest!.fuller, p: strongest!.p },
    );
    const activation = caveats.some((c) => c.code === ACTIVATION_CODE);
    if (!activation) suggestions.push({ code: 'test-higher-inhibitor' });
    addCaveats(caveats, reasons, suggestions, false);
    if (input.inhibitorReach) reasons.push(input.inhibitorReach());
    return {
      outcome: 'no-inhibition',
      mechanism: 'none',
      decisive: false,
      candidates: ['none'],
      headline: { code: 'no-inhibition', activation },
      reasons,
      suggestions,
    };
  }

  // 2. Best three-parameter model, then mixed only if it earns its extra constant.
  const three = usable.filter((m) => THREE_PARAM.includes(m.mechanism)).sort((a, b) => a.aicc - b.aicc);
  const mixedFit = usable.find((m) => m.mechanism === 'mixed');
  let winner: RankedModelEvidence;
  if (three.length === 0) {
    winner = mixedFit ?? bestOverall;
  } else {
    const best3 = three[0];
    const vsMixed = test(best3.mechanism, 'mixed');
    if (mixedFit && vsMixed && mixedFit.aicc < best3.aicc && vsMixed.p < mixedLevel) {
      winner = mixedFit;
      reasons.push({ code: 'mixed-earns-constant', against: best3.mechanism, p: vsMixed.p, aiccGain: best3.aicc - mixedFit.aicc });
    } else {
      winner = best3;
      if (mixedFit && vsMixed) reasons.push({ code: 'mixed-not-supported', against: best3.mechanism, p: vsMixed.p });
    }
  }

  // 3. Rivals among the three-parameter models (non-nested alternatives).
  const rivals =
    winner.mechanism === 'mixed'
      ? []
      : three.filter((m) => m.mechanism !== winner.mechanism && m.aicc - winner.aicc < rivalDelta);
  for (const m of three) {
    if (m.mechanism === winner.mechanism) continue;
    reasons.push({ code: 'aicc-gap', mechanism: m.mechanism, winner: winner.mechanism, gap: m.aicc - winner.aicc, rival: m.aicc - winner.aicc < rivalDelta });
  }

  let outcome: VerdictOutcome = 'decisive';
  let lean: 'competitive' | 'uncompetitive' | undefined;
  const candidates: Mechanism[] = [winner.mechanism, ...rivals.map((r) => r.mechanism)];
  if (rivals.length > 0) {
    outcome = 'undecided';
    for (const r of rivals) {
      const pair = pairKey(winner.mechanism, r.mechanism);
      if (pair) addAdvice(suggestions, { code: 'separate', pair });
    }
  }

  // 4. A three-parameter winner must exclude the mixed alternative it could hide.
  let exclusion: ExclusionFinding | undefined;
  if (winner.mechanism !== 'mixed' && THREE_PARAM.includes(winner.mechanism)) {
    // computed only here, when a three-parameter winner needs them (four constrained refits)
    const tests = typeof input.exclusions === 'function' ? input.exclusions() : (input.exclusions ?? null);
    exclusion = exclusionFinding(winner.mechanism, tests);
    reasons.push({ code: 'exclusion', winner: winner.mechanism, finding: exclusion });
    if (!exclusion.excluded) {
      if (outcome === 'decisive') outcome = 'undecided';
      if (!candidates.includes('mixed')) candidates.push('mixed');
      const pair = exclusion.tests.length === 0 ? undefined : EXCLUSION_EXPERIMENT[exclusion.component];
      if (pair) addAdvice(suggestions, { code: 'separate', pair });
    }
  }

  // 5. Mixed: read the lean off alpha.
  if (winner.mechanism === 'mixed') {
    const [lo, hi] = input.alphaInterval ?? [null, null];
    if (lo !== null && lo > 1) {
      outcome = 'mixed-lean';
      lean = 'competitive';
      reasons.push({ code: 'alpha-above-one', lower: lo });
    } else if (hi !== null && hi < 1) {
      outcome = 'mixed-lean';
      lean = 'uncompetitive';
      reasons.push({ code: 'alpha-below-one', upper: hi });
    } else {
      outcome = 'undecided';
      candidates.push('noncompetitive');
      reasons.push({ code: 'alpha-includes-one' });
      suggestions.push({ code: 'separate', pair: 'mixed|noncompetitive' });
    }
  }

  if (!winner.converged) {
    outcome = 'undecided';
    reasons.push({ code: 'fit-not-converged', mechanism: winner.mechanism });
  }
  const detection = test('none', winner.mechanism);
  if (none && detection) reasons.unshift({ code: 'inhibition-detected', mechanism: winner.mechanism, p: detection.p });
  const blocked = addCaveats(caveats, reasons, suggestions, true);
  if (blocked && (outcome === 'decisive' || outcome === 'mixed-lean')) outcome = 'undecided';

  const decisive = outcome === 'decisive' || outcome === 'mixed-lean';
  // the headline of a blocking caveat leads: first one marked `leading` (the first thing to fix), else any
  const leadingCaveat = caveats.find((c) => c.blocking && hasHeadline(c) && c.leading) ?? caveats.find((c) => c.blocking && hasHeadline(c));
  return {
    outcome,
    mechanism: winner.mechanism,
    ...(lean ? { lean } : {}),
    decisive,
    candidates: [...new Set(candidates)],
    headline: leadingCaveat ? { code: 'caveat', caveat: leadingCaveat } : headline(outcome, winner.mechanism, lean, candidates, exclusion),
    reasons,
    suggestions,
    ...(exclusion ? { exclusion } : {}),
    caveats: caveatCodes(caveats),
  };
}

/** The experiment that would settle a component the exclusion step could not exclude. */
const EXCLUSION_EXPERIMENT: Record<ExclusionFinding['component'], MechanismPair> = {
  uncompetitive: 'competitive|mixed',
  competitive: 'mixed|uncompetitive',
  'unequal-constants': 'mixed|noncompetitive',
};

/** Advice once: a separating experiment already given is not repeated. */
function addAdvice(suggestions: Advice[], advice: Advice & { code: 'separate' }): void {
  if (!suggestions.some((s) => s.code === 'separate' && s.pair === advice.pair)) suggestions.push(advice);
}

function caveatCodes(caveats: readonly Caveat[]): Array<{ code: string; blocking: boolean }> {
  return caveats.map((c) => ({ code: c.code, blocking: c.blocking }));
}

/**
 * Noise-free data: the simplest model that reproduces the rates exactly is the call. No test or
 * interval means anything without noise, so the reasons say so; design caveats still apply.
 */
function exactVerdict(exact: readonly ExactFitEvidence[], caveats: readonly Caveat[], alpha: number | null): Verdict {
  const simplest = exact[0];
  const mechanism = simplest.mechanism;
  const reasons: VerdictReason[] = [{ code: 'exact-fit', mechanism, relativeSse: simplest.relativeSse }, { code: 'exact-no-tests' }];
  const suggestions: Advice[] = [];
  if (mechanism === 'none') {
    addCaveats(caveats, reasons, suggestions, false);
    return { outcome: 'no-inhibition', mechanism, decisive: false, candidates: ['none'], headline: { code: 'exact-no-inhibition' }, reasons, suggestions };
  }
  let outcome: VerdictOutcome = 'decisive';
  let lean: 'competitive' | 'uncompetitive' | undefined;
  if (mechanism === 'mixed') {
    if (alpha !== null && alpha > 1) lean = 'competitive';
    else if (alpha !== null && alpha < 1) lean = 'uncompetitive';
    outcome = lean ? 'mixed-lean' : 'undecided';
  }
  const blocked = addCaveats(caveats, reasons, suggestions, true);
  if (blocked) outcome = 'undecided';
  const decisive = outcome === 'decisive' || outcome === 'mixed-lean';
  return {
    outcome,
    mechanism,
    ...(lean ? { lean } : {}),
    decisive,
    candidates: [mechanism],
    headline: decisive ? { code: 'exact', mechanism, ...(lean ? { lean } : {}) } : headline(outcome, mechanism, lean, [mechanism]),
    reasons,
    suggestions,
  };
}

function exclusionFinding(winner: Mechanism, exclusions: AlphaExclusions | null): ExclusionFinding {
  const component = winner === 'competitive' ? 'uncompetitive' : winner === 'uncompetitive' ? 'competitive' : 'unequal-constants';
  if (!exclusions) return { component, excluded: false, tests: [] };
  const tests =
    winner === 'competitive' ? [exclusions.competitive] : winner === 'uncompetitive' ? [exclusions.uncompetitive] : [...exclusions.noncompetitive];
  return { component, excluded: tests.every((t) => t.excluded), tests };
}

/** Every caveat becomes a reason and offers its advice; returns true when one blocks a firm call. */
function addCaveats(caveats: readonly Caveat[], reasons: VerdictReason[], suggestions: Advice[], canBlock: boolean): boolean {
  let blocked = false;
  for (const c of caveats) {
    reasons.push({ code: 'caveat', caveat: c });
    suggestions.push({ code: 'caveat', caveat: c });
    if (c.blocking && canBlock) blocked = true;
  }
  return blocked;
}

function headline(outcome: VerdictOutcome, winner: Mechanism, lean: 'competitive' | 'uncompetitive' | undefined, candidates: Mechanism[], exclusion?: ExclusionFinding): VerdictHeadline {
  switch (outcome) {
    case 'decisive':
      return { code: 'decisive', mechanism: winner };
    case 'mixed-lean':
      return { code: 'mixed-lean', lean: lean! };
    case 'no-inhibition':
      return { code: 'no-inhibition', activation: false };
    case 'undecided': {
      const list = [...new Set(candidates)];
      if (exclusion && !exclusion.excluded && list.length === 2 && list[1] === 'mixed')
        return { code: 'hidden-component', winner, component: exclusion.component };
      return list.length > 1 ? { code: 'not-decided', winner, candidates: list } : { code: 'not-firm', winner };
    }
  }
}
