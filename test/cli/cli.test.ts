import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/run-cli.js';
import { LARGE_FILE_BYTES } from '../../src/cli/commands/analyze-action.js';
import { runCaptured } from '../helpers/cli-capture.js';

const ROOT = join(__dirname, '..', '..');

const run = (args: string[], cwd: string = ROOT) => runCaptured(args, cwd);

function tmp(): string {
  return mkdtempSync(join(tmpdir(), 'mechanist-cli-'));
}

describe('mechanist analyze', () => {
  it('prints the verdict and the ranked table for the demo data', async () => {
    const r = await run(['analyze', 'data/demo/hlx-amidase-kt0417.csv', '--error', 'proportional']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^Verdict: /m);
    expect(r.out).toMatch(/Models, ranked by AICc/);
    expect(r.out).toMatch(/line 19: flagged in the exclude column/);
    expect(r.err).toBe('');
  });

  it('--json gives one JSON document of the documented shape, models sorted by AICc', async () => {
    const r = await run(['analyze', 'data/demo/hlx-amidase-kt0417.csv', '--json']);
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.out);
    expect(doc.input.rowsRead).toBe(doc.input.rowsUsed + doc.input.excluded.length);
    expect(doc.input.excluded[0]).toMatchObject({ line: 19, reason: expect.any(String) });
    expect(doc.models.map((m: { mechanism: string }) => m.mechanism).sort()).toEqual(['competitive', 'mixed', 'noncompetitive', 'none', 'uncompetitive']);
    for (let k = 1; k < doc.models.length; k++) expect(doc.models[k].aicc).toBeGreaterThanOrEqual(doc.models[k - 1].aicc);
    const names: Record<string, string[]> = {
      none: ['Vmax', 'Km'],
      competitive: ['Vmax', 'Km', 'Ki'],
      uncompetitive: ['Vmax', 'Km', 'Kiu'],
      noncompetitive: ['Vmax', 'Km', 'Ki'],
      mixed: ['Vmax', 'Km', 'Ki', 'Kiu', 'alpha'],
    };
    for (const m of doc.models) {
      expect(Object.keys(m.params)).toEqual(names[m.mechanism]);
      expect(typeof m.converged).toBe('boolean');
      for (const key of ['sse', 'aicc', 'bic', 'weight']) expect(typeof m[key]).toBe('number');
      expect(m.params.Km).toMatchObject({ value: expect.any(Number), se: expect.any(Number), ci95: [expect.any(Number), expect.any(Number)] });
    }
    expect(doc.verdict).toMatchObject({ mechanism: expect.any(String), decisive: expect.any(Boolean), reasons: expect.any(Array) });
    const weights = doc.models.reduce((a: number, m: { weight: number }) => a + m.weight, 0);
    expect(weights).toBeCloseTo(1, 12);
  });

  it('--out writes results.json, parameters.csv and summary.txt', async () => {
    const dir = tmp();
    const r = await run(['analyze', join(ROOT, 'data/demo/hlx-amidase-kt0417.csv'), '--out', dir]);
    expect(r.code).toBe(0);
    for (const f of ['results.json', 'parameters.csv', 'summary.txt']) expect(existsSync(join(dir, f))).toBe(true);
    const csv = readFileSync(join(dir, 'parameters.csv'), 'utf8').trim().split('\n');
    expect(csv[0]).toBe('mechanism,rank,aicc_weight,parameter,value,se,wald95_low,wald95_high,profile95_low,profile95_high,detected,note');
    const doc = JSON.parse(readFileSync(join(dir, 'results.json'), 'utf8'));
    const best = doc.models[0];
    const km = csv.find((line) => line.startsWith(`${best.mechanism},1,`) && line.split(',')[3] === 'Km')!.split(',');
    expect(Number(km[4])).toBe(best.params.Km.value);
    expect(Number(km[8])).toBe(best.params.Km.profile95[0]);
    expect(Number(km[9])).toBe(best.params.Km.profile95[1]);
  });

  it('a malformed file: one line naming file, line and column; exit 2; no stack trace', async () => {
    const dir = tmp();
    const file = join(dir, 'broken.csv');
    writeFileSync(file, 'substrate,inhibitor,rate\n1,0,2\n2,0,-x\n3,-1,4\n');
    const r = await run(['analyze', file]);
    expect(r.code).toBe(2);
    expect(r.err.trim().split('\n')).toHaveLength(1);
    expect(r.err).toMatch(/broken\.csv:4:2: /);
    expect(r.err).not.toMatch(/at .*\.ts|undefined|NaN/);
  });

  it('a missing file and a bad option end in exit 2 with one line', async () => {
    const a = await run(['analyze', 'no-such-file.csv']);
    expect(a.code).toBe(2);
    expect(a.err.trim().split('\n')).toHaveLength(1);
    const b = await run(['analyze', 'data/demo/hlx-amidase-kt0417.csv', '--error', 'cauchy']);
    expect(b.code).toBe(2);
    expect(b.err).toMatch(/--error: "cauchy" is not one of constant, proportional, sqrt, column, auto/);
    const c = await run(['analyze']);
    expect(c.code).toBe(2);
    const d = await run(['frobnicate']);
    expect(d.code).toBe(2);
  });

  it('an analysis that cannot be completed exits 1 and says why', async () => {
    const r = await run(['analyze', 'data/demo/hlx-amidase-kt0417.csv', '--error', 'column']);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/analysis not completed: the column error model needs/);
  });

  it('a multi-compound file asks which compound, and --compound all analyses each', async () => {
    const a = await run(['analyze', 'examples/compounds-long.csv']);
    expect(a.code).toBe(2);
    expect(a.err).toMatch(/holds \d+ compounds .*--compound/);
    const b = await run(['analyze', 'examples/compounds-long.csv', '--compound', 'all', '--json']);
    expect(b.code).toBe(0);
    const docs = JSON.parse(b.out);
    expect(Array.isArray(docs)).toBe(true);
    expect(docs.length).toBeGreaterThan(1);
  });

  it('--help documents the exit codes', async () => {
    const r = await run(['--help']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/Exit codes:/);
    expect(r.out).toMatch(/2 {2}bad input or usage/);
  });
});

describe('mechanist simulate', () => {
  it('writes a reproducible CSV that analyze reads back and calls correctly', async () => {
    const dir = tmp();
    const args = ['simulate', '--mechanism', 'uncompetitive', '--vmax', '50', '--km', '5', '--kiu', '3', '--substrate', '1,2,4,8,16,32,64', '--inhibitor', '0,1.5,3,6,12', '--seed', '9'];
    const a = await run([...args, '--output', join(dir, 'a.csv')]);
    const b = await run(args);
    expect(a.code).toBe(0);
    expect(readFileSync(join(dir, 'a.csv'), 'utf8')).toBe(b.out);
    const r = await run(['analyze', join(dir, 'a.csv'), '--error', 'proportional', '--json']);
    const doc = JSON.parse(r.out);
    expect(doc.verdict.mechanism).toBe('uncompetitive');
  });
  it('refuses a model without its constant', async () => {
    const r = await run(['simulate', '--mechanism', 'mixed', '--ki', '2']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/needs --kiu/);
  });
});

describe('mechanist demo', () => {
  it('analyses the shipped demo data and writes the results folder', async () => {
    const dir = tmp();
    const r = await run(['demo', '--out', join(dir, 'demo')]);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/mixed inhibition, leaning competitive/);
    expect(existsSync(join(dir, 'demo', 'results.json'))).toBe(true);
  });
});

describe('notes on big inputs (issue 16, item 6)', () => {
  it(`a file of ${LARGE_FILE_BYTES / 1e6} MB or more is announced on a terminal before it is read; not when stderr is not a terminal`, async () => {
    const dir = mkdtempSync(join(tmpdir(), 'mechanist-big-'));
    const file = join(dir, 'big.csv');
    writeFileSync(file, 'substrate,inhibitor,rate,rate\n' + '1,0,2,3\n'.repeat(Math.ceil(LARGE_FILE_BYTES / 8)));
    for (const errIsTTY of [true, false]) {
      let err = '';
      const code = await runCli(['analyze', file], { out: () => {}, err: (t) => void (err += t), errIsTTY, cwd: dir });
      expect(code).toBe(2);
      const lines = err.trim().split('\n');
      expect(lines.at(-1)).toMatch(/duplicate column name "rate"/);
      expect(lines.length).toBe(errIsTTY ? 2 : 1);
      if (errIsTTY) expect(lines[0]).toMatch(new RegExp(`^mechanist: note: reading .*big\\.csv \\(10 MB\\)$`));
    }
  });
});
