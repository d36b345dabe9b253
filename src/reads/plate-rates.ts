/**
 * From kinetic reads and a plate map to one initial rate per well: match wells to the map, find
 * saturated reads, subtract the blank, convert signal to product concentration, choose the
 * straight early window (or fit the integrated Michaelis-Menten equation), and flag what makes a
 * rate doubtful. Nothing is dropped silently: map wells without reads, reads without a map entry,
 * unusable reads and every flag are listed.
 */
import { InputError, type ConcentrationUnit } from '../input/types.js';
import { formatNumber, locate } from '../input/messages.js';
import type { Conversion, KineticReads, MapEntry, PlateMap, ReadExclusion, TimeUnit, WellCurve, WellFlag, WellRate } from './types.js';
import { chooseBlank } from './blank-correction.js';
import { chooseWindow } from './initial-window.js';
import { saturatedReads, shapeFlags } from './well-shape.js';
import { fitIntegratedCurve, productFormed } from './integrated-michaelis-menten.js';
import { conversionIn } from './conversion.js';
import { correctForDepletion } from './depletion-correction.js';
import { SECONDS_PER } from './time-values.js';
import { listWells, wellLabel } from './well-names.js';
import { FRACTION_DIGITS, INTEGRATED_MIN_USE, MIN_WINDOW_READS, NOISY_FACTOR, SUBSTRATE_USE_LIMIT } from './thresholds.js';

export interface RatesOptions {
  /** signal per unit of product, in any concentration unit (converted to the map's [S] unit) */
  conversion?: { signalPerUnit: number; givenUnit: ConcentrationUnit; description: string };
  /** detector ceiling in raw signal: reads at or above it are saturated */
  ceiling?: number;
  /** which rate to report: the straight early window (default) or v0 of the integrated fit */
  rateFrom?: 'window' | 'integrated';
  /** confidence level of the Km interval of the integrated fit (default 0.95) */
  level?: number;
  /** correct window rates for the substrate used in the window (default true; needs a conversion) */
  depletionCorrection?: boolean;
}

export interface BlankWell {
  plate: string;
  well: string;
  substrate: number | null;
  inhibitor: number | null;
  mapLine: number;
  reads: number;
}

export interface PlateRates {
  /** sample and excluded wells of the map that have reads, in map order (plate after plate) */
  wells: WellRate[];
  blanks: BlankWell[];
  units: { substrate: ConcentrationUnit | null; inhibitor: ConcentrationUnit | null; time: TimeUnit; rate: string };
  conversion: Conversion | null;
  rateFrom: 'window' | 'integrated';
  /** map wells (plate/well labels) with no reads, and the map line of each */
  mapWellsWithoutReads: { label: string; line: number; role: MapEntry['role']; compound: string; substrate: number | null; inhibitor: number | null }[];
  /** wells in the reads with no map entry */
  readsWithoutMap: { label: string; source: string }[];
  excludedReads: (ReadExclusion & { source: string })[];
  notes: string[];
  sources: { reads: string[]; map: string };
}

interface Instance {
  entry: MapEntry;
  plate: string;
  curve: WellCurve;
}

function roundFraction(x: number): number {
  return Number(x.toPrecision(FRACTION_DIGITS));
}

/** All reads files in one time unit (the first file's). */
function unifyTime(reads: readonly KineticReads[]): { unit: TimeUnit; curves: (WellCurve & { source: string })[] } {
  const unit = reads[0].timeUnit;
  const curves: (WellCurve & { source: string })[] = [];
  const seen = new Map<string, string>();
  for (const r of reads) {
    const factor = SECONDS_PER[r.timeUnit] / SECONDS_PER[unit];
    for (const c of r.curves) {
      const key = `${c.plate}\u0000${c.well}`;
      const other = seen.get(key);
      if (other !== undefined) {
        throw new InputError(
          `${locate(r.source, { line: c.lines[0] })}well ${wellLabel(c.plate, c.well)} also has reads in ${other}; name the plates (a plate column, or one plate per file)`,
          r.source, c.lines[0],
        );
      }
      seen.set(key, r.source);
      curves.push({ ...c, times: factor === 1 ? c.times : c.times.map((t) => t * factor), source: r.source });
    }
  }
  return { unit, curves };
}

export function ratesFromReads(reads: readonly KineticReads[], map: PlateMap, options: RatesOptions = {}): PlateRates {
  if (reads.length === 0) throw new InputError('no kinetic reads given', '');
  const { unit: timeUnit, curves } = unifyTime(reads);
  const notes = [...reads.flatMap((r) => r.notes), ...map.notes];
  const rateFrom = options.rateFrom ?? 'window';

  let conversion: Conversion | null = null;
  if (options.conversion) {
    if (map.units.substrate === null) {
      throw new InputError(`${locate(map.source, { line: 1 })}the substrate unit is not given in the plate map; write it in the header (e.g. "substrate (uM)") so that the conversion factor can be applied`, map.source, 1);
    }
    conversion = conversionIn(options.conversion, map.units.substrate);
  } else {
    notes.push('no --conversion given: rates are in signal per time; the substrate use in the window is not checked and the integrated Michaelis-Menten fit is not run');
  }
  if (rateFrom === 'integrated' && conversion === null) {
    throw new InputError('the integrated Michaelis-Menten fit needs product concentrations: give --conversion', '');
  }

  // match reads to the map
  const plates = [...new Set(curves.map((c) => c.plate))];
  const byKey = new Map(curves.map((c) => [`${c.plate}\u0000${c.well}`, c]));
  const matched = new Set<string>();
  const instances: Instance[] = [];
  const missing: PlateRates['mapWellsWithoutReads'] = [];
  const platesOfEntry = (e: MapEntry): string[] => (map.byPlate ? [e.plate] : plates);
  for (const plate of map.byPlate ? [''] : plates) {
    for (const entry of map.entries) {
      for (const p of map.byPlate ? platesOfEntry(entry) : [plate]) {
        const key = `${p}\u0000${entry.well}`;
        const curve = byKey.get(key);
        if (!curve) missing.push({ label: wellLabel(p, entry.well), line: entry.line, role: entry.role, compound: entry.compound, substrate: entry.substrate, inhibitor: entry.inhibitor });
        else {
          matched.add(key);
          instances.push({ entry, plate: p, curve });
        }
      }
    }
  }
  const readsWithoutMap = curves
    .filter((c) => !matched.has(`${c.plate}\u0000${c.well}`))
    .map((c) => ({ label: wellLabel(c.plate, c.well), source: c.source }));
  if (missing.length > 0) notes.push(`${map.source}: ${missing.length} plate-map ${missing.length === 1 ? 'well has' : 'wells have'} no reads: ${listWells(missing.map((m) => m.label))}`);
  if (readsWithoutMap.length > 0) notes.push(`${readsWithoutMap.length} ${readsWithoutMap.length === 1 ? 'well has' : 'wells have'} reads but no plate-map entry, and no rate: ${listWells(readsWithoutMap.map((r) => r.label))}`);

  const plateTop = new Map<string, number>();
  for (const c of curves) for (const s of c.signals) plateTop.set(c.plate, Math.max(plateTop.get(c.plate) ?? Number.NEGATIVE_INFINITY, s));

  const blanksByPlate = new Map<string, { entry: MapEntry; curve: WellCurve }[]>();
  const blankWells: BlankWell[] = [];
  for (const inst of instances) {
    if (inst.entry.role !== 'blank') continue;
    const list = blanksByPlate.get(inst.plate) ?? [];
    const drop = new Set(saturatedReads(inst.curve.signals, options.ceiling, plateTop.get(inst.plate)!));
    const curve = drop.size === 0 ? inst.curve : {
      ...inst.curve,
      times: inst.curve.times.filter((_, k) => !drop.has(k)),
      signals: inst.curve.signals.filter((_, k) => !drop.has(k)),
    };
    list.push({ entry: inst.entry, curve });
    blanksByPlate.set(inst.plate, list);
    blankWells.push({ plate: inst.plate, well: inst.entry.well, substrate: inst.entry.substrate, inhibitor: inst.entry.inhibitor, mapLine: inst.entry.line, reads: curve.times.length });
    if (drop.size > 0) notes.push(`blank well ${wellLabel(inst.plate, inst.entry.well)}: ${drop.size} saturated reads left out of the background`);
  }

  const wells = instances
    .filter((inst) => inst.entry.role !== 'blank')
    .map((inst) => wellRate(inst, blanksByPlate.get(inst.plate) ?? [], conversion, timeUnit, plateTop.get(inst.plate)!, options, rateFrom));
  flagNoisyWells(wells);
  if (conversion !== null && options.depletionCorrection !== false) notes.push(...correctForDepletion(wells));
  for (const w of wells) w.excludeReason = excludeReasonOf(w);

  const excludedReads = reads.flatMap((r) => r.excluded.map((e) => ({ ...e, source: r.source })));
  const rateUnit = `${conversion ? conversion.unit : reads[0].signalUnit ?? 'signal'}/${timeUnit}`;
  return {
    wells,
    blanks: blankWells,
    units: { substrate: map.units.substrate, inhibitor: map.units.inhibitor, time: timeUnit, rate: rateUnit },
    conversion,
    rateFrom,
    mapWellsWithoutReads: missing,
    readsWithoutMap,
    excludedReads,
    notes,
    sources: { reads: reads.map((r) => r.source), map: map.source },
  };
}

function wellRate(
  inst: Instance,
  blanks: readonly { entry: MapEntry; curve: WellCurve }[],
  conversion: Conversion | null,
  timeUnit: TimeUnit,
  plateTop: number,
  options: RatesOptions,
  rateFrom: 'window' | 'integrated',
): WellRate {
  const { entry, curve, plate } = inst;
  const flags: WellFlag[] = [];
  const drop = new Set(saturatedReads(curve.signals, options.ceiling, plateTop));
  const keep = curve.times.map((_, k) => k).filter((k) => !drop.has(k));
  const times = keep.map((k) => curve.times[k]);
  const blank = chooseBlank(entry, curve.times, blanks);
  const corrected = curve.signals.map((s, k) => s - (blank.background ? blank.background[k] : 0));
  const scale = conversion ? conversion.signalPerUnit : 1;
  const valueOf = (k: number): number => corrected[k] / scale;
  const values = keep.map(valueOf);
  const droppedTimes = [...drop].map((k) => curve.times[k]);
  const droppedValues = [...drop].map(valueOf);
  if (drop.size > 0) {
    const top = curve.signals[[...drop][0]];
    flags.push({ code: 'saturated', message: `detector saturation: ${drop.size} reads at the top of the signal (${formatNumber(top)}) from ${formatNumber(droppedTimes[0])} ${timeUnit}; they are left out` });
  }
  const substrate = entry.substrate;
  const base: WellRate = {
    plate, well: entry.well, compound: entry.compound, substrate, inhibitor: entry.inhibitor, role: entry.role, mapLine: entry.line,
    rate: null, se: null, method: null, window: null, fractionUsed: null, integrated: null, integratedNote: null, depletion: null,
    flags, blank: blank.description, times, values, droppedTimes, droppedValues, excludeReason: null,
  };
  if (times.length < MIN_WINDOW_READS) {
    flags.push({ code: 'few-reads', message: `too few reads: ${times.length} usable, at least ${MIN_WINDOW_READS} are needed for a rate and its curvature test` });
    return base;
  }
  const hasS = conversion !== null && substrate !== null && substrate > 0;
  const window = hasS ? windowWithinLimit(times, values, substrate!) : chooseWindow(times, values);
  base.window = window;
  base.rate = window.slope;
  base.se = window.se;
  base.method = 'window';
  if (window.forced) {
    flags.push({ code: 'curved-start', message: `no straight start: even the first ${MIN_WINDOW_READS} reads curve (p = ${formatNumber(window.curvatureP)}); the rate from them is likely off` });
  }
  if (hasS) {
    base.fractionUsed = roundFraction((window.slope * window.to) / substrate!);
  }
  flags.push(...shapeFlags(times, values, window.slope, window.intercept, hasS ? substrate : null, timeUnit));

  if (hasS && !flags.some((f) => f.code === 'lag' || f.code === 'burst')) {
    const usedByEnd = (values[values.length - 1] - window.intercept) / substrate!;
    if (rateFrom !== 'integrated') {
      // the integrated fit is run only when asked for (it costs about 1 ms per well)
    } else if (usedByEnd >= INTEGRATED_MIN_USE) {
      const fit = fitIntegratedCurve(times, values, substrate!, window.slope, options.level ?? 0.95);
      if (fit && fit.converged && Number.isFinite(fit.se.v0)) {
        const usedFit = productFormed(times[times.length - 1], fit.vmax, fit.km, substrate!) / substrate!;
        if (usedFit >= INTEGRATED_MIN_USE) base.integrated = fit;
        else base.integratedNote = `the curve uses only ${formatNumber(100 * usedFit)}% of the substrate; the integrated fit needs ${100 * INTEGRATED_MIN_USE}% to determine Km`;
      } else base.integratedNote = 'the integrated Michaelis-Menten fit did not converge';
    } else base.integratedNote = `the curve uses under ${100 * INTEGRATED_MIN_USE}% of the substrate; the integrated fit needs more to determine Km`;
  } else if (hasS && rateFrom === 'integrated') base.integratedNote = 'not fitted: the curve has a lag or a burst, which the integrated Michaelis-Menten equation does not describe';

  if (rateFrom === 'integrated' && base.integrated) {
    base.rate = base.integrated.v0;
    base.se = base.integrated.se.v0;
    base.method = 'integrated';
  } else if (rateFrom === 'integrated' && base.integratedNote) {
    base.integratedNote += '; the rate is from the straight early window';
  }
  if (base.method === 'window' && base.fractionUsed !== null && base.fractionUsed > SUBSTRATE_USE_LIMIT) {
    flags.push({
      code: 'substrate-use',
      message: `${formatNumber(100 * base.fractionUsed)}% of the substrate is used by the end of the window (${formatNumber(window.to)} ${timeUnit}), more than ${100 * SUBSTRATE_USE_LIMIT}%: the rate is below the initial rate`,
    });
  }
  return base;
}

/**
 * The straight early window kept within SUBSTRATE_USE_LIMIT: the longest straight start is
 * chosen, and while the substrate used by its end (slope x end time / [S]0) is over the limit, the
 * window is cut at the last read that the limit allows by that slope and chosen again. The slope
 * of the longer window is the better determined one, so the cut does not chase noise in the first
 * few reads. Never shorter than MIN_WINDOW_READS.
 */
function windowWithinLimit(times: readonly number[], values: readonly number[], substrate: number) {
  let window = chooseWindow(times, values);
  for (let step = 0; step < 20; step++) {
    const slope = Math.abs(window.slope);
    if (roundFraction((slope * window.to) / substrate) <= SUBSTRATE_USE_LIMIT || window.reads <= MIN_WINDOW_READS) break;
    let k = 0;
    while (k < window.reads && roundFraction((slope * times[k]) / substrate) <= SUBSTRATE_USE_LIMIT) k++;
    k = Math.max(MIN_WINDOW_READS, Math.min(k, window.reads - 1));
    window = chooseWindow(times, values, k);
  }
  return window;
}

/** Wells whose scatter about their line is above NOISY_FACTOR x the plate's median scatter. */
function flagNoisyWells(wells: WellRate[]): void {
  const byPlate = new Map<string, WellRate[]>();
  for (const w of wells) if (w.window && Number.isFinite(w.window.residualSd)) byPlate.set(w.plate, [...(byPlate.get(w.plate) ?? []), w]);
  for (const list of byPlate.values()) {
    if (list.length < 3) continue;
    const sds = list.map((w) => w.window!.residualSd).sort((a, b) => a - b);
    const mid = sds.length >> 1;
    const median = sds.length % 2 ? sds[mid] : (sds[mid - 1] + sds[mid]) / 2;
    if (!(median > 0)) continue;
    for (const w of list) {
      const ratio = w.window!.residualSd / median;
      if (ratio > NOISY_FACTOR) {
        w.flags.push({ code: 'noisy', message: `noisy: the scatter about the line is ${formatNumber(ratio)} times the plate's median (more than ${NOISY_FACTOR})` });
      }
    }
  }
}

function excludeReasonOf(w: WellRate): string | null {
  const reasons: string[] = [];
  if (w.role === 'exclude') reasons.push(`excluded in the plate map (line ${w.mapLine})`);
  reasons.push(...w.flags.map((f) => f.message));
  return reasons.length > 0 ? reasons.join('; ') : null;
}
