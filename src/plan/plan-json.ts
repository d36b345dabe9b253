/**
 * The JSON document of a plan (`mechanist plan --json`, plan.json). Contract (README "Planning"):
 * `recommended: { units: {substrate, inhibitor}, wells: [{substrate, inhibitor, replicates}] }` and
 * `candidates: [{ name, wellCount, wells, predicted: { <mechanism>: { decisiveCorrect,
 * decisiveWrong, kiFoldWidth, ... } } }]`; shares are fractions of the simulations; `predicted` is
 * null for an information-only plan; non-finite numbers are null.
 */
import { TOOL_NAME, TOOL_VERSION } from '../version.js';
import type { DesignPoint } from './design-types.js';
import type { PlanCandidate, PlanResult } from './plan-experiment.js';

function finite(x: number | null | undefined): number | null {
  return x !== null && x !== undefined && Number.isFinite(x) ? x : null;
}

function wells(points: readonly DesignPoint[]) {
  return [...points]
    .sort((a, b) => a.inhibitor - b.inhibitor || a.substrate - b.substrate)
    .map((p) => ({ substrate: p.substrate, inhibitor: p.inhibitor, replicates: p.replicates }));
}

function candidateJson(c: PlanCandidate) {
  return {
    name: c.name,
    role: c.role,
    description: c.description,
    wellCount: c.wellCount,
    wells: wells(c.points),
    predicted: c.predicted
      ? Object.fromEntries(
          Object.entries(c.predicted).map(([m, p]) => [
            m,
            {
              simulations: p!.simulations,
              decisiveCorrect: p!.decisiveCorrect,
              decisiveWrong: p!.decisiveWrong,
              kiFoldWidth: finite(p!.kiFoldWidth),
              kiuFoldWidth: finite(p!.kiuFoldWidth),
              calls: p!.calls,
            },
          ]),
        )
      : null,
    expected: Object.fromEntries(
      Object.entries(c.expected).map(([m, e]) => [
        m,
        { firmCallChance: finite(e!.firmCallChance), kiFoldWidth: finite(e!.kiFoldWidth), kiuFoldWidth: finite(e!.kiuFoldWidth) },
      ]),
    ),
  };
}

export function planJson(plan: PlanResult) {
  const r = plan.request;
  return {
    tool: { name: TOOL_NAME, version: TOOL_VERSION },
    recommended: { units: { substrate: r.units.substrate, inhibitor: r.units.inhibitor }, wellCount: plan.recommended.wellCount, wells: wells(plan.recommended.points) },
    candidates: plan.candidates.map(candidateJson),
    settings: {
      mechanisms: r.mechanisms,
      prior: {
        km: r.prior.km,
        ...(r.prior.ki ? { ki: r.prior.ki } : {}),
        ...(r.prior.ic50 ? { ic50: r.prior.ic50.range, atSubstrate: r.prior.ic50.atSubstrate } : {}),
        vmax: r.prior.vmax,
      },
      noise: r.noise,
      constraints: { ...r.constraints, maxInhibitor: finite(r.constraints.maxInhibitor) },
      enzyme: r.enzyme ?? null,
      measuredWells: (r.fixedPoints ?? []).reduce((t, p) => t + p.replicates, 0),
      simulations: r.simulations,
      seed: r.seed,
      analysisOptions: plan.analysisOptions,
    },
    gridsScreened: plan.gridsScreened,
    assumptions: plan.assumptions,
    notes: plan.notes,
  };
}
