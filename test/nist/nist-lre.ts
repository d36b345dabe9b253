/**
 * Runs the engine on one NIST StRD problem from one start and measures the log relative errors
 * (McCullough 1998) of the parameters, the residual sum of squares and the standard deviations.
 * SD_j = sqrt(s^2 [(J'J)^-1]_jj) with s^2 = RSS / (n - p), (J'J)^-1 from the pivoted QR of J.
 */
import { levenbergMarquardt } from '../../src/fit/levenberg-marquardt.js';
import { unscaledCovariance } from '../../src/fit/qr.js';
import type { LeastSquaresResult } from '../../src/fit/least-squares-problem.js';
import { logRelativeError, nistProblem, type NistFixture } from './models.js';

interface NistRun {
  name: string;
  start: 1 | 2;
  result: LeastSquaresResult;
  parameterLre: number[];
  rssLre: number;
  sdLre: number[];
  minParameterLre: number;
  minSdLre: number;
}

export function runNist(fixture: NistFixture, start: 1 | 2): NistRun {
  const problem = nistProblem(fixture);
  const result = levenbergMarquardt(problem, fixture.starts[start - 1]);
  const { values, standardDeviations, residualSumOfSquares } = fixture.certified;
  const parameterLre = values.map((c, j) => logRelativeError(result.x[j], c));
  const rssLre = logRelativeError(result.sse, residualSumOfSquares);
  const { matrix } = unscaledCovariance(result.jacobian, problem.n, problem.m);
  const s2 = result.sse / (problem.n - problem.m);
  const sdLre = standardDeviations.map((c, j) => logRelativeError(Math.sqrt(s2 * matrix[j * problem.m + j]), c));
  return {
    name: fixture.name,
    start,
    result,
    parameterLre,
    rssLre,
    sdLre,
    minParameterLre: Math.min(...parameterLre),
    minSdLre: Math.min(...sdLre),
  };
}
