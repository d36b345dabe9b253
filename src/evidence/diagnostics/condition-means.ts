/**
 * Mean observed rate per (S, I) condition, with the number of rates behind each mean: the
 * model-free summary the pattern checks (substrate inhibition, activation, saturating inhibitor)
 * read.
 */
import type { FitData } from '../../fit/fit-data.js';
import { distinctLevels } from '../../input/distinct-levels.js';

export interface ConditionMean {
  s: number;
  i: number;
  mean: number;
  count: number;
  /** indices of the points behind the mean */
  indices: number[];
}

/** Condition means, sorted by [I] then [S]. */
export function conditionMeans(data: FitData): ConditionMean[] {
  const groups = new Map<string, ConditionMean>();
  for (let k = 0; k < data.v.length; k++) {
    const id = `${data.s[k]}|${data.i[k]}`;
    let g = groups.get(id);
    if (!g) {
      g = { s: data.s[k], i: data.i[k], mean: 0, count: 0, indices: [] };
      groups.set(id, g);
    }
    g.mean += data.v[k];
    g.count++;
    g.indices.push(k);
  }
  const out = [...groups.values()];
  for (const g of out) g.mean /= g.count;
  return out.sort((a, b) => a.i - b.i || a.s - b.s);
}

/** The inhibitor levels, ascending. */
export function inhibitorLevelsOf(means: readonly ConditionMean[]): number[] {
  return distinctLevels(means.map((m) => m.i));
}

/** Ratio of the mean at level `i` to the control mean at the same [S], per shared [S] level. */
export function activityRatios(means: readonly ConditionMean[], i: number): Array<{ s: number; ratio: number }> {
  const control = new Map(means.filter((m) => m.i === 0).map((m) => [m.s, m.mean]));
  return means
    .filter((m) => m.i === i && control.has(m.s) && control.get(m.s)! > 0)
    .map((m) => ({ s: m.s, ratio: m.mean / control.get(m.s)! }));
}
