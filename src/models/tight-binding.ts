/**
 * Tight-binding inhibition: total enzyme and total inhibitor, the Morrison quadratic
 * (src/models/morrison.ts; Morrison 1969), with the mechanism entering only through the apparent
 * constant Ki_app([S]) (Williams, J. W. and Morrison, J. F. (1979) Methods Enzymol. 63, 437-467;
 * Copeland, R. A. (2013) Evaluation of Enzyme Inhibitors in Drug Discovery, 2nd ed., ch. 7):
 *   v = Vmax·S/(Km + S) · Ef/E,   Ef/E from E = [E]t, I = [I]t, K = Ki_app(S)
 *   competitive     K = Ki·(1 + S/Km)
 *   uncompetitive   K = Kiu·(1 + Km/S)
 *   noncompetitive  K = Ki
 *   mixed           K = (Km + S)/(Km/Ki + S/Kiu)
 * As E -> 0 each is the classic rate law (test/models/tight-binding.test.ts checks it to 1e-9).
 *
 * Two variants per mechanism: E read per point (the `enzyme` covariate: `--enzyme CONC` or an
 * `enzyme` column), or E fitted as the parameter Et (`--enzyme fit`), in inhibitor units.
 */
import type { Containment, Mechanism, MechanismModel, ParamName, ParamSpec } from './types.js';
import { activityDerivatives, morrisonFractions } from './morrison.js';
import { roughScales, singleConstantGuesses, inhibitionConstantGuesses } from './starting-values.js';

type TightMechanism = Exclude<Mechanism, 'none'>;

const CONSTANTS: Record<TightMechanism, ParamName[]> = {
  competitive: ['Ki'],
  uncompetitive: ['Kiu'],
  noncompetitive: ['Ki'],
  mixed: ['Ki', 'Kiu'],
};

const APPARENT: Record<TightMechanism, string> = {
  competitive: 'K = Ki·(1 + S/Km)',
  uncompetitive: 'K = Kiu·(1 + Km/S)',
  noncompetitive: 'K = Ki',
  mixed: 'K = (Km + S)/(Km/Ki + S/Kiu)',
};

/**
 * Ki_app(S) and its derivatives with respect to ln Km and ln of each inhibition constant
 * (written into dK[0] for Km, dK[1..] for the constants in CONSTANTS order).
 */
export function apparentConstant(mechanism: TightMechanism, km: number, c: ArrayLike<number>, s: number, dK?: Float64Array): number {
  switch (mechanism) {
    case 'competitive': {
      const K = c[0] * (1 + s / km);
      if (dK) {
        dK[0] = (-c[0] * s) / km;
        dK[1] = K;
      }
      return K;
    }
    case 'uncompetitive': {
      const K = c[0] * (1 + km / s);
      if (dK) {
        dK[0] = (c[0] * km) / s;
        dK[1] = K;
      }
      return K;
    }
    case 'noncompetitive':
      if (dK) {
        dK[0] = 0;
        dK[1] = c[0];
      }
      return c[0];
    case 'mixed': {
      const a = km / c[0];
      const d = a + s / c[1];
      const K = (km + s) / d;
      if (dK) {
        dK[0] = (km / d) * (1 - K / c[0]);
        dK[1] = (K * a) / d;
        dK[2] = (K * (s / c[1])) / d;
      }
      return K;
    }
  }
}

function tightBindingModel(mechanism: TightMechanism, enzyme: 'given' | 'fitted'): MechanismModel {
  const constants = CONSTANTS[mechanism];
  const params: ParamName[] = ['Vmax', 'Km', ...constants, ...(enzyme === 'fitted' ? (['Et'] as ParamName[]) : [])];
  const specs: ParamSpec[] = params.map((name) => ({
    name,
    dimension: name === 'Vmax' ? 'rate' : name === 'Km' ? 'substrate' : name === 'Et' ? 'enzyme' : 'inhibitor',
  }));
  const nc = constants.length;
  const cView = new Float64Array(nc);
  const dK = new Float64Array(nc + 1);
  const suffix = enzyme === 'fitted' ? ' (Et fitted)' : '';
  const idOf = (m: Mechanism) => (m === 'none' ? 'none' : `tight-binding ${m}${suffix}`);
  const contains: Containment[] = [
    { model: 'none', rules: constants.map((p) => ({ kind: 'limit' as const, param: p, to: 'infinity' as const })) },
  ];
  if (mechanism === 'mixed')
    contains.push(
      { model: idOf('competitive'), rules: [{ kind: 'limit', param: 'Kiu', to: 'infinity' }] },
      { model: idOf('uncompetitive'), rules: [{ kind: 'limit', param: 'Ki', to: 'infinity' }] },
      { model: idOf('noncompetitive'), rules: [{ kind: 'equal', param: 'Kiu', sameAs: 'Ki' }] },
    );
  const enzymeAt = (p: ArrayLike<number>, e: number | undefined): number => (enzyme === 'fitted' ? p[2 + nc] : (e ?? 0));
  return {
    mechanism,
    family: 'tight-binding',
    id: idOf(mechanism),
    label: `tight-binding ${mechanism}`,
    equation: `v = Vmax·S/(Km + S) · (1 − 2·I/(E + I + K + √((I + K − E)² + 4·E·K))), ${APPARENT[mechanism]}, E = [E]t${enzyme === 'fitted' ? ' (fitted)' : ''}`,
    params,
    specs,
    contains,
    ...(enzyme === 'given' ? { covariates: ['enzyme' as const] } : {}),
    capabilities: { classicClosedForms: false },
    rate(p, s, i, e) {
      for (let j = 0; j < nc; j++) cView[j] = p[2 + j];
      const K = apparentConstant(mechanism, p[1], cView, s);
      const v0 = (p[0] * s) / (p[1] + s);
      return v0 * morrisonFractions(enzymeAt(p, e), i, K).activity;
    },
    gradLog(p, s, i, out, o, e) {
      for (let j = 0; j < nc; j++) cView[j] = p[2 + j];
      const E = enzymeAt(p, e);
      const K = apparentConstant(mechanism, p[1], cView, s, dK);
      const v0 = (p[0] * s) / (p[1] + s);
      const f = morrisonFractions(E, i, K);
      const d = activityDerivatives(E, K, f);
      out[o] = v0 * f.activity;
      out[o + 1] = (-v0 * f.activity * p[1]) / (p[1] + s) + v0 * d.dK * dK[0];
      for (let j = 0; j < nc; j++) out[o + 2 + j] = v0 * d.dK * dK[1 + j];
      if (enzyme === 'fitted') out[o + 2 + nc] = v0 * d.eDE;
    },
    starts(data) {
      const r = roughScales(data);
      const guesses = nc === 1 ? singleConstantGuesses(r).map((k) => [k]) : (() => {
        const [low, mid, high] = inhibitionConstantGuesses(r);
        return [[mid, mid], [low, high], [high, low]];
      })();
      const et = enzyme === 'fitted' ? [r.inhibitorLevels[0] ?? r.inhibitorMiddle] : [];
      return guesses.map((g) => [r.vmax, r.km, ...g, ...et]);
    },
  };
}

const MECHS: TightMechanism[] = ['competitive', 'uncompetitive', 'noncompetitive', 'mixed'];

/** The four tight-binding models with [E]t given per point, simplest first. */
export const TIGHT_BINDING_GIVEN: readonly MechanismModel[] = MECHS.map((m) => tightBindingModel(m, 'given'));
/** The four tight-binding models with [E]t fitted. */
export const TIGHT_BINDING_FITTED: readonly MechanismModel[] = MECHS.map((m) => tightBindingModel(m, 'fitted'));
export const TIGHT_BINDING_MODELS: readonly MechanismModel[] = [...TIGHT_BINDING_GIVEN, ...TIGHT_BINDING_FITTED];
