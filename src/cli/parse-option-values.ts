/** Parsing of option values given on the command line, with one-line usage errors. */
import { UsageError } from './exit-codes.js';
import { ERROR_MODELS, type ErrorModel } from '../fit/error-models.js';
import { parseConcentration, parseConcentrationUnit, type Concentration } from '../input/units.js';
import type { ConcentrationUnit } from '../input/types.js';
import { InputError } from '../input/types.js';

export function numberOption(name: string, text: string, check: (x: number) => boolean = () => true, rule = ''): number {
  const x = Number(text);
  if (text.trim() === '' || !Number.isFinite(x) || !check(x)) throw new UsageError(`option ${name}: "${text}" is not ${rule || 'a number'}`);
  return x;
}

export function positiveNumber(name: string, text: string): number {
  return numberOption(name, text, (x) => x > 0, 'a positive number');
}

export function integerOption(name: string, text: string, min: number): number {
  return numberOption(name, text, (x) => Number.isInteger(x) && x >= min, `a whole number of at least ${min}`);
}

export function numberList(name: string, text: string): number[] {
  const parts = text.split(',').map((s) => s.trim()).filter((s) => s !== '');
  if (parts.length === 0) throw new UsageError(`option ${name}: give a comma-separated list of numbers`);
  return parts.map((p) => numberOption(name, p, (x) => x >= 0, 'a non-negative number'));
}

export function errorModelOption(text: string): ErrorModel {
  if ((ERROR_MODELS as readonly string[]).includes(text)) return text as ErrorModel;
  throw new UsageError(`option --error: "${text}" is not one of ${ERROR_MODELS.join(', ')}, auto`);
}

export function unitOption(name: string, text: string): ConcentrationUnit {
  try {
    return parseConcentrationUnit(text);
  } catch (e) {
    if (e instanceof InputError) throw new UsageError(`option ${name}: ${e.message}`);
    throw e;
  }
}

/** A positive concentration with an optional unit (`25uM`, `25 uM`, `25`). */
export function concentrationOption(name: string, text: string): Concentration {
  let c: Concentration;
  try {
    c = parseConcentration(text);
  } catch (e) {
    if (e instanceof InputError) throw new UsageError(`option ${name}: ${e.message}`);
    throw e;
  }
  if (!(c.value > 0)) throw new UsageError(`option ${name}: "${text}" is not a positive concentration`);
  return c;
}
