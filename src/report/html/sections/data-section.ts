/**
 * The data: every excluded row with its reason and its values as written in the file (always
 * shown), then the full table of the file's rows in line order, with the fitted rate and scaled
 * residual of the drawn model.
 */
import type { AnalysisResult } from '../../../analysis/types.js';
import { escapeHtml } from '../escape.js';
import { sig } from '../../../text/format-number.js';
import { cell, htmlTable, type Cell } from '../html-table.js';
import type { Exclusion } from '../../../input/types.js';
import { displayUnit } from '../../../figures/axis-units.js';
import { drawnModel } from '../../../figures/figure-context.js';

/** A cell of an excluded row as written in the file: its text, "blank", or "–" when not recorded. */
function writtenCell(x: Exclusion, quantity: 'substrate' | 'inhibitor' | 'rate'): Cell {
  const text = x.asWritten?.[quantity];
  if (text === undefined) return cell('–', true);
  const shown = text.trim();
  return shown === '' ? cell('<span class="muted">blank</span>', true) : cell(escapeHtml(shown), true, 'as-written');
}

export function dataSection(result: AnalysisResult): string {
  const u = result.input.units;
  const su = displayUnit(u.substrate);
  const iu = displayUnit(u.inhibitor);
  const vu = displayUnit(u.rate);
  const head = (q: string, unit: string | null) => escapeHtml(unit ? `${q} (${unit})` : q);
  const model = drawnModel(result);
  const s = Math.sqrt(model.residualVariance);
  const points = result.table.points;
  const hasSd = points.some((p) => p.sd !== undefined);
  const excluded = result.input.excluded;
  const excludedTable = excluded.length
    ? htmlTable(
        [cell('line', true), cell('column', true), cell(head('[S]', su), true), cell(head('[I]', iu), true), cell(head('v', vu), true), cell('reason')],
        [...excluded]
          .sort((a, b) => a.line - b.line || (a.column ?? 0) - (b.column ?? 0))
          .map((x) => [
            cell(String(x.line), true),
            cell(x.column !== undefined ? String(x.column) : '–', true),
            writtenCell(x, 'substrate'),
            writtenCell(x, 'inhibitor'),
            writtenCell(x, 'rate'),
            cell(escapeHtml(x.reason)),
          ]),
        'data excluded',
      )
    : '<p>No rows were excluded.</p>';
  type Row = { line: number; cells: Cell[] };
  const rows: Row[] = points.map((p, k) => ({
    line: p.line,
    cells: [
      cell(String(p.line), true),
      cell(escapeHtml(sig(p.substrate, 4)), true),
      cell(escapeHtml(sig(p.inhibitor, 4)), true),
      cell(escapeHtml(sig(p.rate, 4)), true),
      ...(hasSd ? [cell(escapeHtml(sig(p.sd, 3)), true)] : []),
      cell(escapeHtml(sig(model.fit.fitted[k], 4)), true),
      cell(escapeHtml(s > 0 ? (model.fit.weightedResiduals[k] / s).toFixed(2) : '–'), true),
      cell('used'),
    ],
  }));
  for (const x of excluded) {
    rows.push({
      line: x.line,
      cells: [cell(String(x.line), true), writtenCell(x, 'substrate'), writtenCell(x, 'inhibitor'), writtenCell(x, 'rate'), ...(hasSd ? [cell('–', true)] : []), cell('–', true), cell('–', true), cell(`excluded: ${escapeHtml(x.reason)}`, false, 'excluded-row')],
    });
  }
  rows.sort((a, b) => a.line - b.line);
  const full = htmlTable(
    [cell('line', true), cell(head('[S]', su), true), cell(head('[I]', iu), true), cell(head('v', vu), true), ...(hasSd ? [cell('sd', true)] : []), cell(escapeHtml(`fitted (${model.modelId ?? model.mechanism})`), true), cell('scaled residual', true), cell('status')],
    rows.map((r) => r.cells),
  );
  const inp = result.input;
  return `<section id="data">
<h2>Data</h2>
<p>${escapeHtml(`${inp.rowsUsed} of ${inp.rowsRead} rows entered the fit (${inp.layout} layout, separator “${inp.separator === '\t' ? 'tab' : inp.separator}”, decimal mark “${inp.decimalMark}”).`)}</p>
<h3>Excluded rows (${excluded.length})</h3>
${excluded.length ? '<p class="muted">Values as written in the file; none of these entered the fit.</p>' : ''}
${excludedTable}
<details class="full-data"><summary>All rows, in file order (${rows.length})</summary>
${full}
</details>
</section>`;
}
