/**
 * What `mechanist plan` is given: its options as commander parses them and their defaults. Shared by
 * plan.ts (the command, loaded at start-up) and plan-action.ts (the work, loaded when it runs), so
 * neither imports the other.
 */

/** Simulations per design and true mechanism by default. */
export const DEFAULT_PLAN_SIMULATIONS = 50;

export interface PlanCliOptions {
  km?: string;
  ki?: string;
  ic50?: string;
  atSubstrate?: string;
  mechanisms?: string;
  noise?: string;
  vmax?: string;
  from?: string;
  error: string;
  compound?: string;
  wells: string;
  replicates: string;
  plate: string;
  maxSubstrate?: string;
  maxInhibitor?: string;
  dilution: string;
  substrateLevels?: string;
  inhibitorLevels?: string;
  enzyme?: string;
  seed: string;
  simulations: string;
  simulate: boolean;
  json?: boolean;
  out?: string;
  plateMap?: string;
}
