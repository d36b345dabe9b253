/**
 * From signal to concentration of product.
 *
 * - A factor: `--conversion 6.22/mM` (signal per mM of product), or by the Beer-Lambert law
 *   A = epsilon l c, an extinction coefficient per cm with the path length:
 *   `--conversion 6220/M/cm --path-length 0.5` gives 3110 per M. A negative factor means the signal
 *   falls as product forms (e.g. a cofactor that is used up).
 * - A standard curve: a file of known concentrations and their signals
 *   (`concentration (uM),signal`), fitted by ordinary least squares; the slope is the factor. The
 *   fit is checked for linearity by the t test of an added quadratic term (Draper & Smith (1998)
 *   Applied Regression Analysis, 3rd ed., ch. 12, lack of fit by a higher-order term).
 */
import { tCdf } from '../stats/distributions.js';
import { InputError, type ConcentrationUnit } from '../input/types.js';
import { formatNumber, locate, quoteText } from '../input/messages.js';
import { parseConcentrationUnit, unitShift } from '../input/units.js';
import { splitHeaderName } from '../input/header.js';
import { readNumberCell } from '../input/numbers.js';
import type { Conversion } from './types.js';
import { readTextFile } from '../input/read-text-file.js';
import { tokenizeTable } from './read-kinetic-reads.js';
import { CURVATURE_P } from './thresholds.js';

/** Least-squares straight line with its slope SE, and the p value of an added quadratic term. */
export interface StandardCurveFit {
  slope: number;
  intercept: number;
  slopeSe: number;
  rSquared: number;
  /** p value of the quadratic term (null with fewer than 4 distinct concentrations) */
  curvatureP: number | null;
  points: number;
  unit: ConcentrationUnit;
}

const FACTOR = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(?:per\s+|\/\s*)([^/\s]+)\s*(\/\s*cm)?\s*$/;

/** Reads `6.22/mM`, `6.22 per mM` or `6220/M/cm` (the last needs `pathLengthCm`). */
export function parseConversionFactor(text: string, pathLengthCm?: number): Omit<Conversion, 'unit'> & { givenUnit: ConcentrationUnit } {
  const match = FACTOR.exec(text);
  if (!match) {
    throw new InputError(
      `option --conversion: ${quoteText(text)} is neither a factor (e.g. 6.22/mM, or 6220/M/cm with --path-length) nor a standard-curve file that exists`,
      '',
    );
  }
  const value = Number(match[1]);
  if (!Number.isFinite(value) || value === 0) throw new InputError(`option --conversion: the factor must be a non-zero number`, '');
  const givenUnit = parseConcentrationUnit(match[2]);
  if (match[3] !== undefined) {
    if (pathLengthCm === undefined) {
      throw new InputError(`option --conversion: ${quoteText(text)} is per cm (an extinction coefficient); give the path length with --path-length CM`, '');
    }
    return {
      signalPerUnit: value * pathLengthCm,
      givenUnit,
      description: `Beer-Lambert law: ${formatNumber(value)} per ${givenUnit} per cm x ${formatNumber(pathLengthCm)} cm = ${formatNumber(value * pathLengthCm)} signal per ${givenUnit}`,
    };
  }
  if (pathLengthCm !== undefined) throw new InputError(`option --path-length: only used with a factor per cm (e.g. 6220/M/cm)`, '');
  return { signalPerUnit: value, givenUnit, description: `${formatNumber(value)} signal per ${givenUnit} of product` };
}

/** The conversion expressed per unit `target` (the substrate unit of the plate map). */
export function conversionIn(factor: { signalPerUnit: number; givenUnit: ConcentrationUnit; description: string }, target: ConcentrationUnit): Conversion {
  // signal per target = signal per given x (given per target) = x 10^(shift target -> given)
  const perTarget = factor.signalPerUnit * 10 ** unitShift(target, factor.givenUnit);
  const note = factor.givenUnit === target ? '' : ` (${formatNumber(perTarget)} per ${target})`;
  return { signalPerUnit: perTarget, unit: target, description: factor.description + note };
}

/** Fits a standard curve (concentration, signal) read from text. */
export function fitStandardCurve(text: string, source: string): StandardCurveFit {
  const table = tokenizeTable(text, source, 'expected a standard curve: concentration (unit),signal');
  const { row: header, rows, decimalMark } = table;
  let cIndex = -1;
  let sIndex = -1;
  let unit: ConcentrationUnit | null = null;
  header.cells.forEach((cell, k) => {
    const { key, unit: u } = splitHeaderName(cell);
    if (key === 'concentration') {
      cIndex = k;
      if (u !== null) unit = parseConcentrationUnit(u, { source, line: header.line, column: k + 1 });
    } else if (key === 'signal') sIndex = k;
  });
  if (cIndex < 0 || sIndex < 0) {
    throw new InputError(`${locate(source, { line: header.line })}a standard curve needs columns "concentration (unit)" and "signal"`, source, header.line);
  }
  if (unit === null) {
    throw new InputError(`${locate(source, { line: header.line, column: cIndex + 1 })}the concentration unit is not given; write it in the header, e.g. "concentration (uM)"`, source, header.line, cIndex + 1);
  }
  const x: number[] = [];
  const y: number[] = [];
  for (const row of rows) {
    for (const [k, out] of [[cIndex, x], [sIndex, y]] as const) {
      const value = readNumberCell(row.cells[k] ?? '', decimalMark);
      if (typeof value !== 'number') {
        throw new InputError(`${locate(source, { line: row.line, column: k + 1 })}${quoteText((row.cells[k] ?? '').trim())} is not a number; every standard needs a concentration and a signal`, source, row.line, k + 1);
      }
      out.push(value);
    }
  }
  const distinct = new Set(x).size;
  if (distinct < 3) {
    throw new InputError(`${locate(source)}a standard curve needs at least 3 different concentrations to check that it is straight; it has ${distinct}`, source);
  }
  const fit = lineFit(x, y);
  let curvatureP: number | null = null;
  if (distinct >= 4) curvatureP = quadraticTermP(x, y);
  if (curvatureP !== null && curvatureP < CURVATURE_P) {
    throw new InputError(
      `${locate(source)}the standard curve is not straight (quadratic term p = ${formatNumber(curvatureP)} < ${CURVATURE_P}); use only its linear range`,
      source,
    );
  }
  return { ...fit, curvatureP, points: x.length, unit };
}

export async function readStandardCurve(path: string): Promise<StandardCurveFit> {
  return fitStandardCurve(await readTextFile(path), path);
}

export function standardCurveConversion(fit: StandardCurveFit, source: string): { signalPerUnit: number; givenUnit: ConcentrationUnit; description: string } {
  const p = fit.curvatureP === null ? 'not tested (fewer than 4 concentrations)' : `p = ${formatNumber(fit.curvatureP)}`;
  return {
    signalPerUnit: fit.slope,
    givenUnit: fit.unit,
    description: `standard curve ${source}: slope ${formatNumber(fit.slope)} (SE ${formatNumber(fit.slopeSe)}) signal per ${fit.unit}, ${fit.points} standards, R^2 ${formatNumber(fit.rSquared)}, curvature ${p}`,
  };
}

function lineFit(x: number[], y: number[]): { slope: number; intercept: number; slopeSe: number; rSquared: number } {
  const n = x.length;
  const mx = x.reduce((a, b) => a + b, 0) / n;
  const my = y.reduce((a, b) => a + b, 0) / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (x[i] - mx) ** 2;
    sxy += (x[i] - mx) * (y[i] - my);
    syy += (y[i] - my) ** 2;
  }
  const slope = sxy / sxx;
  const sse = Math.max(0, syy - slope * sxy);
  return { slope, intercept: my - slope * mx, slopeSe: n > 2 ? Math.sqrt(sse / (n - 2) / sxx) : Number.NaN, rSquared: syy > 0 ? 1 - sse / syy : 1 };
}

/** Two-sided p value of the quadratic coefficient in y = a + b x + c x^2 (orthogonal polynomials). */
function quadraticTermP(x: readonly number[], y: readonly number[]): number {
  const q = quadraticFit(x, y, x.length);
  return q.p;
}

/**
 * Least squares y = a + b u + c u^2 on the first `n` points, in an orthogonal basis (centred
 * linear term, quadratic term orthogonalised against it), so nothing cancels badly. Returns the
 * coefficient of the squared term in the original x scale, its t statistic's two-sided p value,
 * and the slope of the quadratic at given x values via `slopeAt`.
 */
export function quadraticFit(x: readonly number[], y: readonly number[], n: number): { c: number; seC: number; p: number; slopeAt: (t: number) => number; sse: number } {
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i];
    my += y[i];
  }
  mx /= n;
  my /= n;
  let s11 = 0;
  let s1y = 0;
  let s12 = 0;
  let s2sum = 0;
  for (let i = 0; i < n; i++) {
    const d = x[i] - mx;
    s11 += d * d;
    s1y += d * (y[i] - my);
    s12 += d * d * d;
    s2sum += d * d;
  }
  const mean2 = s2sum / n;
  const g = s12 / s11; // projection of (d^2 - mean2) on d
  let s22 = 0;
  let s2y = 0;
  for (let i = 0; i < n; i++) {
    const d = x[i] - mx;
    const q2 = d * d - mean2 - g * d;
    s22 += q2 * q2;
    s2y += q2 * (y[i] - my);
  }
  const b1 = s1y / s11;
  const c = s22 > 0 ? s2y / s22 : 0;
  let sse = 0;
  for (let i = 0; i < n; i++) {
    const d = x[i] - mx;
    const r = y[i] - my - b1 * d - c * (d * d - mean2 - g * d);
    sse += r * r;
  }
  const df = n - 3;
  let p = 1;
  let seC = Number.NaN;
  if (df > 0 && s22 > 0) {
    seC = Math.sqrt(sse / df / s22);
    const t = Math.abs(c) / seC;
    p = seC > 0 ? 2 * tCdf(-t, df) : c === 0 ? 1 : 0;
    if (!Number.isFinite(p)) p = 0;
  }
  // y = my + (b1 - c g) d + c (d^2 - mean2): slope at x is b1 - c g + 2 c (x - mx)
  return { c, seC, p, sse, slopeAt: (t: number) => b1 - c * g + 2 * c * (t - mx) };
}
