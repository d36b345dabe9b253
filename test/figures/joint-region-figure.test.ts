/**
 * The joint (Ki, Kiu) figure (issue 13, item 6): log axes always; where the region is cut by the
 * searched range, that part of the outline is drawn dotted in its own colour and labelled, and the
 * caption and notes describe only what is drawn. Data: simulated competitive inhibition (INVENTED;
 * Kiu runs off, so the mixed region is open) and the demo analysis (closed region).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { analyzeTable } from '../../src/analysis/analyze-table.js';
import { renderFigures } from '../../src/figures/render-figures.js';
import type { FigureOutput } from '../../src/figures/figure-output.js';
import { simulatedTable } from '../helpers/sim-table.js';
import { demoAnalysis } from './read-demo.js';

function jointOf(figures: FigureOutput[]): FigureOutput {
  const f = figures.find((x) => x.id === 'fig-joint-ki-kiu');
  expect(f).toBeDefined();
  return f!;
}

describe('joint (Ki, Kiu) region figure', () => {
  let open: FigureOutput;
  let closed: FigureOutput;
  let openRegion: { open: boolean; box?: { low: number; high: number }; kiu: number[] };
  beforeAll(async () => {
    const result = analyzeTable(simulatedTable('competitive', 11), { errorModel: 'proportional' });
    openRegion = result.models.find((m) => m.mechanism === 'mixed')!.jointRegion!;
    open = jointOf(renderFigures(result));
    closed = jointOf(renderFigures(await demoAnalysis()));
  }, 60_000);

  it('an open region: the searched box is recorded and the cut edge is drawn dotted and labelled', () => {
    expect(openRegion.open).toBe(true);
    expect(openRegion.box!.high).toBeGreaterThan(openRegion.box!.low);
    // some outline points lie on the box edge
    expect(openRegion.kiu.some((v) => Math.abs(Math.log(v / openRegion.box!.high)) < 1e-9)).toBe(true);
    expect(open.svg).toContain('class="region-edge"');
    expect(open.svg).toContain('edge of searched range');
    expect(open.caption).toContain('dotted');
  });

  it('a closed region: no edge drawn, and neither caption nor notes speak of one', () => {
    expect(closed.svg).not.toContain('region-edge');
    expect(closed.svg).not.toContain('edge of searched range');
    expect(closed.caption).not.toContain('dotted');
    expect(closed.svg).toContain('class="region-contour"');
  });

  it('notes name only what is drawn: the estimate dot only when there is one, Ki = Kiu only when drawn', () => {
    for (const f of [open, closed]) {
      expect(f.svg.includes('class="estimate"')).toBe(f.svg.includes('Dot: the estimate.'));
      expect(f.svg.includes('class="alpha-one"')).toBe(f.svg.includes('Dashed: Ki = Kiu'));
    }
  });
});
