/**
 * Inputs for the batch tests, written into a fresh temporary folder: simulated rate tables
 * (INVENTED data, made with the project's seeded simulator, src/simulate/simulate-rates.ts) as
 * single-compound files in a folder, a loose file, a file with a compound column holding three
 * compounds, and (on request) a corrupt file and a compound whose data cannot be fitted.
 */
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ratesToCsv, simulateRates } from '../../src/simulate/simulate-rates.js';
import type { Mechanism, ParamName } from '../../src/models/types.js';

const SUBSTRATE = [2, 4, 8, 15, 30, 60, 120, 240];
const INHIBITOR = [0, 0.5, 1, 2, 4];

export function simulatedCsv(mechanism: Mechanism, params: Partial<Record<ParamName, number>>, seed: number): string {
  const points = simulateRates({ mechanism, params, substrate: SUBSTRATE, inhibitor: INHIBITOR, replicates: 2, noise: 'proportional', noiseLevel: 0.05, seed });
  return ratesToCsv(points, { substrate: 'uM', inhibitor: 'uM' });
}

/** Long-layout CSV with a compound column: each compound's simulated table, one after another. */
export function compoundColumnCsv(compounds: Array<[string, string]>): string {
  const lines = ['compound,substrate (uM),inhibitor (uM),rate,replicate'];
  for (const [name, csv] of compounds) for (const line of csv.trim().split('\n').slice(1)) lines.push(`${name},${line}`);
  return lines.join('\n') + '\n';
}

interface BatchInputs {
  root: string;
  /** folder with competitive.csv, mixed.csv, uncompetitive.csv (and broken.csv when asked) */
  folder: string;
  /** a single-compound file outside the folder (noncompetitive) */
  loose: string;
  /** file with a compound column: CPD-1 (competitive), CPD-2 (none), competitive (uncompetitive) */
  multi: string;
}

export function writeBatchInputs(options: { broken?: boolean } = {}): BatchInputs {
  const root = mkdtempSync(join(tmpdir(), 'mechanist-batch-'));
  const folder = join(root, 'plates');
  mkdirSync(folder);
  writeFileSync(join(folder, 'mixed.csv'), simulatedCsv('mixed', { Vmax: 100, Km: 10, Ki: 1, Kiu: 5 }, 11));
  writeFileSync(join(folder, 'competitive.csv'), simulatedCsv('competitive', { Vmax: 100, Km: 10, Ki: 0.8 }, 12));
  writeFileSync(join(folder, 'uncompetitive.csv'), simulatedCsv('uncompetitive', { Vmax: 100, Km: 10, Kiu: 1.5 }, 13));
  writeFileSync(join(folder, 'notes.md'), 'not a rate table; the folder scan skips it\n');
  if (options.broken) writeFileSync(join(folder, 'broken.csv'), 'substrate (uM),inhibitor (uM),rate\n2,0,12.5\n4,zero,20.1\n8,0,-\n');
  const loose = join(root, 'loose-noncompetitive.csv');
  writeFileSync(loose, simulatedCsv('noncompetitive', { Vmax: 100, Km: 10, Ki: 1.2 }, 14));
  const multi = join(root, 'screen.csv');
  writeFileSync(
    multi,
    compoundColumnCsv([
      ['CPD-1', simulatedCsv('competitive', { Vmax: 80, Km: 5, Ki: 2 }, 21)],
      ['CPD-2', simulatedCsv('none', { Vmax: 90, Km: 8 }, 22)],
      ['competitive', simulatedCsv('uncompetitive', { Vmax: 120, Km: 12, Kiu: 3 }, 23)],
    ]),
  );
  return { root, folder, loose, multi };
}
