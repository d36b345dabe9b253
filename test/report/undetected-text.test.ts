/** A constant past the detection bound is printed with the bound's unit (issue 13, item 3). */
import { describe, expect, it } from 'vitest';
import { undetectedText } from '../../src/report/undetected-text.js';

describe('undetectedText', () => {
  const e = { name: 'Kiu' as const, exceeds: 400, note: 'Kiu > 400: the uncompetitive arm is not detected in the tested inhibitor range' };
  it('puts the unit on the bound and keeps the reason', () => {
    expect(undetectedText(e, 'nM')).toBe('Kiu > 400 nM: the uncompetitive arm is not detected in the tested inhibitor range');
  });
  it('leaves the note as it is without a unit, and for alpha (no unit)', () => {
    expect(undetectedText(e, '')).toBe(e.note);
    expect(undetectedText({ name: 'alpha', exceeds: 1, note: 'alpha runs off' }, 'nM')).toBe('alpha runs off');
  });
});
