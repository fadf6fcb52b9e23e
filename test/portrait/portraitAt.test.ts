import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { loadModel } from '../../src/model/loadModel.js';
import { portraitAt } from '../../src/portraitAt.js';

describe('portraitAt', () => {
  it('keeps the default window within the bounds the model gives its states', () => {
    // Rosenzweig & MacArthur (1963) plankton model (models/predator-prey-enrichment.yaml): the
    // equilibria (0, 0), (K, 0) and the coexistence state put the window's padding below zero, where
    // populations mean nothing; the model says both are at least 0.
    const text = readFileSync('models/predator-prey-enrichment.yaml', 'utf8');
    const bounded = portraitAt(loadModel(text, 'pp.yaml'), {}).data.window;
    expect([bounded.x[0], bounded.y[0]]).toEqual([0, 0]);
    const free = portraitAt(loadModel(text.replaceAll(', min: 0', ''), 'pp.yaml'), {}).data.window;
    expect(free.x[0]).toBeLessThan(0);
    expect(free.y[0]).toBeLessThan(0);
    expect(free.x[1]).toBe(bounded.x[1]);
  });
});
