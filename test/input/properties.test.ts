/**
 * Property tests (fast-check) of the input stage: order does not matter, units do not change
 * points, the two layouts agree, and no input, however broken, ends in anything but an
 * InputError or a table in which every row read is accounted for.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decodeRateBytes, InputError, parseRateText, type RateTable } from '../../src/input/index.js';
import { sortedPoints } from './read-fixture.js';

/** A simulated plate: distinct [S] > 0, distinct [I] including 0, replicates, any finite rates (null = blank cell). */
interface Plate {
  substrate: number[];
  inhibitor: number[];
  replicates: number;
  /** rates[s][i][r] */
  rates: (number | null)[][][];
}

const concentration = fc.double({ min: 1e-3, max: 1e4, noNaN: true, noDefaultInfinity: true });
const rateValue = fc.double({ min: -5, max: 500, noNaN: true, noDefaultInfinity: true });

function plateArbitrary(blanks: boolean): fc.Arbitrary<Plate> {
  return fc
    .record({
      substrate: fc.uniqueArray(concentration, { minLength: 2, maxLength: 6 }),
      inhibitor: fc.uniqueArray(concentration, { minLength: 1, maxLength: 4 }).map((v) => [0, ...v]),
      replicates: fc.integer({ min: 1, max: 3 }),
    })
    .chain((d) => {
      const cell = blanks ? fc.option(rateValue, { freq: 6 }) : rateValue;
      return fc
        .array(fc.array(fc.array(cell, { minLength: d.replicates, maxLength: d.replicates }), { minLength: d.inhibitor.length, maxLength: d.inhibitor.length }), {
          minLength: d.substrate.length,
          maxLength: d.substrate.length,
        })
        .map((rates) => ({ ...d, rates }));
    });
}

interface LongRow { s: string; i: string; r: string; rep: string }

function longRows(plate: Plate): LongRow[] {
  const rows: LongRow[] = [];
  plate.substrate.forEach((s, a) =>
    plate.inhibitor.forEach((i, b) =>
      plate.rates[a][b].forEach((r, k) => rows.push({ s: String(s), i: String(i), r: r === null ? '' : String(r), rep: String(k + 1) })),
    ),
  );
  return rows;
}

const LONG_COLUMNS = ['substrate (uM)', 'inhibitor (nM)', 'rate', 'replicate'] as const;
const FIELD: Record<(typeof LONG_COLUMNS)[number], keyof LongRow> = { 'substrate (uM)': 's', 'inhibitor (nM)': 'i', rate: 'r', replicate: 'rep' };

function writeLong(rows: LongRow[], columns: readonly (typeof LONG_COLUMNS)[number][] = LONG_COLUMNS): string {
  return [columns.join(','), ...rows.map((row) => columns.map((c) => row[FIELD[c]]).join(','))].join('\n') + '\n';
}

/** Matrix with replicates as repeated [I] columns, or as repeated blocks. */
function writeMatrix(plate: Plate, replicatesAs: 'columns' | 'blocks'): string {
  const corner = 'substrate (uM) \\ inhibitor (nM)';
  const cell = (v: number | null): string => (v === null ? '' : String(v));
  if (replicatesAs === 'columns') {
    const header = [corner, ...plate.inhibitor.flatMap((i) => Array.from({ length: plate.replicates }, () => String(i)))];
    const body = plate.substrate.map((s, a) => [String(s), ...plate.inhibitor.flatMap((_, b) => plate.rates[a][b].map(cell))]);
    return [header, ...body].map((r) => r.join(',')).join('\n') + '\n';
  }
  const blocks = Array.from({ length: plate.replicates }, (_, k) => {
    const header = [corner, ...plate.inhibitor.map(String)];
    const body = plate.substrate.map((s, a) => [String(s), ...plate.inhibitor.map((_, b) => cell(plate.rates[a][b][k]))]);
    return [header, ...body].map((r) => r.join(',')).join('\n');
  });
  return blocks.join('\n\n') + '\n';
}

/** Parses, and returns the tables or the InputError; anything else thrown fails the test. */
function outcome(run: () => RateTable[]): RateTable[] | InputError {
  try {
    return run();
  } catch (error) {
    if (error instanceof InputError) return error;
    throw error;
  }
}

/** The invariants every outcome must satisfy. */
function expectAccountedFor(result: RateTable[] | InputError, source: string): void {
  const plain = (text: string): void => {
    expect(text).not.toMatch(/[\r\n]|undefined|NaN/);
  };
  if (result instanceof InputError) {
    plain(result.message);
    expect(result.message.startsWith(`${source}:`)).toBe(true);
    expect(result.exitCode).toBe(2);
    return;
  }
  expect(result.length).toBeGreaterThan(0);
  for (const t of result) {
    expect(t.points.length + t.excluded.length).toBe(t.rowsRead);
    for (const p of t.points) {
      expect(Number.isFinite(p.substrate) && p.substrate > 0).toBe(true);
      expect(Number.isFinite(p.inhibitor) && p.inhibitor >= 0).toBe(true);
      expect(Number.isFinite(p.rate)).toBe(true);
    }
    for (const e of t.excluded) plain(e.reason);
    for (const w of t.warnings) plain(w.message);
  }
}

const parseLoose = (text: string, source = 'p.csv'): RateTable[] => parseRateText(text, { source, requireMechanismDesign: false });

describe('input properties', () => {
  it('shuffled rows and shuffled columns give identical tables', () => {
    fc.assert(
      fc.property(
        plateArbitrary(true).chain((plate) => {
          const rows = longRows(plate);
          return fc.tuple(
            fc.constant(rows),
            fc.shuffledSubarray(rows, { minLength: rows.length, maxLength: rows.length }),
            fc.shuffledSubarray([...LONG_COLUMNS], { minLength: 4, maxLength: 4 }),
          );
        }),
        ([rows, shuffledRows, shuffledColumns]) => {
          const a = outcome(() => parseLoose(writeLong(rows)));
          const b = outcome(() => parseLoose(writeLong(shuffledRows, shuffledColumns)));
          if (a instanceof InputError || b instanceof InputError) {
            expect(a instanceof InputError && b instanceof InputError).toBe(true);
            return;
          }
          expect(sortedPoints(b[0])).toEqual(sortedPoints(a[0]));
          expect([b[0].rowsRead, b[0].excluded.length, b[0].units]).toEqual([a[0].rowsRead, a[0].excluded.length, a[0].units]);
          expect(b[0].warnings.map((w) => w.code).sort()).toEqual(a[0].warnings.map((w) => w.code).sort());
        },
      ),
      { numRuns: 150 },
    );
  });

  it('the same data written in nM and in uM (and in mM and uM) give identical points once converted', () => {
    /** decimal text of the integer `digits` divided by 10^decimals, written by hand (no arithmetic) */
    const withPoint = (digits: string, decimals: number): string => {
      const padded = digits.padStart(decimals + 1, '0');
      return decimals === 0 ? padded : `${padded.slice(0, padded.length - decimals)}.${padded.slice(padded.length - decimals)}`;
    };
    const level = fc.record({ digits: fc.integer({ min: 1, max: 99_999_999 }).map(String), decimals: fc.integer({ min: 0, max: 4 }) });
    fc.assert(
      fc.property(
        fc.uniqueArray(level, { minLength: 5, maxLength: 8, selector: (l) => withPoint(l.digits, l.decimals) }),
        fc.uniqueArray(level, { minLength: 1, maxLength: 3, selector: (l) => withPoint(l.digits, l.decimals) }),
        (substrate, inhibitor) => {
          const rowsIn = (sShift: number, iShift: number): string[] => {
            const rows: string[] = [];
            substrate.forEach((s, a) => {
              rows.push(`${withPoint(s.digits, s.decimals + sShift)},0,${a + 1}`);
              inhibitor.forEach((i, b) => rows.push(`${withPoint(s.digits, s.decimals + sShift)},${withPoint(i.digits, i.decimals + iShift)},${b / 2 + a}`));
            });
            return rows;
          };
          // the same amounts: substrate x uM = x/1000 mM; inhibitor y nM = y/1000 uM
          const inUm = ['substrate (uM),inhibitor (nM),rate', ...rowsIn(0, 0)].join('\n');
          const inMm = ['substrate (mM),inhibitor (uM),rate', ...rowsIn(3, 3)].join('\n');
          const a = parseLoose(inUm)[0];
          const b = parseRateText(inMm, { source: 'b.csv', requireMechanismDesign: false, outputUnits: { substrate: 'uM', inhibitor: 'nM' } })[0];
          expect(b.units).toEqual(a.units);
          expect(b.points).toEqual(a.points);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('the matrix and the long layout of the same data give identical points', () => {
    fc.assert(
      fc.property(plateArbitrary(true), fc.constantFrom('columns' as const, 'blocks' as const), (plate, replicatesAs) => {
        const long = outcome(() => parseLoose(writeLong(longRows(plate)), 'l.csv'));
        const matrix = outcome(() => parseLoose(writeMatrix(plate, replicatesAs), 'm.csv'));
        if (long instanceof InputError || matrix instanceof InputError) {
          expect(long instanceof InputError && matrix instanceof InputError).toBe(true);
          return;
        }
        expect(matrix[0].layout).toBe('matrix');
        expect(sortedPoints(matrix[0])).toEqual(sortedPoints(long[0]));
        expect(matrix[0].rowsRead).toBe(long[0].rowsRead);
        expect(matrix[0].excluded.length).toBe(long[0].excluded.length);
      }),
      { numRuns: 150 },
    );
  });

  it('random bytes end in an InputError or in a fully accounted table', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 400 }), (bytes) => {
        expectAccountedFor(outcome(() => parseLoose(decodeRateBytes(bytes, 'r.bin'), 'r.bin')), 'r.bin');
      }),
      { numRuns: 300 },
    );
  });

  it('random text made of table-like pieces ends in an InputError or in a fully accounted table', () => {
    const piece = fc.constantFrom(',', ';', '\t', '\n', '\r\n', '"', '0', '1', '2.5', '3,5', '-1', 'e', 'x', ' ', 'yes', 'inf', 'NaN',
      'substrate', 'inhibitor', 'rate', 'exclude', 'compound', 'sd', ' (uM)', ' [nM]', '\\', 'substrate (uM) \\ inhibitor (nM)', '\u00b5', '\ufeff');
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 80 }), fc.boolean(), (pieces, strict) => {
        const text = pieces.join('');
        const run = () => parseRateText(text, { source: 't.csv', requireMechanismDesign: strict });
        expectAccountedFor(outcome(run), 't.csv');
      }),
      { numRuns: 400 },
    );
  });

  it('truncated files end in an InputError or in a fully accounted table', () => {
    fc.assert(
      fc.property(plateArbitrary(false), fc.constantFrom('long', 'columns', 'blocks'), fc.double({ min: 0, max: 1, noNaN: true }), (plate, form, cut) => {
        const text = form === 'long' ? writeLong(longRows(plate)) : writeMatrix(plate, form as 'columns' | 'blocks');
        const truncated = text.slice(0, Math.floor(cut * text.length));
        expectAccountedFor(outcome(() => parseRateText(truncated, { source: 'cut.csv' })), 'cut.csv');
      }),
      { numRuns: 200 },
    );
  });

  it('random cell corruption ends in an InputError or in listed exclusions', () => {
    const junk = fc.oneof(
      fc.string({ maxLength: 8 }),
      fc.string({ unit: 'binary', maxLength: 6 }),
      fc.constantFrom('', ' ', 'NaN', 'undefined', 'inf', '-Infinity', '1e999', '-1', '0', '-0', 'yes', 'n/a', '"', '"a', '1,5', '1.5.1', '\\', 'compound', 'rate'),
    );
    fc.assert(
      fc.property(
        plateArbitrary(false),
        fc.constantFrom('long', 'columns', 'blocks'),
        fc.array(fc.tuple(fc.nat(), fc.nat(), junk), { minLength: 1, maxLength: 4 }),
        (plate, form, corruptions) => {
          const text = form === 'long' ? writeLong(longRows(plate)) : writeMatrix(plate, form as 'columns' | 'blocks');
          const grid = text.split('\n').map((line) => line.split(','));
          for (const [r, c, value] of corruptions) {
            const row = grid[r % grid.length];
            row[c % row.length] = value;
          }
          const corrupted = grid.map((row) => row.join(',')).join('\n');
          const result = outcome(() => parseRateText(corrupted, { source: 'bad.csv' }));
          expectAccountedFor(result, 'bad.csv');
        },
      ),
      { numRuns: 300 },
    );
  });
});
