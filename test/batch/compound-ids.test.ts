/**
 * Compound ids and report folder names of a batch run (rule in src/batch/plan-compounds.ts,
 * documented in README "Batch"), and the folder scan (src/batch/collect-inputs.ts).
 */
import { describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { uniqueCompoundIds, uniqueFolderNames } from '../../src/batch/plan-compounds.js';
import { collectInputFiles } from '../../src/batch/collect-inputs.js';

describe('uniqueCompoundIds', () => {
  it('keeps compound names and file names when they are unique', () => {
    const ids = uniqueCompoundIds([
      { source: 'run/a.csv', nameInFile: 'CPD-1' },
      { source: 'run/a.csv', nameInFile: 'CPD-2' },
      { source: 'run/plate7.csv', nameInFile: null },
    ]);
    expect(ids).toEqual(['CPD-1', 'CPD-2', 'plate7']);
  });

  it('adds the file name to a name that two files share, and only to that one', () => {
    const ids = uniqueCompoundIds([
      { source: 'run/a.csv', nameInFile: 'CPD-1' },
      { source: 'run/b.csv', nameInFile: 'CPD-1' },
      { source: 'run/b.csv', nameInFile: 'CPD-2' },
    ]);
    expect(ids).toEqual(['CPD-1@a.csv', 'CPD-1@b.csv', 'CPD-2']);
  });

  it('uses the path when the file names are the same too, and the position as a last resort', () => {
    const ids = uniqueCompoundIds([
      { source: 'day1/a.csv', nameInFile: 'X' },
      { source: 'day2/a.csv', nameInFile: 'X' },
      { source: 'day1/p.csv', nameInFile: null },
      { source: 'day2/p.csv', nameInFile: null },
      { source: 'q.csv', nameInFile: 'Y' },
      { source: 'q.csv', nameInFile: 'Y' },
    ]);
    expect(ids).toEqual(['X@day1/a.csv', 'X@day2/a.csv', 'day1/p.csv', 'day2/p.csv', 'Y@q.csv#5', 'Y@q.csv#6']);
  });

  it('disambiguates a compound named like another file', () => {
    // "plate1" is both a compound in screen.csv and the id of the unnamed table plate1.csv
    const ids = uniqueCompoundIds([
      { source: 'screen.csv', nameInFile: 'plate1' },
      { source: 'plate1.csv', nameInFile: null },
    ]);
    expect(ids).toEqual(['plate1@screen.csv', 'plate1.csv']);
    expect(new Set(ids).size).toBe(ids.length);
  });
});

describe('uniqueFolderNames', () => {
  it('makes safe names and separates names that clash after cleaning or by case', () => {
    expect(uniqueFolderNames(['CPD 1', 'CPD_1', 'cpd_1', '../up', 'ok'])).toEqual(['CPD_1', 'CPD_1-2', 'cpd_1-3', '__up', 'ok']);
  });
});

describe('collectInputFiles', () => {
  it('lists a folder\'s table files by name, keeps given files in order, and notes repeats and empty folders', () => {
    const root = mkdtempSync(join(tmpdir(), 'mechanist-collect-'));
    mkdirSync(join(root, 'in'));
    mkdirSync(join(root, 'empty'));
    mkdirSync(join(root, 'in', 'sub.csv'));
    for (const name of ['b.csv', 'A.tsv', 'c.TXT', 'a.csv', 'readme.md', '.hidden.csv']) writeFileSync(join(root, 'in', name), 'x');
    writeFileSync(join(root, 'first.csv'), 'x');
    const { files, notes } = collectInputFiles(['first.csv', 'in', 'empty', 'in/a.csv', 'missing.csv'], root);
    expect(files.map((f) => f.given)).toEqual(['first.csv', 'in/A.tsv', 'in/a.csv', 'in/b.csv', 'in/c.TXT', 'missing.csv']);
    expect(files[0].path).toBe(join(root, 'first.csv'));
    expect(notes).toEqual(['folder empty holds no .csv, .tsv, .txt files', 'in/a.csv is listed more than once; it is analysed once']);
  });
});
