/** `mechanist plan`: the options (their type and defaults in plan-options.ts); the work is in plan-action.ts, loaded when the command runs. */
import { Command } from 'commander';
import type { CliIo } from '../io.js';
import { DEFAULT_PLAN_SIMULATIONS, type PlanCliOptions } from './plan-options.js';


export function planCommand(io: CliIo): Command {
  return new Command('plan')
    .description('plan the [S] x [I] grid most likely to give a firm, correct call, checked by simulation through the analysis')
    .option('--km <conc>', 'Km, a value (20uM) or a range (10uM..40uM); sets the substrate unit')
    .option('--ki <conc>', 'inhibition constant, value or range (50nM, 10nM..500nM); sets the inhibitor unit')
    .option('--ic50 <conc>', 'IC50 instead of --ki, value or range, measured at --at-substrate')
    .option('--at-substrate <conc>', '[S] at which the IC50 was measured')
    .option('--mechanisms <list>', 'mechanisms still in play, comma-separated (default: all five)')
    .option('--noise <model:level>', 'expected noise: proportional:CV or constant:SD (default proportional:0.05; with --from, the fitted noise)')
    .option('--vmax <x>', 'expected Vmax in rate units (needed for constant noise)')
    .option('--wells <n>', 'wells for this compound', '96')
    .option('--replicates <n>', 'replicate wells per design point', '2')
    .option('--plate <n>', 'plate format: 96 or 384', '96')
    .option('--max-substrate <conc>', 'highest [S] (solubility); default 10 x the upper Km')
    .option('--max-inhibitor <conc>', 'highest [I]; default no limit beyond 10 x the largest inhibition constant in the prior')
    .option('--dilution <scheme>', 'free (any levels), serial:FOLD (each level FOLD below the next), or list', 'free')
    .option('--substrate-levels <list>', 'allowed [S] levels (substrate unit), comma-separated: implies --dilution list')
    .option('--inhibitor-levels <list>', 'allowed [I] levels (inhibitor unit), comma-separated: implies --dilution list')
    .option('--enzyme <conc>', '[E] in the well: accepted and recorded, not yet used (no tight-binding planning yet)')
    .option('--seed <n>', 'random seed of the simulations', '1')
    .option('--simulations <n>', 'simulations per design and true mechanism', String(DEFAULT_PLAN_SIMULATIONS))
    .option('--no-simulate', 'information criteria only, no Monte Carlo check')
    .option('--json', 'print the plan as one JSON document')
    .option('--out <dir>', 'write plan.html (with figures/), plan.json, summary.txt and plate-map.csv into this folder')
    .option('--plate-map <file>', 'write the recommended plate map (CSV) to this file')
    .option('--from <file>', 'plan a follow-up from a rate table (the wells to add) or from the JSON of an analysis')
    .option('--error <model>', 'with --from a rate table: the error model of its analysis, auto (the better of constant and proportional by likelihood), constant or proportional', 'auto')
    .option('--compound <name>', 'with --from: the compound of a multi-compound file')
    .action(async (o: PlanCliOptions) => (await import('./plan-action.js')).runPlan(io, o));
}
