/** `mechanist plan`: the [S] x [I] design that most likely decides, checked through the analysis. */
import { resolve } from 'node:path';
import { MECHANISMS } from '../../models/index.js';
import type { Mechanism } from '../../models/types.js';
import type { ConcentrationUnit } from '../../input/types.js';
import { parseConcentrationRange, parseUnitConcentration } from '../../plan/concentration-text.js';
import { concentrationIn as inUnit } from '../../input/units.js';
import { planExperiment, type PlanRequest } from '../../plan/plan-experiment.js';
import type { DilutionScheme } from '../../plan/candidate-designs.js';
import type { PlanPrior } from '../../plan/plan-prior.js';
import { planJson } from '../../plan/plan-json.js';
import { planText } from '../../plan/plan-text.js';
import { plateMapCsv } from '../../plan/plate-map.js';
import { writeFileAtomic, writeFolderAtomic } from '../../report/write-atomic.js';
import { checkOutputFolder, checkReplaceableReportFolder } from '../../report/output-folder.js';
import { UsageError } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { integerOption, numberList, numberOption, positiveNumber } from '../parse-option-values.js';
import { cliProgressBar } from '../progress-bar.js';
import { readFile } from 'node:fs/promises';
import { readRateFile } from '../../input/index.js';
import { analyzeTable } from '../../analysis/analyze-table.js';
import type { AnalysisResult } from '../../analysis/types.js';
import type { RateTable } from '../../input/types.js';
import { followUpBasis, summaryFromJson, summaryFromResult, type FollowUpBasis } from '../../plan/follow-up.js';
import { chooseTables } from './analyze-action.js';
import { wellsCurve } from '../../plan/wells-curve.js';
import { type PlanCliOptions } from './plan-options.js';

function usage<T>(option: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof UsageError) throw e;
    throw new UsageError(`option ${option}: ${e instanceof Error ? e.message : String(e)}`);
  }
}

function concentrationIn(option: string, text: string, unit: ConcentrationUnit): number {
  return usage(option, () => inUnit(parseUnitConcentration(text), unit));
}

function mechanismsOption(text: string | undefined): Mechanism[] {
  if (text === undefined) return MECHANISMS.map((m) => m.mechanism);
  const names = text.split(',').map((s) => s.trim()).filter(Boolean);
  const known = MECHANISMS.map((m) => m.mechanism) as string[];
  for (const n of names) if (!known.includes(n)) throw new UsageError(`option --mechanisms: "${n}" is not one of ${known.join(', ')}`);
  if (!names.some((n) => n !== 'none')) throw new UsageError('option --mechanisms: name at least one inhibited mechanism');
  return known.filter((k) => names.includes(k)) as Mechanism[];
}

function noiseOption(text: string): PlanRequest['noise'] {
  const m = /^(constant|proportional):(.+)$/.exec(text.trim());
  if (!m) throw new UsageError(`option --noise: "${text}" is not constant:SD or proportional:CV (for example proportional:0.05)`);
  return { model: m[1] as 'constant' | 'proportional', level: positiveNumber('--noise', m[2]) };
}

function dilutionOption(o: PlanCliOptions): DilutionScheme {
  const t = o.dilution.trim();
  if (o.substrateLevels || o.inhibitorLevels) {
    if (t !== 'free' && t !== 'list') throw new UsageError('options --substrate-levels/--inhibitor-levels go with --dilution list');
    return {
      kind: 'list',
      ...(o.substrateLevels ? { substrate: numberList('--substrate-levels', o.substrateLevels).filter((x) => x > 0) } : {}),
      ...(o.inhibitorLevels ? { inhibitor: numberList('--inhibitor-levels', o.inhibitorLevels).filter((x) => x > 0) } : {}),
    };
  }
  if (t === 'free') return { kind: 'free' };
  if (t === 'list') throw new UsageError('option --dilution list needs --substrate-levels and/or --inhibitor-levels');
  const m = /^serial:(.+)$/.exec(t);
  if (!m) throw new UsageError(`option --dilution: "${t}" is not free, serial:FOLD or list`);
  return { kind: 'serial', fold: numberOption('--dilution', m[1], (x) => x > 1, 'a fold above 1') };
}

/** Reads --from: a rate table (analysed as `analyze` would, with --error) or the JSON of an analysis. */
async function readFollowUp(o: PlanCliOptions, cwd: string): Promise<FollowUpBasis> {
  if (o.km || o.ki || o.ic50) throw new UsageError('option --from takes Km and the inhibition constants from the analysis: leave out --km, --ki and --ic50');
  const path = resolve(cwd, o.from!);
  const bad = (e: unknown): never => {
    throw new UsageError(`option --from: ${e instanceof Error ? e.message : String(e)}`);
  };
  if (/\.json$/i.test(path)) {
    let doc;
    try {
      doc = JSON.parse(await readFile(path, 'utf8'));
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code) throw e;
      return bad(new Error(`${o.from}: not valid JSON (${(e as Error).message})`));
    }
    try {
      return followUpBasis(summaryFromJson(doc, o.from!));
    } catch (e) {
      return bad(e);
    }
  }
  if (o.error !== 'auto' && o.error !== 'constant' && o.error !== 'proportional')
    throw new UsageError(`option --error: "${o.error}" is not auto, constant or proportional`);
  const [table] = chooseTables(await readRateFile(path), o.compound, o.from!);
  const result = analyzeForPlanning(table, o.error);
  try {
    return followUpBasis(summaryFromResult(result));
  } catch (e) {
    return bad(e);
  }
}

/**
 * The analysis a follow-up plan starts from. The planner simulates constant or proportional noise, so
 * 'auto' (the default, as for `analyze`) is the choice by likelihood between those two.
 */
function analyzeForPlanning(table: RateTable, error: 'auto' | 'constant' | 'proportional'): AnalysisResult {
  return analyzeTable(table, { errorModel: error, ...(error === 'auto' ? { autoAmong: PLANNED_NOISE } : {}), detail: 'summary' });
}

/** The error models the planner simulates. */
const PLANNED_NOISE = ['constant', 'proportional'] as const;

/** Builds the library request from the options; `basis` from --from (readFollowUp has refused --km, --ki and --ic50 with it). */
function planRequestFrom(o: PlanCliOptions, basis?: FollowUpBasis): PlanRequest {
  if (basis) return followUpRequest(o, basis);
  if (!o.km) throw new UsageError('option --km is required (a value such as 20uM or a range such as 10uM..40uM)');
  const km = usage('--km', () => parseConcentrationRange(o.km!));
  if (!o.ki && !o.ic50) throw new UsageError('give --ki (value or range) or --ic50 with --at-substrate');
  if (o.ki && o.ic50) throw new UsageError('give either --ki or --ic50, not both');
  const inhibition = usage(o.ki ? '--ki' : '--ic50', () => parseConcentrationRange((o.ki ?? o.ic50)!));
  const sUnit = km.unit;
  const iUnit = inhibition.unit;
  const noise = noiseOption(o.noise ?? 'proportional:0.05');
  if (noise.model === 'constant' && o.vmax === undefined)
    throw new UsageError('constant noise needs --vmax (the expected Vmax, in the same rate unit as the SD)');
  const prior: PlanPrior = { km: km.range, vmax: o.vmax !== undefined ? positiveNumber('--vmax', o.vmax) : 1 };
  if (o.ki) prior.ki = inhibition.range;
  else {
    if (!o.atSubstrate) throw new UsageError('option --ic50 needs --at-substrate (the [S] at which it was measured)');
    prior.ic50 = { range: inhibition.range, atSubstrate: concentrationIn('--at-substrate', o.atSubstrate, sUnit) };
  }
  return {
    prior,
    mechanisms: mechanismsOption(o.mechanisms),
    noise,
    constraints: constraintsFrom(o, sUnit, iUnit, 10 * km.range[1]),
    units: { substrate: sUnit, inhibitor: iUnit },
    ...commonSettings(o, iUnit),
  };
}

function constraintsFrom(o: PlanCliOptions, sUnit: ConcentrationUnit, iUnit: ConcentrationUnit, defaultMaxSubstrate: number): PlanRequest['constraints'] {
  const plate = integerOption('--plate', o.plate, 1);
  if (plate !== 96 && plate !== 384) throw new UsageError(`option --plate: "${o.plate}" is not 96 or 384`);
  const wells = integerOption('--wells', o.wells, 1);
  if (wells > plate) throw new UsageError(`option --wells: ${wells} wells do not fit a ${plate}-well plate`);
  return {
    maxSubstrate: o.maxSubstrate ? concentrationIn('--max-substrate', o.maxSubstrate, sUnit) : defaultMaxSubstrate,
    maxInhibitor: o.maxInhibitor ? concentrationIn('--max-inhibitor', o.maxInhibitor, iUnit) : Infinity,
    wells,
    replicates: integerOption('--replicates', o.replicates, 1),
    plate,
    dilution: dilutionOption(o),
  };
}

function commonSettings(o: PlanCliOptions, iUnit: ConcentrationUnit) {
  return {
    simulations: o.simulate ? integerOption('--simulations', o.simulations, 1) : 0,
    seed: integerOption('--seed', o.seed, 0),
    ...(o.enzyme ? { enzyme: concentrationIn('--enzyme', o.enzyme, iUnit) } : {}),
  };
}

/** A follow-up: prior, mechanisms and noise from the earlier analysis (--mechanisms and --noise override). */
function followUpRequest(o: PlanCliOptions, basis: FollowUpBasis): PlanRequest {
  const notes = [...basis.notes];
  const units = { substrate: basis.units.substrate ?? 'uM', inhibitor: basis.units.inhibitor ?? 'uM' } as const;
  if (!basis.units.substrate || !basis.units.inhibitor) notes.push('the analysed table gives no concentration unit; the plan uses its numbers as they are (labelled uM)');
  const noise = o.noise ? noiseOption(o.noise) : basis.noise;
  const mechanisms = o.mechanisms ? mechanismsOption(o.mechanisms) : basis.mechanisms;
  const measuredTop = Math.max(0, ...basis.fixedPoints.map((p) => p.substrate));
  return {
    prior: { ...basis.prior, ...(o.vmax !== undefined ? { vmax: positiveNumber('--vmax', o.vmax) } : {}) },
    mechanisms,
    noise,
    constraints: constraintsFrom(o, units.substrate, units.inhibitor, Math.max(10 * basis.prior.km[1], measuredTop)),
    units,
    fixedPoints: basis.fixedPoints,
    notes,
    ...commonSettings(o, units.inhibitor),
  };
}

/** Plans, prints and writes, as `mechanist plan` does. */
export async function runPlan(io: CliIo, o: PlanCliOptions): Promise<void> {
  // an output folder that cannot take the plan is found before the simulations run
  const dir = o.out ? resolve(io.cwd, o.out) : null;
  if (dir !== null) {
    checkOutputFolder(dir, o.out);
    checkReplaceableReportFolder(dir, o.out!);
  }
  const request = planRequestFrom(o, o.from ? await readFollowUp(o, io.cwd) : undefined);
  const bar = io.errIsTTY && request.simulations > 0 ? cliProgressBar(io, 'simulating') : null;
  if (bar) request.onProgress = (done, total) => bar.update(done, total);
  let plan;
  try {
    plan = planExperiment(request);
  } catch (e) {
    bar?.finish();
    if (e instanceof Error && !(e instanceof UsageError)) throw new UsageError(`cannot plan: ${e.message}`);
    throw e;
  }
  bar?.finish();
  const units = { substrate: request.units.substrate, inhibitor: request.units.inhibitor };
  const csv = plateMapCsv(plan.recommended.points, request.constraints.plate, units);
  const text = planText(plan);
  const json = JSON.stringify(planJson(plan), null, 2) + '\n';
  if (dir !== null) {
    // the page and figure code (d3 and the element tree) is loaded only when a page is written
    const { planFigures } = await import('../../plan/plan-figures.js');
    const { planPage } = await import('../../plan/plan-page.js');
    const figures = planFigures(plan, wellsCurve(request));
    // the folder appears whole or not at all, as a report folder does
    writeFolderAtomic(dir, [
      ['plan.json', json],
      ['summary.txt', text],
      ['plate-map.csv', csv],
      ...figures.map((f) => [`figures/${f.file}`, f.svg] as const),
      ['plan.html', planPage(plan, figures)],
    ]);
  }
  if (o.plateMap) writeFileAtomic(resolve(io.cwd, o.plateMap), csv);
  io.out(o.json ? json : text);
}
