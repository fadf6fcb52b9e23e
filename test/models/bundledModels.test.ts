/**
 * Every model in models/ loads, compiles, and its exact Jacobian agrees with central finite
 * differences (relative mismatch below 1e-6, the check of the model-file issue) at the start guess
 * and at points spread around it; each cites a published source in `about`.
 */
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkJacobian } from '../../src/compile/checkJacobian.js';
import { equilibriaAt } from '../../src/equilibriaAt.js';
import { readModelFile } from '../../src/model/loadModel.js';
import { prepare } from '../../src/setup.js';

const files = readdirSync('models').filter((f) => /\.(ya?ml|json)$/.test(f)).map((f) => join('models', f));

describe('bundled models', () => {
  it('there are at least three of them', () => {
    expect(files.length).toBeGreaterThanOrEqual(3);
  });

  for (const file of files) {
    it(`${file}: exact Jacobian matches central differences to 1e-6 relative at nine points`, () => {
      const model = readModelFile(file);
      const { system, params, guess } = prepare(model);
      for (let k = 0; k < 9; k++) {
        // Points at ±20% around the guess (deterministic pattern; common practice for such checks).
        const x = guess.map((v, i) => v * (1 + 0.2 * Math.sin(1.3 * (k + 1) * (i + 1))) + 0.01 * k);
        const c = checkJacobian(system, x, params);
        expect(c.maxRelError, `${file} at point ${k}`).toBeLessThan(1e-6);
      }
    });

    it(`${file}: cites a source (a year in parentheses) in its about text`, () => {
      const model = readModelFile(file);
      expect(model.about ?? '').toMatch(/\(\d{4}\)|\b(19|20)\d{2}\b/);
    });
  }

  it('the toggle switch at its nominal (bistable) values has exactly three equilibria: two stable nodes and a saddle', () => {
    // Gardner, Cantor & Collins (2000), Nature 403:339, Fig. 1: with alpha1 = alpha2 = 10 and
    // cooperativities 2 the switch is bistable (three steady states, the middle one unstable).
    const { search } = equilibriaAt(readModelFile('models/genetic-toggle-switch.yaml'));
    const types = search.equilibria.map((e) => e.type).sort();
    expect(types).toEqual(['saddle', 'stable node', 'stable node']);
    expect(search.equilibria.filter((e) => e.stable)).toHaveLength(2);
    for (const e of search.equilibria) expect(e.residual).toBeLessThanOrEqual(1e-10);
  });
});
