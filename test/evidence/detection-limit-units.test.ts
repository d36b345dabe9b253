/**
 * "highest [I] tested: 200 nM": a no-inhibition call prints its concentrations with their unit
 * (issue 13, item 3). Data: simulated (INVENTED) enzyme without inhibitor, [I] up to 200 nM.
 */
import { describe, expect, it } from 'vitest';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import { simulateRates } from '../../src/simulate/simulate-rates.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';
import { textSummary } from '../../src/report/text-summary.js';
import { wordVerdict } from '../../src/wording/verdict-words.js';

describe('no-inhibition reason with units', () => {
  it('names the highest [I] with its unit, in the verdict and the text summary', () => {
    const points = simulateRates({ mechanism: 'none', params: { Vmax: 50, Km: 20 }, substrate: [5, 10, 20, 40, 80, 160], inhibitor: [0, 25, 50, 100, 200], replicates: 2, noise: 'proportional', noiseLevel: 0.03, seed: 31 });
    const result = analyzeTable(tableFromPoints(points, { units: { substrate: 'uM', inhibitor: 'nM' } }), { profile: false });
    expect(result.verdict.outcome).toBe('no-inhibition');
    const reason = result.verdict.reasons.find((r) => r.code === 'inhibitor-reach');
    expect(reason).toMatchObject({ code: 'inhibitor-reach', highest: 200, unit: 'nM' });
    expect(wordVerdict(result.verdict).reasons).toContainEqual(expect.stringMatching(/^highest \[I\] tested: 200 nM/));
    expect(textSummary(result)).toContain('highest [I] tested: 200 nM');
  });
});
