/**
 * The columns of summary.csv: one row per compound, flat cells for spreadsheets. The interval
 * columns are named for the confidence level (ki_ci95_low for 0.95). Booleans read yes/no, blank
 * cells mean "not available" (a failed compound, or a constant the called mechanism lacks).
 */
import { levelKey } from '../report/results-json.js';
import type { CompoundSummary, ConstantSummary } from './types.js';

type Cell = string | number | boolean | null;

interface SummaryColumn {
  name: string;
  /** plain words for the README and the index page */
  meaning: string;
  value: (row: CompoundSummary) => Cell;
}

type ConstantName = 'Ki' | 'Kiu' | 'alpha' | 'IC50' | 'beta' | 'Et';

function constantColumns(name: ConstantName, level: number): SummaryColumn[] {
  const key = name.toLowerCase();
  const ci = levelKey('ci', level);
  const part = (row: CompoundSummary): ConstantSummary | null => row[name];
  return [
    { name: key, meaning: name === 'IC50' ? 'IC50 of a table with one [S] level (dose-response fit; blank for other tables)' : `${name} of the called mechanism`, value: (r) => part(r)?.value ?? null },
    { name: `${key}_${ci}_low`, meaning: `lower end of its interval (for a constant not detected: the detection bound it exceeds)`, value: (r) => part(r)?.low ?? null },
    { name: `${key}_${ci}_high`, meaning: `upper end of its interval (blank when open)`, value: (r) => part(r)?.high ?? null },
    { name: `${key}_interval`, meaning: 'profile, wald, not-detected or unavailable', value: (r) => part(r)?.interval ?? null },
    ...(name === 'alpha'
      ? []
      : [{ name: `${key}_unit`, meaning: `unit of ${name} and its interval (the [I] unit of the run)`, value: (r: CompoundSummary) => r.units.inhibitor }]),
  ];
}

/** The summary.csv columns, in order, for intervals at `level`. */
export function summaryColumns(level: number): SummaryColumn[] {
  return [
    { name: 'position', meaning: 'place in input order (file order, then compound order in the file)', value: (r) => r.position },
    { name: 'compound', meaning: 'compound id, unique within the run', value: (r) => r.compound },
    { name: 'source', meaning: 'input file as given', value: (r) => r.source },
    { name: 'name_in_file', meaning: 'compound name written in the file (blank when it names none)', value: (r) => r.nameInFile },
    { name: 'status', meaning: 'analysed or failed', value: (r) => r.status },
    { name: 'outcome', meaning: 'verdict outcome: decisive, mixed-lean, undecided or no-inhibition', value: (r) => r.outcome },
    { name: 'mechanism', meaning: 'called mechanism', value: (r) => r.mechanism },
    { name: 'family', meaning: 'family of the call: classic, tight-binding or partial', value: (r) => r.family },
    { name: 'lean', meaning: 'for mixed-lean: the pure mechanism it leans to', value: (r) => r.lean },
    { name: 'decisive', meaning: 'yes when the call is decisive', value: (r) => r.decisive },
    { name: 'error_model', meaning: 'error model the compound was fitted with', value: (r) => r.errorModel },
    { name: 'top_model', meaning: 'model ranked first by AICc', value: (r) => r.topModel },
    { name: 'top_weight', meaning: 'Akaike weight of that model', value: (r) => r.topWeight },
    { name: 'aicc_gap_to_second', meaning: 'AICc of the second-ranked model minus that of the first', value: (r) => r.gapToSecond },
    { name: 'constants_of', meaning: 'model whose constants fill the next columns (the called mechanism)', value: (r) => r.constantsOf },
    ...constantColumns('Ki', level),
    ...constantColumns('Kiu', level),
    ...constantColumns('alpha', level),
    ...constantColumns('beta', level),
    ...constantColumns('Et', level),
    { name: 'km', meaning: 'Km of the called mechanism', value: (r) => r.Km },
    { name: 'km_unit', meaning: 'unit of Km (the [S] unit of the run)', value: (r) => r.units.substrate },
    { name: 'vmax', meaning: 'Vmax of the called mechanism', value: (r) => r.Vmax },
    { name: 'vmax_unit', meaning: 'unit of Vmax (the rate unit of the file, as written)', value: (r) => r.units.rate },
    ...constantColumns('IC50', level),
    { name: 'rows_used', meaning: 'points that entered the fit', value: (r) => r.rowsUsed },
    { name: 'rows_excluded', meaning: 'rows or cells kept out of the fit', value: (r) => r.rowsExcluded },
    { name: 'flag_count', meaning: 'number of flags', value: (r) => r.flags.length },
    { name: 'flags', meaning: 'input warnings and fits that did not converge, separated by " | "', value: (r) => r.flags.join(' | ') },
    { name: 'error', meaning: 'why the compound could not be analysed', value: (r) => r.error },
    { name: 'report', meaning: 'its report, relative to the output folder (with --reports)', value: (r) => r.report },
    { name: 'headline', meaning: 'the verdict in one sentence', value: (r) => r.headline },
  ];
}
