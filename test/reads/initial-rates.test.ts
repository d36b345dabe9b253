/**
 * The science of the reads stage on simulated progress curves with a known truth: initial rates
 * from the straight early window, the integrated Michaelis-Menten fit, the 10% rule and the flags.
 * Curves come from the integrated Michaelis-Menten equation in its Lambert W form (Schnell &
 * Mendoza 1997), evaluated by src/reads/integrated-michaelis-menten.ts, which
 * test/reads/lambert-w.test.ts checks against scipy (test/fixtures/lambertw/runner.py).
 * Invented enzymes and numbers (simulation only).
 */
import { describe, expect, it } from 'vitest';
import {
  conversionIn,
  fitStandardCurve,
  parseConversionFactor,
  parseKineticReads,
  parsePlateMap,
  ratesFromReads,
  readThresholds,
  type WellRate,
} from '../../src/reads/index.js';
import { simulatePlate } from '../../src/simulate/simulate-plate.js';
import { InputError } from '../../src/input/types.js';

const PER_UM = { signalPerUnit: 1, givenUnit: 'uM' as const, description: '1 per uM' };

function ratesOf(readsCsv: string, mapCsv: string, options: Parameters<typeof ratesFromReads>[2] = { conversion: PER_UM }) {
  return ratesFromReads([parseKineticReads(readsCsv, { source: 'r.csv' })], parsePlateMap(mapCsv, 'm.csv'), options);
}

/** A wide reads file from functions of time (one per well). */
function readsFrom(times: number[], wells: Record<string, (t: number) => number>): string {
  const names = Object.keys(wells);
  return [`time (s),${names.join(',')}`, ...times.map((t) => [t, ...names.map((w) => wells[w](t))].join(','))].join('\n') + '\n';
}

const codes = (w: WellRate) => w.flags.map((f) => f.code);

describe('initial rate from the straight early window (simulated Michaelis-Menten progress curves)', () => {
  // Km 50 uM, Vmax 0.5 uM/s, reads every 10 s for 10 min; 1 signal unit per uM, noise SD 0.05 uM
  const times = Array.from({ length: 61 }, (_, k) => 10 * k);
  const design = { mechanism: 'none' as const, params: { Vmax: 0.5, Km: 50 }, inhibitor: [0], replicates: 4, times, signalPerUnit: 1, noiseSd: 0.05, drift: 0.001 };

  it('v0 within 2% of the truth when under 10% of the substrate is used in the window, [S]0 from Km/10 to 10 Km (20 seeds)', () => {
    let checked = 0;
    let worst = 0;
    for (let seed = 1; seed <= 20; seed++) {
      // read noise 0.001 uM, so that the check is of the method (window, depletion correction) and
      // not of the noise (SE under 0.5%); the next tests cover the noise
      const plate = simulatePlate({ ...design, params: { Vmax: 0.05, Km: 50 }, substrate: [5, 10, 25, 50, 100, 250, 500], seed, noiseSd: 0.001 });
      const result = ratesOf(plate.readsCsv, plate.mapCsv);
      for (const w of result.wells) {
        const truth = plate.wells.find((x) => x.well === w.well)!.v0;
        expect(w.fractionUsed!).toBeGreaterThan(0);
        if (w.fractionUsed! > readThresholds.SUBSTRATE_USE_LIMIT) continue;
        checked++;
        worst = Math.max(worst, Math.abs(w.rate! - truth) / truth);
      }
    }
    expect(checked).toBeGreaterThanOrEqual(500); // of 560 wells
    expect(worst).toBeLessThan(0.02);
  });

  it('without the depletion correction the line lies under v0 by up to (f/2) Km/(Km + S0), most at low [S]', () => {
    let worstLow = 0;
    for (let seed = 1; seed <= 10; seed++) {
      const plate = simulatePlate({ ...design, params: { Vmax: 0.05, Km: 50 }, substrate: [5, 10, 25], seed, noiseSd: 0.005 });
      const result = ratesOf(plate.readsCsv, plate.mapCsv, { conversion: PER_UM, depletionCorrection: false });
      for (const w of result.wells) {
        const truth = plate.wells.find((x) => x.well === w.well)!.v0;
        const f = w.fractionUsed!;
        const chordBias = f * (50 / (50 + w.substrate!)); // the slowing of the rate over the window
        expect(truth - w.rate!).toBeLessThan(chordBias * truth + 3 * w.se!);
        if (w.substrate === 5 && f <= 0.1) worstLow = Math.max(worstLow, (truth - w.rate!) / truth);
      }
    }
    expect(worstLow).toBeGreaterThan(0.03); // the bias the correction removes
  });

  it('the standard error of the rate is honest: |error| < 2 SE in about 95% of wells', () => {
    let inside = 0;
    let total = 0;
    for (let seed = 21; seed <= 40; seed++) {
      const plate = simulatePlate({ ...design, substrate: [250, 500], seed, noiseSd: 0.5 });
      const result = ratesOf(plate.readsCsv, plate.mapCsv);
      for (const w of result.wells) {
        const truth = plate.wells.find((x) => x.well === w.well)!.v0;
        total++;
        if (Math.abs(w.rate! - truth) < 2 * w.se!) inside++;
      }
    }
    // 160 wells; under a true 95% rate, fewer than 142 happens with probability under 1%
    expect(inside / total).toBeGreaterThanOrEqual(142 / 160);
  });

  it('blank wells at the same [S] remove the drift, and the choice is stated', () => {
    const plate = simulatePlate({ ...design, substrate: [250], seed: 5, noiseSd: 0, drift: 0.02 });
    const result = ratesOf(plate.readsCsv, plate.mapCsv);
    expect(result.wells[0].blank).toMatch(/^minus the mean of blank wells A5, A6 \(same \[S\], \[I\] not given\)$/);
    const truth = plate.wells[0].v0;
    expect(Math.abs(result.wells[0].rate! - truth) / truth).toBeLessThan(0.01);
  });
});

describe('integrated Michaelis-Menten fit (Goudar, Sonnad & Duggleby 1999)', () => {
  it('recovers Km within its interval (95%) in at least 34 of 40 curves, and v0 = Vmax S0/(Km + S0) within 2%', () => {
    const times = Array.from({ length: 60 }, (_, k) => 20 * k);
    let covered = 0;
    let total = 0;
    for (let seed = 1; seed <= 10; seed++) {
      const plate = simulatePlate({ mechanism: 'none', params: { Vmax: 0.2, Km: 40 }, substrate: [20, 40, 80, 160], inhibitor: [0], replicates: 1, times, signalPerUnit: 1, noiseSd: 0.05, seed, blanksPerSubstrate: 1 });
      const result = ratesOf(plate.readsCsv, plate.mapCsv, { conversion: PER_UM, rateFrom: 'integrated' });
      for (const w of result.wells) {
        expect(w.method).toBe('integrated');
        const fit = w.integrated!;
        total++;
        if (fit.kmInterval[0] <= 40 && 40 <= fit.kmInterval[1]) covered++;
        const truth = plate.wells.find((x) => x.well === w.well)!.v0;
        expect(Math.abs(w.rate! - truth) / truth).toBeLessThan(0.02);
      }
    }
    // binomial(40, 0.95): P(covered < 34) < 1%
    expect(total).toBe(40);
    expect(covered).toBeGreaterThanOrEqual(34);
  });
  it('is not used when the curve uses too little substrate to determine Km; the window rate stays, with the reason', () => {
    const times = Array.from({ length: 30 }, (_, k) => 10 * k);
    const plate = simulatePlate({ mechanism: 'none', params: { Vmax: 0.01, Km: 40 }, substrate: [500], inhibitor: [0], replicates: 1, times, signalPerUnit: 1, noiseSd: 0.01, seed: 3, blanksPerSubstrate: 1 });
    const [w] = ratesOf(plate.readsCsv, plate.mapCsv, { conversion: PER_UM, rateFrom: 'integrated' }).wells;
    expect(w.method).toBe('window');
    expect(w.integratedNote).toMatch(/under 20% of the substrate.*straight early window/);
  });
});

describe('the 10% rule, at its threshold (common practice)', () => {
  const times = [0, 10, 20, 30, 40]; // exactly MIN_WINDOW_READS reads: the window cannot be shortened
  const straight = (t: number) => 0.25 * t; // 0.25 uM/s: 10 uM by 40 s
  it('exactly 10% used is not flagged; a hair more is', () => {
    const reads = readsFrom(times, { A1: straight, A2: straight });
    const result = ratesOf(reads, 'well,substrate (uM),inhibitor (uM)\nA1,100,0\nA2,99.999,0\n');
    const [exact, over] = result.wells;
    expect(exact.fractionUsed).toBe(0.1);
    expect(codes(exact)).toEqual([]);
    expect(codes(over)).toEqual(['substrate-use']);
    expect(over.flags[0].message).toMatch(/^10% of the substrate is used by the end of the window \(40 s\), more than 10%/);
    expect(over.excludeReason).toContain('more than 10%');
  });
  it('a longer straight curve: the window stops at the last read within 10%, and is not flagged', () => {
    const long = Array.from({ length: 20 }, (_, k) => 10 * k);
    const result = ratesOf(readsFrom(long, { A1: straight }), 'well,substrate (uM),inhibitor (uM)\nA1,200,0\n');
    const w = result.wells[0];
    expect(w.window!.to).toBe(80); // 0.25 x 80 / 200 = 10%
    expect(w.fractionUsed).toBe(0.1);
    expect(codes(w)).toEqual([]);
    expect(w.rate).toBeCloseTo(0.25, 12);
  });
});

describe('flags, each with the well and the reason', () => {
  const times = Array.from({ length: 40 }, (_, k) => 15 * k);
  const map = 'well,substrate (uM),inhibitor (uM)\n' + ['A1', 'A2', 'A3', 'A4', 'A5', 'A6', 'A7', 'A8'].map((w) => `${w},1000,0`).join('\n') + '\n';
  const jitter = (k: number) => 0.02 * Math.sin(7.3 * k + 1.1); // fixed small scatter (uM)
  const noisyLine = (slope: number, scale = 1) => (t: number) => slope * t + scale * jitter(t / 15);
  it('lag, burst, saturation, noisy; ordinary straight wells are not flagged', () => {
    const reads = readsFrom(times, {
      A1: noisyLine(0.1),
      A2: noisyLine(0.1),
      A3: noisyLine(0.12),
      A4: (t) => 0.1 * t * (t / (t + 150)) + jitter(t / 15), // lag: the rate rises towards 0.1
      A5: (t) => 8 * (1 - Math.exp(-t / 40)) + 0.02 * t + jitter(t / 15), // burst, with little substrate used
      A6: (t) => Math.min(0.2 * t, 80) + jitter(t / 15) * (0.2 * t < 80 ? 1 : 0), // clipped at the top of the plate's signal
      A7: noisyLine(0.1, 20), // 20 x the scatter
      A8: noisyLine(0.09),
    });
    const result = ratesOf(reads, map, { conversion: PER_UM });
    const by = Object.fromEntries(result.wells.map((w) => [w.well, w]));
    for (const ok of ['A1', 'A2', 'A3', 'A8']) expect(codes(by[ok]), ok).toEqual([]);
    expect(codes(by.A4)).toContain('lag');
    expect(codes(by.A5)).toContain('burst');
    expect(codes(by.A6)).toContain('saturated');
    expect(by.A6.droppedTimes.length).toBeGreaterThanOrEqual(3);
    expect(by.A6.rate).toBeCloseTo(0.2, 3);
    expect(codes(by.A7)).toContain('noisy');
    expect(by.A4.excludeReason).toContain('lag: the rate rises');
  });
  it('too few reads: no rate, and the well is listed as excluded', () => {
    const result = ratesOf(readsFrom([0, 10, 20], { A1: (t) => t }), 'well,substrate (uM),inhibitor (uM)\nA1,100,0\n');
    expect(result.wells[0].rate).toBeNull();
    expect(codes(result.wells[0])).toEqual(['few-reads']);
  });
  it('a detector ceiling given as an option', () => {
    const result = ratesOf(readsFrom(times, { A1: (t) => 0.1 * t }), 'well,substrate (uM),inhibitor (uM)\nA1,1000,0\n', { conversion: PER_UM, ceiling: 30 });
    expect(codes(result.wells[0])).toEqual(['saturated']);
    expect(result.wells[0].values.at(-1)).toBeLessThan(30);
    expect(result.wells[0].rate).toBeCloseTo(0.1, 10);
  });
});

describe('signal to concentration', () => {
  it('Beer-Lambert: 6220 per M per cm over 0.5 cm is 3110 per M, 0.00311 per uM (NADH at 340 nm, from memory)', () => {
    const c = conversionIn(parseConversionFactor('6220/M/cm', 0.5), 'uM');
    expect(c.signalPerUnit).toBeCloseTo(0.00311, 15);
    expect(() => parseConversionFactor('6220/M/cm')).toThrow(/path length/);
    expect(() => parseConversionFactor('abc')).toThrow(InputError);
  });
  it('a standard curve is fitted by least squares and refused when it bends', () => {
    const fit = fitStandardCurve('concentration (uM),signal\n0,0.01\n10,0.07\n20,0.13\n40,0.25\n80,0.49\n', 'std.csv');
    expect(fit.slope).toBeCloseTo(0.006, 12);
    expect(fit.intercept).toBeCloseTo(0.01, 12);
    expect(fit.unit).toBe('uM');
    expect(() => fitStandardCurve('concentration (uM),signal\n0,0\n10,0.1\n20,0.19\n40,0.33\n80,0.5\n', 'std.csv')).toThrow(/^std\.csv: the standard curve is not straight/);
    expect(() => fitStandardCurve('concentration,signal\n0,0\n', 'std.csv')).toThrow(/^std\.csv:1:1: the concentration unit is not given/);
  });
  it('a falling signal (negative factor) gives positive rates', () => {
    const reads = readsFrom([0, 10, 20, 30, 40, 50], { A1: (t) => 1 - 0.00622 * 0.2 * t });
    const result = ratesOf(reads, 'well,substrate (uM),inhibitor (uM)\nA1,100,0\n', { conversion: { signalPerUnit: -0.00622, givenUnit: 'uM', description: '' } });
    expect(result.wells[0].rate).toBeCloseTo(0.2, 10);
  });
});
