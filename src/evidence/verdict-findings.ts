/**
 * What the verdict found, as data: each reason, piece of advice and headline is a code with its
 * numbers. src/wording/verdict-words.ts words them for the report, the text summary and
 * results.json; science code and its tests read the codes (docs/decisions/coded-findings.md).
 */
import type { Mechanism } from '../models/types.js';
import type { ErrorModel } from '../fit/error-models.js';
import type { Caveat } from './caveat.js';
import type { AlphaBoundTest } from './alpha-exclusion.js';

/** What the exclusion step found for a three-parameter winner. */
export interface ExclusionFinding {
  /** the component that a firm call must exclude */
  component: 'uncompetitive' | 'competitive' | 'unequal-constants';
  /** true when every test behind the call rejected the mixed alternative */
  excluded: boolean;
  tests: AlphaBoundTest[];
}

/**
 * How far the tested [I] reached in a no-inhibition call (src/evidence/detection-limit.ts):
 * `bound` is the smallest inhibition constant still compatible with the data under the best
 * three-parameter model, or why there is none.
 */
export interface InhibitorReach {
  code: 'inhibitor-reach';
  highest: number;
  unit: string | null;
  bound:
    | { kind: 'no-model' }
    | { kind: 'runs-past'; mechanism: Mechanism; name: string; exceeds: number }
    | { kind: 'unbounded' }
    | { kind: 'lower'; mechanism: Mechanism; name: string; lower: number };
}

/** A pair of mechanisms the advice should separate (the key of the separating experiment). */
export type MechanismPair =
  | 'competitive|noncompetitive'
  | 'competitive|uncompetitive'
  | 'noncompetitive|uncompetitive'
  | 'competitive|mixed'
  | 'mixed|uncompetitive'
  | 'mixed|noncompetitive';

export type VerdictReason =
  | { code: 'error-model-chosen'; chosen: ErrorModel; runnerUp: ErrorModel | null; aiccMargin: number | null }
  | { code: 'no-fit-converged' }
  | { code: 'none-ranks-first' }
  | { code: 'inhibition-not-significant'; best: Mechanism; p: number }
  | { code: 'mixed-earns-constant'; against: Mechanism; p: number; aiccGain: number }
  | { code: 'mixed-not-supported'; against: Mechanism; p: number }
  | { code: 'aicc-gap'; mechanism: Mechanism; winner: Mechanism; gap: number; rival: boolean }
  | { code: 'exclusion'; winner: Mechanism; finding: ExclusionFinding }
  | { code: 'alpha-above-one'; lower: number }
  | { code: 'alpha-below-one'; upper: number }
  | { code: 'alpha-includes-one' }
  | { code: 'fit-not-converged'; mechanism: Mechanism }
  | { code: 'inhibition-detected'; mechanism: Mechanism; p: number }
  | { code: 'exact-fit'; mechanism: Mechanism; relativeSse: number }
  | { code: 'exact-no-tests' }
  | { code: 'caveat'; caveat: Caveat }
  | InhibitorReach
  /** a reason of another family's verdict, kept beside the call (tight-binding or classic models) */
  | { code: 'within-family'; models: 'classic' | 'tight-binding'; reason: VerdictReason }
  /** a reason of the family comparison (src/evidence/family-comparison.ts), still worded there */
  | { code: 'family-note'; text: string };

/** A piece of advice; `leading` puts it before the others (the first thing to fix). */
export type Advice =
  | { code: 'check-units' }
  | { code: 'test-higher-inhibitor' }
  | { code: 'separate'; pair: MechanismPair }
  /** the caveat's advice, if its wording has one; first when the caveat is `leading` */
  | { code: 'caveat'; caveat: Caveat }
  | { code: 'family-note'; text: string };

export type VerdictHeadline =
  | { code: 'no-fit' }
  | { code: 'no-inhibition'; activation: boolean }
  | { code: 'exact-no-inhibition' }
  | { code: 'exact'; mechanism: Mechanism; lean?: 'competitive' | 'uncompetitive' }
  | { code: 'decisive'; mechanism: Mechanism }
  | { code: 'mixed-lean'; lean: 'competitive' | 'uncompetitive' }
  | { code: 'hidden-component'; winner: Mechanism; component: ExclusionFinding['component'] }
  | { code: 'not-decided'; winner: Mechanism; candidates: Mechanism[] }
  | { code: 'not-firm'; winner: Mechanism }
  /** the headline of the blocking caveat that leads */
  | { code: 'caveat'; caveat: Caveat }
  /** the headline of another family's call (src/evidence/family-comparison.ts), still worded there */
  | { code: 'family-note'; text: string };
