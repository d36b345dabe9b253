/** `mechanist simulate`: a rate table from a chosen mechanism, with seeded noise. */
import { Command } from 'commander';
import { resolve } from 'node:path';
import { MECHANISMS } from '../../models/index.js';
import type { Mechanism, ParamName } from '../../models/types.js';
import { ratesToCsv, simulateRates, type NoiseModel } from '../../simulate/simulate-rates.js';
import { writeFileAtomic } from '../../report/write-atomic.js';
import { UsageError } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { integerOption, numberList, numberOption, positiveNumber, unitOption } from '../parse-option-values.js';

interface SimulateCliOptions {
  mechanism: string;
  vmax: string;
  km: string;
  ki?: string;
  kiu?: string;
  substrate: string;
  inhibitor: string;
  replicates: string;
  noise: string;
  noiseLevel: string;
  seed: string;
  substrateUnit?: string;
  inhibitorUnit?: string;
  rateUnit?: string;
  output?: string;
}

export function simulateCommand(io: CliIo): Command {
  return new Command('simulate')
    .description('write a simulated rate table (CSV) from a chosen mechanism')
    .option('--mechanism <name>', `one of ${MECHANISMS.map((m) => m.mechanism).join(', ')}`, 'competitive')
    .option('--vmax <x>', 'true Vmax', '100')
    .option('--km <x>', 'true Km (substrate units)', '10')
    .option('--ki <x>', 'true Ki (inhibitor units)')
    .option('--kiu <x>', 'true Kiu (inhibitor units)')
    .option('--substrate <list>', 'substrate levels, comma-separated', '2,4,8,15,30,60,120,240')
    .option('--inhibitor <list>', 'inhibitor levels, comma-separated (include 0)', '0,0.5,1,2,4')
    .option('--replicates <n>', 'replicates per grid point', '3')
    .option('--noise <model>', 'constant | proportional | sqrt', 'proportional')
    .option('--noise-level <x>', 'SD (constant), CV (proportional) or SD per sqrt(rate) (sqrt)', '0.05')
    .option('--seed <n>', 'random seed (integer)', '1')
    .option('--substrate-unit <unit>', 'unit written in the [S] header', 'uM')
    .option('--inhibitor-unit <unit>', 'unit written in the [I] header', 'uM')
    .option('--rate-unit <text>', 'unit written in the rate header')
    .option('-o, --output <file>', 'write to this file instead of standard output')
    .action((o: SimulateCliOptions) => {
      const mechanism = o.mechanism as Mechanism;
      const model = MECHANISMS.find((m) => m.mechanism === mechanism);
      if (!model) throw new UsageError(`option --mechanism: "${o.mechanism}" is not one of ${MECHANISMS.map((m) => m.mechanism).join(', ')}`);
      const params: Partial<Record<ParamName, number>> = { Vmax: positiveNumber('--vmax', o.vmax), Km: positiveNumber('--km', o.km) };
      if (o.ki !== undefined) params.Ki = positiveNumber('--ki', o.ki);
      if (o.kiu !== undefined) params.Kiu = positiveNumber('--kiu', o.kiu);
      for (const name of model.params)
        if (params[name] === undefined) throw new UsageError(`the ${model.label} model needs --${name.toLowerCase()}`);
      if (!['constant', 'proportional', 'sqrt'].includes(o.noise))
        throw new UsageError(`option --noise: "${o.noise}" is not constant, proportional or sqrt`);
      const points = simulateRates({
        mechanism,
        params,
        substrate: numberList('--substrate', o.substrate),
        inhibitor: numberList('--inhibitor', o.inhibitor),
        replicates: integerOption('--replicates', o.replicates, 1),
        noise: o.noise as NoiseModel,
        noiseLevel: numberOption('--noise-level', o.noiseLevel, (x) => x >= 0, 'a non-negative number'),
        seed: integerOption('--seed', o.seed, 0),
      });
      const csv = ratesToCsv(points, {
        substrate: unitOption('--substrate-unit', o.substrateUnit ?? 'uM'),
        inhibitor: unitOption('--inhibitor-unit', o.inhibitorUnit ?? 'uM'),
        ...(o.rateUnit ? { rate: o.rateUnit } : {}),
      });
      if (o.output) writeFileAtomic(resolve(io.cwd, o.output), csv);
      else io.out(csv);
    });
}
