/**
 * Progress on long reads and analyses: the bar itself, the reader's position reports, and what
 * `analyze` and `batch` draw on a terminal stderr (forced on in-process: errIsTTY with no wait
 * before the first draw). No timings are asserted; only what is drawn, and that nothing is drawn
 * off a terminal or under --json / --quiet.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/run-cli.js';
import type { CliIo } from '../../src/cli/io.js';
import { megabytesRead, progressBar } from '../../src/cli/progress-bar.js';
import { parseRateText } from '../../src/input/parse-rate-text.js';

const SUBSTRATE = [2, 4, 8, 15, 30, 60, 120, 240];
const INHIBITOR = [0, 0.5, 1, 2, 4];

/** A long export of `rows` rows over two compounds (invented: competitive, 4% wobble, no randomness). */
function exportText(rows: number): string {
  const lines = ['compound,substrate (uM),inhibitor (uM),rate (nM/s),replicate'];
  for (let k = 0; k < rows; k++) {
    const j = k % 40;
    const s = SUBSTRATE[j % 8];
    const i = INHIBITOR[Math.floor(j / 8)];
    const v = ((100 * s) / (10 * (1 + i) + s)) * (1 + 0.04 * Math.sin(k * 1.7));
    lines.push(`${k < rows / 2 ? 'PG-1' : 'PG-2'},${s},${i},${v.toFixed(4)},${Math.floor(k / 40) + 1}`);
  }
  return lines.join('\n') + '\n';
}

function terminalIo(cwd: string, terminal: boolean): CliIo & { stdout: string; stderr: string } {
  const io = {
    stdout: '',
    stderr: '',
    out: (t: string) => void (io.stdout += t),
    err: (t: string) => void (io.stderr += t),
    errIsTTY: terminal,
    progressDelayMs: 0,
    cwd,
  };
  return io;
}

describe('progress bar', () => {
  it('draws on a terminal writer, erases itself when done, and is silent elsewhere', () => {
    let text = '';
    const bar = progressBar('reading', { write: (t) => (text += t), terminal: true, delayMs: 0, width: 10, count: megabytesRead });
    bar.update(14_000_000, 56_000_000);
    expect(text).toBe('\rreading [###.......] 25% 14.0 of 56.0 MB');
    bar.update(56_000_000, 56_000_000);
    expect(text.endsWith('\r\x1b[K')).toBe(true);
    let silent = '';
    const off = progressBar('reading', { write: (t) => (silent += t), terminal: false, delayMs: 0 });
    off.update(1, 4);
    off.finish();
    expect(silent).toBe('');
  });
});

describe('reader position reports', () => {
  it('reports the characters read, rising, ending at the whole text', () => {
    const text = exportText(5000);
    const seen: [number, number][] = [];
    const tables = parseRateText(text, { source: 'p.csv', onReadProgress: (done, total) => seen.push([done, total]) });
    expect(tables.map((t) => t.points.length)).toEqual([2500, 2500]);
    expect(seen.length).toBeGreaterThan(2);
    for (let k = 1; k < seen.length; k++) expect(seen[k][0]).toBeGreaterThan(seen[k - 1][0]);
    expect(seen.every(([, total]) => total === text.length)).toBe(true);
    expect(seen.at(-1)).toEqual([text.length, text.length]);
  });
});

describe('progress in the CLI', () => {
  const dir = mkdtempSync(join(tmpdir(), 'mechanist-progress-'));
  writeFileSync(join(dir, 'export.csv'), exportText(4000));

  it('analyze draws a reading bar and a bar over the compounds on a terminal', async () => {
    const io = terminalIo(dir, true);
    expect(await runCli(['analyze', 'export.csv', '--compound', 'all', '--no-profile'], io)).toBe(0);
    expect(io.stderr).toMatch(/\rreading \[[#.]+\] \d+% [\d.]+ of 0\.1 MB/);
    expect(io.stderr).toMatch(/\ranalysing \[[#.]+\] \d+% \(\d\/2 compounds\)/);
    expect(io.stderr).toContain('\r\x1b[K');
    expect(io.stdout).toContain('PG-2');
  }, 60_000);

  it('analyze draws nothing off a terminal or under --json', async () => {
    const plain = terminalIo(dir, false);
    expect(await runCli(['analyze', 'export.csv', '--compound', 'all', '--no-profile'], plain)).toBe(0);
    expect(plain.stderr).not.toContain('\r');
    const json = terminalIo(dir, true);
    expect(await runCli(['analyze', 'export.csv', '--compound', 'all', '--no-profile', '--json'], json)).toBe(0);
    expect(json.stderr).not.toContain('\r');
  }, 60_000);

  it('batch draws a reading bar that moves within the file, then its compound bar; none with --quiet', async () => {
    const io = terminalIo(dir, true);
    expect(await runCli(['batch', 'export.csv', '--out', 'run', '--jobs', '1', '--no-profile'], io)).toBe(0);
    expect(io.stderr).toMatch(/\rreading \[[#.]+\] [1-9]\d?% \(0\/1 files\)/);
    expect(io.stderr).toMatch(/\rbatch \[[#.]+\] \d+% \(1\/2\)/);
    const quiet = terminalIo(dir, true);
    expect(await runCli(['batch', 'export.csv', '--out', 'run-quiet', '--jobs', '1', '--no-profile', '--quiet'], quiet)).toBe(0);
    expect(quiet.stderr).not.toContain('\r');
  }, 60_000);
});
