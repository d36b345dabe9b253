/**
 * Units in a batch (issue 13, item 3): every compound is put in one unit per axis (`--unit`, or
 * the first file's) with a note, never compared side by side in different units; the summary
 * carries the unit of every constant; `--at-substrate` takes a unit. Data: the same simulated
 * (INVENTED) table written once with [I] in uM and once with [I] in nM.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { CompoundSummary } from '../../src/batch/types.js';
import { simulatedCsv } from './batch-inputs.js';
import { runCaptured } from '../helpers/cli-capture.js';

const cli = runCaptured;

/** The same table with [I] written in nM (values x 1000, exact for these levels). */
function inNanomolar(csv: string): string {
  const [head, ...rows] = csv.trim().split('\n');
  const lines = rows.map((r) => {
    const cells = r.split(',');
    cells[1] = String(Number(cells[1]) * 1000);
    return cells.join(',');
  });
  return [head.replace('inhibitor (uM)', 'inhibitor (nM)'), ...lines].join('\n') + '\n';
}

describe('batch: one unit per run', () => {
  const root = mkdtempSync(join(tmpdir(), 'mechanist-units-'));
  const csv = simulatedCsv('competitive', { Vmax: 10, Km: 20, Ki: 1.5 }, 77);
  writeFileSync(join(root, 'a-micro.csv'), csv);
  writeFileSync(join(root, 'b-nano.csv'), inNanomolar(csv));

  it('converts the second file to the first file\'s [I] unit, with a note; the constants then agree', async () => {
    const r = await cli(['batch', 'a-micro.csv', 'b-nano.csv', '--out', 'out', '--at-substrate', '0.03mM'], root);
    expect(r.code).toBe(0);
    expect(r.err).toContain("mechanist: note: b-nano: [I] from nM to uM converted, to the run's unit (the first file's; set it with --unit)");
    const doc = JSON.parse(readFileSync(join(root, 'out', 'summary.json'), 'utf8'));
    const rows = doc.compounds as CompoundSummary[];
    expect(rows.map((x) => x.units)).toEqual([
      { substrate: 'uM', inhibitor: 'uM', rate: null },
      { substrate: 'uM', inhibitor: 'uM', rate: null },
    ]);
    expect(rows[1].Ki!.value).toBeCloseTo(rows[0].Ki!.value!, 9);
    // --at-substrate 0.03mM is 30 in the run's [S] unit (uM)
    expect(doc.settings.analysis.atSubstrate).toBe(30);
    const [header, first] = readFileSync(join(root, 'out', 'summary.csv'), 'utf8').split('\n');
    const names = header.split(',');
    for (const unitColumn of ['ki_unit', 'kiu_unit', 'km_unit', 'vmax_unit']) expect(names).toContain(unitColumn);
    expect(names.indexOf('ki_unit')).toBe(names.indexOf('ki_interval') + 1);
    expect(first.split(',')[names.indexOf('ki_unit')]).toBe('uM');
    expect(readFileSync(join(root, 'out', 'index.html'), 'utf8')).toContain('Ki <span class="unit">(uM)</span>');
  });

  it('--unit nM puts both files in nM, with no conversion note', async () => {
    const r = await cli(['batch', 'a-micro.csv', 'b-nano.csv', '--out', 'out-nm', '--unit', 'nM'], root);
    expect(r.code).toBe(0);
    expect(r.err).not.toContain('converted');
    const rows = JSON.parse(readFileSync(join(root, 'out-nm', 'summary.json'), 'utf8')).compounds as CompoundSummary[];
    expect(rows.map((x) => x.units.inhibitor)).toEqual(['nM', 'nM']);
    expect(rows.map((x) => x.units.substrate)).toEqual(['nM', 'nM']);
  });

  it('a file without an [I] unit is flagged, not silently compared', async () => {
    writeFileSync(join(root, 'c-none.csv'), csv.replace('inhibitor (uM)', 'inhibitor'));
    const r = await cli(['batch', 'a-micro.csv', 'c-none.csv', '--out', 'out-none'], root);
    expect(r.err).toContain('c-none: the [I] unit is not known');
    const rows = JSON.parse(readFileSync(join(root, 'out-none', 'summary.json'), 'utf8')).compounds as CompoundSummary[];
    expect(rows[1].flags.some((f) => f.includes('cannot be put in the run'))).toBe(true);
  });
});

describe('--at-substrate with a unit', () => {
  const root = mkdtempSync(join(tmpdir(), 'mechanist-at-'));
  writeFileSync(join(root, 'plate.csv'), simulatedCsv('competitive', { Vmax: 10, Km: 20, Ki: 1.5 }, 78));
  it('25uM and 0.025mM and 25 give the same IC50; the summary prints [S] with its unit', async () => {
    const texts = await Promise.all(['25uM', '0.025 mM', '25', '25UM'].map((at) => cli(['analyze', 'plate.csv', '--at-substrate', at], root)));
    const ic50 = texts.map((t) => t.out.split('\n').find((l) => l.includes('IC50 at [S]')));
    expect(ic50[0]).toMatch(/^ {2}IC50 at \[S\] = 25 uM: [\d.]+ uM /);
    expect(new Set(ic50).size).toBe(1);
  });
  it('a unit that is not a concentration, or a non-positive value, is a usage error (exit 2)', async () => {
    const bad = await cli(['analyze', 'plate.csv', '--at-substrate', '25 kg'], root);
    expect(bad.code).toBe(2);
    expect(bad.err).toBe('mechanist: option --at-substrate: unknown concentration unit "kg"; use M, mM, uM (or \u00b5M), nM or pM\n');
    const zero = await cli(['analyze', 'plate.csv', '--at-substrate', '0uM'], root);
    expect(zero.err).toBe('mechanist: option --at-substrate: "0uM" is not a positive concentration\n');
  });
  it('--seed is checked even without --bootstrap', async () => {
    const r = await cli(['analyze', 'plate.csv', '--seed', '1.5'], root);
    expect(r.code).toBe(2);
    expect(r.err).toBe('mechanist: option --seed: "1.5" is not a whole number of at least 0\n');
  });
});
