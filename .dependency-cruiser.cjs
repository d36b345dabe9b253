/**
 * The layer rule of src/ (docs/decisions/layer-rule.md), checked by `npm test` and so by CI.
 *
 * LAYERS lists the layers from the bottom up. A module may import its own layer and any layer
 * below it, never one above. Layers that share a row are siblings: neither imports the other.
 * Type-only imports count (tsPreCompilationDeps): a type names what a layer knows about, and a
 * type pointing upward is the first step of a value import pointing upward.
 */
const LAYERS = [
  ['text', '^src/(text/|version\\.ts$)'], // formatting and the version string: import nothing
  ['stats', '^src/stats/'], // pure statistics: distributions, tests, ranks (imports nothing of the project)
  ['input', '^src/input/'], // rate tables from files
  ['reads', '^src/reads/'], // kinetic plate reads -> rate table (a front end of input)
  ['models', '^src/models/'], // the rate equations
  ['fit', '^src/fit/'], // least squares and what it leaves (covariance, leverages)
  ['simulate', '^src/simulate/'], // simulated rates and plates from the models; the seeded random source
  ['evidence', '^src/evidence/'], // intervals, comparisons, checks, the verdict
  ['analysis', '^src/analysis/'], // one table's analysis in stages, and its result types
  ['wording', '^src/wording/'], // the sentences of coded findings: verdict, reasons, advice, caveats
  ['figures', '^src/figures/'], // SVG figures
  ['report', '^src/report/'], // text, JSON, CSV, HTML and the result folder
  [['batch', '^src/batch/'], ['plan', '^src/plan/']], // many compounds; the experiment planner
  ['cli', '^src/cli/'], // the command line
  ['api', '^src/index\\.ts$'], // the library's public exports
];

const rows = LAYERS.map((row) => (Array.isArray(row[0]) ? row : [row]));
const above = (i) => rows.slice(i + 1).flat().map(([, path]) => path);

const layerRules = rows.flatMap((row, i) =>
  row
    .filter(() => i < rows.length - 1)
    .map(([name, path]) => ({
      name: `layer-${name}`,
      comment: `${name} imports only its own layer and those below it (docs/decisions/layer-rule.md)`,
      severity: 'error',
      from: { path },
      to: { path: above(i) },
    })),
);

const siblingRules = rows
  .filter((row) => row.length > 1)
  .flatMap((row) =>
    row.map(([name, path]) => ({
      name: `siblings-${name}`,
      comment: `${name} does not import its sibling layers (${row.map(([n]) => n).join(', ')})`,
      severity: 'error',
      from: { path },
      to: { path: row.filter(([n]) => n !== name).map(([, p]) => p) },
    })),
  );

module.exports = {
  forbidden: [
    ...layerRules,
    ...siblingRules,
    {
      name: 'no-circular',
      comment: 'no import circles, type-only ones included',
      severity: 'error',
      from: { path: '^src/' },
      to: { circular: true },
    },
    {
      name: 'in-a-layer',
      comment: 'every module of src/ belongs to a layer of .dependency-cruiser.cjs',
      severity: 'error',
      from: { path: '^src/', pathNot: rows.flat().map(([, path]) => path) },
      to: {},
    },
    {
      name: 'resolvable',
      comment: 'every relative import resolves to a file',
      severity: 'error',
      from: { path: '^src/' },
      to: { couldNotResolve: true },
    },
  ],
  options: {
    doNotFollow: { path: 'node_modules' },
    tsPreCompilationDeps: true,
    tsConfig: { fileName: 'tsconfig.json' },
    enhancedResolveOptions: { exportsFields: ['exports'], conditionNames: ['import', 'require', 'node', 'default'] },
  },
};
