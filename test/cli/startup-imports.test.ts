/**
 * Start-up cost (issue 13, item 1): the figure code (d3 on a jsdom document) is loaded only when
 * figures are drawn. Checked two ways: the static import graph of the CLI entry and of the batch
 * worker reaches neither package (only `import()` inside the --out / --reports paths does), and a
 * real process that runs `analyze --json` has not loaded jsdom while one that runs `--out` has.
 * The timings themselves are in bench/startup-bench.mjs (docs/benchmarks.md), not here.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync, existsSync, mkdtempSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';

const ROOT = join(__dirname, '..', '..');

/** Packages reached from `entry` through static (non-type) imports and re-exports of src/*.ts. */
function staticPackages(entry: string): Map<string, string> {
  const packages = new Map<string, string>();
  const seen = new Set<string>();
  const queue = [resolve(ROOT, entry)];
  while (queue.length > 0) {
    const file = queue.shift()!;
    if (seen.has(file)) continue;
    seen.add(file);
    const source = readFileSync(file, 'utf8');
    for (const m of source.matchAll(/^\s*(import|export)\s+(type\s+)?[^;]*?from\s+'([^']+)'/gms)) {
      if (m[2]) continue;
      const spec = m[3];
      if (spec.startsWith('.')) queue.push(resolve(dirname(file), spec.replace(/\.js$/, '.ts')));
      else if (!spec.startsWith('node:') && !packages.has(spec)) packages.set(spec, file);
    }
  }
  return packages;
}

describe('the figure code is loaded only when figures are drawn', () => {
  for (const entry of ['src/cli/main.ts', 'src/batch/worker.ts', 'src/batch/index.ts']) {
    it(`${entry} does not import d3 or jsdom at start-up`, () => {
      const packages = staticPackages(entry);
      expect(packages.size).toBeGreaterThan(0); // the walk found the imports (commander, @stdlib ...)
      expect(packages.get('jsdom')).toBeUndefined();
      expect(packages.get('d3')).toBeUndefined();
    });
  }
  it('src/cli/main.ts loads only commander at start-up: the analysis and its statistics library come with the command that needs them', () => {
    expect([...staticPackages('src/cli/main.ts').keys()]).toEqual(['commander']);
  });
  it('the walk does find d3 and jsdom from the figure code (the check can fail)', () => {
    const packages = staticPackages('src/report/write-results.ts');
    expect(packages.has('d3')).toBe(true);
    expect(packages.has('jsdom')).toBe(true);
  });

  const BIN = join(ROOT, 'dist', 'cli', 'main.js');
  const loadedJsdom = (args: string[]) => {
    // jsdom is a CommonJS package: once loaded it sits in require.cache
    const script = `import { createRequire } from 'node:module';
      const { runCli } = await import(${JSON.stringify(join(ROOT, 'dist', 'cli', 'run-cli.js'))});
      const quiet = { out: () => {}, err: (s) => process.stderr.write(s), errIsTTY: false, cwd: ${JSON.stringify(ROOT)} };
      const code = await runCli(${JSON.stringify(args)}, quiet);
      const cache = Object.keys(createRequire(import.meta.url).cache);
      console.log(JSON.stringify({ code, jsdom: cache.some((k) => k.includes('/node_modules/jsdom/')) }));`;
    const r = spawnSync(process.execPath, ['--input-type=module', '-e', script], { cwd: ROOT, encoding: 'utf8' });
    expect(r.stderr).toBe('');
    return JSON.parse(r.stdout.trim().split('\n').at(-1)!) as { code: number; jsdom: boolean };
  };
  it('a process running analyze --json never loads jsdom; one running --out does', () => {
    expect(existsSync(BIN), 'run "npm run build" first').toBe(true);
    const demo = join(ROOT, 'data', 'demo', 'hlx-amidase-kt0417.csv');
    expect(loadedJsdom(['analyze', demo, '--json'])).toEqual({ code: 0, jsdom: false });
    expect(loadedJsdom(['--help'])).toEqual({ code: 0, jsdom: false });
    const out = mkdtempSync(join(tmpdir(), 'mechanist-startup-'));
    expect(loadedJsdom(['analyze', demo, '--out', out])).toEqual({ code: 0, jsdom: true });
  }, 60_000);
});
