/**
 * Residual diagnostics of one fitted mechanism: does the model miss systematically?
 *
 *  - Runs test on the signs of the residuals ordered by [S] within each [I] series, per series and
 *    pooled (Wald, A. and Wolfowitz, J. (1940) Ann. Math. Stat. 11, 147-162; src/stats/). Where
 *    replicates exist, the residuals of one (S, I) condition are averaged first, so that the runs
 *    follow the curve and not the replicate noise (this project's convention).
 *  - Trend of the weighted residuals against [S], [I] and the fitted rate (Spearman; src/stats/).
 *  - Lack-of-fit F test, pure error against lack of fit, where replicates exist
 *    (Draper, N. R. and Smith, H. (1998) Applied Regression Analysis, 3rd ed., sec. 2.1).
 *  - Shapiro-Wilk test of the internally studentised residuals (Royston, P. (1995) Appl. Stat. 44,
 *    547-551), for 3 to 5000 residuals (the range of Royston's approximation); null outside it.
 *  - Suspect points: externally studentised residual beyond 3 in absolute value (about 0.3% of
 *    points under a correct Gaussian model; common practice), and high leverage h > 3p/n
 *    (Belsley, Kuh and Welsch (1980) Regression Diagnostics, Wiley, use 2p/n; 3p/n is the
 *    stricter variant, common practice). Flagged, never dropped.
 */
import type { MechanismFit } from '../../fit/fit-mechanism.js';
import type { FitData } from '../../fit/fit-data.js';
import { pooledRunsTest, type PooledRunsTestResult } from '../../stats/pooled-runs-test.js';
import { residualTrends } from '../../stats/residual-trends.js';
import type { SpearmanResult } from '../../stats/spearman-correlation.js';
import { lackOfFitTest, type LackOfFitOutcome } from '../../stats/lack-of-fit-test.js';
import { shapiroWilk, type ShapiroWilkResult } from '../../stats/shapiro-wilk.js';
import { hatValues } from '../../fit/hat-values.js';
import { studentisedResiduals } from '../../stats/studentised-residuals.js';

export const STUDENTISED_LIMIT = 3;
export const LEVERAGE_FACTOR = 3;

export interface SuspectPoint {
  /** index into the fitted points */
  index: number;
  substrate: number;
  inhibitor: number;
  rate: number;
  studentised: number;
  leverage: number;
  why: 'large residual' | 'high leverage' | 'large residual and high leverage';
}

export interface ResidualDiagnostics {
  mechanism: MechanismFit['mechanism'];
  runs: PooledRunsTestResult;
  trends: Record<'substrate' | 'inhibitor' | 'fitted', SpearmanResult>;
  lackOfFit: LackOfFitOutcome;
  normality: ShapiroWilkResult | null;
  /** internally studentised residuals, one per point (NaN where undefined) */
  studentised: Float64Array;
  /** externally studentised residuals */
  studentisedExternal: Float64Array;
  leverage: Float64Array;
  suspects: SuspectPoint[];
}

function conditionKey(s: number, i: number): string {
  return `${s}|${i}`;
}

/** Mean weighted residual per (S, I) condition, ordered by [S] within each [I] series. */
export function residualSeriesBySubstrate(fit: MechanismFit, data: FitData): number[][] {
  const sums = new Map<string, { s: number; i: number; sum: number; count: number }>();
  for (let k = 0; k < fit.n; k++) {
    const key = conditionKey(data.s[k], data.i[k]);
    const entry = sums.get(key) ?? { s: data.s[k], i: data.i[k], sum: 0, count: 0 };
    entry.sum += fit.weightedResiduals[k];
    entry.count++;
    sums.set(key, entry);
  }
  const bySeries = new Map<number, Array<{ s: number; mean: number }>>();
  for (const e of sums.values()) {
    const list = bySeries.get(e.i) ?? [];
    list.push({ s: e.s, mean: e.sum / e.count });
    bySeries.set(e.i, list);
  }
  return [...bySeries.keys()]
    .sort((a, b) => a - b)
    .map((i) => bySeries.get(i)!.sort((a, b) => a.s - b.s).map((x) => x.mean));
}

export function residualDiagnostics(fit: MechanismFit, data: FitData): ResidualDiagnostics {
  const n = fit.n;
  const runs = pooledRunsTest(residualSeriesBySubstrate(fit, data));
  const trends = residualTrends(fit.weightedResiduals, { substrate: data.s, inhibitor: data.i, fitted: fit.fitted });
  const groups = Array.from({ length: n }, (_, k) => conditionKey(data.s[k], data.i[k]));
  const lackOfFit = lackOfFitTest(fit.weightedResiduals, groups, fit.p, fit.weights);

  const hat = hatValues(fit.jacobian, n, fit.p);
  const s = fit.df > 0 ? Math.sqrt(fit.sse / fit.df) : NaN;
  const usable = Number.isFinite(s) && s > 0 && fit.df > 0;
  const stud = usable
    ? studentisedResiduals(fit.weightedResiduals, hat.leverage, s, fit.df)
    : { internal: new Float64Array(n).fill(NaN), external: new Float64Array(n).fill(NaN) };
  const finiteInternal = Array.from(stud.internal).filter(Number.isFinite);
  let normality: ShapiroWilkResult | null = null;
  // Royston's approximation covers 3 <= n <= 5000; larger tables are not tested for normality
  if (finiteInternal.length >= 3 && finiteInternal.length <= 5000 && Math.max(...finiteInternal) > Math.min(...finiteInternal))
    normality = shapiroWilk(finiteInternal);

  const suspects: SuspectPoint[] = [];
  const leverageLimit = (LEVERAGE_FACTOR * fit.p) / n;
  for (let k = 0; k < n; k++) {
    const big = Math.abs(stud.external[k]) > STUDENTISED_LIMIT;
    const lever = hat.leverage[k] > leverageLimit;
    if (!big && !lever) continue;
    suspects.push({
      index: k,
      substrate: data.s[k],
      inhibitor: data.i[k],
      rate: data.v[k],
      studentised: stud.external[k],
      leverage: hat.leverage[k],
      why: big && lever ? 'large residual and high leverage' : big ? 'large residual' : 'high leverage',
    });
  }
  return {
    mechanism: fit.mechanism,
    runs,
    trends,
    lackOfFit,
    normality,
    studentised: stud.internal,
    studentisedExternal: stud.external,
    leverage: hat.leverage,
    suspects,
  };
}
