/**
 * The layer rule (docs/decisions/layer-rule.md, .dependency-cruiser.cjs): src/ passes it, the
 * checker rejects an upward import, a circle and a module outside every layer, and the order the
 * decision states is the order configured. `npm test` runs the same check on src/ before vitest.
 */
import { describe, expect, it } from 'vitest';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const CONFIG = join(root, '.dependency-cruiser.cjs');
const BIN = join(root, 'node_modules', 'dependency-cruiser', 'bin', 'dependency-cruise.mjs');

/** Runs the checker on `src` under `cwd` with the project's configuration. */
function cruise(cwd: string): { status: number | null; out: string } {
  const r = spawnSync(process.execPath, [BIN, 'src', '--config', CONFIG, '--output-type', 'err'], { cwd, encoding: 'utf8' });
  return { status: r.status, out: r.stdout + r.stderr };
}

/** A scratch project: the real tsconfig.json and the given files under src/. */
function scratch(files: Record<string, string>): string {
  const dir = mkdtempSync(join(tmpdir(), 'mechanist-layers-'));
  copyFileSync(join(root, 'tsconfig.json'), join(dir, 'tsconfig.json'));
  for (const [path, text] of Object.entries(files)) {
    mkdirSync(dirname(join(dir, path)), { recursive: true });
    writeFileSync(join(dir, path), text);
  }
  return dir;
}

function inScratch(files: Record<string, string>): { status: number | null; out: string } {
  const dir = scratch(files);
  try {
    return cruise(dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

describe('one-way layers', () => {
  it('src/ has no upward import, no circle and no module outside a layer', () => {
    const r = cruise(root);
    expect(r.out).toContain('no dependency violations found');
    expect(r.status).toBe(0);
  });

  it('an upward import fails, type-only included (evidence naming an analysis type)', () => {
    const r = inScratch({
      'src/analysis/types.ts': 'export interface Result { n: number }\n',
      'src/evidence/verdict.ts': "import type { Result } from '../analysis/types.js';\nexport const n = (r: Result) => r.n;\n",
    });
    expect(r.status).not.toBe(0);
    expect(r.out).toContain('layer-evidence: src/evidence/verdict.ts → src/analysis/types.ts');
  });

  it('a downward import passes (report using the formatting module)', () => {
    const r = inScratch({
      'src/text/format-number.ts': 'export const sig = (x: number) => String(x);\n',
      'src/report/summary.ts': "import { sig } from '../text/format-number.js';\nexport const line = sig(1);\n",
    });
    expect(r.out).toContain('no dependency violations found');
    expect(r.status).toBe(0);
  });

  it('siblings do not import each other (batch and plan)', () => {
    const r = inScratch({
      'src/plan/plan.ts': 'export const plan = 1;\n',
      'src/batch/run.ts': "import { plan } from '../plan/plan.js';\nexport const run = plan;\n",
    });
    expect(r.status).not.toBe(0);
    expect(r.out).toContain('siblings-batch');
  });

  it('a circle inside one layer fails', () => {
    const r = inScratch({
      'src/stats/a.ts': "import { b } from './b.js';\nexport const a = () => b;\n",
      'src/stats/b.ts': "import { a } from './a.js';\nexport const b = () => a;\n",
    });
    expect(r.status).not.toBe(0);
    expect(r.out).toContain('no-circular');
  });

  it('a module outside every layer fails', () => {
    const r = inScratch({
      'src/text/format-number.ts': 'export const sig = (x: number) => String(x);\n',
      'src/elsewhere/x.ts': "import { sig } from '../text/format-number.js';\nexport const x = sig(2);\n",
    });
    expect(r.status).not.toBe(0);
    expect(r.out).toContain('in-a-layer');
  });

  it('the decision states the configured order, bottom up', () => {
    const config = createRequire(import.meta.url)(CONFIG) as { forbidden: Array<{ name: string }> };
    const configured = config.forbidden.filter((r) => r.name.startsWith('layer-')).map((r) => r.name.slice('layer-'.length));
    const doc = readFileSync(join(root, 'docs', 'decisions', 'layer-rule.md'), 'utf8');
    const line = doc.split('\n').find((l) => l.startsWith('Order: '))!;
    const stated = line.slice('Order: '.length).split(', ').flatMap((s) => s.split(' | '));
    // the top layer (api) imports anything below it and so has no rule of its own
    expect(stated.slice(0, -1)).toEqual(configured);
    expect(stated.at(-1)).toBe('api');
  });
});
