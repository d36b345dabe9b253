/**
 * The summary row of one compound, from its analysis (summarizeAnalysis) or from the reason it
 * could not be analysed (failedSummary).
 *
 * Constants are those of the called mechanism (verdict.mechanism): Ki, Kiu and alpha are null
 * when that mechanism has no such constant (e.g. Kiu of the competitive model). Intervals are the
 * profile-likelihood ones when the estimate carries them (Bates & Watts 1988, sec. 6.1), else the
 * Wald ones (src/evidence/intervals/wald-estimates.ts).
 */
import type { AnalysisResult } from '../analysis/types.js';
import type { EstimateName, ParameterEstimate } from '../evidence/intervals/wald-estimates.js';
import type { RateTable } from '../input/types.js';
import type { CompoundSummary, ConstantSummary } from './types.js';
import type { SingleSubstrateResult } from '../analysis/single-substrate.js';
import { interval, sig } from '../text/format-number.js';
import { wordVerdict } from '../wording/verdict-words.js';

/** Where the row of a compound sits and what it is called (set by the batch plan). */
interface RowIdentity {
  position: number;
  compound: string;
  nameInFile: string | null;
  source: string;
}

function finiteOrNull(x: number | null | undefined): number | null {
  return x === null || x === undefined || !Number.isFinite(x) ? null : x;
}

/** Value and interval of one estimate, profile interval first (see IntervalKind). */
function constantSummary(e: ParameterEstimate): ConstantSummary {
  if (!e.detected) {
    return { value: null, low: finiteOrNull(e.exceeds), high: null, interval: 'not-detected' };
  }
  if (e.profile) {
    return { value: finiteOrNull(e.value), low: finiteOrNull(e.profile[0]), high: finiteOrNull(e.profile[1]), interval: 'profile' };
  }
  if (e.wald) {
    return { value: finiteOrNull(e.value), low: finiteOrNull(e.wald[0]), high: finiteOrNull(e.wald[1]), interval: 'wald' };
  }
  return { value: finiteOrNull(e.value), low: null, high: null, interval: 'unavailable' };
}

/** Input warnings and fits that did not converge, one plain line each. */
function analysisFlags(result: AnalysisResult): string[] {
  const flags = result.input.warnings.map((w) => w.message);
  for (const m of result.models) if (!m.converged) flags.push(`the ${m.label} fit did not converge: ${m.message}`);
  return flags;
}

/** The row of an analysed compound. `identity` defaults to the analysis' own source and compound. */
export function summarizeAnalysis(result: AnalysisResult, identity?: Partial<RowIdentity>, report: string | null = null): CompoundSummary {
  const verdict = result.verdict;
  const top = result.models[0] ?? null;
  const second = result.models[1] ?? null;
  const family = result.family?.family ?? 'classic';
  const called =
    (family === 'classic'
      ? result.models.find((m) => m.mechanism === verdict.mechanism)
      : result.familyModels?.find((m) => m.modelId === result.family.model)) ?? null;
  const estimate = (name: EstimateName) => called?.estimates.find((e) => e.name === name);
  const constant = (name: EstimateName) => {
    const e = estimate(name);
    return e ? constantSummary(e) : null;
  };
  const nameInFile = identity?.nameInFile !== undefined ? identity.nameInFile : (result.input.compound ?? null);
  return {
    position: identity?.position ?? 1,
    compound: identity?.compound ?? result.input.compound ?? result.input.source,
    nameInFile,
    source: identity?.source ?? result.input.source,
    status: 'analysed',
    outcome: verdict.outcome,
    mechanism: verdict.mechanism,
    family,
    lean: verdict.lean ?? null,
    decisive: verdict.decisive,
    headline: wordVerdict(verdict).headline,
    errorModel: result.errorModel,
    topModel: top?.mechanism ?? null,
    topWeight: finiteOrNull(top?.weight),
    gapToSecond: top && second ? finiteOrNull(second.aicc - top.aicc) : null,
    constantsOf: called?.mechanism ?? null,
    Ki: constant('Ki'),
    Kiu: constant('Kiu'),
    alpha: constant('alpha'),
    beta: constant('beta'),
    Et: constant('Et'),
    Km: finiteOrNull(estimate('Km')?.value),
    Vmax: finiteOrNull(estimate('Vmax')?.value),
    IC50: null,
    units: { substrate: result.input.units.substrate, inhibitor: result.input.units.inhibitor, rate: result.input.units.rate },
    rowsUsed: result.input.rowsUsed,
    rowsExcluded: result.input.excluded.length,
    flags: analysisFlags(result),
    error: null,
    report,
  };
}

/**
 * The row of a compound that could not be analysed, saying why; the row counts are given when
 * the table was read (the analysis failed, not the reading).
 */
export function failedSummary(identity: RowIdentity, error: string, table?: RateTable | null): CompoundSummary {
  return {
    ...identity,
    status: 'failed',
    outcome: null,
    mechanism: null,
    family: null,
    lean: null,
    decisive: null,
    headline: null,
    errorModel: null,
    topModel: null,
    topWeight: null,
    gapToSecond: null,
    constantsOf: null,
    Ki: null,
    Kiu: null,
    alpha: null,
    beta: null,
    Et: null,
    Km: null,
    Vmax: null,
    IC50: null,
    units: { substrate: table?.units.substrate ?? null, inhibitor: table?.units.inhibitor ?? null, rate: table?.units.rate ?? null },
    rowsUsed: table ? table.points.length : null,
    rowsExcluded: table ? table.excluded.length : null,
    flags: table ? table.warnings.map((w) => w.message) : [],
    error,
    report: null,
  };
}

/**
 * The row of a one-[S] compound (an IC50 curve): no mechanism is called, the IC50 of the preferred
 * dose-response model fills `IC50` (profile interval when it has an end, else Wald), and the
 * headline says that one [S] cannot tell the mechanism.
 */
export function summarizeDoseResponse(result: SingleSubstrateResult, identity: RowIdentity, report: string | null = null): CompoundSummary {
  const e = result.evidence;
  const chosen = e.models.find((m) => m.model === e.chosen)!;
  const profiled = chosen.ic50.profile[0] !== null || chosen.ic50.profile[1] !== null;
  const [low, high] = profiled ? chosen.ic50.profile : chosen.ic50.wald;
  const unit = result.units.inhibitor ? ` ${result.units.inhibitor}` : '';
  const pct = Math.round(result.level * 100);
  const table = result.table;
  return {
    ...failedSummary(identity, '', table),
    status: 'analysed',
    error: null,
    headline: `One [S] level: IC50 ${sig(chosen.ic50.value)}${unit} (${profiled ? 'profile' : 'Wald'} ${pct}% ${interval(low, high)}); one [S] cannot tell the mechanism.`,
    topModel: null,
    IC50: { value: finiteOrNull(chosen.ic50.value), low: finiteOrNull(low), high: finiteOrNull(high), interval: profiled ? 'profile' : 'wald' },
    flags: [...table.warnings.map((w) => w.message), ...e.models.filter((m) => !m.converged).map((m) => `the ${m.label} fit did not converge`)],
    report,
  };
}
