#!/usr/bin/env node
/**
 * Big-input benchmark (issue 16, item 6): a long-layout export of BIGFILE_BENCH_ROWS rows
 * (default 1,750,000, about 50 MB with compound, replicate and well columns; invented data:
 * competitive, Km 10 uM, Ki 1 uM, 5% proportional noise from a fixed-seed generator), written to a
 * temporary folder. Each stage runs in its own child process, so its peak memory
 * (process.resourceUsage().maxRSS) is its own:
 *   read     readRateFile on the whole file (one table per compound);
 *   analyze  `mechanist analyze` (defaults) on one compound of n rows, for n in BIGFILE_BENCH_SIZES
 *            (default 4000,17500,40000), to show how the time grows with n; all rows as one
 *            compound only with BIGFILE_BENCH_FULL=1;
 *   batch    `mechanist batch FILE --out DIR --jobs 2 --quiet` on the whole file (BIGFILE_BENCH_COMPOUNDS
 *            compounds, default 50): what a user runs on a many-compound export (README, "Many
 *            compounds"). The target of issue 16: the whole file analysed in under 60 s with a peak
 *            under 1 GB on two cores (BIGFILE_BENCH_BATCH=0 skips it).
 * Prints `summary:` lines for bench/run.mjs. Timings depend on the machine's load.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, '..');
const mainJs = join(root, 'dist', 'cli', 'main.js');
const ROWS = Number(process.env.BIGFILE_BENCH_ROWS ?? 1_750_000);
const COMPOUNDS = Number(process.env.BIGFILE_BENCH_COMPOUNDS ?? 50);
const SIZES = (process.env.BIGFILE_BENCH_SIZES ?? '4000,17500,40000').split(',').map(Number).filter((n) => n > 0);
const FULL = process.env.BIGFILE_BENCH_FULL === '1';
const BATCH = process.env.BIGFILE_BENCH_BATCH !== '0';
const TARGET_SECONDS = 60;
const TARGET_MB = 1000;
const TIMEOUT_MS = Number(process.env.BIGFILE_BENCH_TIMEOUT_S ?? 900) * 1000;

const SUBSTRATE = [2, 4, 8, 15, 30, 60, 120, 240];
const INHIBITOR = [0, 0.5, 1, 2, 4];

/** A fixed-seed generator (Park-Miller minimal standard), enough for bench noise. */
function generator(seed) {
  let state = seed;
  return () => (state = (state * 16807) % 2147483647) / 2147483647;
}

/** The file's text: `rows` rows over `compounds` compounds (one compound: no compound column). */
function exportText(rows, compounds) {
  const random = generator(17);
  const perCompound = Math.ceil(rows / compounds);
  const header = `${compounds > 1 ? 'compound,' : ''}substrate (uM),inhibitor (uM),rate (nM/s),replicate,well`;
  const parts = [header + '\n'];
  let chunk = [];
  for (let k = 0; k < rows; k++) {
    const j = k % 40;
    const s = SUBSTRATE[j % 8];
    const i = INHIBITOR[Math.floor(j / 8)];
    const noise = 1 + 0.05 * Math.sqrt(3) * (2 * random() - 1);
    const v = ((100 * s) / (10 * (1 + i / 1) + s)) * noise;
    const compound = compounds > 1 ? `BIG-${String(Math.floor(k / perCompound) + 1).padStart(3, '0')},` : '';
    chunk.push(`${compound}${s},${i},${v.toFixed(5)},${Math.floor(k / 40) % 1000 + 1},P${String(k % 1536).padStart(4, '0')}`);
    if (chunk.length === 50_000) {
      parts.push(chunk.join('\n') + '\n');
      chunk = [];
    }
  }
  if (chunk.length > 0) parts.push(chunk.join('\n') + '\n');
  return parts.join('');
}

/** Runs `args` under node, returns seconds, peak RSS (MB, from the child's own report) and status. */
function stage(args, input = null) {
  const started = Date.now();
  const r = spawnSync(process.execPath, args, { cwd: root, encoding: 'utf8', timeout: TIMEOUT_MS, maxBuffer: 1 << 26, input: input ?? undefined });
  const seconds = (Date.now() - started) / 1000;
  const peak = /peakMB=(\d+)/.exec(r.stderr ?? '')?.[1];
  const status = r.error ? `timeout after ${TIMEOUT_MS / 1000} s` : r.status === 0 ? 'ok' : `exit ${r.status}: ${(r.stderr ?? '').trim().split('\n').filter((l) => !l.startsWith('peakMB')).at(-1) ?? ''}`;
  return { seconds, peakMB: peak ? Number(peak) : null, status };
}

/** node options that print the child's peak RSS on exit (works for the CLI too). */
const PEAK_HOOK = ['--import', `data:text/javascript,${encodeURIComponent("process.on('exit', () => process.stderr.write('peakMB=' + Math.round(process.resourceUsage().maxRSS / 1024) + '\\n'));")}`];

const dir = mkdtempSync(join(tmpdir(), 'mechanist-bigfile-'));
try {
  const whole = join(dir, 'export.csv');
  writeFileSync(whole, exportText(ROWS, COMPOUNDS));
  const fileMB = statSync(whole).size / 1e6;
  console.log(`file: ${ROWS} rows over ${COMPOUNDS} compounds, ${fileMB.toFixed(1)} MB (${whole})`);

  const readScript = `import { readRateFile } from ${JSON.stringify(pathToFileURL(join(root, 'dist', 'input', 'index.js')).href)};
const t = await readRateFile(process.argv[1], {}); console.log(t.length + ' tables, ' + t.reduce((a, x) => a + x.points.length, 0) + ' points');`;
  const read = stage([...PEAK_HOOK, '--input-type=module', '-e', readScript, whole]);
  console.log(`read: ${read.seconds.toFixed(1)} s, peak ${read.peakMB} MB (${read.peakMB ? (read.peakMB / fileMB).toFixed(1) : '?'} x the file), ${read.status}`);
  console.log(`summary: bigfile read ${ROWS} rows (${fileMB.toFixed(0)} MB): ${read.seconds.toFixed(1)} s, peak ${read.peakMB} MB, ${read.status}`);

  const sizes = [...SIZES, ...(FULL ? [ROWS] : [])];
  for (const n of sizes) {
    const file = join(dir, `one-${n}.csv`);
    writeFileSync(file, exportText(n, 1));
    const mb = statSync(file).size / 1e6;
    const r = stage([...PEAK_HOOK, mainJs, 'analyze', file]);
    console.log(`analyze ${n} rows (${mb.toFixed(1)} MB): ${r.seconds.toFixed(1)} s, peak ${r.peakMB} MB, ${r.status}`);
    console.log(`summary: bigfile analyze one compound of ${n} rows: ${r.seconds.toFixed(1)} s, peak ${r.peakMB} MB, ${r.status}`);
  }
  if (BATCH) {
    const r = stage([...PEAK_HOOK, mainJs, 'batch', whole, '--out', join(dir, 'out'), '--jobs', '2', '--quiet']);
    const met = (ok) => (ok ? 'met' : 'NOT met');
    const timeMet = r.status === 'ok' && r.seconds < TARGET_SECONDS;
    const memoryMet = r.status === 'ok' && r.peakMB !== null && r.peakMB < TARGET_MB;
    console.log(`batch: ${r.seconds.toFixed(1)} s, peak ${r.peakMB} MB (${r.peakMB ? (r.peakMB / fileMB).toFixed(1) : '?'} x the file), ${r.status}`);
    console.log(
      `summary: bigfile batch, whole file (${ROWS} rows, ${COMPOUNDS} compounds), 2 jobs: ${r.seconds.toFixed(1)} s (target < ${TARGET_SECONDS} s: ${met(timeMet)}), ` +
        `peak ${r.peakMB} MB (target < ${TARGET_MB} MB: ${met(memoryMet)}), ${r.status}`,
    );
  }
} finally {
  rmSync(dir, { recursive: true, force: true });
}
