/**
 * The two sorting rules of flagged points (src/evidence/diagnostics/standing-out.ts): a large residual
 * (beyond STUDENTISED_LIMIT) starts the robust refit and the caveat; the report lists the points that
 * stand out, which are those plus leveraged points off the curve beyond LEVERAGED_RESIDUAL_LIMIT.
 * Invented, simulated data.
 */
import { describe, expect, it } from 'vitest';
import { residualDiagnostics, STUDENTISED_LIMIT, type SuspectPoint } from '../../src/evidence/diagnostics/residual-diagnostics.js';
import { LEVERAGED_RESIDUAL_LIMIT, largeResidualPoints, pointsThatStandOut, standsOut } from '../../src/evidence/diagnostics/standing-out.js';
import { fitDataFromTable } from '../../src/fit/fit-data.js';
import { fitMechanism } from '../../src/fit/fit-mechanism.js';
import { MECHANISMS } from '../../src/models/index.js';
import { simulateRates } from '../../src/simulate/simulate-rates.js';
import { tableOf } from '../helpers/sim-table.js';

const point = (studentised: number, why: SuspectPoint['why']): SuspectPoint => ({ index: 0, substrate: 1, inhibitor: 0, rate: 1, studentised, leverage: 0.5, why });

describe('which flagged points stand out', () => {
  it('high leverage alone is not enough; with a residual beyond the leveraged limit it is', () => {
    expect(standsOut(point(0.4, 'high leverage'))).toBe(false);
    expect(standsOut(point(LEVERAGED_RESIDUAL_LIMIT + 0.1, 'high leverage'))).toBe(true);
    expect(standsOut(point(-(LEVERAGED_RESIDUAL_LIMIT + 0.1), 'high leverage'))).toBe(true);
    expect(standsOut(point(STUDENTISED_LIMIT + 1, 'large residual'))).toBe(true);
    expect(standsOut(point(STUDENTISED_LIMIT + 1, 'large residual and high leverage'))).toBe(true);
  });

  it('on a fit with one planted outlier: the outlier is a large residual, every large residual stands out, leverage-only points are counted', () => {
    const competitive = MECHANISMS.find((m) => m.mechanism === 'competitive')!;
    const points = simulateRates({ mechanism: 'competitive', params: { Vmax: 100, Km: 10, Ki: 2 }, substrate: [2, 4, 7, 10, 15, 25, 50, 100], inhibitor: [0, 1, 2, 4, 8], replicates: 2, noise: 'constant', noiseLevel: 1, seed: 3 });
    points[17].rate += 25;
    // one well far out in [S] and one at a lone high [I]: high leverage, on the curve
    const far = simulateRates({ mechanism: 'competitive', params: { Vmax: 100, Km: 10, Ki: 2 }, substrate: [2000], inhibitor: [0, 200], replicates: 1, noise: 'constant', noiseLevel: 1, seed: 4 });
    const data = fitDataFromTable(tableOf([...points, ...far]));
    const d = residualDiagnostics(fitMechanism(competitive, data, 'constant'), data);
    const large = largeResidualPoints(d);
    expect(large.map((s) => s.index)).toContain(17);
    const { suspects, leverageOnly } = pointsThatStandOut(d);
    for (const s of large) expect(suspects).toContain(s);
    // the far wells carry high leverage on the curve: counted, not listed
    const onTheCurve = d.suspects.filter((s) => s.why === 'high leverage' && Math.abs(s.studentised) <= LEVERAGED_RESIDUAL_LIMIT);
    expect(onTheCurve.length).toBeGreaterThan(0);
    expect(leverageOnly).toBe(onTheCurve.length);
    for (const s of onTheCurve) expect(suspects).not.toContain(s);
    expect(largeResidualPoints(undefined)).toEqual([]);
  });
});
