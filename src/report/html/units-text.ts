/** Units of each reported constant, in the table's units, for the tables of the page. */
import type { AnalysisResult } from '../../analysis/types.js';
import { displayUnit } from '../../figures/axis-units.js';

export function parameterUnit(name: string, result: AnalysisResult): string {
  const u = result.input.units;
  const unit = name === 'Km' ? u.substrate : name === 'Ki' || name === 'Kiu' || name === 'Et' ? u.inhibitor : name === 'Vmax' ? u.rate : null;
  return displayUnit(unit) ?? '';
}
