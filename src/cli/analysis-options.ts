/**
 * The options shared by `analyze`, `demo` and `batch`: how to read the table and how to analyse it.
 * Declared once here so every command offers the same spelling and help text.
 */
import type { Command } from 'commander';
import type { ParseOptions } from '../input/options.js';
import type { AnalysisOptions } from '../analysis/analyze-table.js';
import { availableParallelism } from 'node:os';
import { concentrationOption, errorModelOption, integerOption, numberOption, unitOption } from './parse-option-values.js';
import { concentrationIn, type Concentration } from '../input/units.js';
import type { RateTable } from '../input/types.js';
import { progressBar } from './progress-bar.js';
import { UsageError } from './exit-codes.js';

export interface SharedCliOptions {
  error?: string;
  level?: string;
  layout?: string;
  separator?: string;
  decimalMark?: string;
  substrateUnit?: string;
  inhibitorUnit?: string;
  rateUnit?: string;
  unit?: string;
  robust?: boolean;
  bootstrap?: string;
  seed?: string;
  threads?: string;
  atSubstrate?: string;
  profile?: boolean;
  json?: boolean;
  enzyme?: string;
  partial?: boolean;
}

export function addSharedOptions(cmd: Command): Command {
  return cmd
    .option('--error <model>', 'error model: constant | proportional | sqrt | column (the sd column) | auto (chosen by likelihood)', 'auto')
    .option('--robust', 'add a bounded-influence (bisquare) refit and say whether the call depends on a few points')
    .option('--level <p>', 'confidence level of the intervals', '0.95')
    .option('--layout <kind>', 'table layout: long | matrix (default: detected)')
    .option('--separator <name>', 'field separator: comma | tab | semicolon (default: detected)')
    .option('--decimal-mark <name>', 'decimal mark: point | comma (default: detected)')
    .option('--substrate-unit <unit>', 'unit of [S] in the file (M, mM, uM, nM, pM); overrides the header')
    .option('--inhibitor-unit <unit>', 'unit of [I] in the file; overrides the header')
    .option('--rate-unit <text>', 'unit of the rates, as text; overrides the header')
    .option('--unit <unit>', 'report both concentrations in this unit (M, mM, uM, nM, pM)')
    .option('--bootstrap <n>', 'add a wild bootstrap with n resamples (percentile and BCa intervals, mechanism-selection frequencies)')
    .option('--seed <s>', 'seed of the bootstrap (same seed, same result)', '1')
    .option('--threads <t>', 'threads for the bootstrap (default: the available cores, at most 4)')
    .option('--at-substrate <x>', 'report the IC50 at this [S] (Cheng-Prusoff), with its unit (25uM; a plain number is in the [S] unit of the report)')
    .option('--no-profile', 'skip the profile-likelihood intervals (Wald only)')
    .option('--enzyme <conc>', 'total active enzyme for the tight-binding (Morrison) models, with its unit (5nM), or "fit" when unknown')
    .option('--partial', 'also fit the partial (hyperbolic) models, where the inhibited complex still turns over');
}

export function parseOptionsFrom(o: SharedCliOptions): ParseOptions {
  const parse: ParseOptions = {};
  if (o.layout !== undefined) {
    if (o.layout !== 'long' && o.layout !== 'matrix') throw new UsageError(`option --layout: "${o.layout}" is not long or matrix`);
    parse.layout = o.layout;
  }
  if (o.separator !== undefined) {
    const sep = ({ comma: ',', tab: '\t', semicolon: ';' } as const)[o.separator as 'comma' | 'tab' | 'semicolon'];
    if (!sep) throw new UsageError(`option --separator: "${o.separator}" is not comma, tab or semicolon`);
    parse.separator = sep;
  }
  if (o.decimalMark !== undefined) {
    const mark = ({ point: '.', comma: ',' } as const)[o.decimalMark as 'point' | 'comma'];
    if (!mark) throw new UsageError(`option --decimal-mark: "${o.decimalMark}" is not point or comma`);
    parse.decimalMark = mark;
  }
  if (o.substrateUnit) parse.substrateUnit = unitOption('--substrate-unit', o.substrateUnit);
  if (o.inhibitorUnit) parse.inhibitorUnit = unitOption('--inhibitor-unit', o.inhibitorUnit);
  if (o.rateUnit) parse.rateUnit = o.rateUnit;
  if (o.unit) {
    const u = unitOption('--unit', o.unit);
    parse.outputUnits = { substrate: u, inhibitor: u };
  }
  return parse;
}

export function analysisOptionsFrom(o: SharedCliOptions): AnalysisOptions {
  return {
    errorModel: o.error === undefined || o.error === 'auto' ? 'auto' : errorModelOption(o.error),
    ...(o.robust ? { robust: true } : {}),
    level: numberOption('--level', o.level ?? '0.95', (x) => x > 0 && x < 1, 'a number between 0 and 1'),
    ...intervalOptionsFrom(o),
    ...familyOptionsFrom(o),
  };
}

/** --enzyme CONC|fit and --partial. */
function familyOptionsFrom(o: Pick<SharedCliOptions, 'enzyme' | 'partial'>): AnalysisOptions {
  const out: AnalysisOptions = {};
  if (o.partial) out.partial = true;
  if (o.enzyme !== undefined) {
    const text = o.enzyme.trim();
    if (text === 'fit') out.enzyme = 'fit';
    else {
      let c: Concentration;
      try {
        c = concentrationOption('--enzyme', text);
      } catch {
        throw new UsageError(`option --enzyme: "${o.enzyme}" is not a positive concentration with a unit (for example 5nM) or "fit"`);
      }
      if (c.unit === null) throw new UsageError(`option --enzyme: "${o.enzyme}" needs a unit (M, mM, uM, nM or pM), for example ${c.value}nM`);
      out.enzyme = { value: c.value, unit: c.unit };
    }
  }
  return out;
}

/** --bootstrap, --seed, --threads, --at-substrate and --no-profile; a progress bar unless --json. */
function intervalOptionsFrom(o: SharedCliOptions): AnalysisOptions {
  const out: AnalysisOptions = {};
  if (o.profile === false) out.profile = false;
  const at = atSubstrateOption(o);
  if (at !== undefined && at.unit === null) out.atSubstrate = at.value;
  // checked even without a bootstrap, so a typo is caught the first time, not when one is added
  const seed = integerOption('--seed', o.seed ?? '1', 0);
  if (o.bootstrap !== undefined) {
    const threads = o.threads !== undefined ? integerOption('--threads', o.threads, 1) : Math.min(4, availableParallelism());
    out.bootstrap = {
      resamples: integerOption('--bootstrap', o.bootstrap, 1),
      seed,
      workers: threads,
    };
    if (!o.json) {
      const bar = progressBar('bootstrap');
      out.onProgress = (done, total) => bar.update(done, total);
    }
  }
  return out;
}

/** --at-substrate as given: a number with its unit, or a plain number (unit null). */
export function atSubstrateOption(o: SharedCliOptions): Concentration | undefined {
  return o.atSubstrate === undefined ? undefined : concentrationOption('--at-substrate', o.atSubstrate);
}

/**
 * The IC50 [S] of --at-substrate in the [S] unit of `table` (which the analysis works in); a plain
 * number is used as it is. A unit given for a table whose [S] unit is unknown is a usage error.
 */
export function atSubstrateFor(at: Concentration, table: RateTable, option = '--at-substrate'): number {
  if (at.unit === null) return at.value;
  const to = table.units.substrate;
  if (to === null)
    throw new UsageError(`option ${option}: ${table.source} gives no [S] unit to convert ${at.value} ${at.unit} to; give --substrate-unit, or a plain number`);
  return concentrationIn(at, to);
}
