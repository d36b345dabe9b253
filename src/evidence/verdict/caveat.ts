/**
 * A finding that bears on how far the verdict can be trusted: a code, the numbers behind it, and
 * whether it blocks a firm call. Produced by the diagnostics and pattern checks, read by the verdict
 * (src/evidence/verdict/verdict.ts). Science code never words a caveat: src/wording/caveat-words.ts gives
 * its sentence, the experiment that would remove it and, when it blocks, the headline it leads with
 * (docs/decisions/coded-findings.md).
 */
import type { Mechanism } from '../../models/types.js';
import type { ErrorModel } from '../../fit/error-models.js';

interface CaveatBase {
  /** true when the caveat forbids a decisive call */
  blocking: boolean;
  /** true when its advice should come before the general advice (it is the first thing to fix) */
  leading?: boolean;
}

/** A point the robust refit gave less than half weight, by its line in the input file. */
export interface DownWeightedLine {
  line: number;
  rate: number;
}

/** A tested concentration or fitted constant above the plausibility limit (src/evidence/checks/plausibility-check.ts). */
export interface ImplausibleValue {
  label: string;
  value: number;
  unit: string;
  /** the value in mol/L */
  molar: number;
}

/** The caveats the evidence and analysis layers find, with their numbers. */
export type CodedCaveat = CaveatBase &
  (
    | { code: 'residual-runs'; mechanism: Mechanism; p: number }
    | { code: 'lack-of-fit'; mechanism: Mechanism; p: number }
    | { code: 'trend-substrate' | 'trend-inhibitor' | 'trend-fitted'; mechanism: Mechanism; rho: number; p: number }
    | { code: 'non-normal'; mechanism: Mechanism; p: number }
    /** points with a studentised residual beyond `limit`; `robustRefitRuns`: the robust refit answers for them */
    | { code: 'suspect-points'; count: number; limit: number; robustRefitRuns: boolean }
    | { code: 'series-disagree'; mechanism: Mechanism; count: number; seLimit: number }
    /** `callUnderBest`: the call under the better error model when it differs (then blocking) */
    | { code: 'error-model'; chosen: ErrorModel; best: ErrorModel; aiccGap: number; callUnderBest: Mechanism | null }
    | { code: 'substrate-inhibition'; peak: { s: number; mean: number }; top: { s: number; mean: number }; standardErrors: number }
    | { code: 'activation'; levelsAbove: number; levels: number; medianRatio: number; rho: number }
    | { code: 'inhibitor-saturating'; lowestInhibitor: number; activityPercent: number }
    | { code: 'implausible-concentration'; flagged: ImplausibleValue[]; limitMolar: number }
    /**
     * the robust (bisquare) refit: `change` is 'none-down-weighted' (run because a point stands out,
     * no point below half weight), 'stays' (points down-weighted, same call) or 'changes' (blocking)
     */
    | {
        code: 'robust';
        change: 'none-down-weighted' | 'stays' | 'changes';
        downWeighted: DownWeightedLine[];
        robustCall: Mechanism | null;
        robustLean?: 'competitive' | 'uncompetitive';
        leastSquaresCall: Mechanism | null;
      }
  );

/**
 * A caveat worded below the evidence layer: the design findings of src/input/design-checks.ts
 * (shared with the library's designWarnings) and the input's pasted-block warning carry their
 * sentences with them.
 */
export interface WordedCaveat extends CaveatBase {
  code: string;
  text: { message: string; suggestion?: string; headline?: string };
}

export type Caveat = CodedCaveat | WordedCaveat;

/** true for a caveat that carries its own sentences (input-layer findings). */
export function isWorded(c: Caveat): c is WordedCaveat {
  return 'text' in c;
}

/**
 * true for a caveat whose headline should lead the verdict when it blocks: the patterns the models
 * cannot describe, a robust refit that changes the call, and input findings that carry a headline.
 */
export function hasHeadline(c: Caveat): boolean {
  if (isWorded(c)) return c.text.headline !== undefined;
  return c.code === 'substrate-inhibition' || c.code === 'inhibitor-saturating' || (c.code === 'robust' && c.change === 'changes');
}

/** Caveat code of the activation check: the no-inhibition verdict then drops the "test higher [I]" advice. */
export const ACTIVATION_CODE = 'activation' as const;
