/**
 * The benchmarks and scripts import the compiled library (../dist/...), which the unused-export
 * finder cannot follow back to src/: this test checks that every name they import exists in the
 * built module (npm test builds dist/ first). Without it, an export made local breaks
 * `npm run bench` and nothing else notices.
 */
import { describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const folders = ['bench', 'scripts', 'examples'];
const files = folders.flatMap((f) => (existsSync(join(root, f)) ? readdirSync(join(root, f)).filter((n) => n.endsWith('.mjs')).map((n) => join(root, f, n)) : []));

describe('benchmarks and scripts import names the built library has', () => {
  it('every named import from ../dist exists', async () => {
    if (!existsSync(join(root, 'dist', 'index.js'))) throw new Error('dist/ is missing: run `npm run build` first (npm test builds it)');
    const missing: string[] = [];
    let checked = 0;
    for (const file of files) {
      const text = readFileSync(file, 'utf8');
      for (const m of text.matchAll(/import\s*\{([^}]+)\}\s*from\s*'(\.\.\/dist\/[^']+)'/g)) {
        const mod = (await import(pathToFileURL(resolve(dirname(file), m[2])).href)) as Record<string, unknown>;
        for (const name of m[1].split(',').map((s) => s.trim().split(/\s+as\s+/)[0]).filter(Boolean)) {
          checked++;
          if (!(name in mod)) missing.push(`${file.slice(root.length + 1)}: ${m[2]} has no export ${name}`);
        }
      }
    }
    expect(missing).toEqual([]);
    expect(checked).toBeGreaterThan(10);
  });
});
