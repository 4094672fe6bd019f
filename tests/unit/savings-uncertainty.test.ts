import { sampleCovariance, sampleVariance } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { fitFuelCurve, generateDailyLogs } from '../../optimizer/fit/index';
import type { QuadraticFuelCurve, ReserveRule } from '../../optimizer/plant';
import { createRng } from '../../optimizer/random';
import { deltaInterval, multivariateNormalSampler, sampleSavings, vesselSavings } from '../../optimizer/savings/index';
import type { CurveUncertainty, SavingsDay } from '../../optimizer/savings/index';
import { savingsSet } from '../fixtures/savings/plants';

/** Known "true" curves of three sets (made up for the test; not any real engine). */
const TRUE: { id: string; ratedKw: number; curve: QuadraticFuelCurve }[] = [
  { id: 'DG1', ratedKw: 1000, curve: { kind: 'quadratic', a: 25, b: 0.19, c: 3e-5 } },
  { id: 'DG2', ratedKw: 1000, curve: { kind: 'quadratic', a: 35, b: 0.18, c: 4e-5 } },
  { id: 'DG3', ratedKw: 600, curve: { kind: 'quadratic', a: 15, b: 0.2, c: 5e-5 } },
];
const trueUnits = TRUE.map((t) => savingsSet(t.id, t.curve.a, t.curve.b, t.curve.c, t.ratedKw, 25));
const rule: ReserveRule = { marginKw: 0, marginPct: 10, minSets: 1, nMinus1: false, busTieClosed: true };

/** Ten logged days of the period: all three sets at an equal % of rating, plant loads 700..1600 kW. */
const periodDays: SavingsDay[] = [700, 800, 900, 1000, 1100, 1200, 1300, 1400, 1500, 1600].map((loadKw, i) => ({
  date: `2024-05-${String(i + 1).padStart(2, '0')}`,
  modeHours: { sea: 24 },
  sets: TRUE.map((t) => ({ unitId: t.id, hoursRun: 24, kwh: ((loadKw * t.ratedKw) / 2600) * 24 })),
  fuel: { grade: 'MGO' },
}));

/** Fits of the three sets on seeded noisy daily logs from the true curves (60 days each, 3 kg/h noise at 24 h). */
function fitsForTrial(seed: number): Record<string, CurveUncertainty> {
  const rng = createRng(seed);
  const fits: Record<string, CurveUncertainty> = {};
  for (const t of TRUE) {
    const points = generateDailyLogs(rng, { curve: t.curve, ratedKw: t.ratedKw, days: 60, noiseSdKgPerH: 3, minLoadPct: 25 });
    // robust: 'none' so the covariance is the classical σ̂²(XᵀWX)⁻¹ whose t interval is exact under normal noise.
    fits[t.id] = fitFuelCurve(points, { ratedKw: t.ratedKw, robust: 'none' });
  }
  return fits;
}

describe('avoidable-fuel interval covers the true saving (generated data with known curves)', () => {
  const truth = vesselSavings({ units: trueUnits, rules: { sea: rule }, days: periodDays });
  const trueDayKg = truth.days.map((d) => d.avoidableFuelKg!);
  const truePeriodKg = trueDayKg.reduce((s, x) => s + x, 0);

  it('the true saving is material (the test is not about a zero)', () => {
    expect(truePeriodKg).toBeGreaterThan(1000);
  });

  it('95 % delta-method intervals cover the true period and day savings in 200 seeded trials at 0.90–0.99', () => {
    // Nominal 0.95; binomial SD over 200 trials is √(0.95·0.05/200) ≈ 0.015, so 0.90–0.99 is about ±3 SD
    // (wider above, since a first-order interval errs on the narrow side when it errs). Deterministic: fixed seeds.
    const TRIALS = 200;
    let periodHits = 0;
    let dayHits = 0;
    let dayCount = 0;
    for (let trial = 0; trial < TRIALS; trial++) {
      const fits = fitsForTrial(10_000 + trial);
      const s = vesselSavings({ units: trueUnits, fits, rules: { sea: rule }, days: periodDays });
      const p = s.period.avoidableFuelT;
      if (p.lower * 1000 <= truePeriodKg && truePeriodKg <= p.upper * 1000) periodHits++;
      s.byDay.forEach((d, i) => {
        dayCount++;
        if (d.avoidableFuelT.lower * 1000 <= trueDayKg[i] && trueDayKg[i] <= d.avoidableFuelT.upper * 1000) dayHits++;
      });
    }
    const periodCoverage = periodHits / TRIALS;
    const dayCoverage = dayHits / dayCount;
    expect(periodCoverage).toBeGreaterThanOrEqual(0.9);
    expect(periodCoverage).toBeLessThanOrEqual(0.99);
    expect(dayCoverage).toBeGreaterThanOrEqual(0.9);
    expect(dayCoverage).toBeLessThanOrEqual(0.99);
  });

  it('seeded sampling with re-optimisation agrees with the delta method (SD within 15 %, same seed → same result)', () => {
    // Envelope theorem: re-optimising moves the optimum only to second order, so the two SDs should be close;
    // 15 % allows the Monte Carlo error of 400 draws (≈ 3.5 % on an SD) and the second-order terms.
    const fits = fitsForTrial(77);
    const input = { units: trueUnits, fits, rules: { sea: rule }, days: periodDays };
    const delta = vesselSavings(input).period.avoidableFuelT;
    const sampled = sampleSavings(input, { samples: 400, seed: 5 });
    expect(Math.abs(sampled.period.sdKg / (delta.sd * 1000) - 1)).toBeLessThan(0.15);
    expect(sampled.period.lowerKg).toBeLessThan(delta.value * 1000);
    expect(sampled.period.upperKg).toBeGreaterThan(delta.value * 1000);
    expect(sampleSavings(input, { samples: 50, seed: 5 }).period).toEqual(sampleSavings(input, { samples: 50, seed: 5 }).period);
  });
});

describe('multivariateNormalSampler and deltaInterval against simple-statistics', () => {
  const mean = [20, 0.19, 3e-5];
  const cov = [
    [4, -0.006, 5.4e-6],
    [-0.006, 1e-5, -9e-9],
    [5.4e-6, -9e-9, 1e-11],
  ];
  const N = 20_000;
  const draw = multivariateNormalSampler(mean, cov);
  const rng = createRng(2024);
  const draws = Array.from({ length: N }, () => draw(rng));

  it('sample covariance of 20 000 draws matches the input (simple-statistics sampleCovariance, 5 SE)', () => {
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j <= i; j++) {
        const got = sampleCovariance(draws.map((d) => d[i]), draws.map((d) => d[j]));
        // SE of a sample covariance ≈ √((σ_ii σ_jj + σ_ij²) / N) (normal theory).
        const se = Math.sqrt((cov[i][i] * cov[j][j] + cov[i][j] ** 2) / N);
        expect(Math.abs(got - cov[i][j])).toBeLessThan(5 * se);
      }
    }
  });

  it('delta variance gᵀΣg equals the sample variance of the linear quantity g·θ (simple-statistics, 5 %)', () => {
    const g: [number, number, number] = [24, 24 * 500, 24 * 500 * 500];
    const fit: CurveUncertainty = { curve: { kind: 'quadratic', a: mean[0], b: mean[1], c: mean[2] }, covariance: cov };
    const interval = deltaInterval(0, { X: g }, { X: fit });
    const values = draws.map((d) => g[0] * d[0] + g[1] * d[1] + g[2] * d[2]);
    // Relative SE of a sample variance is √(2/N) ≈ 1 %; 5 % is 5 SE.
    expect(Math.abs(sampleVariance(values) / interval.sdKg ** 2 - 1)).toBeLessThan(0.05);
    expect(interval.upperKg - interval.lowerKg).toBeCloseTo(2 * 1.959964 * interval.sdKg, 4); // normal 97.5 % point, from memory
  });

  it('a semi-definite covariance (coefficient at its bound) is sampled through the eigen-decomposition', () => {
    const semi = [
      [0, 0, 0],
      [0, 1e-5, -9e-9],
      [0, -9e-9, 1e-11],
    ];
    const d = multivariateNormalSampler(mean, semi)(createRng(3));
    expect(d[0]).toBe(20);
    expect(() => multivariateNormalSampler([0, 0], [[1, 2], [2, 1]])).toThrow(/semi-definite/);
  });
});
