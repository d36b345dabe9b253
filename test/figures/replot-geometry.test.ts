/**
 * Replot geometry, from the very functions the figures draw with (src/figures/replot-geometry.ts
 * and the meeting point the replot figures compute). Expected intersections as published:
 *  - double reciprocal (Lineweaver & Burk 1934): competitive lines meet on the 1/v axis; mixed lines
 *    at 1/[S] = -1/(alpha·Km), 1/v = (1 - 1/alpha)/Vmax; noncompetitive on the 1/[S] axis at
 *    -1/Km; uncompetitive lines are parallel;
 *  - Dixon (1953): lines per [S] meet at [I] = -Ki, 1/v = (1 - Ki/Kiu)/Vmax;
 *  - Cornish-Bowden (1974): lines per [S] meet at [I] = -Kiu, [S]/v = Km·(1 - Kiu/Ki)/Vmax;
 *  - slope and intercept replots cross zero at [I] = -Ki and -Kiu.
 * The constants are invented round numbers; the formulas are the published ones.
 */
import { describe, expect, it } from 'vitest';
import {
  cornishBowdenLine,
  dixonLine,
  doubleReciprocalLine,
  eadieHofsteeLine,
  hanesWoolfLine,
  interceptReplotLine,
  meetingPoint,
  modelRate,
  REPLOT_TRANSFORMS,
  slopeReplotLine,
  xIntercept,
  type RateConstants,
} from '../../src/figures/replot-geometry.js';
import { familyMeetingPoint, lineEnds, lineExtent } from '../../src/figures/replot-figures.js';

const MIXED: RateConstants = { Vmax: 40, Km: 45, Ki: 110, Kiu: 620 };
const COMPETITIVE: RateConstants = { Vmax: 40, Km: 45, Ki: 110, Kiu: Infinity };
const UNCOMPETITIVE: RateConstants = { Vmax: 40, Km: 45, Ki: Infinity, Kiu: 300 };
const NONCOMPETITIVE: RateConstants = { Vmax: 40, Km: 45, Ki: 150, Kiu: 150 };
const I_LEVELS = [0, 60, 120, 250, 500];
const S_LEVELS = [6, 12, 25, 50, 100, 200, 400, 800];

function close(actual: number, expected: number, rel = 1e-10): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.max(1, Math.abs(expected)));
}

describe('double-reciprocal lines (Lineweaver & Burk 1934)', () => {
  it('competitive: lines meet on the 1/v axis at 1/Vmax', () => {
    const p = familyMeetingPoint(COMPETITIVE, I_LEVELS, doubleReciprocalLine)!;
    close(p.x, 0);
    close(p.y, 1 / COMPETITIVE.Vmax);
  });
  it('mixed: lines meet at 1/[S] = -1/(alpha·Km), 1/v = (1 - 1/alpha)/Vmax', () => {
    const alpha = MIXED.Kiu / MIXED.Ki;
    const p = familyMeetingPoint(MIXED, I_LEVELS, doubleReciprocalLine)!;
    close(p.x, -1 / (alpha * MIXED.Km));
    close(p.y, (1 - 1 / alpha) / MIXED.Vmax);
    // every pair meets at the same point, not only the extreme levels
    for (let k = 1; k < I_LEVELS.length - 1; k++) {
      const q = meetingPoint(doubleReciprocalLine(MIXED, I_LEVELS[0]), doubleReciprocalLine(MIXED, I_LEVELS[k]))!;
      close(q.x, p.x, 1e-9);
      close(q.y, p.y, 1e-9);
    }
  });
  it('noncompetitive: lines meet on the 1/[S] axis at -1/Km', () => {
    const p = familyMeetingPoint(NONCOMPETITIVE, I_LEVELS, doubleReciprocalLine)!;
    close(p.x, -1 / NONCOMPETITIVE.Km);
    close(p.y, 0);
  });
  it('uncompetitive: lines are parallel (no meeting point)', () => {
    expect(familyMeetingPoint(UNCOMPETITIVE, I_LEVELS, doubleReciprocalLine)).toBeNull();
  });
});

describe('Dixon lines (Dixon 1953)', () => {
  it('mixed: lines meet at [I] = -Ki, 1/v = (1 - Ki/Kiu)/Vmax', () => {
    const p = familyMeetingPoint(MIXED, S_LEVELS, dixonLine)!;
    close(p.x, -MIXED.Ki);
    close(p.y, (1 - MIXED.Ki / MIXED.Kiu) / MIXED.Vmax);
  });
  it('competitive: they meet at [I] = -Ki, 1/v = 1/Vmax', () => {
    const p = familyMeetingPoint(COMPETITIVE, S_LEVELS, dixonLine)!;
    close(p.x, -COMPETITIVE.Ki);
    close(p.y, 1 / COMPETITIVE.Vmax);
  });
  it('uncompetitive: parallel', () => {
    expect(familyMeetingPoint(UNCOMPETITIVE, S_LEVELS, dixonLine)).toBeNull();
  });
});

describe('Cornish-Bowden lines (Cornish-Bowden 1974)', () => {
  it('mixed: lines meet at [I] = -Kiu, [S]/v = Km·(1 - Kiu/Ki)/Vmax', () => {
    const p = familyMeetingPoint(MIXED, S_LEVELS, cornishBowdenLine)!;
    close(p.x, -MIXED.Kiu);
    close(p.y, (MIXED.Km * (1 - MIXED.Kiu / MIXED.Ki)) / MIXED.Vmax);
  });
  it('competitive: parallel', () => {
    expect(familyMeetingPoint(COMPETITIVE, S_LEVELS, cornishBowdenLine)).toBeNull();
  });
});

describe('slope and intercept replots', () => {
  it('cross zero at [I] = -Ki and [I] = -Kiu; flat when the arm is absent', () => {
    close(xIntercept(slopeReplotLine(MIXED))!, -MIXED.Ki);
    close(xIntercept(interceptReplotLine(MIXED))!, -MIXED.Kiu);
    expect(xIntercept(interceptReplotLine(COMPETITIVE))).toBeNull();
  });
});

describe('points and lines use the same transform', () => {
  const families = [
    ['doubleReciprocal', doubleReciprocalLine, 'inhibitor'],
    ['hanesWoolf', hanesWoolfLine, 'inhibitor'],
    ['eadieHofstee', eadieHofsteeLine, 'inhibitor'],
    ['dixon', dixonLine, 'substrate'],
    ['cornishBowden', cornishBowdenLine, 'substrate'],
  ] as const;
  for (const [name, line, per] of families) {
    it(`${name}: noise-free rates of the model fall exactly on its line`, () => {
      for (const s of S_LEVELS) {
        for (const i of I_LEVELS) {
          const v = modelRate(MIXED, s, i);
          const p = REPLOT_TRANSFORMS[name](s, i, v);
          const l = line(MIXED, per === 'inhibitor' ? i : s);
          close(p.y, l.slope * p.x + l.intercept, 1e-9);
        }
      }
    });
  }
});

describe('drawn extent of the lines', () => {
  it('reaches left past the meeting point when it is near the data', () => {
    const xs = I_LEVELS;
    const meet = familyMeetingPoint(MIXED, S_LEVELS, dixonLine);
    const e = lineExtent(xs, meet);
    expect(e.meetShown).toBe(true);
    expect(e.lo).toBeLessThan(-MIXED.Ki);
    const ends = lineEnds(xs, [0, 0, 0, 0, 0], 1, e, meet);
    expect(ends[0][0]).toBe(e.lo);
  });
  it('does not stretch to a meeting point far outside the data', () => {
    const e = lineExtent([0, 1, 2], { x: -100, y: 1 });
    expect(e.meetShown).toBe(false);
    expect(e.lo).toBe(0);
  });
});
