/**
 * IC50-shift designs (issue 13, item 5): 2-3 [S] levels with full [I] series go through the global
 * fit as before, and the report adds IC50 against [S], one dose-response IC50 per series. Data:
 * simulated (INVENTED) competitive inhibitor, Ki 80 nM, Km 25 uM, [S] 5, 50 and 500 uM; for a
 * competitive inhibitor IC50 = Ki (1 + [S]/Km) (Cheng, Y. and Prusoff, W. H. (1973) Biochem.
 * Pharmacol. 22, 3099-3108), so the series IC50 must rise with [S].
 */
import { describe, expect, it } from 'vitest';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import { ic50ShiftSeries, isIc50ShiftDesign } from '../../src/analysis/ic50-shift.js';
import { analyzeSingleSubstrate } from '../../src/analysis/single-substrate.js';
import { renderFigures } from '../../src/figures/render-figures.js';
import { simulateRates } from '../../src/simulate/simulate-rates.js';
import { tableFromPoints } from '../../src/simulate/table-from-points.js';
import { simulatedTable } from '../helpers/sim-table.js';

const SUBSTRATE = [5, 50, 500];
const table = tableFromPoints(
  simulateRates({ mechanism: 'competitive', params: { Vmax: 40, Km: 25, Ki: 80 }, substrate: SUBSTRATE, inhibitor: [0, 10, 30, 100, 300, 1000, 3000, 10000], replicates: 2, noise: 'proportional', noiseLevel: 0.04, seed: 5 }),
  { units: { substrate: 'uM', inhibitor: 'nM' } },
);

describe('IC50-shift design', () => {
  it('is recognised for 2-3 [S] with full [I] series, not for a grid of 8 [S]', () => {
    expect(isIc50ShiftDesign(table)).toBe(true);
    expect(isIc50ShiftDesign(simulatedTable('competitive', 1))).toBe(false);
    expect(ic50ShiftSeries(simulatedTable('competitive', 1))).toEqual([]);
  });

  it('one IC50 per [S], equal to the one-[S] analysis of that series, rising with [S] as a competitive inhibitor must', () => {
    const series = ic50ShiftSeries(table);
    expect(series.map((p) => p.substrate)).toEqual(SUBSTRATE);
    for (const p of series) {
      const alone = analyzeSingleSubstrate({ ...table, points: table.points.filter((q) => q.substrate === p.substrate) });
      const chosen = alone.evidence.models.find((m) => m.model === alone.evidence.chosen)!;
      expect(p.ic50).toBe(chosen.ic50.value);
    }
    expect(series[1].ic50).toBeGreaterThan(series[0].ic50);
    expect(series[2].ic50).toBeGreaterThan(series[1].ic50);
    // the truth Ki (1 + S/Km) lies inside at least two of the three intervals (invented data, 4% noise)
    const inside = series.filter((p) => p.interval[0]! < 80 * (1 + p.substrate / 25) && 80 * (1 + p.substrate / 25) < p.interval[1]!);
    expect(inside.length).toBeGreaterThanOrEqual(2);
  });

  it('the report draws IC50 against [S] for this design only, with the global fit\'s implied line', () => {
    const result = analyzeTable(table, { profile: false });
    expect(result.verdict.mechanism).toBe('competitive');
    const figure = renderFigures(result).find((f) => f.id === 'fig-ic50-shift');
    expect(figure?.file).toBe('ic50-shift.svg');
    expect(figure!.svg.match(/class="series-ic50"/g)).toHaveLength(3);
    expect(figure!.svg).toContain('class="implied-ic50"');
    const grid = renderFigures(analyzeTable(simulatedTable('competitive', 1), { profile: false }));
    expect(grid.some((f) => f.id === 'fig-ic50-shift')).toBe(false);
  }, 60_000);
});
