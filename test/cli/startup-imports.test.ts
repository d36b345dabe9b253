/**
 * Start-up cost (issue 13, item 1): the figure code (d3) is loaded only when figures are drawn.
 * Checked two ways: the static import graph of the CLI entry and of the batch worker does not
 * reach d3 (only `import()` inside the --out / --reports paths does), and a real process that runs
 * `analyze --json` has not loaded d3 while one that runs `--out` has (module resolutions recorded
 * by a loader hook). jsdom, which the figures were once drawn on, is loaded by none of them: the
 * figures are an element tree of their own (src/figures/svg-document.ts).
 * The timings themselves are in bench/startup-bench.mjs (docs/benchmarks.md), not here.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync, existsSync, mkdtempSync, writeFileSync } from 'node:fs';
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
  it('the walk does find d3 from the figure code (the check can fail), and jsdom from nowhere', () => {
    const packages = staticPackages('src/report/write-results.ts');
    expect(packages.has('d3')).toBe(true);
    expect(packages.has('jsdom')).toBe(false);
    expect(staticPackages('src/index.ts').has('jsdom')).toBe(false);
  });

  const BIN = join(ROOT, 'dist', 'cli', 'main.js');
  /** Runs the CLI in a fresh process and says which of d3 and jsdom it loaded. */
  const loaded = (args: string[]) => {
    const dir = mkdtempSync(join(tmpdir(), 'mechanist-imports-'));
    const record = join(dir, 'resolved.txt');
    writeFileSync(record, '');
    // a resolve hook (it runs on the loader thread) appends every resolved URL to the record
    // before the import it answers can go on, so the record is complete when the command returns
    const hook = `import { appendFileSync } from 'node:fs';
      let file;
      export function initialize(data) { file = data.file; }
      export async function resolve(specifier, context, next) {
        const r = await next(specifier, context);
        appendFileSync(file, r.url + '\\n');
        return r;
      }`;
    const script = `import { createRequire, register } from 'node:module';
      register('data:text/javascript,' + encodeURIComponent(${JSON.stringify(hook)}), import.meta.url, { data: { file: ${JSON.stringify(record)} } });
      const { runCli } = await import(${JSON.stringify(join(ROOT, 'dist', 'cli', 'run-cli.js'))});
      const quiet = { out: () => {}, err: (s) => process.stderr.write(s), errIsTTY: false, cwd: ${JSON.stringify(ROOT)} };
      const code = await runCli(${JSON.stringify(args)}, quiet);
      const cache = Object.keys(createRequire(import.meta.url).cache);
      console.log(JSON.stringify({ code, jsdom: cache.some((k) => k.includes('/node_modules/jsdom/')) }));`;
    const r = spawnSync(process.execPath, ['--input-type=module', '-e', script], { cwd: ROOT, encoding: 'utf8' });
    expect(r.stderr).toBe('');
    const { code, jsdom } = JSON.parse(r.stdout.trim().split('\n').at(-1)!) as { code: number; jsdom: boolean };
    const urls = readFileSync(record, 'utf8').split('\n');
    expect(urls.some((u) => u.endsWith('/dist/cli/run-cli.js'))).toBe(true); // the hook saw the imports
    return { code, d3: urls.some((u) => u.includes('/node_modules/d3')), jsdom: jsdom || urls.some((u) => u.includes('/node_modules/jsdom/')) };
  };
  it('a process running analyze --json never loads d3; one running --out does; none loads jsdom', () => {
    expect(existsSync(BIN), 'run "npm run build" first').toBe(true);
    const demo = join(ROOT, 'data', 'demo', 'hlx-amidase-kt0417.csv');
    expect(loaded(['analyze', demo, '--json'])).toEqual({ code: 0, d3: false, jsdom: false });
    expect(loaded(['--help'])).toEqual({ code: 0, d3: false, jsdom: false });
    const out = mkdtempSync(join(tmpdir(), 'mechanist-startup-'));
    expect(loaded(['analyze', demo, '--out', out])).toEqual({ code: 0, d3: true, jsdom: false });
  }, 60_000);
});
