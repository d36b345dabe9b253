/**
 * Compiles the NIST StRD test helpers (test/nist/models.ts, test/nist/nist-lre.ts and the engine
 * they import from src/fit/) with the project's TypeScript into a fresh temporary folder, copies the
 * NIST fixtures beside them, and returns the folder, so the nist-* scripts can run the same code as
 * the tests without a TypeScript loader. Used by scripts/nist-lre-table.mjs and
 * scripts/nist-compare-ml-lm.mjs.
 */
import { execFileSync } from 'node:child_process';
import { cpSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

export const repoRoot = join(dirname(fileURLToPath(import.meta.url)), '..');

/** Compiles and imports the NIST helpers; returns { models, lre } modules. */
export async function loadCompiledNistHelpers() {
  const out = mkdtempSync(join(tmpdir(), 'mechanist-nist-'));
  const tsc = join(repoRoot, 'node_modules', 'typescript', 'bin', 'tsc');
  execFileSync(
    process.execPath,
    [
      tsc,
      '--outDir', out,
      '--rootDir', repoRoot,
      '--module', 'NodeNext',
      '--moduleResolution', 'NodeNext',
      '--target', 'ES2022',
      '--strict',
      '--skipLibCheck',
      '--types', 'node',
      join(repoRoot, 'test', 'nist', 'models.ts'),
      join(repoRoot, 'test', 'nist', 'nist-lre.ts'),
    ],
    { stdio: 'inherit', cwd: repoRoot },
  );
  writeFileSync(join(out, 'package.json'), '{ "type": "module" }\n');
  cpSync(join(repoRoot, 'test', 'fixtures', 'nist-strd'), join(out, 'test', 'fixtures', 'nist-strd'), { recursive: true });
  const models = await import(pathToFileURL(join(out, 'test', 'nist', 'models.js')).href);
  const lre = await import(pathToFileURL(join(out, 'test', 'nist', 'nist-lre.js')).href);
  return { models, lre, out };
}
