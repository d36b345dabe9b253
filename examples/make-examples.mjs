// Writes the example rate tables in this folder. The data are simulated (invented for the
// demonstration): rates from the mechanism formulas of the domain brief with 4 % proportional
// Gaussian noise from a seeded generator, so the files are reproducible. Run: node examples/make-examples.mjs
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

const here = dirname(fileURLToPath(import.meta.url));

// Park-Miller minimal standard generator; Box-Muller for normal deviates
let seed = 20240611;
const uniform = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
const normal = () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());

/** mixed-model rate; competitive when Kiu is Infinity (BRIEF section 2) */
const rate = (p, S, I) => (p.Vmax * S) / (p.Km * (1 + I / p.Ki) + S * (1 + I / p.Kiu));

const SUBSTRATE_UM = [2, 4, 8, 16, 32, 64];
const INHIBITOR_NM = [0, 20, 40, 80, 160];
const COMPOUNDS = {
  'CPD-A': { Vmax: 2.0, Km: 12, Ki: 40, Kiu: Infinity }, // competitive
  'CPD-B': { Vmax: 2.0, Km: 12, Ki: 60, Kiu: 150 }, // mixed
};

/** measurements[s][i][replicate] for one compound, two replicates */
function simulate(p) {
  return SUBSTRATE_UM.map((S) =>
    INHIBITOR_NM.map((I) => [1, 2].map(() => Number((rate(p, S, I) * (1 + 0.04 * normal())).toFixed(3)))),
  );
}

const data = Object.fromEntries(Object.entries(COMPOUNDS).map(([name, p]) => [name, simulate(p)]));
const a = data['CPD-A'];

function longRows(v, compound) {
  const rows = [];
  SUBSTRATE_UM.forEach((S, s) =>
    INHIBITOR_NM.forEach((I, i) => v[s][i].forEach((r, k) => rows.push({ compound, S, I, r, rep: k + 1, well: `${'ABCDEFGH'[s]}${i * 2 + k + 1}` }))),
  );
  return rows;
}

// long, comma-separated
writeFileSync(
  join(here, 'long.csv'),
  ['substrate (uM),inhibitor (nM),rate (uM/min),replicate,well', ...longRows(a).map((r) => `${r.S},${r.I},${r.r},${r.rep},${r.well}`)].join('\n') + '\n',
);
// long, tab-separated, with an exclude column
writeFileSync(
  join(here, 'long.tsv'),
  ['substrate (uM)\tinhibitor (nM)\trate (uM/min)\treplicate\texclude', ...longRows(a).map((r, k) => `${r.S}\t${r.I}\t${r.r}\t${r.rep}\t${k === 7 ? 'yes' : ''}`)].join('\n') + '\n',
);
// long, semicolon-separated with decimal commas, CRLF line ends and a BOM, as spreadsheet exports write it
writeFileSync(
  join(here, 'long-semicolon.csv'),
  '\uFEFF' + ['substrate [uM];inhibitor [nM];rate [uM/min];replicate', ...longRows(a).map((r) => `${r.S};${r.I};${String(r.r).replace('.', ',')};${r.rep}`)].join('\r\n') + '\r\n',
);
// several compounds, long layout
writeFileSync(
  join(here, 'compounds-long.csv'),
  ['compound,substrate (uM),inhibitor (nM),rate (uM/min),replicate', ...Object.entries(data).flatMap(([name, v]) => longRows(v, name).map((r) => `${name},${r.S},${r.I},${r.r},${r.rep}`))].join('\n') + '\n',
);

const corner = 'substrate (uM) \\ inhibitor (nM) \\ rate (uM/min)';
/** one block: replicates as repeated [I] columns */
function matrixBlock(v, replicates) {
  const header = [corner, ...INHIBITOR_NM.flatMap((I) => replicates.map(() => I))].join(',');
  const rows = SUBSTRATE_UM.map((S, s) => [S, ...INHIBITOR_NM.flatMap((_, i) => replicates.map((k) => v[s][i][k]))].join(','));
  return [header, ...rows].join('\n');
}
// matrix, one block per plate read (replicate 1, then replicate 2): the form shown in the README
writeFileSync(join(here, 'matrix.csv'), [matrixBlock(a, [0]), matrixBlock(a, [1])].join('\n\n') + '\n');
// matrix, replicates side by side as repeated [I] columns (also read)
writeFileSync(join(here, 'matrix-side-by-side.csv'), matrixBlock(a, [0, 1]) + '\n');
// several compounds: one titled block per compound and plate read
writeFileSync(
  join(here, 'compounds-matrix.csv'),
  Object.entries(data).flatMap(([name, v]) => [0, 1].map((k) => `compound,${name}\n${matrixBlock(v, [k])}`)).join('\n\n') + '\n',
);
