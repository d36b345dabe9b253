/**
 * Output safety helpers (issue 16): formula cells neutralised in CSV (OWASP "CSV Injection"),
 * folder names safe on any file system, folders and files written whole or not at all, temporary
 * entries of killed processes cleared, output folders checked before the work, and the run lock.
 * Fault cases run the real file system: a tiny tmpfs (needs root; skipped with a message when it
 * cannot be mounted) for "no space left" and a read-only mount.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { hostname, tmpdir } from 'node:os';
import { join } from 'node:path';
import { csvCell, neutraliseFormula } from '../../src/report/csv-cell.js';
import { safeName, SAFE_NAME_MAX_LENGTH } from '../../src/report/safe-name.js';
import { removeStaleTemporaries, temporaryPathFor, writeFileAtomic, writeFilesAtomic, writeFolderAtomic } from '../../src/report/write-atomic.js';
import { checkOutputFolder, checkReplaceableReportFolder } from '../../src/report/output-folder.js';
import { OutputError } from '../../src/report/output-error.js';
import { takeRunLock, RUN_LOCK_FILE } from '../../src/batch/run-lock.js';
import { uniqueFolderNames } from '../../src/batch/plan-compounds.js';

const fresh = () => mkdtempSync(join(tmpdir(), 'mechanist-out-'));
const mounts: string[] = [];

/** Mounts a tmpfs of `size` (e.g. '64k') at a new folder, or returns null when mounting is not possible. */
function tmpfs(size: string, readOnly = false): string | null {
  const dir = fresh();
  const r = spawnSync('mount', ['-t', 'tmpfs', '-o', `size=${size}${readOnly ? ',ro' : ''}`, 'tmpfs', dir]);
  if (r.status !== 0) return null;
  mounts.push(dir);
  return dir;
}
afterAll(() => {
  for (const dir of mounts) spawnSync('umount', [dir]);
});
const canMount = (() => {
  const probe = tmpfs('16k');
  return probe !== null;
})();

/** Every entry under `dir`, relative, sorted (hidden ones included). */
function tree(dir: string): string[] {
  const out: string[] = [];
  const walk = (rel: string) => {
    for (const name of readdirSync(join(dir, rel))) {
      const path = rel ? `${rel}/${name}` : name;
      out.push(path);
      try {
        readdirSync(join(dir, path));
        walk(path);
      } catch {
        // a file
      }
    }
  };
  walk('');
  return out.sort();
}

function thrown(f: () => unknown): OutputError {
  try {
    f();
  } catch (error) {
    if (error instanceof OutputError) return error;
    throw error;
  }
  throw new Error('no OutputError');
}

describe('CSV cells a spreadsheet would run as formulas (OWASP CSV Injection)', () => {
  it('text starting with = + - @ tab or CR gets a leading apostrophe; quoting still applies', () => {
    expect(csvCell('=HYPERLINK("http://x","y")')).toBe(`"'=HYPERLINK(""http://x"",""y"")"`);
    expect(csvCell('+cmd')).toBe("'+cmd");
    expect(csvCell('-2+3+cmd|x')).toBe("'-2+3+cmd|x");
    expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvCell('\t=1')).toBe("'\t=1");
    expect(csvCell('\r=1')).toBe(`"'\r=1"`);
  });
  it('numbers stay numbers, negative ones too, and text that is a plain number is left alone', () => {
    expect(csvCell(-1.5)).toBe('-1.5');
    expect(csvCell(-2e-7)).toBe('-2e-7');
    expect(neutraliseFormula('-5')).toBe('-5');
    expect(neutraliseFormula('+1.5e3')).toBe('+1.5e3');
    expect(neutraliseFormula('CPD-7')).toBe('CPD-7');
    expect(neutraliseFormula('- 5')).toBe("'- 5");
  });
});

describe('folder names', () => {
  it('"." and ".." never name the folder itself or its parent; case-only differences stay apart', () => {
    expect(safeName('.')).toBe('_');
    expect(safeName('..')).toBe('_');
    expect(uniqueFolderNames(['.', '..', 'A', 'a'])).toEqual(['_', '_-2', 'A', 'a-4']);
  });
  it('long ids are shortened with a stable hash: unique, same in every run, within the limit', () => {
    const a = 'X'.repeat(300) + '-1';
    const b = 'X'.repeat(300) + '-2';
    expect(safeName(a)).toHaveLength(SAFE_NAME_MAX_LENGTH);
    expect(safeName(a)).not.toBe(safeName(b));
    expect(safeName(a)).toBe(safeName('X'.repeat(300) + '-1'));
    expect(safeName(a)).toMatch(/^X+-[0-9a-f]{12}$/);
    // the folder can be created, also with the temporary name's additions
    const dir = fresh();
    writeFolderAtomic(join(dir, safeName(a)), [['results.json', '{}\n']]);
    expect(readdirSync(dir)).toEqual([safeName(a)]);
  });
});

describe('writing whole or not at all', () => {
  it('a folder replaces an older one whole (a figure no longer drawn goes), leaving no temporary entry', () => {
    const root = fresh();
    const dir = join(root, 'CPD-1');
    writeFolderAtomic(dir, [['report.html', 'old\n'], ['figures/a.svg', '<svg/>\n'], ['figures/b.svg', '<svg/>\n']]);
    writeFolderAtomic(dir, [['report.html', 'new\n'], ['figures/a.svg', '<svg/>\n']]);
    expect(tree(root)).toEqual(['CPD-1', 'CPD-1/figures', 'CPD-1/figures/a.svg', 'CPD-1/report.html']);
    expect(readFileSync(join(dir, 'report.html'), 'utf8')).toBe('new\n');
  });
  it.skipIf(!canMount)('no space left (tmpfs of 64 KiB): the folder is absent, no temporary entry, one clear OutputError', () => {
    const disk = tmpfs('64k')!;
    const e = thrown(() => writeFolderAtomic(join(disk, 'CPD-1'), [['report.html', 'x'.repeat(200_000)], ['results.json', '{}']]));
    expect(e.stage).toBe('write');
    expect(e.message).toMatch(/cannot write .*CPD-1: no space left on the device; nothing was left half-written/);
    expect(tree(disk)).toEqual([]);
  });
  it.skipIf(!canMount)('no space left: an older folder of that name survives intact', () => {
    const disk = tmpfs('64k')!;
    writeFolderAtomic(join(disk, 'CPD-1'), [['report.html', 'old\n']]);
    expect(() => writeFolderAtomic(join(disk, 'CPD-1'), [['report.html', 'x'.repeat(200_000)]])).toThrow(OutputError);
    expect(tree(disk)).toEqual(['CPD-1', 'CPD-1/report.html']);
    expect(readFileSync(join(disk, 'CPD-1', 'report.html'), 'utf8')).toBe('old\n');
  });
  it.skipIf(!canMount)('no space left: files renamed together keep every old file when one of them cannot be written', () => {
    const disk = tmpfs('64k')!;
    writeFilesAtomic([[join(disk, 'summary.csv'), 'old\n'], [join(disk, 'summary.json'), 'old\n']]);
    expect(() => writeFilesAtomic([[join(disk, 'summary.csv'), 'new\n'], [join(disk, 'summary.json'), 'x'.repeat(200_000)]])).toThrow(/no space left/);
    expect(tree(disk)).toEqual(['summary.csv', 'summary.json']);
    expect(readFileSync(join(disk, 'summary.csv'), 'utf8')).toBe('old\n');
    expect(() => writeFileAtomic(join(disk, 'big.txt'), 'x'.repeat(200_000))).toThrow(/no space left/);
    expect(tree(disk)).toEqual(['summary.csv', 'summary.json']);
  });
  it('temporary entries of processes that no longer run are removed; those of running ones are kept', () => {
    const dir = fresh();
    // a process id that is not running: a child that has ended
    const dead = Number(execFileSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' }));
    const ours = temporaryPathFor(join(dir, 'CPD-1'));
    mkdirSync(join(dir, `.CPD-2.${dead}.abc123.tmp`));
    writeFileSync(join(dir, `.summary.csv.${dead}.zz9.tmp`), '');
    mkdirSync(ours);
    writeFileSync(join(dir, 'notes.tmp'), ''); // not one of ours
    expect(removeStaleTemporaries(dir).sort()).toEqual([`.CPD-2.${dead}.abc123.tmp`, `.summary.csv.${dead}.zz9.tmp`]);
    expect(existsSync(ours)).toBe(true);
    expect(removeStaleTemporaries(dir, true)).toHaveLength(1);
    expect(readdirSync(dir)).toEqual(['notes.tmp']);
  });
});

describe('output folder checked before the work', () => {
  it('an existing file, a missing parent, a parent that is a file: one line each', () => {
    const dir = fresh();
    writeFileSync(join(dir, 'file'), '');
    expect(thrown(() => checkOutputFolder(join(dir, 'file'), 'file')).message).toBe('file: is an existing file, not a folder; give a folder for the output');
    expect(thrown(() => checkOutputFolder(join(dir, 'no', 'out'), 'no/out')).message).toMatch(/^no\/out: its parent folder .*no does not exist; create it first/);
    expect(thrown(() => checkOutputFolder(join(dir, 'file', 'out'), 'file/out')).message).toMatch(/^file\/out: .*file is a file, not a folder/);
    expect(checkOutputFolder(join(dir, 'new'))).toEqual({ created: true });
    expect(checkOutputFolder(dir)).toEqual({ created: false });
    expect(checkOutputFolder(join(dir, 'a', 'b', 'c'), 'a/b/c', true)).toEqual({ created: true });
    expect(readdirSync(dir)).toEqual(['file']); // the checks create nothing, probes included
  });
  it.skipIf(!canMount)('a read-only file system is found by a probe (root ignores permission bits)', () => {
    const ro = tmpfs('16k', true)!;
    const e = thrown(() => checkOutputFolder(ro, 'ro'));
    expect([e.stage, e.message]).toEqual(['check', 'ro: cannot write there (the file system is read-only); choose another output folder']);
    expect(thrown(() => checkOutputFolder(join(ro, 'sub'), 'ro/sub')).message).toMatch(/read-only/);
  });
  it('a report folder that holds other files is not replaced', () => {
    const dir = fresh();
    writeFileSync(join(dir, 'my-notes.docx'), '');
    writeFileSync(join(dir, 'report.html'), '');
    expect(thrown(() => checkReplaceableReportFolder(dir, 'out')).message).toMatch(/^out: holds files that are not part of a report \(my-notes\.docx\)/);
    rmSync(join(dir, 'my-notes.docx'));
    writeFileSync(join(dir, '.DS_Store'), ''); // a file browser's clutter does not count
    expect(() => checkReplaceableReportFolder(dir, 'out')).not.toThrow();
  });
});

describe('the run lock', () => {
  it('a second run into a held folder refuses; a lock of a process that ended is taken over with a note', () => {
    const dir = fresh();
    const first = takeRunLock(dir, 'out', 'test');
    expect(first.note).toBeNull();
    const e = thrown(() => takeRunLock(dir, 'out', 'test'));
    expect(e.stage).toBe('check');
    expect(e.message).toMatch(new RegExp(`^out: another mechanist run \\(process ${process.pid}, started .*\\) is writing into this folder; wait for it to finish, or choose another output folder$`));
    first.release();
    expect(existsSync(join(dir, RUN_LOCK_FILE))).toBe(false);
    const dead = Number(execFileSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' }));
    writeFileSync(join(dir, RUN_LOCK_FILE), JSON.stringify({ pid: dead, host: hostname(), started: 'then', command: 'x' }));
    const second = takeRunLock(dir, 'out', 'test');
    expect(second.note).toMatch(new RegExp(`took over the lock of an earlier run \\(process ${dead}`));
    second.release();
    expect(readdirSync(dir)).toEqual([]);
  });
});
