/** parameters.csv: one row per model and parameter, for spreadsheets. */
import type { AnalysisResult } from '../analysis/types.js';
import { csvCell } from './csv-cell.js';


/** A profile end: the number, "open" for an end not reached, blank when no profile was computed. */
function profileEnd(profile: [number | null, number | null] | undefined, side: 0 | 1): number | string | null {
  if (!profile) return null;
  return profile[side] === null ? 'open' : profile[side];
}

export function parametersCsv(result: AnalysisResult): string {
  const pct = Math.round(result.level * 100);
  const header = [
    'mechanism', 'rank', 'aicc_weight', 'parameter', 'value', 'se',
    `wald${pct}_low`, `wald${pct}_high`, `profile${pct}_low`, `profile${pct}_high`, 'detected', 'note',
  ];
  const rows = [header.join(',')];
  result.models.forEach((m, rank) => {
    for (const e of m.estimates) {
      rows.push(
        [
          m.mechanism, rank + 1, m.weight, e.name, e.value, e.se, e.wald?.[0], e.wald?.[1],
          profileEnd(e.profile, 0), profileEnd(e.profile, 1), e.detected ? 'yes' : 'no', e.note ?? '',
        ]
          .map(csvCell)
          .join(','),
      );
    }
  });
  return rows.join('\n') + '\n';
}
