/**
 * Why a constant has no value, with the unit on the bound it exceeds ("Ki > 400 nM: ..."): the
 * estimate's note carries the bound as a bare number, since the fit knows no units. Used by the
 * text summary and the report page (issue 13: every printed concentration carries its unit).
 */
import type { ParameterEstimate } from '../evidence/intervals/wald-estimates.js';
import { sig } from '../text/format-number.js';

export function undetectedText(e: Pick<ParameterEstimate, 'name' | 'note' | 'exceeds'>, unit: string): string {
  const note = e.note ?? 'not determined';
  if (e.exceeds === undefined || !unit || e.name === 'alpha') return note;
  const tail = note.includes(': ') ? note.slice(note.indexOf(': ')) : '';
  return `${e.name} > ${sig(e.exceeds)} ${unit}${tail}`;
}
