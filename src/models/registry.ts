/**
 * The model registry: every model describes itself (parameters with their dimension, rate,
 * analytic log-parameter gradient, covariates, the smaller models it contains and by which
 * constraint or limit, capabilities), and what the rest of the tool needs is derived from that
 * description here: model ids, the nested pairs to test, warm starts embedded from smaller
 * solutions, parameter units and starting scales.
 *
 * The nested pairs (src/evidence/selection/nested-comparisons.ts) and the warm starts and nesting check of
 * the classic five (src/fit/fit-all-mechanisms.ts) and of the other families
 * (src/fit/fit-family.ts) are derived here. The classic apparent-constant, Cheng-Prusoff and replot
 * geometry tables are still written by hand (their closed forms hold for the classic laws only).
 */
import type { Containment, MechanismModel, ModelFamily, NestingRule, ParamDimension, ParamName } from './types.js';
import { MECHANISMS } from './index.js';
import { TIGHT_BINDING_MODELS } from './tight-binding.js';
import { PARTIAL_MODELS } from './partial.js';

/** The registry id of a model. */
export function modelId(model: MechanismModel): string {
  if (model.id) return model.id;
  const family = familyOf(model);
  return family === 'classic' ? model.mechanism : `${family} ${model.mechanism}`;
}

export function familyOf(model: MechanismModel): ModelFamily {
  return model.family ?? 'classic';
}

const registry = new Map<string, MechanismModel>();
for (const m of [...MECHANISMS, ...TIGHT_BINDING_MODELS, ...PARTIAL_MODELS]) registry.set(modelId(m), m);

/** Adds a model (a library user's own, or a test's); its id must be new. Returns a function that removes it. */
export function registerModel(model: MechanismModel): () => void {
  const id = modelId(model);
  if (registry.has(id)) throw new Error(`a model with id "${id}" is already registered`);
  if (!model.specs || model.specs.length !== model.params.length)
    throw new Error(`model "${id}" must describe every parameter (specs, in params order)`);
  registry.set(id, model);
  return () => {
    if (registry.get(id) === model) registry.delete(id);
  };
}

/** Registered models of a family (registration order: the built-in ones simplest first). */
export function registeredModels(family?: ModelFamily): MechanismModel[] {
  return [...registry.values()].filter((m) => family === undefined || familyOf(m) === family);
}

export function lookupModel(id: string): MechanismModel | undefined {
  return registry.get(id);
}

/** A nested pair derived from a `contains` entry. */
export interface DerivedPair {
  simpler: MechanismModel;
  fuller: MechanismModel;
  rules: readonly NestingRule[];
  /** true when a rule sends a parameter to the edge of its domain (a boundary test) */
  boundary: boolean;
}

/** Every (simpler, fuller) pair among `models` that a `contains` entry declares. */
export function nestedPairsAmong(models: readonly MechanismModel[], lookup: (id: string) => MechanismModel | undefined = (id) => models.find((m) => modelId(m) === id)): DerivedPair[] {
  const pairs: DerivedPair[] = [];
  for (const fuller of models) {
    for (const c of fuller.contains ?? []) {
      const simpler = lookup(c.model);
      if (!simpler) continue;
      pairs.push({ simpler, fuller, rules: c.rules, boundary: c.rules.some((r) => r.kind === 'limit') });
    }
  }
  return pairs;
}

export function containmentOf(simpler: MechanismModel, fuller: MechanismModel): Containment | undefined {
  const id = modelId(simpler);
  return fuller.contains?.find((c) => c.model === id);
}

/**
 * The parameters of `fuller` that reproduce a solution of `simpler`, from the containment rules:
 * shared names carry over, a limit puts its parameter at `edge(name, to)`, `equal` copies the
 * other parameter, `fixed` sets the value. Null when `fuller` does not contain `simpler`.
 */
export function embedByRules(
  simpler: MechanismModel,
  fuller: MechanismModel,
  params: ArrayLike<number>,
  edge: (name: ParamName, to: 'zero' | 'infinity') => number,
): number[] | null {
  const c = containmentOf(simpler, fuller);
  if (!c) return null;
  const own = (name: ParamName): number | undefined => {
    const j = simpler.params.indexOf(name);
    return j >= 0 ? params[j] : undefined;
  };
  const out = fuller.params.map((name) => own(name) ?? NaN);
  for (const rule of c.rules) {
    const j = fuller.params.indexOf(rule.param);
    if (j < 0) continue;
    if (rule.kind === 'limit') out[j] = edge(rule.param, rule.to);
    else if (rule.kind === 'fixed') out[j] = rule.value;
    else out[j] = own(rule.sameAs) ?? out[fuller.params.indexOf(rule.sameAs)];
  }
  return out.every((x) => Number.isFinite(x)) ? out : null;
}

/** The dimension of a parameter: from the model's specs, else the classic meaning of its name. */
export function dimensionOf(model: MechanismModel, name: ParamName): ParamDimension {
  const spec = model.specs?.find((s) => s.name === name);
  if (spec) return spec.dimension;
  return CLASSIC_DIMENSIONS[name];
}

/** The dimension a parameter name has in every built-in model (alpha and other names: dimensionless). */
function dimensionOfName(name: string): ParamDimension {
  return (CLASSIC_DIMENSIONS as Record<string, ParamDimension>)[name] ?? 'dimensionless';
}

const CLASSIC_DIMENSIONS: Record<ParamName, ParamDimension> = {
  Vmax: 'rate',
  Km: 'substrate',
  Ki: 'inhibitor',
  Kiu: 'inhibitor',
  beta: 'dimensionless',
  Et: 'enzyme',
};

/** The unit text of a parameter, from the table's units (enzyme concentrations are in inhibitor units). */
export function unitOfDimension(dimension: ParamDimension, units: { substrate: string | null; inhibitor: string | null; rate: string | null }): string {
  switch (dimension) {
    case 'rate':
      return units.rate ?? '';
    case 'substrate':
      return units.substrate ?? '';
    case 'inhibitor':
    case 'enzyme':
      return units.inhibitor ?? '';
    case 'dimensionless':
      return '';
  }
}

/** The unit text of a parameter by name ('' when dimensionless or not known), from the table's units. */
export function unitOfParameter(name: string, units: { substrate: string | null; inhibitor: string | null; rate: string | null }): string {
  return unitOfDimension(dimensionOfName(name), units);
}
