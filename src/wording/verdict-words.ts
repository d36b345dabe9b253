/**
 * The words of a verdict (src/evidence/verdict/verdict.ts): the headline, the reasons and the advice, from
 * the codes and numbers the verdict holds. The report, the text summary, results.json and the batch
 * summary word a verdict only through wordVerdict; the thresholds in a sentence are the constants
 * the rule uses (src/evidence/verdict/verdict.ts, src/evidence/selection/alpha-exclusion.ts).
 */
import type { Mechanism } from '../models/types.js';
import type { Verdict } from '../evidence/verdict/verdict.js';
import type { Advice, ExclusionFinding, InhibitorReach, MechanismPair, VerdictHeadline, VerdictReason } from '../evidence/verdict/verdict-findings.js';
import { ALPHA_FAR, EXCLUSION_LEVEL, NONCOMPETITIVE_BAND } from '../evidence/selection/alpha-exclusion.js';
import { DETECTION_FACTOR } from '../evidence/intervals/detection-bound.js';
import { pPhrase, rounded, sig, valueWithUnit } from '../text/format-number.js';
import { wordCaveat } from './caveat-words.js';
import { familyAdvice, familyHeadline, familyReason } from './family-words.js';

/** A verdict in words: what results.json, the report and the text summary print. */
export interface VerdictWords {
  headline: string;
  reasons: string[];
  suggestions: string[];
}

export function wordVerdict(v: Pick<Verdict, 'headline' | 'reasons' | 'suggestions'>): VerdictWords {
  return { headline: wordHeadline(v.headline), reasons: v.reasons.map(wordReason), suggestions: wordAdvice(v.suggestions) };
}

/** The experiment that separates two mechanisms. */
const SEPARATING_EXPERIMENT: Record<MechanismPair, string> = {
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

const HIDDEN_COMPONENT: Record<ExclusionFinding['component'], string> = {
  uncompetitive: 'a weak uncompetitive component is not excluded',
  competitive: 'a weak competitive component is not excluded',
  'unequal-constants': 'Ki and Kiu may differ (mixed) by more than the data resolve',
};

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

function wordHeadline(h: VerdictHeadline): string {
  switch (h.code) {
    case 'no-fit':
      return 'No model could be fitted to these data.';
    case 'no-inhibition':
      return h.activation ? 'No inhibition: the rates rise with [I], as they would for an activator.' : 'No inhibition detected in the tested inhibitor range.';
    case 'exact-no-inhibition':
      return 'No inhibition: the rates follow the model without inhibition exactly.';
    case 'exact':
      return `The rates follow ${h.mechanism} inhibition${h.lean ? `, leaning ${h.lean},` : ''} exactly (noise-free data).`;
    case 'decisive':
      return `The data support ${h.mechanism} inhibition.`;
    case 'mixed-lean':
      return `The data support mixed inhibition, leaning ${h.lean}.`;
    case 'hidden-component':
      return `${capitalise(h.winner)} ranks first, but ${HIDDEN_COMPONENT[h.component]}.`;
    case 'not-decided':
      return `Not decided between ${h.candidates.slice(0, -1).join(', ')} and ${h.candidates[h.candidates.length - 1]}; ${h.winner} ranks first.`;
    case 'not-firm':
      return `${capitalise(h.winner)} ranks first, but the call is not firm (see reasons).`;
    case 'caveat':
      return wordCaveat(h.caveat).headline ?? '';
    case 'tight-binding':
    case 'partial':
      return familyHeadline(h);
  }
}

function wordReason(r: VerdictReason): string {
  switch (r.code) {
    case 'error-model-chosen':
      return r.runnerUp !== null && r.aiccMargin !== null
        ? `error model chosen automatically: ${r.chosen} (AICc ${r.aiccMargin.toFixed(1)} lower than ${r.runnerUp})`
        : `error model chosen automatically: ${r.chosen} (the only one usable on these rates)`;
    case 'no-fit-converged':
      return 'none of the five fits converged';
    case 'none-ranks-first':
      return 'the model without inhibition has the lowest AICc';
    case 'inhibition-not-significant':
      return `no inhibited model improves significantly on the model without inhibition (best: ${r.best}, ${pPhrase(r.p)})`;
    case 'mixed-earns-constant':
      return `mixed improves on the best three-parameter model, ${r.against} (${pPhrase(r.p)}, AICc lower by ${r.aiccGain.toFixed(1)})`;
    case 'mixed-not-supported':
      return `the extra constant of mixed is not supported against ${r.against} (${pPhrase(r.p)})`;
    case 'aicc-gap':
      return `${r.mechanism}: AICc ${r.gap.toFixed(1)} above ${r.winner}${r.rival ? ' (still substantially supported)' : ''}`;
    case 'exclusion':
      return exclusionPhrase(r.winner, r.finding);
    case 'alpha-above-one':
      return `the interval for alpha lies above 1 (from ${r.lower.toPrecision(3)}): the inhibitor prefers free enzyme`;
    case 'alpha-below-one':
      return `the interval for alpha lies below 1 (up to ${r.upper.toPrecision(3)}): the inhibitor prefers the enzyme-substrate complex`;
    case 'alpha-includes-one':
      return 'the interval for alpha includes 1, so pure noncompetitive inhibition is not excluded';
    case 'fit-not-converged':
      return `the ${r.mechanism} fit did not converge`;
    case 'inhibition-detected':
      return `inhibition is detected: ${r.mechanism} improves on no inhibition (${pPhrase(r.p)})`;
    case 'exact-fit':
      return `the ${r.mechanism} fit reproduces every rate exactly (weighted SSE ${r.relativeSse.toExponential(1)} of the weighted sum of squared rates): the rates are noise-free (simulated or computed), and no model with fewer constants fits them exactly`;
    case 'exact-no-tests':
      return 'without noise, p-values, intervals and residual checks describe rounding only; the call rests on which models fit exactly';
    case 'caveat':
      return wordCaveat(r.caveat).message;
    case 'inhibitor-reach':
      return reachPhrase(r);
    case 'within-family':
      return `${r.models === 'classic' ? 'classic models' : 'tight-binding models'}: ${wordReason(r.reason)}`;
    default:
      return familyReason(r);
  }
}

/**
 * The advice in order: each once, a caveat's advice first when the caveat leads (the first thing
 * to fix), a caveat without advice skipped.
 */
function wordAdvice(advice: readonly Advice[]): string[] {
  const out: string[] = [];
  for (const a of advice) {
    const text = adviceText(a);
    if (text === undefined || out.includes(text)) continue;
    if (a.code === 'caveat' && a.caveat.leading) out.unshift(text);
    else out.push(text);
  }
  return out;
}

function adviceText(a: Advice): string | undefined {
  switch (a.code) {
    case 'check-units':
      return 'check the rates and concentrations for unit or transcription errors';
    case 'test-higher-inhibitor':
      return 'test higher inhibitor concentrations (several times the expected Ki or the IC50)';
    case 'separate':
      return SEPARATING_EXPERIMENT[a.pair];
    case 'caveat':
      return wordCaveat(a.caveat).suggestion;
    case 'give-enzyme':
    case 'partial-plateau':
      return familyAdvice(a);
  }
}

/** The reason sentence for the exclusion step (src/evidence/selection/alpha-exclusion.ts). */
function exclusionPhrase(winner: Mechanism, e: ExclusionFinding): string {
  if (e.tests.length === 0) return `the mixed model was not fitted, so a hidden component of the ${winner} call cannot be excluded`;
  const worst = e.tests.reduce((a, b) => (b.p > a.p ? b : a));
  const test = `one-sided profile test, ${pPhrase(worst.p)}; needed p < ${EXCLUSION_LEVEL}`;
  if (winner === 'competitive')
    return e.excluded
      ? `binding to the enzyme-substrate complex is excluded down to ${ALPHA_FAR}-fold weaker than to free enzyme (alpha > ${ALPHA_FAR}; ${test})`
      : `a weak uncompetitive component is not excluded: alpha = ${ALPHA_FAR} (Kiu = ${ALPHA_FAR} x Ki) fits about as well (${test})`;
  if (winner === 'uncompetitive')
    return e.excluded
      ? `binding to free enzyme is excluded down to ${ALPHA_FAR}-fold weaker than to the enzyme-substrate complex (alpha < ${rounded(1 / ALPHA_FAR, 3)}; ${test})`
      : `a weak competitive component is not excluded: alpha = ${rounded(1 / ALPHA_FAR, 3)} (Ki = ${ALPHA_FAR} x Kiu) fits about as well (${test})`;
  return e.excluded
    ? `Ki and Kiu agree within a factor of ${NONCOMPETITIVE_BAND} (alpha between ${rounded(1 / NONCOMPETITIVE_BAND, 3)} and ${NONCOMPETITIVE_BAND}; ${test})`
    : `Ki and Kiu may differ by more than a factor of ${NONCOMPETITIVE_BAND}: alpha = ${rounded(worst.bound, 3)} is not excluded (${test})`;
}

/** How far the tested [I] reached, every concentration with its unit (issue 13). */
function reachPhrase(r: InhibitorReach): string {
  const c = (x: number) => valueWithUnit(sig(x, 3), r.unit ?? undefined);
  const b = r.bound;
  switch (b.kind) {
    case 'no-model':
      return `highest [I] tested: ${c(r.highest)}`;
    case 'runs-past':
      return `highest [I] tested: ${c(r.highest)}; under ${b.mechanism} the fitted ${b.name} runs past ${c(b.exceeds)} (${DETECTION_FACTOR} x the highest [I])`;
    case 'unbounded':
      return `highest [I] tested: ${c(r.highest)}; the data do not bound the inhibition constant from below`;
    case 'lower':
      return `highest [I] tested: ${c(r.highest)}, ${sig(r.highest / b.lower, 2)} x the smallest ${b.name} still compatible with the data under ${b.mechanism} (${c(b.lower)})`;
  }
}
