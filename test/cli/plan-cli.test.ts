/** `mechanist plan` on the command line: JSON contract, files, usage errors with exit code 2. */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, existsSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCaptured } from '../helpers/cli-capture.js';

const run = runCaptured;

const BASE = ['plan', '--km', '10uM..40uM', '--ki', '50nM..500nM', '--max-substrate', '400uM', '--max-inhibitor', '5uM', '--wells', '48', '--mechanisms', 'competitive,mixed'];

describe('mechanist plan', () => {
  it('--out that is a file, or a folder of other files, is refused before any planning (exit 2); a rerun replaces the plan whole', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'plan-out-'));
    const file = join(dir, 'a-file');
    writeFileSync(file, 'x');
    const asFile = await run([...BASE, '--simulations', '5', '--out', file]);
    expect(asFile.code).toBe(2);
    expect(asFile.err).toMatch(/is an existing file, not a folder/);
    const foreign = join(dir, 'data');
    // a missing parent folder is refused, and nothing is created
    expect((await run([...BASE, '--no-simulate', '--out', join(dir, 'data', 'nested')])).code).toBe(2);
    writeFileSync(join(dir, 'notes.txt'), 'mine');
    const intoData = await run([...BASE, '--no-simulate', '--out', dir]);
    expect(intoData.code).toBe(2);
    expect(intoData.err).toMatch(/holds files that are not part of a report \(a-file, notes\.txt/);
    expect(existsSync(foreign)).toBe(false);
    const plan = join(dir, 'plan');
    expect((await run([...BASE, '--no-simulate', '--out', plan])).code).toBe(0);
    expect((await run([...BASE, '--no-simulate', '--out', plan])).code).toBe(0);
    expect(existsSync(join(plan, 'plan.html'))).toBe(true);
  });
  it('--json --no-simulate: one document, units from the options, the recommended wells add up to the budget', async () => {
    const r = await run([...BASE, '--no-simulate', '--json']);
    expect(r.code).toBe(0);
    expect(r.err).toBe('');
    const doc = JSON.parse(r.out);
    expect(doc.recommended.units).toEqual({ substrate: 'uM', inhibitor: 'nM' });
    expect(doc.recommended.wells.reduce((s: number, w: { replicates: number }) => s + w.replicates, 0)).toBe(48);
    expect(Math.max(...doc.recommended.wells.map((w: { inhibitor: number }) => w.inhibitor))).toBeLessThanOrEqual(5000);
    expect(doc.candidates.map((c: { name: string }) => c.name)).toEqual(expect.arrayContaining(['recommended', 'common-grid', 'single-inhibitor']));
    expect(doc.settings.simulations).toBe(0);
  });
  it('--out writes plan.json, summary.txt and the plate map; --plate-map writes the CSV alone', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'mechanist-plan-'));
    const r = await run([...BASE, '--simulations', '2', '--out', join(dir, 'out'), '--plate-map', join(dir, 'map.csv'), '--enzyme', '5nM']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^Plan for 48 wells/);
    expect(r.out).toMatch(/\[E\] was given but is not yet used/);
    for (const f of ['plan.json', 'summary.txt', 'plate-map.csv', 'plan.html', 'figures/plan-grid.svg', 'figures/plan-wells.svg']) expect(existsSync(join(dir, 'out', f))).toBe(true);
    const html = readFileSync(join(dir, 'out', 'plan.html'), 'utf8');
    expect(html).not.toMatch(/<script/);
    expect(html).toMatch(/id="fig-plan-grid"/);
    expect(html).toMatch(/id="fig-plan-wells"/);
    expect(html).toMatch(/The plan rests on its assumptions/);
    expect(html).toMatch(/Research use only/);
    expect(readFileSync(join(dir, 'out', 'figures', 'plan-grid.svg'), 'utf8')).toMatch(/^<svg[^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    const csv = readFileSync(join(dir, 'map.csv'), 'utf8').trim().split('\n');
    expect(csv[0]).toBe('well,substrate (uM),inhibitor (nM),replicate');
    expect(csv).toHaveLength(49);
    expect(csv[1]).toMatch(/^A1,/);
    const doc = JSON.parse(readFileSync(join(dir, 'out', 'plan.json'), 'utf8'));
    expect(doc.candidates[0].predicted.mixed.simulations).toBe(2);
    expect(doc.settings.enzyme).toBe(5);
  });
  it('an IC50 with its [S] is accepted', async () => {
    const r = await run(['plan', '--km', '20uM', '--ic50', '80nM', '--at-substrate', '20uM', '--no-simulate', '--wells', '48', '--json']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out).settings.prior.atSubstrate).toBe(20);
  });
  for (const [args, message] of [
    [['plan', '--ki', '50nM'], /--km is required/],
    [['plan', '--km', '20uM'], /give --ki/],
    [['plan', '--km', '20', '--ki', '50nM'], /option --km: "20" is not a concentration/],
    [['plan', '--km', '20uM', '--ic50', '80nM'], /--at-substrate/],
    [['plan', '--km', '20uM', '--ki', '50nM', '--noise', 'gaussian'], /option --noise/],
    [['plan', '--km', '20uM', '--ki', '50nM', '--noise', 'constant:0.5'], /--vmax/],
    [['plan', '--km', '20uM', '--ki', '50nM', '--wells', '200'], /do not fit a 96-well plate/],
    [['plan', '--km', '20uM', '--ki', '50nM', '--mechanisms', 'competitive,allosteric'], /"allosteric"/],
    [['plan', '--km', '20uM', '--ki', '50nM', '--dilution', 'serial:1'], /option --dilution/],
  ] as const)
    it(`usage error: ${args.slice(1).join(' ')}`, async () => {
      const r = await run([...args]);
      expect(r.code).toBe(2);
      expect(r.err.trim().split('\n')).toHaveLength(1);
      expect(r.err).toMatch(message);
      expect(r.out).toBe('');
    });
});

describe('mechanist plan --from', () => {
  it('a rate table: the wells to add, with the measured ones counted', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'mechanist-plan-from-'));
    const sim = await run(['simulate', '--mechanism', 'mixed', '--km', '20', '--ki', '0.2', '--kiu', '1', '--substrate', '5,10,20,40', '--inhibitor', '0,0.1,0.2', '--replicates', '2', '--seed', '4', '-o', join(dir, 'plate.csv')]);
    expect(sim.code).toBe(0);
    const r = await run(['plan', '--from', join(dir, 'plate.csv'), '--error', 'proportional', '--wells', '24', '--no-simulate', '--json']);
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.out);
    expect(doc.settings.measuredWells).toBe(24);
    expect(doc.recommended.wellCount).toBe(24);
    expect(doc.notes.join(' ')).toMatch(/follow-up of/);
  });
  it('without --error the table is analysed as analyze does by default (auto), and the plan says which noise it took', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'mechanist-plan-auto-'));
    const sim = await run(['simulate', '--mechanism', 'competitive', '--km', '20', '--ki', '0.5', '--substrate', '4,8,16,32,64', '--inhibitor', '0,0.5,1.5', '--replicates', '3', '--noise', 'proportional', '--seed', '8', '-o', join(dir, 'plate.csv')]);
    expect(sim.code).toBe(0);
    const analysed = JSON.parse((await run(['analyze', join(dir, 'plate.csv'), '--json'])).out);
    const chosen = analysed.errorModel as string;
    expect(['constant', 'proportional']).toContain(chosen);
    const r = await run(['plan', '--from', join(dir, 'plate.csv'), '--wells', '24', '--no-simulate', '--json']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out).notes.join(' ')).toContain(`noise ${chosen} `);
    const bad = await run(['plan', '--from', join(dir, 'plate.csv'), '--error', 'sqrt']);
    expect(bad.code).toBe(2);
    expect(bad.err).toContain('is not auto, constant or proportional');
  });

  it('when analyze would choose an error model the planner cannot simulate (sqrt), the better of constant and proportional by likelihood is taken', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'mechanist-plan-sqrt-'));
    const sim = await run(['simulate', '--mechanism', 'competitive', '--km', '20', '--ki', '0.5', '--substrate', '4,8,16,32,64,128', '--inhibitor', '0,0.5,1.5', '--replicates', '4', '--noise', 'sqrt', '--seed', '1', '-o', join(dir, 'plate.csv')]);
    expect(sim.code).toBe(0);
    const analysed = JSON.parse((await run(['analyze', join(dir, 'plate.csv'), '--json'])).out);
    expect(analysed.errorModel).toBe('sqrt');
    // analyze's own scores: the best AICc under each error model
    const scores = analysed.diagnostics.errorModelChoice.scores as Array<{ errorModel: string; bestAicc: number }>;
    const plannable = scores.filter((x) => x.errorModel === 'constant' || x.errorModel === 'proportional').sort((a, b) => a.bestAicc - b.bestAicc);
    const r = await run(['plan', '--from', join(dir, 'plate.csv'), '--wells', '24', '--no-simulate', '--json']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out).notes.join(' ')).toContain(`noise ${plannable[0].errorModel} `);
  });

  it('usage errors: --from with --km, a JSON that is not an analysis', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'mechanist-plan-from-'));
    writeFileSync(join(dir, 'x.json'), '{"a": 1}');
    const a = await run(['plan', '--from', join(dir, 'x.json'), '--km', '2uM']);
    expect(a.code).toBe(2);
    expect(a.err).toMatch(/leave out --km/);
    const b = await run(['plan', '--from', join(dir, 'x.json')]);
    expect(b.code).toBe(2);
    expect(b.err).toMatch(/not the JSON of a mechanist analysis/);
    const c = await run(['plan', '--from', join(dir, 'missing.csv')]);
    expect(c.code).toBe(2);
  });
});
