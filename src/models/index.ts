/**
 * The registry of mechanisms. Adding a mechanism: write one file exporting a `MechanismModel`,
 * then list it here (see DEVELOPERS.md, "The model contract (adding a model)").
 */
import type { Mechanism, MechanismModel } from './types.js';
import { noInhibition } from './no-inhibition.js';
import { competitive } from './competitive.js';
import { uncompetitive } from './uncompetitive.js';
import { noncompetitive } from './noncompetitive.js';
import { mixed } from './mixed.js';

export { noInhibition, competitive, uncompetitive, noncompetitive, mixed };

/** All mechanisms, simplest first. */
export const MECHANISMS: readonly MechanismModel[] = [noInhibition, competitive, uncompetitive, noncompetitive, mixed];

export function modelFor(mechanism: Mechanism): MechanismModel {
  const found = MECHANISMS.find((m) => m.mechanism === mechanism);
  if (!found) throw new Error(`unknown mechanism "${mechanism}"`);
  return found;
}
