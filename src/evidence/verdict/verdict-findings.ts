/**
 * What the verdict found, as data: each reason, piece of advice and headline is a code with its
 * numbers. src/wording/verdict-words.ts words them for the report, the text summary and
 * results.json; science code and its tests read the codes (docs/decisions/coded-findings.md).
 */
import type { Mechanism } from '../../models/types.js';
import type { ErrorModel } from '../../fit/error-models.js';
import type { Caveat } from './caveat.js';
import type { AlphaBoundTest } from '../selection/alpha-exclusion.js';

/** What the exclusion step found for a three-parameter winner. */
export interface ExclusionFinding {
  /** the component that a firm call must exclude */
  component: 'uncompetitive' | 'competitive' | 'unequal-constants';
  /** true when every test behind the call rejected the mixed alternative */
  excluded: boolean;
  tests: AlphaBoundTest[];
}

/**
 * How far the tested [I] reached in a no-inhibition call (src/evidence/checks/detection-limit.ts):
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
  /** a reason of another family's verdict, kept beside the family call (tight-binding or classic models) */
  | { code: 'within-family'; models: 'classic' | 'tight-binding'; reason: VerdictReason }
  | FamilyReason;

/** A piece of advice; `leading` puts it before the others (the first thing to fix). */
export type Advice =
  | { code: 'check-units' }
  | { code: 'test-higher-inhibitor' }
  | { code: 'separate'; pair: MechanismPair }
  /** the caveat's advice, if its wording has one; first when the caveat is `leading` */
  | { code: 'caveat'; caveat: Caveat }
  /** the family comparison: a constant below the lowest [I] without [E]t given */
  | { code: 'give-enzyme'; constant: ConstantFinding; unit: string }
  /** the family comparison: a partial call that is not firm */
  | { code: 'partial-plateau' };

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
  /** another family's call (src/evidence/selection/family-comparison.ts): tight-binding (lean for mixed-lean) or partial */
  | { code: 'tight-binding'; decisive: boolean; mechanism: Mechanism | null; lean?: 'competitive' | 'uncompetitive'; constant: ConstantFinding | null; unit: string }
  /** `beta` null for partial competitive (beta = 1) */
  | { code: 'partial'; decisive: boolean; mechanism: Mechanism; constant: ConstantFinding | null; beta: ConstantFinding | null; unit: string };

/** A constant as the family comparison names it: its value and best interval (profile, else Wald). */
export interface ConstantFinding {
  name: string;
  value: number | null;
  interval: readonly [number | null, number | null] | null;
}

/** The family comparison's reasons (src/evidence/selection/family-comparison.ts), with the levels it used. */
export type FamilyReason =
  | { code: 'tight-no-inhibition' }
  /** [E]t given and within `ratio`-fold of the constant: the tight-binding call */
  | { code: 'enzyme-near-constant'; enzyme: number; unit: string; ratio: number; name: string }
  | { code: 'enzyme-negligible'; enzyme: number; unit: string; ratio: number; constant: ConstantFinding | null }
  /** [E]t fitted: identified and the boundary test against the classic model (p) */
  | { code: 'enzyme-identified'; et: ConstantFinding | null; unit: string; mechanism: Mechanism; p: number }
  | { code: 'enzyme-not-identifiable'; intervalClosed: boolean }
  /** the partial call: the boundary test against full inhibition, the AICc gain, beta (null: partial competitive) */
  | { code: 'partial-improves'; mechanism: Mechanism; p: number; aiccGain: number; beta: ConstantFinding | null }
  | { code: 'partial-mixed-beats-simpler'; level: number }
  | { code: 'partial-rival'; rival: string; delta: number }
  | { code: 'partial-mixed-not-better'; model: string; level: number }
  | { code: 'partial-not-supported'; why: 'no-improvement' | 'residual-zero' | 'aicc-margin'; model: string; level: number; margin: number };
