/** `mechanist rates`, and `analyze` / `batch` with --reads --plate-map (in-process CLI). */
import { describe, expect, it, beforeAll } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { simulatePlate } from '../../src/simulate/simulate-plate.js';
import { parseRateText } from '../../src/input/index.js';
import { runCaptured } from '../helpers/cli-capture.js';

const run = runCaptured;

let dir = '';
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'mechanist-rates-'));
  // invented enzyme and compound, competitive, Km 20 uM, Ki 1 uM
  const plate = simulatePlate({
    mechanism: 'competitive', params: { Vmax: 0.01, Km: 20, Ki: 1 },
    substrate: [4, 8, 12, 20, 30, 50, 100, 160], inhibitor: [0, 0.5, 1, 2, 4], replicates: 2,
    times: Array.from({ length: 40 }, (_, k) => 15 * k), signalPerUnit: 0.00622, baseline: 0.3, noiseSd: 0.0003, seed: 4, compound: 'QX-101',
  });
  writeFileSync(join(dir, 'reads.csv'), plate.readsCsv);
  // one extra well in the map that has no reads, and one excluded by role
  writeFileSync(join(dir, 'map.csv'), plate.mapCsv.replace('A2,QX-101,4,0,sample', 'A2,QX-101,4,0,exclude') + 'P24,QX-101,4,0,sample\n');
  writeFileSync(join(dir, 'std.csv'), 'concentration (mM),signal\n0,0.3\n0.05,0.6110\n0.1,0.9220\n0.2,1.5440\n');
});

describe('mechanist rates', () => {
  it('writes a rate table that analyze reads as it is; notes and a summary on stderr', async () => {
    const r = await run(['rates', 'reads.csv', '--plate-map', 'map.csv', '--conversion', '6.22/mM', '--out', 'rates.csv'], dir);
    expect(r.code).toBe(0);
    expect(r.err).toContain('1 plate-map well has no reads: P24');
    expect(r.err).toContain("mechanist: 80 wells read: 80 with a rate, 1 marked excluded (excluded in the map 1); 16 blank wells; rates in uM/s");
    const text = readFileSync(join(dir, 'rates.csv'), 'utf8');
    expect(text.split('\n')[0]).toBe('well,compound,substrate (uM),inhibitor (uM),rate (uM/s),sd (uM/s),exclude,note,method,window_from (s),window_to (s),window_reads,substrate_used_pct,blank,depletion_factor');
    const [table] = parseRateText(text, { source: 'rates.csv' });
    expect(table.rowsRead).toBe(81);
    expect(table.excluded.find((e) => e.reason.includes('flagged in the exclude column'))).toBeDefined();
    expect(table.hasSd).toBe(true);
    const a = await run(['analyze', 'rates.csv', '--error', 'column'], dir);
    expect(a.code).toBe(0);
    expect(a.out).toMatch(/Verdict: The data support competitive inhibition/);
  });
  it('a standard-curve file as the conversion gives the same rates as its slope (6.22 per mM)', async () => {
    const byFactor = await run(['rates', 'reads.csv', '--plate-map', 'map.csv', '--conversion', '6.22/mM'], dir);
    const byCurve = await run(['rates', 'reads.csv', '--plate-map', 'map.csv', '--conversion', 'std.csv'], dir);
    expect(byCurve.code).toBe(0);
    expect(byCurve.err).toContain('standard curve std.csv: slope 6.22');
    const rate = (out: string) => Number(out.split('\n')[1].split(',')[4]);
    expect(rate(byCurve.out)).toBeCloseTo(rate(byFactor.out), 10);
  });
  it('Beer-Lambert factor per cm with a path length', async () => {
    const r = await run(['rates', 'reads.csv', '--plate-map', 'map.csv', '--conversion', '6220/M/cm', '--path-length', '1'], dir);
    expect(r.code).toBe(0);
    expect(r.err).toContain('Beer-Lambert law: 6220 per M per cm x 1 cm = 6220 signal per M');
  });
  it('bad input: one line with file, line and column, exit code 2', async () => {
    writeFileSync(join(dir, 'bad-map.csv'), 'well,substrate (uM),inhibitor (uM),role\nA1,4,0,sample\nA2,4,0,enzym\n');
    const r = await run(['rates', 'reads.csv', '--plate-map', 'bad-map.csv'], dir);
    expect(r.code).toBe(2);
    expect(r.err).toBe('mechanist: bad-map.csv:3:4: role "enzym" not understood; write sample, blank (no enzyme) or exclude, or leave it blank for a sample\n');
    const missing = await run(['rates', 'nope.csv', '--plate-map', 'map.csv'], dir);
    expect(missing.code).toBe(2);
    expect(missing.err).toBe('mechanist: nope.csv: no such file; check the path\n');
    const option = await run(['rates', 'reads.csv', '--plate-map', 'map.csv', '--conversion', 'six'], dir);
    expect(option.code).toBe(2);
    expect(option.err).toMatch(/^mechanist: option --conversion: "six" is neither a factor/);
  });
});

describe('analyze and batch with --reads --plate-map', () => {
  it('analyze goes straight from reads to the verdict', async () => {
    const r = await run(['analyze', '--reads', 'reads.csv', '--plate-map', 'map.csv', '--conversion', '6.22/mM', '--error', 'column', '--no-profile'], dir);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^rates from reads\.csv, compound "QX-101": long layout/m);
    expect(r.out).toMatch(/Verdict: The data support competitive inhibition/);
  });
  it('analyze refuses a table and reads together, and a plate map without reads', async () => {
    expect((await run(['analyze', 'x.csv', '--reads', 'reads.csv', '--plate-map', 'map.csv'], dir)).code).toBe(2);
    const r = await run(['analyze', 'x.csv', '--plate-map', 'map.csv'], dir);
    expect(r.code).toBe(2);
    expect(r.err).toBe('mechanist: option --plate-map: only used with --reads\n');
  });
  it('batch writes the rate table into the output folder and analyses it', async () => {
    const r = await run(['batch', '--out', 'out', '--jobs', '1', '--no-profile', '--error', 'column', '--reads', 'reads.csv', '--plate-map', 'map.csv', '--conversion', '6.22/mM'], dir);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^1 of 1 compounds analysed/);
    const summary = readFileSync(join(dir, 'out', 'summary.csv'), 'utf8');
    expect(summary).toContain('QX-101');
    expect(summary).toContain('competitive');
    expect(readFileSync(join(dir, 'out', 'rates-from-reads.csv'), 'utf8')).toMatch(/^well,compound,substrate \(uM\)/);
  });
});

describe('mechanist rates --report', () => {
  it('writes DIR/reads.html with one panel per well that has reads', async () => {
    const r = await run(['rates', 'reads.csv', '--plate-map', 'map.csv', '--conversion', '6.22/mM', '--report', 'page', '--out', 'r2.csv'], dir);
    expect(r.code).toBe(0);
    expect(r.err).toContain('page page/reads.html');
    const html = readFileSync(join(dir, 'page', 'reads.html'), 'utf8');
    expect(html.match(/<svg /g)!.length).toBe(80);
    expect(html).toContain('plate-map well P24 (line 98) has no reads');
  });
});
