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
 *     alternative it could hide (src/evidence/alpha-exclusion.ts: for competitive, alpha <= ALPHA_FAR;
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
 */
import type { Mechanism } from '../models/types.js';
import type { NestedComparison } from './nested-comparisons.js';
export type { Caveat } from './caveat.js';
import { pPhrase, rounded } from '../text/format-number.js';
import { ACTIVATION_CODE, type Caveat } from './caveat.js';
import { ALPHA_FAR, EXCLUSION_LEVEL, NONCOMPETITIVE_BAND, type AlphaBoundTest, type AlphaExclusions } from './alpha-exclusion.js';

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


/** A model that reproduces every rate exactly (src/evidence/exact-fit.ts), fewest parameters first. */
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
   * one-sided profile tests on alpha of the mixed fit (src/evidence/alpha-exclusion.ts); without
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
  /** one plain sentence */
  headline: string;
  reasons: string[];
  /** experiments or checks that would settle what is open */
  suggestions: string[];
  /** for a three-parameter winner: the test against the mixed alternative it could hide */
  exclusion?: ExclusionFinding;
  /** the caveats the verdict read, by code, and whether each blocked a firm call */
  caveats?: Array<{ code: string; blocking: boolean }>;
}

/** What the exclusion step found for a three-parameter winner. */
export interface ExclusionFinding {
  /** the component that a firm call must exclude */
  component: 'uncompetitive' | 'competitive' | 'unequal-constants';
  /** true when every test behind the call rejected the mixed alternative */
  excluded: boolean;
  tests: AlphaBoundTest[];
}

const THREE_PARAM: Mechanism[] = ['competitive', 'uncompetitive', 'noncompetitive'];

const SEPARATING_EXPERIMENT: Record<string, string> = {
  'competitive|noncompetitive':
    'add substrate concentrations well above Km (up to 10 x Km): only there does a competitive inhibitor lose its effect',
  'competitive|uncompetitive':
    'cover substrate from about 0.2 x Km to 10 x Km: competitive inhibition fades at high [S], uncompetitive grows',
  'noncompetitive|uncompetitive':
    'add substrate concentrations below Km (down to about 0.2 x Km): only a noncompetitive inhibitor acts there too',
  'competitive|mixed': 'add substrate concentrations above 5 x Km to measure the effect on the enzyme-substrate complex',
  'mixed|uncompetitive': 'add substrate concentrations below Km to measure the effect on free enzyme',
  'mixed|noncompetitive': 'replicate the grid and extend [I] to several times Ki to pin down alpha',
};

function pairKey(a: Mechanism, b: Mechanism): string {
  return [a, b].sort().join('|');
}


function fmtD(d: number): string {
  return d.toFixed(1);
}

export function decideVerdict(input: VerdictInput): Verdict {
  const level = input.testLevel ?? INHIBITION_LEVEL;
  const mixedLevel = input.mixedLevel ?? MIXED_LEVEL;
  const rivalDelta = input.rivalDelta ?? RIVAL_DELTA;
  const caveats = input.caveats ?? [];
  const by = new Map(input.models.map((m) => [m.mechanism, m]));
  const test = (a: Mechanism, b: Mechanism) => input.nested.find((c) => c.simpler === a && c.fuller === b);
  const reasons: string[] = [];
  const suggestions: string[] = [];
  const usable = input.models.filter((m) => m.converged && Number.isFinite(m.aicc));
  if (usable.length === 0) {
    return {
      outcome: 'undecided',
      mechanism: null,
      decisive: false,
      candidates: [],
      headline: 'No model could be fitted to these data.',
      reasons: ['none of the five fits converged'],
      suggestions: ['check the rates and concentrations for unit or transcription errors'],
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
      bestOverall.mechanism === 'none'
        ? 'the model without inhibition has the lowest AICc'
        : `no inhibited model improves significantly on the model without inhibition (best: ${strongest!.fuller}, ${pPhrase(strongest!.p)})`,
    );
    const activation = caveats.some((c) => c.code === ACTIVATION_CODE);
    if (!activation) suggestions.push('test higher inhibitor concentrations (several times the expected Ki or the IC50)');
    addCaveats(caveats, reasons, suggestions, false);
    return {
      outcome: 'no-inhibition',
      mechanism: 'none',
      decisive: false,
      candidates: ['none'],
      headline: activation ? 'No inhibition: the rates rise with [I], as they would for an activator.' : 'No inhibition detected in the tested inhibitor range.',
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
      reasons.push(
        `mixed improves on the best three-parameter model, ${best3.mechanism} (${pPhrase(vsMixed.p)}, AICc lower by ${fmtD(best3.aicc - mixedFit.aicc)})`,
      );
    } else {
      winner = best3;
      if (mixedFit && vsMixed)
        reasons.push(`the extra constant of mixed is not supported against ${best3.mechanism} (${pPhrase(vsMixed.p)})`);
    }
  }

  // 3. Rivals among the three-parameter models (non-nested alternatives).
  const rivals =
    winner.mechanism === 'mixed'
      ? []
      : three.filter((m) => m.mechanism !== winner.mechanism && m.aicc - winner.aicc < rivalDelta);
  for (const m of three) {
    if (m.mechanism === winner.mechanism) continue;
    reasons.push(`${m.mechanism}: AICc ${fmtD(m.aicc - winner.aicc)} above ${winner.mechanism}${m.aicc - winner.aicc < rivalDelta ? ' (still substantially supported)' : ''}`);
  }

  let outcome: VerdictOutcome = 'decisive';
  let lean: 'competitive' | 'uncompetitive' | undefined;
  const candidates: Mechanism[] = [winner.mechanism, ...rivals.map((r) => r.mechanism)];
  if (rivals.length > 0) {
    outcome = 'undecided';
    for (const r of rivals) {
      const hint = SEPARATING_EXPERIMENT[pairKey(winner.mechanism, r.mechanism)];
      if (hint && !suggestions.includes(hint)) suggestions.push(hint);
    }
  }

  // 4. A three-parameter winner must exclude the mixed alternative it could hide.
  let exclusion: ExclusionFinding | undefined;
  if (winner.mechanism !== 'mixed' && THREE_PARAM.includes(winner.mechanism)) {
    // computed only here, when a three-parameter winner needs them (four constrained refits)
    const tests = typeof input.exclusions === 'function' ? input.exclusions() : (input.exclusions ?? null);
    exclusion = exclusionFinding(winner.mechanism, tests);
    const { phrase, hint } = exclusionWords(winner.mechanism, exclusion);
    reasons.push(phrase);
    if (!exclusion.excluded) {
      if (outcome === 'decisive') outcome = 'undecided';
      if (!candidates.includes('mixed')) candidates.push('mixed');
      if (hint && !suggestions.includes(hint)) suggestions.push(hint);
    }
  }

  // 5. Mixed: read the lean off alpha.
  if (winner.mechanism === 'mixed') {
    const [lo, hi] = input.alphaInterval ?? [null, null];
    if (lo !== null && lo > 1) {
      outcome = 'mixed-lean';
      lean = 'competitive';
      reasons.push(`the interval for alpha lies above 1 (from ${lo.toPrecision(3)}): the inhibitor prefers free enzyme`);
    } else if (hi !== null && hi < 1) {
      outcome = 'mixed-lean';
      lean = 'uncompetitive';
      reasons.push(`the interval for alpha lies below 1 (up to ${hi.toPrecision(3)}): the inhibitor prefers the enzyme-substrate complex`);
    } else {
      outcome = 'undecided';
      candidates.push('noncompetitive');
      reasons.push('the interval for alpha includes 1, so pure noncompetitive inhibition is not excluded');
      suggestions.push(SEPARATING_EXPERIMENT['mixed|noncompetitive']);
    }
  }

  if (!winner.converged) {
    outcome = 'undecided';
    reasons.push(`the ${winner.mechanism} fit did not converge`);
  }
  const detection = test('none', winner.mechanism);
  if (none && detection) reasons.unshift(`inhibition is detected: ${winner.mechanism} improves on no inhibition (${pPhrase(detection.p)})`);
  const blocked = addCaveats(caveats, reasons, suggestions, true);
  if (blocked && (outcome === 'decisive' || outcome === 'mixed-lean')) outcome = 'undecided';

  const decisive = outcome === 'decisive' || outcome === 'mixed-lean';
  // the sentence of a blocking caveat leads: first one marked `leading` (the first thing to fix), else any
  const leadingCaveat = caveats.find((c) => c.blocking && c.headline && c.leading) ?? caveats.find((c) => c.blocking && c.headline);
  return {
    outcome,
    mechanism: winner.mechanism,
    ...(lean ? { lean } : {}),
    decisive,
    candidates: [...new Set(candidates)],
    headline: leadingCaveat?.headline ?? headline(outcome, winner.mechanism, lean, candidates, exclusion),
    reasons,
    suggestions,
    ...(exclusion ? { exclusion } : {}),
    caveats: caveatCodes(caveats),
  };
}

/**
 * Noise-free data: the simplest model that reproduces the rates exactly is the call. No test or
 * interval means anything without noise, so the reasons say so; design caveats still apply.
 */
function caveatCodes(caveats: readonly Caveat[]): Array<{ code: string; blocking: boolean }> {
  return caveats.map((c) => ({ code: c.code, blocking: c.blocking }));
}

function exactVerdict(exact: readonly ExactFitEvidence[], caveats: readonly Caveat[], alpha: number | null): Verdict {
  const simplest = exact[0];
  const mechanism = simplest.mechanism;
  const reasons = [
    `the ${mechanism} fit reproduces every rate exactly (weighted SSE ${simplest.relativeSse.toExponential(1)} of the weighted sum of squared rates): the rates are noise-free (simulated or computed), and no model with fewer constants fits them exactly`,
    'without noise, p-values, intervals and residual checks describe rounding only; the call rests on which models fit exactly',
  ];
  const suggestions: string[] = [];
  if (mechanism === 'none') {
    addCaveats(caveats, reasons, suggestions, false);
    return { outcome: 'no-inhibition', mechanism, decisive: false, candidates: ['none'], headline: 'No inhibition: the rates follow the model without inhibition exactly.', reasons, suggestions };
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
    headline: decisive ? `The rates follow ${mechanism} inhibition${lean ? `, leaning ${lean},` : ''} exactly (noise-free data).` : headline(outcome, mechanism, lean, [mechanism]),
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

/** The reason sentence for the exclusion step, and the experiment that would settle it. */
function exclusionWords(winner: Mechanism, e: ExclusionFinding): { phrase: string; hint?: string } {
  if (e.tests.length === 0)
    return { phrase: `the mixed model was not fitted, so a hidden component of the ${winner} call cannot be excluded`, hint: undefined };
  const worst = e.tests.reduce((a, b) => (b.p > a.p ? b : a));
  const test = `one-sided profile test, ${pPhrase(worst.p)}; needed p < ${EXCLUSION_LEVEL}`;
  if (winner === 'competitive')
    return e.excluded
      ? { phrase: `binding to the enzyme-substrate complex is excluded down to ${ALPHA_FAR}-fold weaker than to free enzyme (alpha > ${ALPHA_FAR}; ${test})` }
      : {
          phrase: `a weak uncompetitive component is not excluded: alpha = ${ALPHA_FAR} (Kiu = ${ALPHA_FAR} x Ki) fits about as well (${test})`,
          hint: SEPARATING_EXPERIMENT['competitive|mixed'],
        };
  if (winner === 'uncompetitive')
    return e.excluded
      ? { phrase: `binding to free enzyme is excluded down to ${ALPHA_FAR}-fold weaker than to the enzyme-substrate complex (alpha < ${rounded(1 / ALPHA_FAR, 3)}; ${test})` }
      : {
          phrase: `a weak competitive component is not excluded: alpha = ${rounded(1 / ALPHA_FAR, 3)} (Ki = ${ALPHA_FAR} x Kiu) fits about as well (${test})`,
          hint: SEPARATING_EXPERIMENT['mixed|uncompetitive'],
        };
  return e.excluded
    ? { phrase: `Ki and Kiu agree within a factor of ${NONCOMPETITIVE_BAND} (alpha between ${rounded(1 / NONCOMPETITIVE_BAND, 3)} and ${NONCOMPETITIVE_BAND}; ${test})` }
    : {
        phrase: `Ki and Kiu may differ by more than a factor of ${NONCOMPETITIVE_BAND}: alpha = ${rounded(worst.bound, 3)} is not excluded (${test})`,
        hint: SEPARATING_EXPERIMENT['mixed|noncompetitive'],
      };
}

function addCaveats(caveats: readonly Caveat[], reasons: string[], suggestions: string[], canBlock: boolean): boolean {
  let blocked = false;
  for (const c of caveats) {
    reasons.push(c.message);
    if (c.suggestion && !suggestions.includes(c.suggestion)) {
      if (c.leading) suggestions.unshift(c.suggestion);
      else suggestions.push(c.suggestion);
    }
    if (c.blocking && canBlock) blocked = true;
  }
  return blocked;
}

const HIDDEN_COMPONENT: Record<ExclusionFinding['component'], string> = {
  uncompetitive: 'a weak uncompetitive component is not excluded',
  competitive: 'a weak competitive component is not excluded',
  'unequal-constants': 'Ki and Kiu may differ (mixed) by more than the data resolve',
};

function headline(outcome: VerdictOutcome, winner: Mechanism, lean: string | undefined, candidates: Mechanism[], exclusion?: ExclusionFinding): string {
  switch (outcome) {
    case 'decisive':
      return `The data support ${winner} inhibition.`;
    case 'mixed-lean':
      return `The data support mixed inhibition, leaning ${lean}.`;
    case 'no-inhibition':
      return 'No inhibition detected in the tested inhibitor range.';
    case 'undecided': {
      const list = [...new Set(candidates)];
      if (exclusion && !exclusion.excluded && list.length === 2 && list[1] === 'mixed')
        return `${capitalise(winner)} ranks first, but ${HIDDEN_COMPONENT[exclusion.component]}.`;
      return list.length > 1
        ? `Not decided between ${list.slice(0, -1).join(', ')} and ${list[list.length - 1]}; ${winner} ranks first.`
        : `${capitalise(winner)} ranks first, but the call is not firm (see reasons).`;
    }
  }
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
