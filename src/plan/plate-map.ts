/**
 * The plate map of a design: one row per well (well, [S], [I], replicate), the wells filled row by
 * row (A1, A2, ... A12, B1, ...), the design points in order of [I] then [S], the replicates of a
 * point side by side. Layout and column names are this tool's own.
 */
import type { DesignPoint } from './design-types.js';
import { csvCell } from '../report/csv-cell.js';

export interface PlateWell {
  well: string;
  substrate: number;
  inhibitor: number;
  replicate: number;
}

const PLATE_SHAPES: Record<96 | 384, { rows: number; columns: number }> = {
  96: { rows: 8, columns: 12 },
  384: { rows: 16, columns: 24 },
};

export function wellName(index: number, plate: 96 | 384): string {
  const { columns } = PLATE_SHAPES[plate];
  const row = Math.floor(index / columns);
  return `${String.fromCharCode(65 + row)}${(index % columns) + 1}`;
}

export function plateWells(points: readonly DesignPoint[], plate: 96 | 384): PlateWell[] {
  const ordered = [...points].sort((a, b) => a.inhibitor - b.inhibitor || a.substrate - b.substrate);
  const total = ordered.reduce((s, p) => s + p.replicates, 0);
  if (total > plate) throw new Error(`the design needs ${total} wells, more than a ${plate}-well plate holds`);
  const out: PlateWell[] = [];
  for (const p of ordered)
    for (let r = 1; r <= p.replicates; r++) out.push({ well: wellName(out.length, plate), substrate: p.substrate, inhibitor: p.inhibitor, replicate: r });
  return out;
}

export function plateMapCsv(points: readonly DesignPoint[], plate: 96 | 384, units: { substrate: string; inhibitor: string }): string {
  const lines = [['well', `substrate (${units.substrate})`, `inhibitor (${units.inhibitor})`, 'replicate'].join(',')];
  for (const w of plateWells(points, plate)) lines.push([w.well, String(w.substrate), String(w.inhibitor), String(w.replicate)].map(csvCell).join(','));
  return lines.join('\n') + '\n';
}
