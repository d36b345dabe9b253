/**
 * The rates as a long rate table (CSV) that `analyze` and `batch` read as it is: `compound`,
 * `substrate`, `inhibitor`, `rate`, `sd` (the standard error of the rate, so `--error column`
 * weights by it), `well`, `exclude` (yes for a flagged or excluded well) and `note` (why), then
 * columns that say how each rate was obtained (kept as annotations by the rate-table reader):
 * method, window, substrate used in it (%), blank choice, the depletion factor the window slope
 * was multiplied by (depletion-correction.ts), and the integrated fit's v0 and Km when run.
 * Map wells without reads are rows too (no rate, excluded, with the reason); blank wells are not
 * rates and are not rows.
 */
import type { PlateRates } from './plate-rates.js';
import type { WellRate } from './types.js';

function cell(text: string): string {
  return /[",\r\n]/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

function num(x: number | null | undefined): string {
  return x === null || x === undefined || !Number.isFinite(x) ? '' : String(x);
}

const withUnit = (name: string, unit: string | null): string => (unit ? `${name} (${unit})` : name);

interface Row {
  plate: string;
  line: number;
  cells: Record<string, string>;
}

/** The rate table text, rows in plate order and then plate-map order. */
export function rateTableText(result: PlateRates): string {
  const { units } = result;
  const anyPlate = result.wells.some((w) => w.plate !== '') || result.mapWellsWithoutReads.some((m) => m.label.includes('/'));
  const anyCompound = result.wells.some((w) => w.compound !== '');
  const anyIntegrated = result.wells.some((w) => w.integrated !== null);
  const columns: [string, string][] = [
    ...(anyPlate ? [['plate', 'plate'] as [string, string]] : []),
    ['well', 'well'],
    ...(anyCompound ? [['compound', 'compound'] as [string, string]] : []),
    ['substrate', withUnit('substrate', units.substrate)],
    ['inhibitor', withUnit('inhibitor', units.inhibitor)],
    ['rate', withUnit('rate', units.rate)],
    ['sd', withUnit('sd', units.rate)],
    ['exclude', 'exclude'],
    ['note', 'note'],
    ['method', 'method'],
    ['from', withUnit('window_from', units.time)],
    ['to', withUnit('window_to', units.time)],
    ['reads', 'window_reads'],
    ['used', 'substrate_used_pct'],
    ['blank', 'blank'],
    ['depletion', 'depletion_factor'],
    ...(anyIntegrated
      ? ([
          ['iv0', withUnit('v0_integrated', units.rate)],
          ['ikm', withUnit('km_integrated', units.substrate)],
          ['ikmlo', withUnit('km_integrated_low', units.substrate)],
          ['ikmhi', withUnit('km_integrated_high', units.substrate)],
        ] as [string, string][])
      : []),
  ];
  const plateOrder = new Map<string, number>();
  const rows: Row[] = result.wells.filter((w) => !anyCompound || w.compound !== '').map((w) => {
    if (!plateOrder.has(w.plate)) plateOrder.set(w.plate, plateOrder.size);
    return { plate: w.plate, line: w.mapLine, cells: wellCells(w) };
  });
  for (const m of result.mapWellsWithoutReads) {
    if (m.role === 'blank') continue;
    const slash = m.label.indexOf('/');
    const plate = slash < 0 ? '' : m.label.slice(0, slash);
    const well = slash < 0 ? m.label : m.label.slice(slash + 1);
    rows.push({ plate, line: m.line, cells: { plate, well, compound: m.compound, substrate: num(m.substrate), inhibitor: num(m.inhibitor), exclude: 'yes', note: `no reads for this well (plate map line ${m.line})` } });
  }
  rows.sort((a, b) => (plateOrder.get(a.plate) ?? 1e9) - (plateOrder.get(b.plate) ?? 1e9) || a.line - b.line);
  const lines = [columns.map(([, header]) => cell(header)).join(',')];
  for (const r of rows) {
    if (anyCompound && (r.cells.compound ?? '') === '') continue; // listed in the notes instead
    lines.push(columns.map(([key]) => cell(r.cells[key] ?? '')).join(','));
  }
  return lines.join('\n') + '\n';
}

function wellCells(w: WellRate): Record<string, string> {
  const cells: Record<string, string> = {
    plate: w.plate,
    well: w.well,
    compound: w.compound,
    substrate: num(w.substrate),
    inhibitor: num(w.inhibitor),
    rate: num(w.rate),
    sd: w.se !== null && w.se > 0 ? num(w.se) : '',
    exclude: w.excludeReason !== null ? 'yes' : '',
    note: w.excludeReason ?? '',
    method: w.method === 'integrated' ? 'integrated Michaelis-Menten' : w.method === 'window' ? 'straight early window' : '',
    blank: w.blank,
  };
  if (w.window) {
    cells.from = num(w.window.from);
    cells.to = num(w.window.to);
    cells.reads = String(w.window.reads);
  }
  if (w.depletion) cells.depletion = w.depletion.note ?? num(w.depletion.factor);
  if (w.fractionUsed !== null) cells.used = num(Number((100 * w.fractionUsed).toPrecision(6)));
  if (w.integrated) {
    cells.iv0 = num(w.integrated.v0);
    cells.ikm = num(w.integrated.km);
    cells.ikmlo = num(w.integrated.kmInterval[0]);
    cells.ikmhi = num(w.integrated.kmInterval[1]);
  }
  return cells;
}

/** Sample wells left out of the rate table because they have no compound while others do. */
export function wellsWithoutCompound(result: PlateRates): string[] {
  if (!result.wells.some((w) => w.compound !== '')) return [];
  return result.wells.filter((w) => w.compound === '').map((w) => (w.plate ? `${w.plate}/${w.well}` : w.well));
}
