/** The built command as a user runs it: a real process, real exit codes, one-line errors. */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const ROOT = join(__dirname, '..', '..');
const BIN = join(ROOT, 'dist', 'cli', 'main.js');

function mechanist(args: string[]) {
  return spawnSync(process.execPath, [BIN, ...args], { cwd: ROOT, encoding: 'utf8' });
}

describe('the built mechanist command (npm test builds dist/ first)', () => {
  it('exists', () => {
    expect(existsSync(BIN), 'run "npm run build" first').toBe(true);
  });
  it('bad input: exit 2, one line on stderr naming file, line and column, no stack trace', () => {
    const dir = mkdtempSync(join(tmpdir(), 'mechanist-proc-'));
    const file = join(dir, 'plate.csv');
    writeFileSync(file, 'substrate,inhibitor,rate,rate\n1,0,2,3\n');
    const r = mechanist(['analyze', file]);
    expect(r.status).toBe(2);
    const lines = r.stderr.trim().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/plate\.csv:1:\d+: duplicate column name "rate"/);
    expect(r.stderr).not.toMatch(/\n\s+at /);
    expect(r.stdout).toBe('');
  });
  it('success: exit 0 and the verdict on stdout', () => {
    const r = mechanist(['analyze', 'examples/long.csv', '--no-profile']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^Verdict: /m);
  });
  it('usage error: exit 2', () => {
    const r = mechanist(['analyze', 'examples/long.csv', '--level', '7']);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });
});
