/**
 * The follow-up plan (`mechanist plan --from FILE`): what an earlier analysis leaves open becomes
 * the prior of a new plan. The mechanisms still in play are the verdict's plausible candidates;
 * Km and the inhibition constants range over their 95% intervals (profile where available, else
 * Wald) in those mechanisms' fits; the noise is the fitted residual SD (constant) or CV
 * (proportional). From a rate table, the wells already measured are kept in every candidate design
 * (in the information and in every simulated dataset), so the plan says which wells to add; the
 * JSON of an analysis holds no rates, so from it the plan is for a new plate.
 */
import type { AnalysisResult } from '../analysis/types.js';
import type { ConcentrationUnit } from '../input/types.js';
import type { Mechanism } from '../models/types.js';
import type { DesignPoint, PlanNoise } from './design-types.js';
import type { PlanPrior, Range } from './plan-prior.js';

interface FittedConstant {
  value: number | null;
  low: number | null;
  high: number | null;
  detected: boolean;
}

/** What a follow-up needs from an analysis, whether read from the result or from its JSON. */
export interface FittedSummary {
  source: string;
  outcome: string;
  decisive: boolean;
  candidates: Mechanism[];
  errorModel: string;
  units: { substrate: string | null; inhibitor: string | null };
  models: Array<{ mechanism: Mechanism; residualSd: number | null; params: Partial<Record<'Vmax' | 'Km' | 'Ki' | 'Kiu', FittedConstant>> }>;
  /** the measured design (null from JSON) */
  points: DesignPoint[] | null;
}

export interface FollowUpBasis {
  prior: PlanPrior;
  mechanisms: Mechanism[];
  noise: PlanNoise;
  fixedPoints: DesignPoint[];
  units: { substrate: ConcentrationUnit | null; inhibitor: ConcentrationUnit | null };
  notes: string[];
}

/** The measured design of an analysis: one point per distinct ([S], [I]) with its count. */
function measuredDesign(result: AnalysisResult): DesignPoint[] {
  const counts = new Map<string, DesignPoint>();
  for (let k = 0; k < result.data.s.length; k++) {
    const key = `${result.data.s[k]}|${result.data.i[k]}`;
    const p = counts.get(key);
    if (p) p.replicates++;
    else counts.set(key, { substrate: result.data.s[k], inhibitor: result.data.i[k], replicates: 1 });
  }
  return [...counts.values()];
}

export function summaryFromResult(result: AnalysisResult): FittedSummary {
  return {
    source: result.input.source,
    outcome: result.verdict.outcome,
    decisive: result.verdict.decisive,
    candidates: result.verdict.candidates,
    errorModel: result.errorModel,
    units: { substrate: result.input.units.substrate, inhibitor: result.input.units.inhibitor },
    models: result.models.map((m) => ({
      mechanism: m.mechanism,
      residualSd: Math.sqrt(m.residualVariance),
      params: Object.fromEntries(
        m.estimates
          .filter((e) => e.name !== 'alpha')
          .map((e) => {
            const pr = e.profile && e.profile[0] !== null && e.profile[1] !== null ? e.profile : null;
            const iv = pr ?? e.wald;
            return [e.name, { value: e.value, low: iv ? iv[0] : null, high: iv ? iv[1] : null, detected: e.detected }];
          }),
      ),
    })),
    points: measuredDesign(result),
  };
}

type JsonValue = null | boolean | number | string | JsonValue[] | { [k: string]: JsonValue };

/** The same summary from `mechanist analyze --json` (results.json); throws on a document of another shape. */
export function summaryFromJson(doc: JsonValue, source: string): FittedSummary {
  const o = doc as { [k: string]: any };
  if (!o || typeof o !== 'object' || !Array.isArray(o.models) || !o.verdict || !o.input)
    throw new Error(`${source}: not the JSON of a mechanist analysis (no models, verdict and input)`);
  const level = typeof o.level === 'number' ? o.level : 0.95;
  const key = Math.round(level * 100);
  return {
    source,
    outcome: String(o.verdict.outcome),
    decisive: Boolean(o.verdict.decisive),
    candidates: o.verdict.candidates as Mechanism[],
    errorModel: String(o.errorModel),
    units: { substrate: o.input.units?.substrate ?? null, inhibitor: o.input.units?.inhibitor ?? null },
    models: (o.models as any[]).map((m) => ({
      mechanism: m.mechanism as Mechanism,
      residualSd: typeof m.residualSd === 'number' ? m.residualSd : null,
      params: Object.fromEntries(
        Object.entries(m.params as Record<string, any>)
          .filter(([name]) => name !== 'alpha')
          .map(([name, p]) => {
            const pr = Array.isArray(p[`profile${key}`]) && p[`profile${key}`].every((x: unknown) => typeof x === 'number') ? p[`profile${key}`] : null;
            const iv = pr ?? (Array.isArray(p[`ci${key}`]) ? p[`ci${key}`] : null);
            return [name, { value: p.value ?? null, low: iv ? iv[0] : null, high: iv ? iv[1] : null, detected: p.detected !== false }];
          }),
      ),
    })),
    points: null,
  };
}

function span(c: FittedConstant | undefined): Range | null {
  if (!c || !c.detected || c.value === null || !(c.value > 0)) return null;
  const low = c.low !== null && c.low > 0 ? c.low : c.value / 2;
  const high = c.high !== null && c.high > low ? c.high : c.value * 2;
  return [Math.min(low, c.value), Math.max(high, c.value)];
}

function union(ranges: Array<Range | null>): Range | null {
  const r = ranges.filter((x): x is Range => x !== null);
  return r.length ? [Math.min(...r.map((x) => x[0])), Math.max(...r.map((x) => x[1]))] : null;
}

/** The prior, mechanisms, noise and measured wells of the follow-up. */
export function followUpBasis(summary: FittedSummary): FollowUpBasis {
  if (summary.errorModel !== 'constant' && summary.errorModel !== 'proportional')
    throw new Error(`${summary.source}: the analysis used the ${summary.errorModel} error model; a follow-up plan needs constant or proportional (re-analyse with --error)`);
  const inPlay = summary.candidates.filter((m) => m !== 'none');
  if (summary.outcome === 'no-inhibition' || inPlay.length === 0)
    throw new Error(`${summary.source}: the analysis detected no inhibition, so there are no fitted constants to plan from; plan a new experiment with --ki or --ic50`);
  const fits = inPlay.map((m) => summary.models.find((x) => x.mechanism === m)).filter((x): x is FittedSummary['models'][number] => x !== undefined);
  const lead = fits[0];
  const km = union(fits.map((f) => span(f.params.Km)));
  const k = union(fits.flatMap((f) => [span(f.params.Ki), span(f.params.Kiu)]));
  if (!km || !k || !lead) throw new Error(`${summary.source}: the plausible mechanisms have no detected Km and inhibition constant to plan from`);
  const sd = lead.residualSd;
  if (!(sd !== null && sd > 0)) throw new Error(`${summary.source}: no residual SD in the analysis`);
  const vmax = lead.params.Vmax?.value ?? 1;
  const notes = [
    `follow-up of ${summary.source} (${summary.outcome}${summary.decisive ? '' : ', not decisive'}): mechanisms in play ${inPlay.join(', ')}; Km ${km[0].toPrecision(3)}..${km[1].toPrecision(3)}, inhibition constants ${k[0].toPrecision(3)}..${k[1].toPrecision(3)} from their 95% intervals; noise ${summary.errorModel} ${sd.toPrecision(3)} from the fit`,
    summary.points
      ? `the ${summary.points.reduce((s, p) => s + p.replicates, 0)} wells already measured are part of every candidate (in the information and in every simulation); the designs and the plate map list only the wells to add`
      : 'the JSON of an analysis holds no rates: the plan is for a new plate, not for wells added to the old one',
  ];
  return {
    prior: { km, ki: k, vmax },
    mechanisms: inPlay,
    noise: { model: summary.errorModel, level: sd },
    fixedPoints: summary.points ?? [],
    units: { substrate: (summary.units.substrate as ConcentrationUnit | null) ?? null, inhibitor: (summary.units.inhibitor as ConcentrationUnit | null) ?? null },
    notes,
  };
}
