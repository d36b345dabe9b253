/**
 * For a "no inhibition detected" call: how far did the tested [I] range reach? Under the best
 * inhibited model, the smallest inhibition constant still compatible with the data is the lower
 * end of its interval (profile where computed, else Wald; the detection bound when the arm ran
 * off). Comparing the highest [I] with it tells the reader how strong an inhibitor could have
 * been missed.
 */
import type { Mechanism } from '../models/types.js';
import type { ParameterEstimate } from './wald-estimates.js';
import { maxInhibitor, type FitData } from '../fit/fit-data.js';
import { sig, valueWithUnit } from '../text/format-number.js';

/** What noInhibitionReason reads of each ranked model (the analysis stage's ModelResult has these). */
interface RankedModelEstimates {
  mechanism: Mechanism;
  /** fitted rate parameters */
  p: number;
  estimates: readonly ParameterEstimate[];
}

export function noInhibitionReason(models: readonly RankedModelEstimates[], data: FitData): string {
  const imax = maxInhibitor(data);
  // every concentration printed with its unit (issue 13): "highest [I] tested: 200 nM"
  const c = (x: number) => valueWithUnit(sig(x, 3), data.units?.inhibitor);
  const inhibited = models.find((m) => m.mechanism !== 'none' && m.p === 3);
  const est = inhibited?.estimates.find((e) => e.name === 'Ki' || e.name === 'Kiu');
  if (!inhibited || !est) return `highest [I] tested: ${c(imax)}`;
  let lower: number | null = null;
  if (est.detected && est.profile && est.profile[0] !== null) lower = est.profile[0];
  else if (est.detected && est.wald) lower = Math.max(est.wald[0], 0);
  else if (!est.detected && est.profile && est.profile[0] !== null) lower = est.profile[0];
  else if (!est.detected && est.exceeds !== undefined)
    return `highest [I] tested: ${c(imax)}; under ${inhibited.mechanism} the fitted ${est.name} runs past ${c(est.exceeds)} (100 x the highest [I])`;
  if (lower === null || !(lower > 0))
    return `highest [I] tested: ${c(imax)}; the data do not bound the inhibition constant from below`;
  return `highest [I] tested: ${c(imax)}, ${sig(imax / lower, 2)} x the smallest ${est.name} still compatible with the data under ${inhibited.mechanism} (${c(lower)})`;
}
