/** Analysis options as posted to batch workers (src/batch/analyze-compound.ts). */
import { describe, expect, it } from 'vitest';
import { fromPortableOptions, toPortableOptions } from '../../src/batch/analyze-compound.js';
import { modelFor } from '../../src/models/index.js';
import type { AnalysisOptions } from '../../src/analysis/analyze-table.js';

describe('toPortableOptions', () => {
  it('names the models, drops callbacks, runs a bootstrap in its compound\'s thread, and survives structured cloning', () => {
    const options: AnalysisOptions = {
      errorModel: 'proportional',
      level: 0.9,
      models: [modelFor('none'), modelFor('competitive')],
      bootstrap: { resamples: 50, seed: 3, workers: 4 },
      onProgress: () => undefined,
    };
    const portable = toPortableOptions(options);
    expect(portable).toEqual({ errorModel: 'proportional', level: 0.9, bootstrap: { resamples: 50, seed: 3, workers: 1 }, mechanisms: ['none', 'competitive'] });
    expect(structuredClone(portable)).toEqual(portable);
    const back = fromPortableOptions(structuredClone(portable));
    expect(back.models?.map((m) => m.mechanism)).toEqual(['none', 'competitive']);
    expect(back.models?.[1]).toBe(modelFor('competitive'));
    expect(options.bootstrap?.workers).toBe(4); // the caller's object is left alone
  });
});
