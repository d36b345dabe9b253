/**
 * One-[S] tables (issue 13, item 5): recognised, fitted as a dose-response curve instead of five
 * mechanism fits, IC50 with intervals, Cheng-Prusoff Ki per mechanism with --km (Cheng, Y. and
 * Prusoff, W. H. (1973) Biochem. Pharmacol. 22, 3099-3108), and the JSON contract. Data: simulated
 * (INVENTED) competitive inhibitor, Ki 80 nM, Km 25 uM, one [S] of 50 uM.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ratesToCsv, simulateRates } from '../../src/simulate/simulate-rates.js';
import { isSingleSubstrateTable, substrateLevels } from '../../src/analysis/single-substrate.js';
import { parseRateText } from '../../src/input/index.js';
import { runCaptured } from '../helpers/cli-capture.js';

const cli = runCaptured;

function csvAt(substrate: number[]): string {
  const points = simulateRates({
    mechanism: 'competitive',
    params: { Vmax: 40, Km: 25, Ki: 80 },
    substrate,
    inhibitor: [0, 10, 30, 100, 300, 1000, 3000, 10000],
    replicates: 2,
    noise: 'proportional',
    noiseLevel: 0.04,
    seed: 9,
  });
  return ratesToCsv(points, { substrate: 'uM', inhibitor: 'nM' });
}

describe('single-[S] tables', () => {
  const root = mkdtempSync(join(tmpdir(), 'mechanist-ic50-'));
  writeFileSync(join(root, 'ic50.csv'), csvAt([50]));
  writeFileSync(join(root, 'shift.csv'), csvAt([10, 100]));

  it('are recognised; two [S] levels are not', () => {
    const [one] = parseRateText(readFileSync(join(root, 'ic50.csv'), 'utf8'), { source: 'ic50.csv' });
    const [two] = parseRateText(readFileSync(join(root, 'shift.csv'), 'utf8'), { source: 'shift.csv' });
    expect(isSingleSubstrateTable(one)).toBe(true);
    expect(substrateLevels(two)).toEqual([10, 100]);
    expect(isSingleSubstrateTable(two)).toBe(false);
  });

  it('--json: the doseResponse contract, with kiByMechanism from --km (Cheng-Prusoff from the IC50)', async () => {
    const r = await cli(['analyze', 'ic50.csv', '--json', '--km', '0.025mM'], root);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.out);
    expect(doc.design).toBe('single-substrate');
    expect(doc.models).toBeUndefined(); // no mechanism fits
    const d = doc.doseResponse;
    expect(['four-parameter-logistic', 'single-site-hyperbola']).toContain(d.model);
    expect(d.ic50.unit).toBe('nM');
    expect(d.ic50.ci95[0]).toBeLessThan(d.ic50.value);
    expect(d.ic50.ci95[1]).toBeGreaterThan(d.ic50.value);
    expect(typeof d.hill.value).toBe('number');
    expect(d.hill.ci95).toHaveLength(2);
    expect(d.substrate).toEqual({ value: 50, unit: 'uM' });
    expect(d.km).toEqual({ value: 25, unit: 'uM' });
    const k = d.kiByMechanism;
    expect(k.competitive.value).toBeCloseTo(d.ic50.value / (1 + 50 / 25), 10);
    expect(k.uncompetitive.value).toBeCloseTo(d.ic50.value / (1 + 25 / 50), 10);
    expect(k.noncompetitive.value).toBe(d.ic50.value);
    expect(k.mixed.value).toBeNull();
    // the simulated truth (competitive, Ki 80 nM) lies in the competitive interval
    expect(k.competitive.ci95[0]).toBeLessThan(80);
    expect(k.competitive.ci95[1]).toBeGreaterThan(80);
    expect(d.notes[0]).toMatch(/^One \[S\] cannot tell the mechanism/);
    expect(doc.verdict.mechanism).toBeNull();
  });

  it('text summary says plainly that one [S] cannot tell the mechanism, with units on every concentration', async () => {
    const r = await cli(['analyze', 'ic50.csv', '--km', '25uM'], root);
    expect(r.out).toContain('Verdict: one [S] level cannot tell the mechanism.');
    expect(r.out).toMatch(/IC50 \(.+\): [\d.]+ nM {2}profile 95% \[[\d.]+, [\d.]+\] nM/);
    expect(r.out).toContain('at [S] = 50 uM, Km = 25 uM (Cheng-Prusoff)');
  });

  it('without --km: no kiByMechanism, and a note on how to get it; --out writes results.json and summary.txt', async () => {
    const r = await cli(['analyze', 'ic50.csv', '--json', '--out', 'out'], root);
    const doc = JSON.parse(r.out);
    expect(doc.doseResponse.kiByMechanism).toBeUndefined();
    expect(doc.doseResponse.notes.some((n: string) => n.includes('--km'))).toBe(true);
    expect(JSON.parse(readFileSync(join(root, 'out', 'results.json'), 'utf8'))).toEqual(doc);
    expect(existsSync(join(root, 'out', 'summary.txt'))).toBe(true);
  });

  it('two [S] levels go through the global mechanism fit as before', async () => {
    const r = await cli(['analyze', 'shift.csv', '--json', '--no-profile'], root);
    const doc = JSON.parse(r.out);
    expect(doc.doseResponse).toBeUndefined();
    expect(doc.models).toHaveLength(5);
  });

  it('--km with a unit that is not a concentration is a usage error', async () => {
    const r = await cli(['analyze', 'ic50.csv', '--km', '25 kg'], root);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/^mechanist: option --km: unknown concentration unit "kg"/);
  });
});

describe('single-[S] compounds in a batch', () => {
  const root = mkdtempSync(join(tmpdir(), 'mechanist-ic50-batch-'));
  writeFileSync(join(root, 'ic50.csv'), csvAt([50]));
  writeFileSync(join(root, 'grid.csv'), csvAt([5, 10, 25, 50, 100, 200]));

  it('get the dose-response IC50 in their row, no mechanism, and a headline saying one [S] cannot tell it', async () => {
    const r = await cli(['batch', 'ic50.csv', 'grid.csv', '--out', 'out', '--reports', '--no-profile'], root);
    expect(r.code).toBe(0);
    const rows = JSON.parse(readFileSync(join(root, 'out', 'summary.json'), 'utf8')).compounds;
    const alone = JSON.parse((await cli(['analyze', 'ic50.csv', '--json'], root)).out).doseResponse.ic50;
    expect(rows[0].mechanism).toBeNull();
    expect(rows[0].IC50.value).toBe(alone.value);
    expect([rows[0].IC50.low, rows[0].IC50.high]).toEqual(alone.ci95);
    expect(rows[0].headline).toMatch(/^One \[S\] level: IC50 [\d.]+ nM \(profile 95% \[[\d.]+, [\d.]+\]\); one \[S\] cannot tell the mechanism\.$/);
    expect(rows[0].report).toBe('compounds/ic50/summary.txt');
    expect(existsSync(join(root, 'out', 'compounds', 'ic50', 'results.json'))).toBe(true);
    expect(rows[1].IC50).toBeNull();
    expect(rows[1].mechanism).not.toBeNull();
    const header = readFileSync(join(root, 'out', 'summary.csv'), 'utf8').split('\n')[0].split(',');
    expect(header).toEqual(expect.arrayContaining(['ic50', 'ic50_ci95_low', 'ic50_ci95_high', 'ic50_interval', 'ic50_unit']));
    expect(readFileSync(join(root, 'out', 'index.html'), 'utf8')).toContain('IC50 <span class="unit">(nM)</span>');
  }, 60_000);
});
