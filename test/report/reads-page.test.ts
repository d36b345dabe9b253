/** The reads page of `mechanist rates --report DIR` (simulated plate; invented compound). */
import { describe, expect, it } from 'vitest';
import { parseKineticReads, parsePlateMap, ratesFromReads } from '../../src/reads/index.js';
import { readsReportHtml } from '../../src/report/html/reads-page.js';

function readsFrom(times: number[], wells: Record<string, (t: number) => number>): string {
  const names = Object.keys(wells);
  return [`time (min),${names.join(',')}`, ...times.map((t) => [t, ...names.map((w) => wells[w](t))].join(','))].join('\n') + '\n';
}

describe('reads page', () => {
  const times = Array.from({ length: 12 }, (_, k) => k);
  const reads = readsFrom(times, {
    A1: (t) => 0.1 * t + 0.001 * Math.sin(3 * t),
    A2: (t) => 0.2 * t + 0.001 * Math.cos(2 * t),
    B1: (t) => 0.3 * t + 0.001 * Math.sin(5 * t),
    B2: (t) => Math.min(0.5 * t, 4) + 0.001 * Math.sin(t) * (t < 8 ? 1 : 0),
    C1: () => 0.05,
    Z9: (t) => 0.1 * t,
  });
  const map = 'well,compound,substrate (uM),inhibitor (uM),role\nA1,QX-<b>,10,0,\nA2,QX-<b>,20,0,\nB1,QX-<b>,10,1,\nB2,QX-<b>,20,1,\nC1,,10,,blank\nD4,QX-<b>,40,0,\n';
  const result = ratesFromReads([parseKineticReads(reads, { source: 'r.csv' })], parsePlateMap(map, 'm.csv'), { conversion: { signalPerUnit: 1, givenUnit: 'uM', description: '1 per uM' } });
  const html = readsReportHtml(result, { date: '2026-01-01' });

  it('one panel per well, laid out by [S] across and [I] down, user text escaped', () => {
    expect(html.match(/<svg /g)!.length).toBe(4);
    expect(html).toContain('Compound QX-&lt;b&gt;');
    expect(html).not.toContain('QX-<b>');
    expect(html).toMatch(/<th scope="col">\[S\] 10 uM<\/th><th scope="col">\[S\] 20 uM<\/th>/);
    expect(html).toMatch(/<th scope="row">\[I\] 0 uM<\/th>[\s\S]*<th scope="row">\[I\] 1 uM<\/th>/);
    const rowOfA2 = html.indexOf('id="well-A2"');
    expect(rowOfA2).toBeGreaterThan(html.indexOf('id="well-A1"'));
    expect(rowOfA2).toBeLessThan(html.indexOf('[I] 1 uM'));
  });
  it('flagged wells are framed and listed with their reason; unused wells and reads are listed', () => {
    expect(result.wells.find((w) => w.well === 'B2')!.flags.map((f) => f.code)).toContain('saturated');
    expect(html).toMatch(/<tr><td>B2<\/td><td>QX-&lt;b&gt;<\/td><td>20<\/td><td>1<\/td><td>detector saturation: /);
    expect(html).toContain('plate-map well D4 (line 7) has no reads');
    expect(html).toContain('well Z9 in r.csv has reads but no plate-map entry');
    expect(html).toContain('Research use');
  });
  it('is self-contained: no script, no external reference', () => {
    expect(html).not.toMatch(/<script|<link|src="http|href="http/);
  });
});
