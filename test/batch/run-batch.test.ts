/**
 * `mechanist batch` run in-process (under the test runner the compounds run in the calling thread,
 * see src/batch/worker-pool.ts): mixed inputs, failed compounds, exit codes, and agreement of every
 * summary row with `mechanist analyze` on that compound alone. Data: simulated (batch-inputs.ts).
 */
import { describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { CompoundSummary } from '../../src/batch/types.js';
import { compoundColumnCsv, simulatedCsv, writeBatchInputs } from './batch-inputs.js';
import { runCaptured } from '../helpers/cli-capture.js';

const cli = runCaptured;

function summaryRows(out: string): CompoundSummary[] {
  return JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8')).compounds as CompoundSummary[];
}

describe('mechanist batch: mixed inputs', () => {
  const inputs = writeBatchInputs();
  const out = join(inputs.root, 'out');
  // One batch run shared by the tests below, started by whichever test runs first: each test awaits it, so
  // any one of them can run alone (vitest -t) and none depends on another having run before it.
  let run: Promise<{ result: { code: number; out: string; err: string }; rows: CompoundSummary[] }> | undefined;
  const batchRun = () =>
    (run ??= cli(['batch', 'plates', 'loose-noncompetitive.csv', 'screen.csv', '--out', 'out', '--reports'], inputs.root).then(
      (result) => ({ result, rows: result.code === 0 ? summaryRows(out) : [] }),
    ));

  it('reads a folder, a file and a compound-column file, in input order, with unique ids', async () => {
    const { result, rows } = await batchRun();
    expect(result.err).toBe('');
    expect(result.code).toBe(0);
    expect(result.out).toMatch(/^7 of 7 compounds analysed; wrote out\/summary\.csv, out\/summary\.json, out\/index\.html\n$/);
    expect(rows.map((r) => [r.position, r.compound, r.source, r.nameInFile])).toEqual([
      [1, 'competitive.csv', 'plates/competitive.csv', null],
      [2, 'mixed', 'plates/mixed.csv', null],
      [3, 'uncompetitive', 'plates/uncompetitive.csv', null],
      [4, 'loose-noncompetitive', 'loose-noncompetitive.csv', null],
      [5, 'CPD-1', 'screen.csv', 'CPD-1'],
      [6, 'CPD-2', 'screen.csv', 'CPD-2'],
      // "competitive" is also the id of plates/competitive.csv: both get longer ids
      [7, 'competitive@screen.csv', 'screen.csv', 'competitive'],
    ]);
    expect(rows.every((r) => r.status === 'analysed' && r.error === null)).toBe(true);
    const csv = readFileSync(join(out, 'summary.csv'), 'utf8').trim().split('\n');
    expect(csv).toHaveLength(8);
    expect(csv[0].split(',').slice(0, 6)).toEqual(['position', 'compound', 'source', 'name_in_file', 'status', 'outcome']);
    expect(csv[0]).toContain('ki_ci95_low');
  });

  it('gives each compound the values `mechanist analyze` gives it alone', async () => {
    const { rows } = await batchRun();
    expect(rows).toHaveLength(7);
    const level = 0.95;
    for (const row of rows) {
      const args = ['analyze', row.source, '--json', ...(row.nameInFile !== null ? ['--compound', row.nameInFile] : [])];
      const alone = await cli(args, inputs.root);
      expect(alone.code).toBe(0);
      const doc = JSON.parse(alone.out);
      expect(row.outcome).toBe(doc.verdict.outcome);
      expect(row.mechanism).toBe(doc.verdict.mechanism);
      expect(row.decisive).toBe(doc.verdict.decisive);
      expect(row.headline).toBe(doc.verdict.headline);
      expect(row.topModel).toBe(doc.models[0].mechanism);
      expect(row.topWeight).toBe(doc.models[0].weight);
      expect(row.gapToSecond).toBeCloseTo(doc.models[1].aicc - doc.models[0].aicc, 12);
      expect(row.rowsUsed).toBe(doc.input.rowsUsed);
      const called = doc.models.find((m: { mechanism: string }) => m.mechanism === doc.verdict.mechanism);
      expect(row.constantsOf).toBe(called.mechanism);
      expect(row.Km).toBe(called.params.Km.value);
      expect(row.Vmax).toBe(called.params.Vmax.value);
      for (const name of ['Ki', 'Kiu', 'alpha'] as const) {
        const p = called.params[name];
        const c = row[name];
        if (p === undefined) {
          expect(c).toBeNull();
          continue;
        }
        expect(c).not.toBeNull();
        if (!p.detected) {
          expect(c!.interval).toBe('not-detected');
          expect(c!.value).toBeNull();
          continue;
        }
        expect(c!.value).toBe(p.value);
        const ci = `ci${level * 100}`;
        if (c!.interval === 'wald') expect([c!.low, c!.high]).toEqual(p[ci]);
        else expect(c!.interval).toBe('profile');
      }
    }
  });

  it('writes each report folder as `analyze --out` does, and links it from the summary', async () => {
    const { rows } = await batchRun();
    expect(rows).toHaveLength(7);
    for (const row of rows) {
      expect(row.report).not.toBeNull();
      expect(existsSync(join(out, row.report!))).toBe(true);
      expect(row.report!.startsWith('compounds/')).toBe(true);
    }
    const alone = await cli(['analyze', 'plates/mixed.csv', '--out', 'alone'], inputs.root);
    expect(alone.code).toBe(0);
    const folder = join(out, 'compounds', 'mixed');
    expect(readFileSync(join(folder, 'results.json'), 'utf8')).toBe(readFileSync(join(inputs.root, 'alone', 'results.json'), 'utf8'));
    expect(readFileSync(join(folder, 'parameters.csv'), 'utf8')).toBe(readFileSync(join(inputs.root, 'alone', 'parameters.csv'), 'utf8'));
  });

  it('puts no date or timing into summary.csv and summary.json, and a run date into index.html', async () => {
    await batchRun();
    const stamp = /\d{4}-\d\d-\d\dT\d\d:\d\d/;
    expect(readFileSync(join(out, 'summary.csv'), 'utf8')).not.toMatch(stamp);
    expect(readFileSync(join(out, 'summary.json'), 'utf8')).not.toMatch(stamp);
    expect(readFileSync(join(out, 'index.html'), 'utf8')).toMatch(stamp);
    const doc = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8'));
    expect(doc.counts).toEqual({ compounds: 7, analysed: 7, failed: 0 });
    expect(doc.settings).toMatchObject({ errorModel: 'auto', level: 0.95, reports: true });
  });
});

describe('mechanist batch: failures', () => {
  it('gives a corrupt file and an unfittable compound a row saying why, analyses the rest, and exits 1', async () => {
    const inputs = writeBatchInputs({ broken: true });
    // a compound-column file in which NEG has a negative rate: the proportional error model refuses it
    const good = simulatedCsv('competitive', { Vmax: 100, Km: 10, Ki: 1 }, 31);
    const negative = simulatedCsv('competitive', { Vmax: 100, Km: 10, Ki: 1 }, 32).replace(/\n(2,0,)[0-9.]+,1\n/, '\n$1-0.5,1\n');
    expect(negative).toContain('2,0,-0.5,1');
    writeFileSync(join(inputs.root, 'two.csv'), compoundColumnCsv([['GOOD', good], ['NEG', negative]]));
    const result = await cli(['batch', 'plates', 'two.csv', 'missing.csv', '--out', 'out', '--error', 'proportional'], inputs.root);
    expect(result.code).toBe(1);
    const rows = summaryRows(join(inputs.root, 'out'));
    expect(rows.map((r) => [r.compound, r.status])).toEqual([
      ['broken', 'failed'],
      ['competitive', 'analysed'],
      ['mixed', 'analysed'],
      ['uncompetitive', 'analysed'],
      ['GOOD', 'analysed'],
      ['NEG', 'failed'],
      ['missing', 'failed'],
    ]);
    const byId = new Map(rows.map((r) => [r.compound, r]));
    expect(byId.get('broken')!.error).toMatch(/^plates\/broken\.csv:\d+(:\d+)?: /);
    expect(byId.get('NEG')!.error).toMatch(/^analysis not completed: .*positive rates/);
    expect(byId.get('NEG')!.rowsUsed).toBe(80);
    expect(byId.get('missing')!.error).toMatch(/missing\.csv.*no such file/);
    expect(rows.filter((r) => r.status === 'failed').every((r) => r.outcome === null && r.report === null)).toBe(true);
    expect(result.out).toMatch(/^4 of 7 compounds analysed, 3 failed; /);
    for (const id of ['broken', 'NEG', 'missing']) expect(result.err).toContain(`mechanist: ${id}: `);
    const csv = readFileSync(join(inputs.root, 'out', 'summary.csv'), 'utf8');
    expect(csv.split('\n')[1]).toMatch(/^1,broken,plates\/broken\.csv,,failed,/);
  });

  it('exits 2 when the inputs hold no rate-table file, or none is given', async () => {
    const root = mkdtempSync(join(tmpdir(), 'mechanist-batch-empty-'));
    mkdirSync(join(root, 'empty'));
    const empty = await cli(['batch', 'empty', '--out', 'out'], root);
    expect(empty.code).toBe(2);
    expect(empty.err).toMatch(/^mechanist: no rate-table files found in empty; /);
    expect(existsSync(join(root, 'out'))).toBe(false);
    expect((await cli(['batch', '--out', 'out'], root)).code).toBe(2);
    expect((await cli(['batch', 'empty'], root)).code).toBe(2);
    expect((await cli(['batch', 'empty', '--out', 'o', '--jobs', '0'], root)).code).toBe(2);
  });
});
