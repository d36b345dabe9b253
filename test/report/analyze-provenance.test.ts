/**
 * `mechanist analyze FILE --out DIR`: the report footer records the SHA-256 of the input file's
 * bytes (checked against node:crypto on the same file) and the options of the run.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { copyFileSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createHash } from 'node:crypto';
import { JSDOM } from 'jsdom';
import { runCli } from '../../src/cli/run-cli.js';
import { demoDataPath } from '../../src/cli/package-paths.js';
import { silentIo } from '../helpers/cli-capture.js';

let dir: string;
let footer: Map<string, string>;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'mechanist-analyze-'));
  copyFileSync(demoDataPath(), join(dir, 'rates.csv'));
  const code = await runCli(['analyze', 'rates.csv', '--out', 'out', '--robust', '--error', 'proportional', '--seed', '5'], silentIo(dir));
  expect(code).toBe(0);
  const doc = new JSDOM(readFileSync(join(dir, 'out', 'report.html'), 'utf8')).window.document;
  const terms = Array.from(doc.querySelectorAll('footer#provenance dt')).map((dt) => dt.textContent ?? '');
  const values = Array.from(doc.querySelectorAll('footer#provenance dd')).map((dd) => dd.textContent ?? '');
  footer = new Map(terms.map((t, k) => [t, values[k]]));
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('analyze --out footer', () => {
  it('records the SHA-256 of the input bytes', () => {
    const expected = createHash('sha256').update(readFileSync(join(dir, 'rates.csv'))).digest('hex');
    expect(footer.get('input SHA-256')).toBe(expected);
  });

  it('records the command and the options as given, defaults marked', () => {
    expect(footer.get('command')).toBe('mechanist analyze rates.csv');
    expect(footer.get('--robust')).toBe('given');
    expect(footer.get('--error')).toBe('proportional');
    expect(footer.get('--seed')).toBe('5');
    expect(footer.get('--level')).toBe('0.95 (default)');
    expect(footer.get('--no-profile')).toBe('not given (default)');
  });
});
