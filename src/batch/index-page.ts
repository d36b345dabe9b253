/**
 * index.html of a batch run: one table row per compound, sortable by any column (click a column
 * heading; again to reverse) and filterable (text search, outcome, status), each compound linked
 * to its report when there is one. Self-contained: inline style and a plain inline script, no
 * fetch of anything, so it works offline and from a file:// address. The run date is shown here
 * only (summary.csv and summary.json carry no dates).
 */
import { interval, sig } from '../text/format-number.js';
import { escapeHtml } from '../report/html/escape.js';
import { TOOL_NAME, TOOL_VERSION } from '../version.js';
import { summaryCounts, type BatchSettings } from './summary-files.js';
import type { CompoundSummary, ConstantSummary } from './types.js';

interface IndexPageContext {
  settings: BatchSettings;
  /** when the run finished (shown on the page) */
  finishedAt: Date;
}

interface PageCell {
  /** HTML shown in the cell */
  html: string;
  /** value the column sorts by: a number, a text, or null (always sorted last) */
  sort: number | string | null;
  title?: string;
}

interface PageColumn {
  heading: string;
  kind: 'number' | 'text';
  cell: (row: CompoundSummary, units: RunUnits) => PageCell;
  /** which of the run's units the heading carries, e.g. "Ki (nM)" */
  unit?: keyof RunUnits;
  /** a class for the cells (and the heading), e.g. a wrapping text column */
  className?: string;
  /** shown only when some row needs it (the IC50 of one-[S] compounds) */
  onlyWhen?: (rows: readonly CompoundSummary[]) => boolean;
}

/** The units of the run: those of the first analysed compound (a batch converts all to one unit). */
type RunUnits = CompoundSummary['units'];

function runUnits(rows: readonly CompoundSummary[]): RunUnits {
  const pick = (axis: keyof RunUnits) => rows.find((r) => r.status === 'analysed' && r.units[axis] !== null)?.units[axis] ?? null;
  return { substrate: pick('substrate'), inhibitor: pick('inhibitor'), rate: pick('rate') };
}

/** ` nM` after a value whose unit differs from the heading's (a compound whose unit is not known). */
function unitNote(row: CompoundSummary, units: RunUnits, axis: keyof RunUnits): string {
  const own = row.units[axis];
  if (own === units[axis]) return '';
  return own === null ? ' <span class="muted">(unit not known)</span>' : ` ${escapeHtml(own)}`;
}

/** The last part of a path: the page stays narrow; the whole path is in the cell's title. */
function fileCell(source: string): PageCell {
  const parts = source.split(/[\\/]/).filter((p) => p !== '');
  const short = parts.length > 1 ? `…/${parts[parts.length - 1]}` : source;
  return { html: escapeHtml(short), sort: source, ...(short !== source ? { title: source } : {}) };
}

function text(value: string | null): PageCell {
  return value === null ? { html: '', sort: null } : { html: escapeHtml(value), sort: value };
}

function number(value: number | null, digits = 4): PageCell {
  return value === null ? { html: '', sort: null } : { html: sig(value, digits), sort: value };
}

function constantCell(c: ConstantSummary | null, unit = ''): PageCell {
  if (c === null) return { html: '', sort: null };
  if (c.interval === 'not-detected') {
    return c.low === null
      ? { html: 'not detected', sort: null, title: 'not detected in the tested range' }
      : { html: `&gt; ${sig(c.low, 3)}${unit}`, sort: c.low, title: 'not detected: above the detection bound' };
  }
  const range = c.interval === 'unavailable' ? ' <span class="muted">(no interval)</span>' : ` <span class="ci">${interval(c.low, c.high)}</span>`;
  return { html: `${sig(c.value)}${unit}${range}`, sort: c.value, title: `${c.interval} interval` };
}

function withUnitNote(cell: PageCell, note: string): PageCell {
  return note === '' || cell.html === '' ? cell : { ...cell, html: cell.html + note };
}

function compoundCell(row: CompoundSummary): PageCell {
  const name = escapeHtml(row.compound);
  const html = row.report === null ? name : `<a href="${escapeHtml(encodeURI(row.report))}">${name}</a>`;
  return { html, sort: row.compound };
}

function outcomeCell(row: CompoundSummary): PageCell {
  const label = row.status === 'failed' ? 'failed' : (row.outcome ?? '');
  return { html: `<span class="tag tag-${escapeHtml(label)}">${escapeHtml(label)}</span>`, sort: label, ...(row.headline ? { title: row.headline } : {}) };
}

/** Rows used, with the excluded count after it: "118 (4 excl.)". */
function rowsCell(row: CompoundSummary): PageCell {
  if (row.rowsUsed === null) return { html: '', sort: null };
  const excluded = row.rowsExcluded ? ` <span class="muted excl">(${row.rowsExcluded} excl.)</span>` : '';
  return { html: `${row.rowsUsed}${excluded}`, sort: row.rowsUsed, title: `${row.rowsUsed} points used, ${row.rowsExcluded ?? 0} rows or cells excluded` };
}

function flagsCell(row: CompoundSummary): PageCell {
  if (row.flags.length === 0) return { html: '0', sort: 0 };
  const list = row.flags.map((f) => `<li>${escapeHtml(f)}</li>`).join('');
  return { html: `<details><summary>${row.flags.length}</summary><ul>${list}</ul></details>`, sort: row.flags.length };
}

const COLUMNS: PageColumn[] = [
  { heading: '#', kind: 'number', cell: (r) => number(r.position, 10) },
  { heading: 'Compound', kind: 'text', cell: compoundCell },
  { heading: 'File', kind: 'text', cell: (r) => fileCell(r.source) },
  { heading: 'Outcome', kind: 'text', cell: outcomeCell },
  { heading: 'Mechanism', kind: 'text', cell: (r) => text(r.mechanism === null ? null : r.lean ? `${r.mechanism} (leans ${r.lean})` : r.mechanism) },
  { heading: 'Headline', kind: 'text', cell: (r) => text(r.error ?? r.headline), className: 'wrap' },
  { heading: 'Top model', kind: 'text', cell: (r) => text(r.topModel) },
  { heading: 'Akaike weight', kind: 'number', cell: (r) => number(r.topWeight, 3) },
  { heading: 'ΔAICc to 2nd', kind: 'number', cell: (r) => number(r.gapToSecond, 3) },
  { heading: 'Ki', kind: 'number', unit: 'inhibitor', cell: (r, u) => constantCell(r.Ki, unitNote(r, u, 'inhibitor')) },
  { heading: 'Kiu', kind: 'number', unit: 'inhibitor', cell: (r, u) => constantCell(r.Kiu, unitNote(r, u, 'inhibitor')) },
  { heading: 'α', kind: 'number', cell: (r) => constantCell(r.alpha) },
  { heading: 'IC50', kind: 'number', unit: 'inhibitor', cell: (r, u) => constantCell(r.IC50, unitNote(r, u, 'inhibitor')), onlyWhen: (rows) => rows.some((r) => r.IC50 !== null) },
  { heading: 'Km', kind: 'number', unit: 'substrate', cell: (r, u) => withUnitNote(number(r.Km), unitNote(r, u, 'substrate')) },
  { heading: 'Vmax', kind: 'number', unit: 'rate', cell: (r, u) => withUnitNote(number(r.Vmax), unitNote(r, u, 'rate')) },
  { heading: 'Rows used', kind: 'number', cell: rowsCell },
  { heading: 'Flags', kind: 'number', cell: flagsCell },
];

const STYLE = `
body{font:14px/1.4 system-ui,sans-serif;margin:1rem;color:#1d2327}
h1{font-size:1.3rem;margin:0 0 .3rem}
.meta,.muted{color:#5f6b73}
.controls{display:flex;gap:1rem;flex-wrap:wrap;align-items:center;margin:1rem 0}
table{border-collapse:collapse;width:100%}
th,td{border-bottom:1px solid #dde3e7;padding:.3rem .3rem;text-align:left;vertical-align:top}
th button{font:inherit;font-weight:600;background:none;border:0;padding:0;cursor:pointer;color:inherit;width:100%;text-align:inherit}
th[aria-sort=ascending] .arrow::after{content:" ▲"}
th[aria-sort=descending] .arrow::after{content:" ▼"}
td.num{text-align:right;font-variant-numeric:tabular-nums;white-space:nowrap}
td{overflow-wrap:anywhere}
td.wrap{min-width:9rem;max-width:20rem;overflow-wrap:normal}
td.num .ci,td.num .excl{display:block;font-size:12px}
th .unit{font-weight:400;color:#5f6b73}
body{max-width:100%}table{table-layout:auto;font-size:13px}
.ci{color:#5f6b73}
.tag{padding:0 .35rem;border-radius:.25rem;background:#eef1f3;white-space:nowrap}
.tag-decisive{background:#d9f0df}.tag-mixed-lean{background:#e3ecfa}
.tag-undecided{background:#fbf0d2}.tag-failed{background:#f7d9d9}
details ul{margin:.2rem 0 0 1rem;padding:0}
`;

/** The inline script: sorting by column and filtering; no network, no external code. */
const SCRIPT = `
(function () {
  var table = document.getElementById('compound-table');
  var body = table.tBodies[0];
  var rows = Array.prototype.slice.call(body.rows);
  var headings = table.tHead.rows[0].cells;
  var search = document.getElementById('search');
  var outcome = document.getElementById('outcome');
  var shown = document.getElementById('shown');
  var current = { column: -1, direction: 1 };

  function sortValue(row, column, kind) {
    var cell = row.cells[column];
    if (!cell.hasAttribute('data-sort')) return null;
    var raw = cell.getAttribute('data-sort');
    return kind === 'number' ? Number(raw) : raw.toLowerCase();
  }

  function compare(a, b, column, kind, direction) {
    var x = sortValue(a, column, kind);
    var y = sortValue(b, column, kind);
    if (x === null && y === null) return Number(a.dataset.position) - Number(b.dataset.position);
    if (x === null) return 1;
    if (y === null) return -1;
    if (x < y) return -direction;
    if (x > y) return direction;
    return Number(a.dataset.position) - Number(b.dataset.position);
  }

  function sortBy(column) {
    var direction = current.column === column ? -current.direction : 1;
    current = { column: column, direction: direction };
    var kind = headings[column].getAttribute('data-kind');
    rows.sort(function (a, b) { return compare(a, b, column, kind, direction); });
    rows.forEach(function (row) { body.appendChild(row); });
    for (var k = 0; k < headings.length; k++) {
      if (k === column) headings[k].setAttribute('aria-sort', direction === 1 ? 'ascending' : 'descending');
      else headings[k].removeAttribute('aria-sort');
    }
  }

  function applyFilter() {
    var words = search.value.trim().toLowerCase();
    var wanted = outcome.value;
    var count = 0;
    rows.forEach(function (row) {
      var ok = (wanted === '' || row.dataset.outcome === wanted) &&
        (words === '' || row.textContent.toLowerCase().indexOf(words) !== -1);
      row.hidden = !ok;
      if (ok) count++;
    });
    shown.textContent = count + ' of ' + rows.length + ' compounds shown';
  }

  for (var k = 0; k < headings.length; k++) {
    (function (column) {
      headings[column].querySelector('button').addEventListener('click', function () { sortBy(column); });
    })(k);
  }
  search.addEventListener('input', applyFilter);
  outcome.addEventListener('change', applyFilter);
  applyFilter();
})();
`;

const OUTCOME_CHOICES = ['decisive', 'mixed-lean', 'undecided', 'no-inhibition', 'failed'];

function rowHtml(row: CompoundSummary, units: RunUnits, columns: readonly PageColumn[]): string {
  const outcome = row.status === 'failed' ? 'failed' : (row.outcome ?? '');
  const cells = columns.map((column) => {
    const c = column.cell(row, units);
    const attrs = [
      column.kind === 'number' ? ' class="num"' : column.className ? ` class="${column.className}"` : '',
      c.sort === null ? '' : ` data-sort="${escapeHtml(String(c.sort))}"`,
      c.title ? ` title="${escapeHtml(c.title)}"` : '',
    ].join('');
    return `<td${attrs}>${c.html}</td>`;
  });
  return `<tr data-position="${row.position}" data-outcome="${escapeHtml(outcome)}">${cells.join('')}</tr>`;
}

export function indexPage(rows: readonly CompoundSummary[], context: IndexPageContext): string {
  const counts = summaryCounts(rows);
  const s = context.settings;
  const units = runUnits(rows);
  const headingText = (c: PageColumn) => {
    const unit = c.unit ? units[c.unit] : null;
    return `${escapeHtml(c.heading)}${unit ? ` <span class="unit">(${escapeHtml(unit)})</span>` : ''}`;
  };
  const columns = COLUMNS.filter((c) => c.onlyWhen === undefined || c.onlyWhen(rows));
  const headings = columns.map((c) => `<th scope="col" data-kind="${c.kind}"><button type="button">${headingText(c)}<span class="arrow" aria-hidden="true"></span></button></th>`).join('');
  const options = ['<option value="">all outcomes</option>', ...OUTCOME_CHOICES.map((o) => `<option value="${o}">${o}</option>`)].join('');
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(TOOL_NAME)} batch: ${counts.compounds} compounds</title>
<style>${STYLE}</style>
</head>
<body>
<h1>Batch of ${counts.compounds} compounds</h1>
<p class="meta">${counts.analysed} analysed, ${counts.failed} failed · error model ${escapeHtml(s.errorModel)} · intervals at ${sig(s.level * 100, 4)}% · ${escapeHtml(TOOL_NAME)} ${escapeHtml(TOOL_VERSION)} · finished ${escapeHtml(context.finishedAt.toISOString())}</p>
<p class="meta">Constants are those of the called mechanism, in the units of the headings (every compound converted to them), with profile-likelihood intervals where computed, else Wald; "&gt; x" marks a constant not detected: it lies past the detection bound x. Click a column heading to sort; click again to reverse. The same table is in summary.csv and summary.json.</p>
<div class="controls">
<label>Search <input id="search" type="search" placeholder="compound, file, mechanism…"></label>
<label>Outcome <select id="outcome">${options}</select></label>
<span id="shown" class="muted"></span>
</div>
<table id="compound-table">
<thead><tr>${headings}</tr></thead>
<tbody>
${rows.map((r) => rowHtml(r, units, columns)).join('\n')}
</tbody>
</table>
<p class="muted">Research use only: results support, and do not replace, expert judgement.</p>
<script>${SCRIPT}</script>
</body>
</html>
`;
}
