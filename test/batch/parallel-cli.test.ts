/**
 * The parallel path of `mechanist batch`, on the compiled CLI (worker threads load dist/batch/
 * worker.js, which exists only after `npx tsc -p tsconfig.json`; `npm test` builds first).
 * The outputs must be byte-identical whatever the number of workers. Data: simulated.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { existsSync, readFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { writeBatchInputs } from './batch-inputs.js';

const root = join(import.meta.dirname, '..', '..');
const mainJs = join(root, 'dist', 'cli', 'main.js');
const workerJs = join(root, 'dist', 'batch', 'worker.js');

function runBuilt(args: string[], cwd: string) {
  const r = spawnSync(process.execPath, [mainJs, ...args], { cwd, encoding: 'utf8' });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

describe('mechanist batch on worker threads (built CLI)', () => {
  const inputs = writeBatchInputs({ broken: true });
  const args = ['plates', 'loose-noncompetitive.csv', 'screen.csv', '--reports'];

  beforeAll(() => {
    if (!existsSync(mainJs) || !existsSync(workerJs)) throw new Error('dist/ is missing: run `npx tsc -p tsconfig.json` before these tests (npm test does)');
  });

  it('writes byte-identical summaries and reports with --jobs 1 and 2', { timeout: 300_000 }, () => {
    const runs = ['1', '2'].map((jobs) => ({ jobs, ...runBuilt(['batch', ...args, '--out', `out-${jobs}`, '--jobs', jobs], inputs.root) }));
    for (const run of runs) {
      expect(run.code).toBe(1); // plates/broken.csv fails
      expect(run.out).toMatch(/^7 of 8 compounds analysed, 1 failed; /);
      expect(run.err).not.toContain('\r'); // stderr is not a terminal: no progress bar
      expect(run.err).toMatch(/^mechanist: broken: plates\/broken\.csv:/);
      expect(run.err).not.toContain('worker threads could not be used');
    }
    const files = ['summary.csv', 'summary.json', 'compounds/mixed/results.json', 'compounds/CPD-1/parameters.csv', 'compounds/CPD-2/summary.txt'];
    for (const file of files) {
      const first = readFileSync(join(inputs.root, 'out-1', file));
      for (const run of runs.slice(1)) expect(readFileSync(join(inputs.root, `out-${run.jobs}`, file)).equals(first), `${file} with --jobs ${run.jobs}`).toBe(true);
    }
  });

  it('really runs on worker threads, with the rows of the in-thread run', { timeout: 300_000 }, () => {
    const script = `
      const { runBatch } = await import(${JSON.stringify(pathToFileURL(join(root, 'dist', 'index.js')).href)});
      const parallel = await runBatch(['plates', 'screen.csv'], { jobs: 2 });
      const serial = await runBatch(['plates', 'screen.csv'], { jobs: 1 });
      console.log(JSON.stringify({ threads: [parallel.threadsUsed, serial.threadsUsed], problem: parallel.workerProblem, same: JSON.stringify(parallel.rows) === JSON.stringify(serial.rows), n: parallel.rows.length }));
    `;
    const r = spawnSync(process.execPath, ['--input-type=module', '-e', script], { cwd: inputs.root, encoding: 'utf8' });
    expect(r.stderr).toBe('');
    expect(JSON.parse(r.stdout)).toEqual({ threads: [2, 0], problem: null, same: true, n: 7 });
  });

  it('starts its workers without the parent\'s node options when node refuses them for a worker (V8 flags)', { timeout: 300_000 }, () => {
    const script = `
      const { runBatch } = await import(${JSON.stringify(pathToFileURL(join(root, 'dist', 'index.js')).href)});
      const parallel = await runBatch(['plates', 'screen.csv'], { jobs: 2 });
      const serial = await runBatch(['plates', 'screen.csv'], { jobs: 1 });
      console.log(JSON.stringify({ threads: parallel.threadsUsed, problem: parallel.workerProblem, same: JSON.stringify(parallel.rows) === JSON.stringify(serial.rows), n: parallel.rows.length }));
    `;
    // --maglev and --max-old-space-size are V8 flags: a worker thread refuses them
    // (ERR_WORKER_INVALID_EXEC_ARGV); the run once failed with that error, then ran on one thread
    for (const flag of ['--maglev', '--max-old-space-size=2048']) {
      const r = spawnSync(process.execPath, [flag, '--input-type=module', '-e', script], { cwd: inputs.root, encoding: 'utf8' });
      expect(r.stderr, flag).toBe('');
      expect(JSON.parse(r.stdout), flag).toEqual({ threads: 2, problem: null, same: true, n: 7 });
    }
  });
});
