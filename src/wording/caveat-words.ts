/**
 * The words of a caveat (src/evidence/verdict/caveat.ts): its sentence among the verdict's reasons, the
 * experiment or action that would remove it, and, for one that blocks, the headline it leads with.
 * The numbers and thresholds come from the caveat; rewording here changes no result.
 */
import { isWorded, type Caveat, type CodedCaveat, type DownWeightedLine } from '../evidence/verdict/caveat.js';
import { pPhrase, rounded, sig } from '../text/format-number.js';
import { DOWN_WEIGHTED_BELOW } from '../evidence/diagnostics/robust-refit.js';

export interface CaveatWords {
  message: string;
  suggestion?: string;
  headline?: string;
}

const TREND_LABEL = { 'trend-substrate': '[S]', 'trend-inhibitor': '[I]', 'trend-fitted': 'the fitted rate' } as const;

/** "line 12, rate 3.41, line 30, rate 0.2 and 2 more": the first four down-weighted points. */
function lineList(points: readonly DownWeightedLine[]): string {
  const shown = points.slice(0, 4).map((d) => `line ${d.line}, rate ${sig(d.rate, 3)}`);
  return shown.join(', ') + (points.length > 4 ? ` and ${points.length - 4} more` : '');
}

export function wordCaveat(c: Caveat): CaveatWords {
  if (isWorded(c)) return c.text;
  return wordCoded(c);
}

function wordCoded(c: CodedCaveat): CaveatWords {
  switch (c.code) {
    case 'residual-runs':
      return {
        message: `the ${c.mechanism} residuals run in long same-sign stretches along [S] (runs test ${pPhrase(c.p)}): the model misses systematically`,
        suggestion: 'look at the residual panels; consider a mechanism outside the five (partial or tight-binding inhibition) or a data problem',
      };
    case 'lack-of-fit':
      return {
        message: `the ${c.mechanism} fit departs from the replicate means more than replicate scatter allows (lack-of-fit ${pPhrase(c.p)})`,
        suggestion: 'check for outliers, drift across the plate, or a mechanism outside the five',
      };
    case 'trend-substrate':
    case 'trend-inhibitor':
    case 'trend-fitted':
      return { message: `the ${c.mechanism} residuals drift with ${TREND_LABEL[c.code]} (Spearman rho ${c.rho.toFixed(2)}, ${pPhrase(c.p)})` };
    case 'non-normal':
      return {
        message: `the ${c.mechanism} residuals are not normal (Shapiro-Wilk ${pPhrase(c.p)}): intervals may be off`,
        suggestion: 'check the error model and look for outliers (--robust)',
      };
    case 'suspect-points':
      return {
        message: `${c.count} point${c.count > 1 ? 's have' : ' has'} a studentised residual beyond ${c.limit} (listed in the report)`,
        suggestion: c.robustRefitRuns
          ? 'inspect the flagged wells (listed in the report); the robust refit says whether the call depends on them'
          : 'inspect the flagged wells; rerun with --robust to see whether the call depends on them',
      };
    case 'series-disagree':
      return {
        message: `fitted alone, ${c.count} apparent constant${c.count > 1 ? 's differ' : ' differs'} from the ${c.mechanism} global fit by more than ${c.seLimit} SE`,
      };
    case 'error-model': {
      const gap = c.aiccGap.toFixed(1);
      return c.callUnderBest
        ? {
            message: `the ${c.chosen} error model fits the scatter clearly worse than ${c.best} (AICc ${gap} higher), and under ${c.best} the call would be ${c.callUnderBest}`,
            suggestion: `rerun with --error ${c.best} (or --error auto)`,
          }
        : {
            message: `the ${c.chosen} error model fits the scatter clearly worse than ${c.best} (AICc ${gap} higher); the call is the same under ${c.best}`,
            suggestion: `rerun with --error ${c.best} (or --error auto) for better intervals`,
          };
    }
    case 'substrate-inhibition':
      return {
        message: `without inhibitor the rate falls at the highest [S] (${rounded(c.peak.mean, 3)} at [S] = ${rounded(c.peak.s, 3)}, ${rounded(c.top.mean, 3)} at [S] = ${rounded(c.top.s, 3)}; ${rounded(c.standardErrors, 3)} standard errors): substrate inhibition? The models assume rates that level off, so Km and the call may be biased`,
        suggestion: 'repeat the highest [S] levels; if the fall holds, exclude the [S] levels past the peak (exclude column) and analyse again',
        headline: 'The rates fall at the highest [S] (substrate inhibition?), which the five models do not describe: no firm call.',
      };
    case 'activation':
      return {
        message: `the rates rise with [I] (at the highest [I] above the control at ${c.levelsAbove} of ${c.levels} [S] levels, median ratio ${rounded(c.medianRatio, 3)}; Spearman rho of the no-inhibition residuals against [I] ${c.rho.toFixed(2)}): the compound looks like an activator, which none of the five models describes`,
        suggestion: 'confirm the activation with a fresh dilution, and rule out a compound signal that adds to the read (compound without enzyme)',
      };
    case 'inhibitor-saturating':
      return {
        message: `at the lowest non-zero [I] (${rounded(c.lowestInhibitor, 3)}) the activity is at most ${rounded(c.activityPercent, 3)}% of the control at any [S]: every tested [I] lies far above Ki, so the series carry almost no information on the mechanism`,
        suggestion: 'test lower [I], from about 0.1 x the IC50 upwards (a dilution series reaching below the lowest [I] used here)',
        headline: 'Every tested [I] inhibits almost completely, so the mechanism cannot be read: test lower [I].',
      };
    case 'implausible-concentration': {
      const flagged = c.flagged.map((f) => `${f.label} = ${rounded(f.value, 3)} ${f.unit}${f.unit === 'M' ? '' : ` (${rounded(f.molar, 3)} M)`}`);
      return {
        message: `${flagged.join(', ')}: above ${c.limitMolar} M, which no enzyme assay reaches; a unit slip (for example uM values in a column labelled M) is the usual cause`,
        suggestion: 'check the concentration units in the column headers (or --substrate-unit / --inhibitor-unit)',
      };
    }
    case 'robust': {
      const n = c.downWeighted.length;
      const which = lineList(c.downWeighted);
      if (c.change === 'none-down-weighted')
        return { message: `a robust (bisquare) refit, run because a point stands out, gives no point a weight below ${DOWN_WEIGHTED_BELOW}; the call stays ${c.robustCall}` };
      if (c.change === 'stays') return { message: `a robust (bisquare) refit down-weights ${n} point(s) (${which}); the call stays ${c.robustCall}` };
      return {
        message: `a robust (bisquare) refit down-weights ${n} point(s) (${which}) and then calls it ${c.robustCall}: the call depends on those points`,
        suggestion: `inspect or repeat the down-weighted wells (${which}); exclude a mistyped value and analyse again`,
        headline: `The call depends on ${n === 1 ? 'one outlying point' : `${n} outlying points`} (${which}): with ${n === 1 ? 'it' : 'them'} down-weighted the data point to ${c.robustCall}${c.robustLean ? `, leaning ${c.robustLean}` : ''}, not ${c.leastSquaresCall}.`,
      };
    }
  }
}
