/**
 * The command-line options of the reads stage, shared by `rates`, `analyze` and `batch`. Only
 * commander here, so that adding them costs nothing at start-up; the work is in reads-input.ts.
 */
import type { Command } from 'commander';

export interface ReadsCliOptions {
  plateMap?: string;
  conversion?: string;
  pathLength?: string;
  ceiling?: string;
  rateFrom?: string;
  depletionCorrection?: boolean;
}

/** Adds --plate-map, --conversion, --path-length, --ceiling and --rate-from. */
export function addReadsOptions(cmd: Command, mapRequired: boolean): Command {
  const map = '--plate-map <file>';
  const mapHelp = 'plate map CSV: well,compound,substrate (unit),inhibitor (unit)[,role][,plate]';
  (mapRequired ? cmd.requiredOption(map, mapHelp) : cmd.option(map, `${mapHelp} (with --reads)`));
  return cmd
    .option('--conversion <factor|file>', 'signal per product concentration (6.22/mM; 6220/M/cm with --path-length) or a standard-curve CSV (concentration (unit),signal)')
    .option('--path-length <cm>', 'optical path length in cm, for a conversion per cm (Beer-Lambert law)')
    .option('--ceiling <signal>', 'detector ceiling: reads at or above it are saturated (default: the plate top value, when repeated)')
    .option('--no-depletion-correction', 'report the window slope as it is, without correcting it for the substrate used in the window')
    .option('--rate-from <method>', 'window (straight early window, default) | integrated (v0 of the integrated Michaelis-Menten fit where valid)', 'window');
}

