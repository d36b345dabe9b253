#!/usr/bin/env node
/**
 * Whole-process times of the command line, as a user waits for them: each command is started as
 * its own node process (node dist/cli/main.js ...) and timed from spawn to exit, so module
 * loading, the analysis and writing are all included.
 *
 *   npx tsc -p tsconfig.json && node bench/startup-bench.mjs
 *
 * Commands and targets (issue 13): `--help` under 0.3 s, `analyze --json` on the demo data under
 * 0.5 s, `analyze --out` on the demo data under 1.5 s (median of the timed runs, after one
 * untimed run that warms the file cache). The figure code (d3 and the report page) is loaded only
 * by `--out`, which draws figures (src/cli/commands/analyze.ts).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const cli = join(root, 'dist', 'cli', 'main.js');
const demo = join(root, 'data', 'demo', 'hlx-amidase-kt0417.csv');
const RUNS = Number(process.env.STARTUP_BENCH_RUNS ?? 7);
const out = mkdtempSync(join(tmpdir(), 'mechanist-startup-'));

const commands = [
  { label: '--help', args: ['--help'], targetS: 0.3 },
  { label: 'analyze --json (demo)', args: ['analyze', demo, '--json'], targetS: 0.5 },
  { label: 'analyze --out (demo)', args: ['analyze', demo, '--out', join(out, 'demo')], targetS: 1.5 },
];

function timeOnce(args) {
  const started = performance.now();
  const child = spawnSync(process.execPath, [cli, ...args], { cwd: root, encoding: 'utf8', maxBuffer: 1 << 26 });
  const seconds = (performance.now() - started) / 1000;
  if (child.status !== 0) throw new Error(`mechanist ${args.join(' ')} exited with ${child.status}: ${child.stderr}`);
  return seconds;
}

const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

console.log(`node ${process.version}, ${cpus().length} cores, load average ${loadavg().map((x) => x.toFixed(1)).join(' ')}; ${RUNS} timed runs each`);
try {
  for (const c of commands) {
    timeOnce(c.args);
    const times = Array.from({ length: RUNS }, () => timeOnce(c.args));
    const m = median(times);
    console.log(`${c.label}: median ${m.toFixed(3)} s, min ${Math.min(...times).toFixed(3)} s, max ${Math.max(...times).toFixed(3)} s`);
    console.log(`summary: mechanist ${c.label}: ${m.toFixed(2)} s whole process (target < ${c.targetS} s: ${m < c.targetS ? 'met' : 'NOT met'})`);
  }
} finally {
  rmSync(out, { recursive: true, force: true });
}
