/**
 * The committed reports/demo/ is what a newcomer opens first: it must be what `mechanist demo`
 * writes today, apart from the date (one <time id="report-date"> element in report.html).
 * Regenerate with `node dist/cli/main.js demo` after a change that alters the output.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { runCli } from '../../src/cli/run-cli.js';
import { packageRoot } from '../../src/cli/package-paths.js';
import { DATE_ELEMENT_PATTERN } from '../../src/report/html/sections/provenance-footer.js';
import { silentIo } from '../helpers/cli-capture.js';

const committed = join(packageRoot(), 'reports', 'demo');
let fresh: string;

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? files(path) : [path];
  });
}

beforeAll(async () => {
  fresh = mkdtempSync(join(tmpdir(), 'mechanist-demo-'));
  const code = await runCli(['demo', '--out', fresh], silentIo(fresh));
  expect(code).toBe(0);
});
afterAll(() => rmSync(fresh, { recursive: true, force: true }));

describe('committed demo report', () => {
  it('has the same files as a fresh run', () => {
    const list = (d: string) => files(d).map((f) => relative(d, f)).sort();
    expect(list(committed)).toEqual(list(fresh));
  });

  it('matches a fresh run byte for byte, except for the date', () => {
    const stale: string[] = [];
    for (const path of files(fresh)) {
      const name = relative(fresh, path);
      const strip = (t: string) => t.replace(DATE_ELEMENT_PATTERN, '');
      if (strip(readFileSync(path, 'utf8')) !== strip(readFileSync(join(committed, name), 'utf8'))) stale.push(name);
    }
    expect(stale, 'reports/demo is out of date: run "npm run build && node dist/cli/main.js demo"').toEqual([]);
  });

  it('is byte-identical to a fresh run, date element included: running the README demo changes nothing (issue 13)', () => {
    const differ = files(fresh).filter((path) => readFileSync(path, 'utf8') !== readFileSync(join(committed, relative(fresh, path)), 'utf8'));
    expect(differ.map((p) => relative(fresh, p))).toEqual([]);
    expect(readFileSync(join(committed, 'report.html'), 'utf8')).toContain('<time id="report-date">not recorded');
  });

  it('carries exactly one date element', () => {
    const html = readFileSync(join(committed, 'report.html'), 'utf8');
    expect(html.match(DATE_ELEMENT_PATTERN)).toHaveLength(1);
  });
});
