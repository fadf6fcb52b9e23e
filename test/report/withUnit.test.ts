import { describe, expect, it } from 'vitest';
import { valueWithUnit, withUnit } from '../../src/report/withUnit.js';

// Conventions of our own: "-" declares a dimensionless quantity, shown in headers, not after values.
describe('units in text', () => {
  it('withUnit puts a declared unit, "-" included, in parentheses after a name', () => {
    expect(withUnit('T', 'K')).toBe('T (K)');
    expect(withUnit('Da', '-')).toBe('Da (-)');
    expect(withUnit('x')).toBe('x');
  });

  it('valueWithUnit writes a unit after a value, but nothing for "-", "" or no unit', () => {
    expect(valueWithUnit('350', 'K')).toBe('350 K');
    expect(valueWithUnit('0.2', '-')).toBe('0.2');
    expect(valueWithUnit('0.2', '')).toBe('0.2');
    expect(valueWithUnit('0.2')).toBe('0.2');
  });
});
