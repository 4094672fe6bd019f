import { describe, expect, it } from 'vitest';
import { fitFuelCurve, generateDailyLogs, sfocBandAt, studentTQuantile } from '../../optimizer/fit';
import type { QuadraticFuelCurve } from '../../optimizer/plant';
import { createRng } from '../../optimizer/random';

// Illustrative 1000 kW set: SFOC 215 / 200 / 205 g/kWh at 50 / 75 / 100 % load (invented, not a maker's figure).
const TRUE_CURVE: QuadraticFuelCurve = { kind: 'quadratic', a: 60, b: 0.045, c: 1e-4 };
const RATED_KW = 1000;
const TRIALS = 200;
const DAYS = 120;
/**
 * Accepted coverage of nominal 95 % intervals over 200 trials: the count is binomial(200, 0.95), SD
 * √(0.95·0.05/200) ≈ 1.5 %, so [90 %, 99 %] is about −3.3 to +2.6 SD; the wider low side allows for the
 * asymptotic (Huber) covariance of the robust fits being approximate at 120 days.
 */
const COVERAGE_MIN = 0.9;
const COVERAGE_MAX = 0.99;

function coverage(robust: 'none' | 'huber' | 'tukey') {
  const hits = { a: 0, b: 0, c: 0, sfoc75: 0 };
  const errors75: number[] = [];
  const trueSfoc75 = (1000 * (TRUE_CURVE.a + TRUE_CURVE.b * 750 + TRUE_CURVE.c * 750 * 750)) / 750;
  for (let s = 0; s < TRIALS; s++) {
    const points = generateDailyLogs(createRng(1000 + s), { curve: TRUE_CURVE, ratedKw: RATED_KW, days: DAYS, noiseSdKgPerH: 3 });
    const fit = fitFuelCurve(points, { ratedKw: RATED_KW, robust });
    const t = studentTQuantile(0.975, fit.dof);
    for (const k of ['a', 'b', 'c'] as const) {
      if (Math.abs(fit.coefficients[k] - TRUE_CURVE[k]) <= t * fit.standardErrors[k]) hits[k]++;
    }
    const band = sfocBandAt(fit, 750);
    if (band.lowerGPerKwh <= trueSfoc75 && trueSfoc75 <= band.upperGPerKwh) hits.sfoc75++;
    errors75.push(band.sfocGPerKwh - trueSfoc75);
  }
  return { hits, errors75 };
}

describe.each(['none', 'huber', 'tukey'] as const)('recovery of a known curve, robust = %s (200 seeded trials)', (robust) => {
  const { hits, errors75 } = coverage(robust);

  it.each(['a', 'b', 'c', 'sfoc75'] as const)('95 %% interval of %s covers the truth at a near-nominal rate (binomial range 90–99 %%)', (k) => {
    const rate = hits[k] / TRIALS;
    expect(rate).toBeGreaterThanOrEqual(COVERAGE_MIN);
    expect(rate).toBeLessThanOrEqual(COVERAGE_MAX);
  });

  it('SFOC at 75 % load is unbiased: mean error within 3 standard errors of the mean error', () => {
    const mean = errors75.reduce((s, e) => s + e, 0) / TRIALS;
    const sd = Math.sqrt(errors75.reduce((s, e) => s + (e - mean) ** 2, 0) / (TRIALS - 1));
    expect(Math.abs(mean)).toBeLessThan((3 * sd) / Math.sqrt(TRIALS));
  });
});
