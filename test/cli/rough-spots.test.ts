/**
 * Small rough spots of the command line (issue 13, item 7): one style for every error message,
 * `analyze --help` naming every file `--out` writes, and long name lists cut to a few with a count.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { listNames } from '../../src/input/messages.js';
import { runCaptured } from '../helpers/cli-capture.js';

const cli = runCaptured;

describe('one style for every error message: "mechanist: ..." on one line, exit 2 for usage', () => {
  const cases: Array<[string[], string]> = [
    [['analyze'], 'mechanist: analyze needs a rate table FILE, or --reads READS --plate-map MAP\n'],
    [['analyze', 'x.csv', '--bogus'], "mechanist: unknown option '--bogus' (did you mean --robust?)\n"],
    [['frob'], "mechanist: unknown command 'frob'\n"],
    [['batch', 'x.csv'], "mechanist: required option '--out <dir>' not specified\n"],
    [['analyze', 'examples/long.csv', '--level', '7'], 'mechanist: option --level: "7" is not a number between 0 and 1\n'],
  ];
  for (const [args, message] of cases) {
    it(args.join(' '), async () => {
      const r = await cli(args);
      expect(r.code).toBe(2);
      expect(r.err).toBe(message);
    });
  }
});

describe('analyze --help', () => {
  it('lists every file --out writes', async () => {
    const r = await cli(['analyze', '--help']);
    expect(r.code).toBe(0);
    for (const name of ['report.html', 'figures/*.svg', 'results.json', 'parameters.csv', 'summary.txt']) expect(r.out).toContain(name);
    expect(r.out).toContain('--at-substrate');
    expect(r.out).toMatch(/25uM/);
  });
});

describe('long name lists are cut to a few, with a count', () => {
  it('listNames', () => {
    expect(listNames(['A', 'B'])).toBe('A, B');
    expect(listNames(['A', 'B', 'C', 'D', 'E', 'F', 'G'])).toBe('A, B, C, D, E and 2 more');
  });
  it('a file of 1500 compounds analysed without --compound names five and counts the rest', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'mechanist-many-'));
    const lines = ['compound,substrate (uM),inhibitor (nM),rate'];
    for (let c = 0; c < 1500; c++) for (const [s, i, v] of [[1, 0, 1], [2, 0, 1.6], [1, 5, 0.7], [2, 5, 1.2], [1, 10, 0.5], [2, 10, 0.9]]) lines.push(`KT-${c},${s},${i},${v}`);
    writeFileSync(join(dir, 'screen.csv'), lines.join('\n') + '\n');
    const r = await cli(['analyze', 'screen.csv'], dir);
    expect(r.code).toBe(2);
    expect(r.err).toBe('mechanist: screen.csv holds 1500 compounds (KT-0, KT-1, KT-2, KT-3, KT-4 and 1495 more): choose one with --compound NAME, or use --compound all\n');
    const missing = await cli(['analyze', 'screen.csv', '--compound', 'NOPE'], dir);
    expect(missing.err).toBe('mechanist: screen.csv has no compound "NOPE"; it holds KT-0, KT-1, KT-2, KT-3, KT-4 and 1495 more\n');
  }, 60_000);
});
