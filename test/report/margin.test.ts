import { describe, expect, it } from 'vitest';
import { computeMargin } from '../../src/report/margin.js';
import { expectClose } from '../helpers/close.js';
import { FOLD_LAMBDA, sCurveTrace, transcriticalTrace } from './fixtures.js';

const base = { parameter: 'lambda', warnMargin: 0.1, failMargin: 0 };

// All numbers below are hand-computed from the analytic S-curve λ = x³ − x (folds at λ = ±2/(3√3)).
describe('computeMargin', () => {
  it('without an operating state takes the first crossing of the start branch and walks to the nearest fold', () => {
    // First crossing of λ = 0.1 in arclength order: lower sheet, x ≈ −1.04; the next special point is the
    // fold at λ = 2/(3√3) ≈ 0.3849 (above), distance 0.2849, relative 2.849. Nothing below on that sheet.
    const m = computeMargin(sCurveTrace(), { ...base, nominal: 0.1 });
    expect(m.branch).toBe(0);
    expect(m.below).toBeNull();
    expect(m.above?.event).toBe(0);
    expect(m.above?.type).toBe('fold');
    expectClose(m.above!.distance, FOLD_LAMBDA - 0.1, { abs: 1e-12 }, 'distance');
    expectClose(m.above!.relative, (FOLD_LAMBDA - 0.1) / 0.1, { abs: 1e-11 }, 'relative');
    expectClose(m.nearestRelative!, 2.849, { abs: 1e-3 }, 'nearest');
    expect(m.status).toBe('ok');
    // Analytic: on the lower sheet the eigenvalues 1 − 3x² (x ≈ −1.04) and −1 are negative.
    expect(m.operatingStable).toBe(true);
    expect(m.operatingUnstableCount).toBe(0);
  });

  it('on the middle sheet finds a fold on each side', () => {
    // Operating state x = y = −0.1 at λ = 0.1 lies on the middle sheet. Walking back: fold at +0.3849
    // (above, distance 0.2849); walking on: fold at −0.3849 (below, distance 0.4849, relative 4.849).
    const m = computeMargin(sCurveTrace(), { ...base, nominal: 0.1, operatingState: Float64Array.from([-0.1, -0.1]) });
    expect(m.below?.event).toBe(1);
    expect(m.above?.event).toBe(0);
    // Analytic: on the middle sheet 1 − 3x² > 0 (|x| < 1/√3): one unstable eigenvalue.
    expect(m.operatingStable).toBe(false);
    expect(m.operatingUnstableCount).toBe(1);
    expectClose(m.below!.distance, FOLD_LAMBDA + 0.1, { abs: 1e-12 }, 'below');
    expectClose(m.below!.relative, 4.849, { abs: 1e-3 }, 'below relative');
    expectClose(m.nearestRelative!, (FOLD_LAMBDA - 0.1) / 0.1, { abs: 1e-11 }, 'nearest');
  });

  it('on the upper sheet finds only the fold below', () => {
    const m = computeMargin(sCurveTrace(), { ...base, nominal: 0.1, operatingState: Float64Array.from([1.05, 1.05]) });
    expect(m.above).toBeNull();
    expect(m.below?.event).toBe(1);
    expectClose(m.below!.distance, FOLD_LAMBDA + 0.1, { abs: 1e-12 }, 'below');
  });

  it('warns inside the warning margin and fails inside the failing margin', () => {
    // Nominal 0.36: relative distance (0.38490 − 0.36)/0.36 = 0.06917.
    const warn = computeMargin(sCurveTrace(), { ...base, nominal: 0.36 });
    expectClose(warn.nearestRelative!, (FOLD_LAMBDA - 0.36) / 0.36, { abs: 1e-12 }, 'relative');
    expectClose(warn.nearestRelative!, 0.06917, { abs: 1e-5 }, 'by hand');
    expect(warn.status).toBe('warn');
    const fail = computeMargin(sCurveTrace(), { ...base, nominal: 0.36, failMargin: 0.07 });
    expect(fail.status).toBe('fail');
    const ok = computeMargin(sCurveTrace(), { ...base, nominal: 0.36, warnMargin: 0.05 });
    expect(ok.status).toBe('ok');
  });

  it('uses the absolute distance as the relative one when the nominal value is zero', () => {
    const m = computeMargin(sCurveTrace(), { ...base, nominal: 0 });
    expectClose(m.above!.relative, FOLD_LAMBDA, { abs: 1e-12 }, 'relative equals distance');
    expectClose(m.above!.distance, FOLD_LAMBDA, { abs: 1e-12 }, 'distance');
  });

  it('reports a nominal value outside the traced range', () => {
    const m = computeMargin(sCurveTrace(), { ...base, nominal: 3 });
    expect(m.status).toBe('nominal outside range');
    expect(m.branch).toBeNull();
    expect(m.nearestRelative).toBeNull();
  });

  it('reports a branch without special points', () => {
    // The state x = λ = 0.5 lies on the switched branch 1, which carries no special point of its own.
    const m = computeMargin(transcriticalTrace(), { ...base, nominal: 0.5, operatingState: Float64Array.from([0.5, 0]) });
    expect(m.branch).toBe(1);
    expect(m.status).toBe('no special point');
    expect(m.below).toBeNull();
    expect(m.above).toBeNull();
  });

  it('on the trivial branch of the transcritical trace measures the crossing point below', () => {
    // x = 0 at λ = 0.5: the transcritical point at λ = 0 is below, distance 0.5, relative 1.
    const m = computeMargin(transcriticalTrace(), { ...base, nominal: 0.5, operatingState: Float64Array.from([0, 0]) });
    expect(m.branch).toBe(0);
    expect(m.below?.type).toBe('transcritical');
    expectClose(m.below!.relative, 1, { abs: 1e-12 }, 'relative');
  });
});
