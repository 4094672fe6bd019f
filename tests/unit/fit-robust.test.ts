import { describe, expect, it } from 'vitest';
import { fitFuelCurve, generateDailyLogs, robustScale, robustWeight, sfocAt } from '../../optimizer/fit';
import type { QuadraticFuelCurve } from '../../optimizer/plant';
import { createRng } from '../../optimizer/random';

const TRUE_CURVE: QuadraticFuelCurve = { kind: 'quadratic', a: 60, b: 0.045, c: 1e-4 };
const RATED_KW = 1000;
const DAYS = 365;
/** 5 % of the days carry a gross error (fuel logged 40 % high, e.g. a mis-read flow meter). */
const OUTLIER_SHARE = 0.05;
/**
 * Tolerated shift of SFOC at 75 % load caused by the outliers, g/kWh: 0.5 % of ~200 g/kWh, below the
 * resolution of a day's fuel measurement (common practice: flow meters of ±0.5–1 % class — from memory).
 */
const SHIFT_TOL_G_PER_KWH = 1.0;

function contaminated(seed: number) {
  const clean = generateDailyLogs(createRng(seed), { curve: TRUE_CURVE, ratedKw: RATED_KW, days: DAYS });
  const rng = createRng(seed + 7919);
  const bad = new Set<number>();
  while (bad.size < Math.round(OUTLIER_SHARE * DAYS)) bad.add(rng.int(0, DAYS - 1));
  const dirty = clean.map((p, i) => (bad.has(i) ? { ...p, fuelKgPerH: p.fuelKgPerH * 1.4 } : p));
  return { clean, dirty, bad };
}

describe.each([1, 2, 3])('5 %% gross outliers, seed %d (truth of the simulation as reference)', (seed) => {
  const { clean, dirty, bad } = contaminated(seed);
  const load75 = 0.75 * RATED_KW;
  const cleanSfoc = sfocAt(fitFuelCurve(clean, { ratedKw: RATED_KW, robust: 'none' }), load75);

  it.each(['huber', 'tukey'] as const)('%s: SFOC at 75 %% load moves by less than the tolerance; every bad day is listed', (robust) => {
    const fit = fitFuelCurve(dirty, { ratedKw: RATED_KW, robust });
    expect(Math.abs(sfocAt(fit, load75) - cleanSfoc)).toBeLessThan(SHIFT_TOL_G_PER_KWH);
    const listed = new Set(fit.outliers.map((o) => o.index));
    for (const i of bad) expect(listed.has(i)).toBe(true);
    // Few clean days are flagged (robust weight < 0.5 means |z| > 2.69 for Huber: ~0.7 % of normal days).
    expect(listed.size - bad.size).toBeLessThan(0.03 * DAYS);
    // Down-weighted, never deleted: every day keeps a weight, and the outliers' weights are those reported.
    expect(fit.days).toBe(DAYS);
    for (const o of fit.outliers) expect(fit.robustWeights[o.index]).toBe(o.robustWeight);
    expect(fit.converged).toBe(true);
  });

  it('without robust weighting the same outliers move SFOC at 75 % load by more than the tolerance', () => {
    const fit = fitFuelCurve(dirty, { ratedKw: RATED_KW, robust: 'none' });
    expect(Math.abs(sfocAt(fit, load75) - cleanSfoc)).toBeGreaterThan(SHIFT_TOL_G_PER_KWH);
  });
});

describe('robust weight functions (Huber & Ronchetti, Robust Statistics, 2nd ed., §7)', () => {
  it('Huber: 1 inside k = 1.345, k/|z| outside', () => {
    expect(robustWeight(1.3, 'huber')).toBe(1);
    expect(robustWeight(-2.69, 'huber')).toBeCloseTo(0.5, 12);
  });
  it('Tukey bisquare: (1 − (z/c)²)² inside c = 4.685, 0 outside', () => {
    expect(robustWeight(4.685 / 2, 'tukey')).toBeCloseTo(0.5625, 12);
    expect(robustWeight(5, 'tukey')).toBe(0);
  });
  it('MAD scale is consistent for σ at the normal: 1.4826·MAD (Φ⁻¹(3/4) = 0.674490, standard normal table)', () => {
    const rng = createRng(11);
    const sample = Array.from({ length: 20000 }, () => rng.normal(0, 3));
    // SE of the MAD-based σ̂ at the normal is ≈ 1.17·σ/√n ≈ 0.025 (from memory); 4 SE tolerance.
    expect(Math.abs(robustScale(sample) - 3)).toBeLessThan(0.1);
  });
});
