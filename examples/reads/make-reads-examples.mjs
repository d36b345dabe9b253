// Writes the kinetic-read examples in examples/reads/ (an invented scenario: the enzyme "ORX-2
// peptidase" and compound "KT-0522", a mixed inhibitor; a chromogenic product read every 20 s for
// 12 min on a 96-well plate). Run after `npm run build`: node examples/reads/make-reads-examples.mjs
import { writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { simulatePlate } from '../../dist/simulate/simulate-plate.js';
import { seededRandom } from '../../dist/simulate/random.js';

const here = dirname(fileURLToPath(import.meta.url));
const SIGNAL_PER_UM = 0.0088; // invented: absorbance per uM of product in these wells
const plate = simulatePlate({
  mechanism: 'mixed',
  params: { Vmax: 0.012, Km: 35, Ki: 0.4, Kiu: 2 }, // uM/s, uM, uM, uM (invented)
  substrate: [7, 14, 28, 56, 112, 224],
  inhibitor: [0, 0.25, 0.5, 1, 2],
  replicates: 2,
  blanksPerSubstrate: 2,
  times: Array.from({ length: 37 }, (_, k) => 20 * k),
  signalPerUnit: SIGNAL_PER_UM,
  baseline: 0.045,
  drift: 4e-6,
  noiseSd: 0.0004,
  seed: 20261202,
  compound: 'KT-0522',
});
writeFileSync(join(here, 'plate-wide.csv'), plate.readsCsv);
writeFileSync(join(here, 'plate-map.csv'), plate.mapCsv);

// the same reads in the long shape
const [header, ...rows] = plate.readsCsv.trim().split('\n').map((l) => l.split(','));
const long = ['well,time (s),signal'];
for (let c = 1; c < header.length; c++) for (const row of rows) long.push(`${header[c]},${row[0]},${row[c]}`);
writeFileSync(join(here, 'plate-long.csv'), long.join('\n') + '\n');

// a standard curve of the product: known concentrations and their absorbance
const rng = seededRandom(7);
const standards = ['concentration (uM),signal'];
for (const c of [0, 10, 20, 40, 60, 80, 100]) standards.push(`${c},${(0.045 + SIGNAL_PER_UM * c + 0.0008 * rng.normal()).toFixed(4)}`);
writeFileSync(join(here, 'standard-curve.csv'), standards.join('\n') + '\n');
console.log(`wrote plate-wide.csv, plate-long.csv, plate-map.csv, standard-curve.csv (${plate.wells.length} wells)`);
