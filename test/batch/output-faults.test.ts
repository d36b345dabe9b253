/**
 * Fault tests of the built CLI (issue 16, items 1-3), each asserting what is left on disk:
 * unusable output folders found before any analysis (an existing file, a missing parent, a
 * read-only mount), a full disk (a 64 KiB tmpfs), Ctrl-C (SIGINT) and SIGKILL at random moments,
 * and two batches started into one output folder. Mounting needs root; those cases are skipped
 * (with the reason in the test name) when `mount -t tmpfs` fails. Data: simulated
 * (batch-inputs.ts).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { compoundColumnCsv, simulatedCsv, writeBatchInputs } from './batch-inputs.js';

const root = join(import.meta.dirname, '..', '..');
const mainJs = join(root, 'dist', 'cli', 'main.js');
const inputs = writeBatchInputs();
const mounts: string[] = [];

function mountTmpfs(options: string): string | null {
  const dir = mkdtempSync(join(tmpdir(), 'mechanist-fault-'));
  if (spawnSync('mount', ['-t', 'tmpfs', '-o', options, 'tmpfs', dir]).status !== 0) return null;
  mounts.push(dir);
  return dir;
}
const canMount = mountTmpfs('size=16k') !== null;
afterAll(() => {
  for (const dir of mounts) spawnSync('umount', [dir]);
});

function runBuilt(args: string[], cwd = inputs.root) {
  const r = spawnSync(process.execPath, [mainJs, ...args], { cwd, encoding: 'utf8' });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

function start(args: string[]): ChildProcess & { done: Promise<number | null> } {
  const child = spawn(process.execPath, [mainJs, ...args], { cwd: inputs.root, stdio: 'ignore' });
  return Object.assign(child, { done: new Promise<number | null>((resolve) => child.on('exit', (code, signal) => resolve(code ?? (signal ? -1 : null)))) });
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Every entry under `dir` (hidden ones too), relative paths. */
function entries(dir: string): string[] {
  if (!existsSync(dir)) return [];
  const out: string[] = [];
  const walk = (rel: string) => {
    for (const name of readdirSync(join(dir, rel))) {
      const path = rel ? `${rel}/${name}` : name;
      out.push(path);
      if (statSync(join(dir, path)).isDirectory()) walk(path);
    }
  };
  walk('');
  return out.sort();
}

const hidden = (dir: string) => entries(dir).filter((p) => p.split('/').some((part) => part.startsWith('.')));

/** Asserts every report folder under out/compounds is complete (all files, figures, parsable JSON). */
function expectCompleteReports(out: string): string[] {
  const folder = join(out, 'compounds');
  const names = existsSync(folder) ? readdirSync(folder).filter((n) => !n.startsWith('.')) : [];
  for (const name of names) {
    const dir = join(folder, name);
    expect(readdirSync(dir).sort(), name).toEqual(['figures', 'parameters.csv', 'report.html', 'results.json', 'summary.txt']);
    expect(readdirSync(join(dir, 'figures')).filter((f) => f.endsWith('.svg')).length, name).toBeGreaterThan(5);
    for (const f of readdirSync(join(dir, 'figures'))) expect(statSync(join(dir, 'figures', f)).size, `${name}/${f}`).toBeGreaterThan(0);
    expect(() => JSON.parse(readFileSync(join(dir, 'results.json'), 'utf8'))).not.toThrow();
    expect(readFileSync(join(dir, 'report.html'), 'utf8')).toMatch(/<\/html>\s*$/);
  }
  return names;
}

const BATCH = ['batch', 'plates', 'loose-noncompetitive.csv', 'screen.csv'];

/**
 * A run long enough that a kill or a second run is sure to land while it holds its lock, however
 * fast the analysis gets: LONG_COMPOUNDS compounds in one file, written once. With reports on one
 * worker that is several seconds at the batch benchmark's target rate (docs/benchmarks.md).
 */
const LONG_COMPOUNDS = 40;
const LONG_BATCH = ['batch', 'long-screen.csv'];
writeFileSync(
  join(inputs.root, 'long-screen.csv'),
  compoundColumnCsv(Array.from({ length: LONG_COMPOUNDS }, (_, k) => [`LS-${String(k + 1).padStart(3, '0')}`, simulatedCsv('competitive', { Vmax: 100, Km: 10, Ki: 0.5 + k / 40 }, 100 + k)] as [string, string])),
);

beforeAll(() => {
  if (!existsSync(mainJs)) throw new Error('dist/ is missing: run `npx tsc -p tsconfig.json` first (npm test does)');
});

describe('unusable output folders are found before any analysis: exit 2, one line, nothing written', () => {
  it('--out that is an existing file', () => {
    writeFileSync(join(inputs.root, 'a-file'), 'x');
    for (const args of [['analyze', 'plates/mixed.csv'], BATCH]) {
      const r = runBuilt([...args, '--out', 'a-file']);
      expect([r.code, r.out, r.err]).toEqual([2, '', 'mechanist: a-file: is an existing file, not a folder; give a folder for the output\n']);
    }
    expect(readFileSync(join(inputs.root, 'a-file'), 'utf8')).toBe('x');
  });
  it('--out whose parent folder is missing (no tree is created for a mistyped path)', () => {
    for (const args of [['analyze', 'plates/mixed.csv'], BATCH]) {
      const r = runBuilt([...args, '--out', 'no-such/out']);
      expect(r.code).toBe(2);
      expect(r.err).toMatch(/^mechanist: no-such\/out: its parent folder .*no-such does not exist; create it first, or give another output folder\n$/);
    }
    expect(existsSync(join(inputs.root, 'no-such'))).toBe(false);
  });
  it.skipIf(!canMount)('--out on a read-only file system (a tmpfs mounted ro; root ignores permission bits, so chmod would prove nothing)', () => {
    const ro = mountTmpfs('size=16k,ro')!;
    for (const args of [['analyze', 'plates/mixed.csv'], BATCH, ['demo']]) {
      const r = runBuilt([...args, '--out', join(ro, 'out')]);
      expect(r.code, args[0]).toBe(2);
      expect(r.err).toMatch(/^mechanist: .*out: cannot write there \(the file system is read-only\); choose another output folder\n$/);
      expect(r.out).toBe('');
    }
  });
  it('analyze --out into a folder that holds other files refuses instead of replacing them', () => {
    const dir = mkdtempSync(join(inputs.root, 'mine-'));
    writeFileSync(join(dir, 'thesis.docx'), 'x');
    const r = runBuilt(['analyze', 'plates/mixed.csv', '--out', dir]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/holds files that are not part of a report \(thesis\.docx\)/);
    expect(readdirSync(dir)).toEqual(['thesis.docx']);
  });
});

describe.skipIf(!canMount)('a full disk (tmpfs of 64 KiB) leaves nothing misleading', () => {
  it('batch --reports: the reports fail as rows, no partial or empty folder, no temporary file, summary consistent', { timeout: 120_000 }, () => {
    const disk = mountTmpfs('size=64k')!;
    const r = runBuilt([...BATCH, '--out', disk, '--reports', '--jobs', '2']);
    expect([1, 3]).toContain(r.code);
    expect(r.err).toMatch(/no space left on the device/);
    expect(r.err).not.toMatch(/internal error/);
    expect(hidden(disk)).toEqual([]);
    const complete = expectCompleteReports(disk);
    if (existsSync(join(disk, 'summary.json'))) {
      const rows = JSON.parse(readFileSync(join(disk, 'summary.json'), 'utf8')).compounds as Array<{ report: string | null; error: string | null }>;
      // every report the summary links exists and is complete; every other row says why
      for (const row of rows) {
        if (row.report !== null) expect(complete).toContain(row.report.split('/')[1]);
        else expect(row.error).toMatch(/no space left on the device/);
      }
      expect(rows.every((row) => !(row.error ?? '').includes(disk))).toBe(true); // no absolute paths in the summary
    } else {
      expect(r.code).toBe(3);
    }
    if (existsSync(join(disk, 'compounds'))) expect(readdirSync(join(disk, 'compounds')).length).toBeGreaterThan(0);
  });
  it('a disk that is already full is found by the probe before any analysis: exit 2, nothing written', () => {
    const disk = mountTmpfs('size=64k')!;
    writeFileSync(join(disk, 'fill'), Buffer.alloc(64 * 1024 - 4096));
    try {
      writeFileSync(join(disk, 'fill2'), Buffer.alloc(8192));
    } catch {
      // full now
    }
    const before = entries(disk);
    const r = runBuilt(['analyze', 'plates/mixed.csv', '--out', join(disk, 'report')]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/^mechanist: .*report: cannot write there \(no space left on the device\); choose another output folder\n$/);
    expect(entries(disk)).toEqual(before);
  });
  it('analyze --out: exit 3 and one line; the report folder is absent rather than half there', () => {
    const disk = mountTmpfs('size=64k')!;
    const r = runBuilt(['analyze', 'plates/mixed.csv', '--out', join(disk, 'report')]);
    expect(r.code).toBe(3);
    expect(r.err).toMatch(/^mechanist: cannot write .*report: no space left on the device; nothing was left half-written\n$/);
    expect(entries(disk)).toEqual([]);
  });
});

describe('interrupted runs', () => {
  // delays drawn at random within the span of a run (worker start-up to the last report), logged on failure
  const delays = Array.from({ length: 3 }, () => Math.round(300 + Math.random() * 3500));

  // A SIGINT that arrives while node is still loading the program (before `batch` installs its
  // handler, which it does before it writes anything) or after the run has finished writing ends
  // the process by the signal (-1 here): nothing is on disk then, or everything is complete.
  it(`SIGINT at ${delays.join(', ')} ms (the first after the run holds its lock): exit 130, no temporary entry, no lock, only complete reports`, { timeout: 180_000 }, async () => {
    let handled = 0;
    for (const [k, delay] of delays.entries()) {
      const out = `int-${k}`;
      const dir = join(inputs.root, out);
      const child = start([...BATCH, '--out', out, '--reports', '--jobs', k === 2 ? '1' : '2']);
      if (k === 0) for (let waited = 0; !existsSync(join(dir, '.mechanist-run.lock')) && waited < 20_000; waited += 20) await sleep(20);
      await sleep(k === 0 ? delay / 4 : delay);
      child.kill('SIGINT');
      const code = await child.done;
      expect([130, 0, -1], `delay ${delay} ms`).toContain(code);
      expect(hidden(dir), `delay ${delay} ms`).toEqual([]);
      expectCompleteReports(dir);
      if (code === 130) {
        handled += 1;
        expect(existsSync(join(dir, 'summary.csv'))).toBe(false);
      }
      if (code === -1) expect(!existsSync(dir) || existsSync(join(dir, 'summary.csv')), `delay ${delay} ms`).toBe(true);
    }
    expect(handled + (existsSync(join(inputs.root, 'int-0', 'summary.csv')) ? 1 : 0)).toBeGreaterThan(0);
  });

  it(`SIGKILL at ${delays.join(', ')} ms: only complete reports are visible; the next run clears the leftovers and takes over the lock`, { timeout: 240_000 }, async () => {
    for (const [k, delay] of delays.entries()) {
      const out = `kill-${k}`;
      const dir = join(inputs.root, out);
      // the first kill lands while a long run holds its lock, so that the takeover below is tested
      const child = start([...(k === 0 ? LONG_BATCH : BATCH), '--out', out, '--reports', '--jobs', k === 0 ? '1' : '2']);
      if (k === 0) for (let waited = 0; !existsSync(join(dir, '.mechanist-run.lock')) && waited < 20_000; waited += 20) await sleep(20);
      await sleep(k === 0 ? delay / 4 : delay);
      child.kill('SIGKILL');
      const code = await child.done;
      expectCompleteReports(dir);
      // what a killed run can leave is hidden: its lock and temporary entries. A run that finished
      // before the kill (exit 0) shows its summary; so may one killed after writing its summary,
      // while it was ending (a whole run of BATCH takes about a second on a quiet machine): the
      // summary is either absent or complete, never part of it
      const visible = entries(dir).filter((p) => !p.startsWith('compounds/') && !p.startsWith('.') && p !== 'compounds');
      const summary = ['index.html', 'summary.csv', 'summary.json'];
      if (code === 0) expect(visible, `delay ${delay} ms, exit ${code}`).toEqual(summary);
      else expect([[], summary], `delay ${delay} ms, exit ${code}`).toContainEqual(visible);
      if (k === 0) expect(code, 'the first kill lands mid-run').toBe(-1);
      if (k === 0) {
        const again = runBuilt([...BATCH, '--out', out, '--reports', '--jobs', '2']);
        expect(again.code).toBe(0);
        expect(hidden(dir)).toEqual([]);
        // the killed run's complete reports are removed as an earlier run's; this run's seven stay
        expect(expectCompleteReports(dir)).toHaveLength(7);
      }
    }
  });
});

describe('analyze after a killed analyze', () => {
  it('the hidden temporary folder a killed run left beside --out is removed; the report is complete; other entries stay', () => {
    const parent = mkdtempSync(join(inputs.root, 'analyze-'));
    const dead = Number(spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' }).stdout);
    const leftover = join(parent, `.report.${dead}.k1ll3d.tmp`);
    spawnSync('mkdir', ['-p', join(leftover, 'figures')]);
    writeFileSync(join(leftover, 'figures', 'rate-curves.svg'), '');
    writeFileSync(join(parent, `.other.${dead}.abc.tmp`), ''); // not this report's: left alone
    const r = runBuilt(['analyze', 'plates/mixed.csv', '--out', join(parent, 'report'), '--no-profile']);
    expect(r.code, r.err).toBe(0);
    expect(readdirSync(parent).sort()).toEqual([`.other.${dead}.abc.tmp`, 'report']);
    expect(readdirSync(join(parent, 'report')).sort()).toEqual(['figures', 'parameters.csv', 'report.html', 'results.json', 'summary.txt']);
  });
});

describe('two batches into one output folder', () => {
  it('the second refuses while the first runs (exit 2, no file touched); the summary and every report it links come from one run', { timeout: 180_000 }, async () => {
    const first = start([...LONG_BATCH, '--out', 'shared', '--reports', '--jobs', '1', '--error', 'constant']);
    const lock = join(inputs.root, 'shared', '.mechanist-run.lock');
    for (let waited = 0; !existsSync(lock) && waited < 20_000; waited += 50) await sleep(50);
    expect(existsSync(lock)).toBe(true);
    const second = runBuilt([...BATCH, '--out', 'shared', '--reports', '--jobs', '1', '--error', 'proportional']);
    expect(second.code).toBe(2);
    expect(second.err).toMatch(/^mechanist: shared: another mechanist run \(process \d+, started [^)]+\) is writing into this folder; wait for it to finish, or choose another output folder\n$/);
    expect(await first.done).toBe(0);
    const dir = join(inputs.root, 'shared');
    const summary = JSON.parse(readFileSync(join(dir, 'summary.json'), 'utf8')) as { settings: { errorModel: string }; compounds: Array<{ report: string; errorModel: string }> };
    expect(summary.settings.errorModel).toBe('constant');
    for (const row of summary.compounds) {
      expect(row.errorModel).toBe('constant');
      expect(JSON.parse(readFileSync(join(dir, row.report.replace(/report\.html$/, 'results.json')), 'utf8')).errorModel).toBe('constant');
    }
    // a later run with other settings replaces the reports whole, and removes those it did not write
    const later = runBuilt(['batch', 'plates', '--out', 'shared', '--reports', '--jobs', '1', '--error', 'proportional']);
    expect(later.code).toBe(0);
    expect(later.err).toMatch(new RegExp(`removed ${LONG_COMPOUNDS} report folders of an earlier run`));
    const names = expectCompleteReports(dir);
    expect(names.sort()).toEqual(['competitive', 'mixed', 'uncompetitive']);
    for (const name of names) expect(JSON.parse(readFileSync(join(dir, 'compounds', name, 'results.json'), 'utf8')).errorModel).toBe('proportional');
    expect(hidden(dir)).toEqual([]);
  });
});

describe('names that are unsafe elsewhere', () => {
  const names = ['.', '..', 'A', 'a', '=HYPERLINK("http://example.invalid","open")', 'L'.repeat(400)];
  const file = join(inputs.root, 'hostile-names.csv');
  writeFileSync(file, compoundColumnCsv(names.map((name, k) => [`"${name.replace(/"/g, '""')}"`, simulatedCsv('competitive', { Vmax: 100, Km: 10, Ki: 1 }, 40 + k)])));

  it('analyze --compound all: one folder per compound, none overwritten, "." and ".." kept inside, long names hashed', { timeout: 120_000 }, () => {
    const r = runBuilt(['analyze', 'hostile-names.csv', '--compound', 'all', '--out', 'names-out', '--no-profile']);
    expect(r.code, r.err).toBe(0);
    const dir = join(inputs.root, 'names-out');
    const folders = readdirSync(dir).sort();
    expect(folders).toHaveLength(names.length);
    expect(folders).toContain('_');
    expect(folders).toContain('_-2');
    expect(folders.filter((f) => /^[Aa](-\d+)?$/.test(f)).sort()).toEqual(['A', 'a-4']);
    expect(folders.some((f) => /^L+-[0-9a-f]{12}$/.test(f) && f.length <= 96)).toBe(true);
    for (const f of folders) expect(JSON.parse(readFileSync(join(dir, f, 'results.json'), 'utf8')).input.source).toBe('hostile-names.csv');
    expect(existsSync(join(inputs.root, 'results.json'))).toBe(false); // ".." did not write into the parent
  });

  it('batch: a formula-like compound name is neutralised in summary.csv (the JSON keeps it as written)', { timeout: 120_000 }, () => {
    const r = runBuilt(['batch', 'hostile-names.csv', '--out', 'names-batch', '--jobs', '1']);
    expect(r.code, r.err).toBe(0);
    const csv = readFileSync(join(inputs.root, 'names-batch', 'summary.csv'), 'utf8');
    expect(csv).toContain(`"'=HYPERLINK(""http://example.invalid"",""open"")"`);
    expect(csv).not.toMatch(/(^|,)=/m);
    const rows = JSON.parse(readFileSync(join(inputs.root, 'names-batch', 'summary.json'), 'utf8')).compounds as Array<{ compound: string }>;
    expect(rows.map((row) => row.compound)).toContain(names[4]); // the JSON keeps the name as written
  });
});
