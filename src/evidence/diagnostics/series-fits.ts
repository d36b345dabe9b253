/**
 * Each inhibitor series fitted alone to the Michaelis-Menten equation: apparent Vmax and Km per
 * [I]. These are diagnostics (the input of the slope and intercept replots and a consistency
 * check of the global model), never the reported constants.
 *
 * The global model's apparent constants they are compared with come from apparent-constants.ts.
 */
import { noInhibition } from '../../models/no-inhibition.js';
import type { MechanismFit } from '../../fit/fit-mechanism.js';
import { fitMechanism } from '../../fit/fit-mechanism.js';
import type { ErrorModel } from '../../fit/error-models.js';
import { subsetFitData, type FitData } from '../../fit/fit-data.js';
import { waldEstimates } from '../intervals/wald-estimates.js';
import { apparentConstants } from '../constants/apparent-constants.js';
import { distinctLevels } from '../../input/distinct-levels.js';

/** A Michaelis-Menten fit of one inhibitor series alone: a diagnostic, not a result. */
export interface SeriesFit {
  inhibitor: number;
  n: number;
  converged: boolean;
  Vmax: number;
  Km: number;
  seVmax: number | null;
  seKm: number | null;
}

/** Indices of the points tested at inhibitor concentration `level`. */
function seriesIndices(inhibitor: Float64Array, level: number): number[] {
  const out: number[] = [];
  for (let k = 0; k < inhibitor.length; k++) if (inhibitor[k] === level) out.push(k);
  return out;
}

/** Michaelis-Menten fit of each [I] series with at least 3 distinct [S] levels. */
export function seriesFits(data: FitData, errorModel: ErrorModel): SeriesFit[] {
  const levels = distinctLevels(data.i);
  const out: SeriesFit[] = [];
  for (const level of levels) {
    const series = subsetFitData(data, seriesIndices(data.i, level));
    if (new Set(series.s).size < 3) continue;
    const fit = fitMechanism(noInhibition, series, errorModel);
    const est = waldEstimates(fit, 0).estimates;
    out.push({
      inhibitor: level,
      n: fit.n,
      converged: fit.converged,
      Vmax: fit.params[0],
      Km: fit.params[1],
      seVmax: est[0].se,
      seKm: est[1].se,
    });
  }
  return out;
}

export interface SeriesDisagreement {
  inhibitor: number;
  quantity: 'Vmax' | 'Km';
  separate: number;
  global: number;
  z: number;
}

/** Standard errors by which a per-series constant may differ from the global fit's before it is flagged. */
export const SERIES_SE_LIMIT = 3;

/**
 * Where the per-series estimates differ from the global model's apparent constants by more than
 * `zLimit` standard errors of the per-series estimate (default SERIES_SE_LIMIT = 3; common practice).
 */
export function seriesDisagreements(fit: MechanismFit, series: readonly SeriesFit[], zLimit = SERIES_SE_LIMIT): SeriesDisagreement[] {
  const out: SeriesDisagreement[] = [];
  for (const sf of series) {
    if (!sf.converged) continue;
    const g = apparentConstants(fit, sf.inhibitor);
    const checks: Array<['Vmax' | 'Km', number, number | null, number]> = [
      ['Vmax', sf.Vmax, sf.seVmax, g.Vmax],
      ['Km', sf.Km, sf.seKm, g.Km],
    ];
    for (const [quantity, separate, se, global] of checks) {
      if (se === null || !(se > 0)) continue;
      const z = (separate - global) / se;
      if (Math.abs(z) > zLimit) out.push({ inhibitor: sf.inhibitor, quantity, separate, global, z });
    }
  }
  return out;
}
