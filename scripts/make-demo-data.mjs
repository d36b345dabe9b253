// Writes data/demo/hlx-amidase-kt0417.csv: the invented demo scenario (see data/demo/README.md).
// Run after `npm run build`: node scripts/make-demo-data.mjs
import { writeFileSync } from 'node:fs';
import { simulateRates } from '../dist/simulate/simulate-rates.js';

const substrate = [6, 12, 25, 50, 100, 200, 400, 800]; // uM; invented Km about 45 uM
const inhibitor = [0, 60, 120, 250, 500]; // nM
const points = simulateRates({
  mechanism: 'mixed',
  params: { Vmax: 38, Km: 45, Ki: 110, Kiu: 620 },
  substrate,
  inhibitor,
  replicates: 3,
  noise: 'proportional',
  noiseLevel: 0.05,
  seed: 20261201,
});

const rows = ['well,substrate (uM),inhibitor (nM),rate (nM/s),replicate,exclude,note'];
const plateRows = 'ABCDEFGHIJKLMNOP';
let k = 0;
for (const p of points) {
  const well = `${plateRows[Math.floor(k / 24)]}${(k % 24) + 1}`;
  let rate = p.rate.toFixed(3);
  let exclude = '';
  let note = '';
  if (k === 17) { exclude = 'yes'; note = 'bubble seen in well'; }
  if (k === 52) { rate = ''; note = 'reader skipped well'; }
  rows.push([well, p.substrate, p.inhibitor, rate, p.replicate, exclude, note].join(','));
  k++;
}
// substrate-free blanks, as plates usually carry them
for (let r = 1; r <= 2; r++) rows.push([`P${r}`, 0, 0, (0.05 * r).toFixed(3), r, '', 'no-substrate blank'].join(','));
writeFileSync(new URL('../data/demo/hlx-amidase-kt0417.csv', import.meta.url), rows.join('\n') + '\n');
console.log(`wrote ${rows.length - 1} rows`);
