/**
 * The nesting check (src/fit/nesting-limit.ts): a nested solution is a limit of the fuller model, so a
 * fuller fit with a higher SSE than that limit is replaced by it, the extra constant at the edge of its
 * domain (infinity for an inhibition constant, zero for beta). Invented, simulated data.
 */
import { describe, expect, it } from 'vitest';
import { MECHANISMS } from '../../src/models/index.js';
import { partialNoncompetitive } from '../../src/models/partial.js';
import { fitDataFromTable } from '../../src/fit/fit-data.js';
import { domainEdge, domainLowEdge, fitAtParams, fitMechanism } from '../../src/fit/fit-mechanism.js';
import { respectNesting } from '../../src/fit/nesting-limit.js';
import { simulatedTable } from '../helpers/sim-table.js';

const model = (m: string) => MECHANISMS.find((x) => x.mechanism === m)!;

describe('respectNesting', () => {
  const competitiveData = fitDataFromTable(simulatedTable('competitive', 31));
  const competitive = fitMechanism(model('competitive'), competitiveData, 'constant');

  it('replaces a stalled mixed fit by the competitive solution with Kiu at the domain edge', () => {
    const [vmax, km, ki] = competitive.params;
    const stalled = fitAtParams(model('mixed'), competitiveData, 'constant', [vmax * 0.8, km * 2, ki * 5, ki * 5], 'stalled on purpose');
    expect(stalled.sse).toBeGreaterThan(competitive.sse);
    const kept = respectNesting(stalled, [competitive], competitiveData, 'constant');
    expect(kept).not.toBe(stalled);
    expect(Array.from(kept.params.slice(0, 3))).toEqual(Array.from(competitive.params));
    expect(kept.params[3]).toBeCloseTo(domainEdge(model('mixed'), competitiveData, 'Kiu'), 6);
    expect(kept.sse).toBeLessThan(stalled.sse);
    expect(kept.sse).toBeGreaterThanOrEqual(competitive.sse * (1 - 1e-9));
    expect(kept.message).toContain('the competitive solution with the extra constant switched off');
  });

  it('keeps a proper fit that is at least as good as every contained solution (the same object)', () => {
    const data = fitDataFromTable(simulatedTable('mixed', 5));
    const nested = fitMechanism(model('competitive'), data, 'constant');
    const mixed = fitMechanism(model('mixed'), data, 'constant', { extraStarts: [[...nested.params, 10 * nested.params[2]]] });
    expect(mixed.sse).toBeLessThan(nested.sse);
    expect(respectNesting(mixed, [nested], data, 'constant')).toBe(mixed);
  });

  it('switches beta off at the low edge for a partial model (the rule that goes to zero)', () => {
    const data = fitDataFromTable(simulatedTable('noncompetitive', 12));
    const classic = fitMechanism(model('noncompetitive'), data, 'constant');
    const [vmax, km, ki] = classic.params;
    const stalled = fitAtParams(partialNoncompetitive, data, 'constant', [vmax, km, ki * 4, 0.6], 'stalled on purpose');
    const kept = respectNesting(stalled, [classic], data, 'constant');
    expect(kept.params[3]).toBeCloseTo(domainLowEdge(partialNoncompetitive, data, 'beta'), 12);
    expect(kept.sse).toBeLessThan(stalled.sse);
  });
});
