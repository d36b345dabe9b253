/**
 * For a "no inhibition detected" call: how far did the tested [I] range reach? Under the best
 * inhibited model, the smallest inhibition constant still compatible with the data is the lower
 * end of its interval (profile where computed, else Wald; the detection bound when the arm ran
 * off). Comparing the highest [I] with it tells the reader how strong an inhibitor could have
 * been missed.
 */
import type { Mechanism } from '../../models/types.js';
import type { ParameterEstimate } from '../intervals/wald-estimates.js';
import type { InhibitorReach } from '../verdict/verdict-findings.js';
import { maxInhibitor, type FitData } from '../../fit/fit-data.js';

/** What inhibitorReach reads of each ranked model (the analysis stage's ModelResult has these). */
interface RankedModelEstimates {
  mechanism: Mechanism;
  /** fitted rate parameters */
  p: number;
  estimates: readonly ParameterEstimate[];
}

/** The reach of the tested [I] range, worded by src/wording/verdict-words.ts. */
export function inhibitorReach(models: readonly RankedModelEstimates[], data: FitData): InhibitorReach {
  const reach = (bound: InhibitorReach['bound']): InhibitorReach => ({ code: 'inhibitor-reach', highest: maxInhibitor(data), unit: data.units?.inhibitor ?? null, bound });
  const inhibited = models.find((m) => m.mechanism !== 'none' && m.p === 3);
  const est = inhibited?.estimates.find((e) => e.name === 'Ki' || e.name === 'Kiu');
  if (!inhibited || !est) return reach({ kind: 'no-model' });
  let lower: number | null = null;
  if (est.detected && est.profile && est.profile[0] !== null) lower = est.profile[0];
  else if (est.detected && est.wald) lower = Math.max(est.wald[0], 0);
  else if (!est.detected && est.profile && est.profile[0] !== null) lower = est.profile[0];
  else if (!est.detected && est.exceeds !== undefined) return reach({ kind: 'runs-past', mechanism: inhibited.mechanism, name: est.name, exceeds: est.exceeds });
  if (lower === null || !(lower > 0)) return reach({ kind: 'unbounded' });
  return reach({ kind: 'lower', mechanism: inhibited.mechanism, name: est.name, lower });
}
