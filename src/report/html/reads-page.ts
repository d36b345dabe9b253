/**
 * The reads page (`mechanist rates --report DIR`): one small panel per well, grouped by compound
 * and laid out with [S] across and [I] down, so that a window that curves, a lag or a plateau is
 * seen next to its neighbours. Then the flagged wells with their reasons, and everything that was
 * not used (map wells without reads, reads without a map entry, unusable reads). Self-contained:
 * inline CSS and SVG, no script, nothing fetched.
 */
import type { PlateRates } from '../../reads/plate-rates.js';
import type { WellRate } from '../../reads/types.js';
import { progressPanel } from '../../figures/progress-panel.js';
import { escapeHtml } from './escape.js';
import { TOOL_VERSION } from '../../version.js';

const PAGE_CSS = `
body { margin: 0; font-family: "Liberation Sans", Arial, Helvetica, sans-serif; color: #1f2328; font-size: 14px; line-height: 1.45; }
header { border-bottom: 3px solid #1d3782; padding: 16px 24px 10px; }
header h1 { margin: 0; font-size: 21px; }
header p { margin: 4px 0 0; color: #5d6670; }
main { padding: 0 24px 40px; }
h2 { font-size: 18px; margin: 28px 0 8px; border-bottom: 1px solid #d8dde2; padding-bottom: 3px; }
.grid { border-collapse: collapse; }
.grid th { font-size: 12px; font-weight: normal; color: #5d6670; padding: 2px 6px; white-space: nowrap; }
.grid td { vertical-align: top; padding: 2px; }
.grid td svg { display: block; margin-bottom: 2px; }
.scroll { overflow-x: auto; max-width: 100%; }
table.list { border-collapse: collapse; font-size: 13px; }
table.list th, table.list td { border-bottom: 1px solid #e3e6e9; padding: 3px 8px; text-align: left; vertical-align: top; }
.note { color: #5d6670; max-width: 80ch; }
.key { font-size: 12px; color: #5d6670; }
`;

const fmt = (x: number | null): string => (x === null ? '' : String(Number(x.toPrecision(4))));

function groupKey(w: WellRate): string {
  return w.compound;
}

function compoundGrid(wells: WellRate[], units: { time: string; value: string; substrate: string; inhibitor: string }): string {
  const sLevels = [...new Set(wells.map((w) => w.substrate))].sort((a, b) => (a ?? -1) - (b ?? -1));
  const iLevels = [...new Set(wells.map((w) => w.inhibitor))].sort((a, b) => (a ?? -1) - (b ?? -1));
  const head = sLevels.map((s) => `<th scope="col">[S] ${escapeHtml(fmt(s))} ${escapeHtml(units.substrate)}</th>`).join('');
  const rows = iLevels.map((i) => {
    const cells = sLevels.map((s) => {
      const here = wells.filter((w) => w.substrate === s && w.inhibitor === i);
      return `<td>${here.map((w) => progressPanel(w, units)).join('')}</td>`;
    }).join('');
    return `<tr><th scope="row">[I] ${escapeHtml(fmt(i))} ${escapeHtml(units.inhibitor)}</th>${cells}</tr>`;
  }).join('\n');
  return `<div class="scroll"><table class="grid"><thead><tr><th></th>${head}</tr></thead><tbody>\n${rows}\n</tbody></table></div>`;
}

export function readsReportHtml(result: PlateRates, context: { date?: string } = {}): string {
  const valueUnit = result.conversion ? result.conversion.unit : 'signal';
  const units = { time: result.units.time, value: valueUnit, substrate: result.units.substrate ?? '', inhibitor: result.units.inhibitor ?? '' };
  const groups = new Map<string, WellRate[]>();
  for (const w of result.wells) groups.set(groupKey(w), [...(groups.get(groupKey(w)) ?? []), w]);
  const sections = [...groups].map(([compound, wells]) =>
    `<h2>${compound === '' ? 'Wells' : `Compound ${escapeHtml(compound)}`}</h2>\n${compoundGrid(wells, units)}`).join('\n');
  const flagged = result.wells.filter((w) => w.excludeReason !== null);
  const flaggedRows = flagged.map((w) =>
    `<tr><td>${escapeHtml(w.plate ? `${w.plate}/${w.well}` : w.well)}</td><td>${escapeHtml(w.compound)}</td><td>${escapeHtml(fmt(w.substrate))}</td><td>${escapeHtml(fmt(w.inhibitor))}</td><td>${escapeHtml(w.excludeReason!)}</td></tr>`).join('\n');
  const unused = [
    ...result.mapWellsWithoutReads.map((m) => `plate-map well ${m.label} (line ${m.line}) has no reads`),
    ...result.readsWithoutMap.map((r) => `well ${r.label} in ${r.source} has reads but no plate-map entry`),
    ...result.excludedReads.map((e) => `${e.source}:${e.line}${e.column ? `:${e.column}` : ''}: a read of well ${e.plate ? `${e.plate}/` : ''}${e.well}: ${e.reason}`),
  ];
  const rated = result.wells.filter((w) => w.rate !== null).length;
  const how = result.rateFrom === 'integrated'
    ? 'v0 of the integrated Michaelis-Menten fit where it is valid, else the straight early window'
    : 'the slope of the straight early window' + (result.conversion ? ', corrected for the substrate used in it' : '');
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Progress curves: ${escapeHtml(result.sources.reads.join(', '))}</title>
<style>${PAGE_CSS}</style></head>
<body>
<header><h1>Progress curves and initial rates</h1>
<p>${escapeHtml(result.sources.reads.join(', '))} with plate map ${escapeHtml(result.sources.map)}: ${result.wells.length} wells, ${rated} with a rate, ${flagged.length} marked excluded, ${result.blanks.length} blank wells.</p></header>
<main>
<p class="note">Rates in ${escapeHtml(result.units.rate)}: ${escapeHtml(how)}. ${result.conversion ? `Conversion: ${escapeHtml(result.conversion.description)}.` : 'No conversion was given: values are blank-corrected signal.'} Research use: check flagged wells by eye before trusting or dropping them.</p>
<p class="key">Each panel: blank-corrected reads (${escapeHtml(valueUnit)}) against time; filled circles are the reads of the window, open circles the others, crosses saturated reads; the solid line is the fit over the window and the dashed line carries it on (or the integrated Michaelis-Menten curve, when it gave the rate). A panel with an orange frame is flagged; its flags are named at the top right.</p>
${sections}
<h2>Flagged and excluded wells</h2>
${flagged.length === 0 ? '<p>None.</p>' : `<div class="scroll"><table class="list"><thead><tr><th>well</th><th>compound</th><th>[S]</th><th>[I]</th><th>why</th></tr></thead><tbody>\n${flaggedRows}\n</tbody></table></div>`}
<h2>Not used</h2>
${unused.length === 0 ? '<p>Every read and every plate-map well was used.</p>' : `<ul>${unused.map((u) => `<li>${escapeHtml(u)}</li>`).join('\n')}</ul>`}
<p class="note">mechanist ${escapeHtml(TOOL_VERSION)}${context.date ? `, ${escapeHtml(context.date)}` : ''}.</p>
</main></body></html>
`;
}
