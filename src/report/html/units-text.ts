/** Units of each reported constant, in the table's units, for the tables of the page. */
import type { AnalysisResult } from '../../analysis/types.js';
import { displayUnit } from '../../figures/axis-units.js';
import { unitOfParameter } from '../../models/registry.js';

export function parameterUnit(name: string, result: AnalysisResult): string {
  const unit = unitOfParameter(name, result.input.units);
  return displayUnit(unit === '' ? null : unit) ?? '';
}
