import { Matrix, solve } from 'ml-matrix';
import { linearRegression, rSquared, sumSimple } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import {
  fitFuelCurve,
  fuelRateAt,
  generateDailyLogs,
  lowestSfocLoadKw,
  sfocAt,
  sfocBandAt,
  studentTQuantile,
  withinDayFuelBiasKgPerH,
  type DailyFuelPoint,
  type ShopTestPoint,
} from '../../optimizer/fit';
import type { QuadraticFuelCurve } from '../../optimizer/plant';
import { createRng } from '../../optimizer/random';

const RATED_KW = 1000;
const CURVE: QuadraticFuelCurve = { kind: 'quadratic', a: 60, b: 0.045, c: 1e-4 };
/** Two exact computations of the same quantity. */
const EXACT_REL_TOL = 1e-9;
// Invented shop test of an illustrative set (not a maker's figures).
const SHOP: ShopTestPoint[] = [
  { loadPct: 25, sfocGPerKwh: 245 },
  { loadPct: 50, sfocGPerKwh: 214 },
  { loadPct: 75, sfocGPerKwh: 199 },
  { loadPct: 100, sfocGPerKwh: 204 },
];

function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

describe('linear model against simple-statistics linearRegression and rSquared', () => {
  const rng = createRng(5);
  const points: DailyFuelPoint[] = Array.from({ length: 60 }, () => {
    const loadKw = 300 + 700 * rng.uniform();
    return { loadKw, fuelKgPerH: 15 + 0.2 * loadKw + rng.normal(0, 2), hoursRun: 24 };
  });
  const fit = fitFuelCurve(points, { ratedKw: RATED_KW, model: 'linear', robust: 'none' });
  const data = points.map((p) => [p.loadKw, p.fuelKgPerH]);
  const line = linearRegression(data);

  it('coefficients and R² agree', () => {
    expect(fit.coefficients.c).toBe(0);
    expect(rel(fit.coefficients.a, line.b)).toBeLessThan(EXACT_REL_TOL);
    expect(rel(fit.coefficients.b, line.m)).toBeLessThan(EXACT_REL_TOL);
    expect(rel(fit.rSquared, rSquared(data, (x) => line.b + line.m * x))).toBeLessThan(EXACT_REL_TOL);
  });

  it('the band is the textbook mean-response interval ŷ ± t·s·√(1/n + (x₀ − x̄)²/Sxx) (Montgomery & Runger, Applied Statistics and Probability for Engineers, §11-5 — section from memory)', () => {
    const n = points.length;
    const xs = points.map((p) => p.loadKw);
    const xBar = sumSimple(xs) / n;
    const sxx = sumSimple(xs.map((x) => (x - xBar) ** 2));
    const s = Math.sqrt(sumSimple(points.map((p) => (p.fuelKgPerH - line.b - line.m * p.loadKw) ** 2)) / (n - 2));
    for (const x0 of [350, 620, 990, 1200]) {
      const half = studentTQuantile(0.975, n - 2) * s * Math.sqrt(1 / n + (x0 - xBar) ** 2 / sxx);
      const band = sfocBandAt(fit, x0);
      expect(rel(((band.upperGPerKwh - band.sfocGPerKwh) * x0) / 1000, half)).toBeLessThan(1e-8);
      expect(rel(((band.sfocGPerKwh - band.lowerGPerKwh) * x0) / 1000, half)).toBeLessThan(1e-8);
      expect(band.extrapolated).toBe(x0 > Math.max(...xs) || x0 < Math.min(...xs));
    }
  });
});

describe('evaluation of a curve', () => {
  it('fuelRateAt and sfocAt: F = a + bP + cP², SFOC = 1000 F / P (definition)', () => {
    const fit = { curve: CURVE };
    expect(fuelRateAt(fit, 750)).toBeCloseTo(60 + 33.75 + 56.25, 10);
    expect(sfocAt(fit, 750)).toBeCloseTo(200, 10);
    expect(() => sfocAt(fit, 0)).toThrow('sfocAt requires loadKw > 0');
  });

  it('lowest SFOC: analytic √(a/c) agrees with a brute-force grid search', () => {
    const fit = { curve: CURVE };
    const analytic = lowestSfocLoadKw(fit, RATED_KW);
    let best = 100;
    for (let p = 100; p <= 1000; p += 0.01) if (sfocAt(fit, p) < sfocAt(fit, best)) best = p;
    expect(Math.abs(analytic - best)).toBeLessThan(0.01);
    expect(rel(analytic, Math.sqrt(60 / 1e-4))).toBeLessThan(EXACT_REL_TOL);
  });

  it('lowest SFOC is clamped to the rating when √(a/c) lies above it (grid search over the rated range)', () => {
    const fit = { curve: { kind: 'quadratic' as const, a: 60, b: 0.1, c: 2e-5 } }; // √(a/c) ≈ 1732 kW
    let best = 100;
    for (let p = 100; p <= 1000; p += 0.01) if (sfocAt(fit, p) < sfocAt(fit, best)) best = p;
    expect(lowestSfocLoadKw(fit, RATED_KW)).toBe(RATED_KW);
    expect(Math.abs(best - RATED_KW)).toBeLessThan(0.011);
  });
});

describe('reported loads: shop-test offsets and extrapolation flags', () => {
  const points = generateDailyLogs(createRng(8), { curve: CURVE, ratedKw: RATED_KW, days: 200, meanLoadPct: 50, loadSdPct: 10, minLoadPct: 30, maxLoadPct: 70 });
  const fit = fitFuelCurve(points, { ratedKw: RATED_KW, shopTest: SHOP });

  it('85 % is interpolated linearly between the 75 % and 100 % shop points; offset = fitted − shop', () => {
    const at85 = fit.atLoads.find((r) => r.loadPct === 85)!;
    expect(at85.shopSfocGPerKwh).toBeCloseTo(0.6 * 199 + 0.4 * 204, 10);
    expect(at85.offsetFromShopGPerKwh).toBeCloseTo(at85.sfocGPerKwh - at85.shopSfocGPerKwh!, 10);
    expect(fit.atLoads.map((r) => r.loadPct)).toEqual([50, 75, 85, 100]);
  });

  it('loads above the data (30–70 % of rating) are flagged extrapolated', () => {
    expect(fit.atLoads.map((r) => r.extrapolated)).toEqual([false, true, true, true]);
    expect(fit.loadRangeKw.max).toBeLessThanOrEqual(700);
  });
});

describe('shop-test prior', () => {
  // Ten days in a narrow band (70–75 % load).
  const rng = createRng(9);
  const few: DailyFuelPoint[] = Array.from({ length: 10 }, () => {
    const loadKw = 700 + 50 * rng.uniform();
    return { loadKw, fuelKgPerH: fuelRateAt({ curve: CURVE }, loadKw) + 3 + rng.normal(0, 1), hoursRun: 12 + 12 * rng.uniform() };
  });

  it('is used for few days / narrow range, with weight 10 · 30 / (30 + days) average days', () => {
    const fit = fitFuelCurve(few, { ratedKw: RATED_KW, shopTest: SHOP, robust: 'none' });
    expect(fit.priorUsed).toBe(true);
    expect(fit.priorWeightDays).toBeCloseTo((10 * 30) / 40, 12);
    expect(fit.priorWeightShare).toBeCloseTo(7.5 / (7.5 + 10), 12);
  });

  it('equals weighted least squares on the data plus the shop points as pseudo-observations (ml-matrix solve)', () => {
    const fit = fitFuelCurve(few, { ratedKw: RATED_KW, shopTest: SHOP, robust: 'none', constrained: false });
    const meanHours = sumSimple(few.map((p) => p.hoursRun)) / few.length;
    const rows = [
      ...few.map((p) => ({ x: p.loadKw / 1000, y: p.fuelKgPerH, w: p.hoursRun / meanHours })),
      ...SHOP.map((s) => ({ x: s.loadPct / 100, y: (s.sfocGPerKwh * s.loadPct * 10) / 1000, w: 7.5 / SHOP.length })),
    ];
    // Normal equations in MW (well conditioned at this size), solved by ml-matrix.
    const xtwx = Matrix.zeros(3, 3);
    const xtwy = Matrix.zeros(3, 1);
    for (const r of rows) {
      const g = [1, r.x, r.x * r.x];
      for (let i = 0; i < 3; i++) {
        xtwy.set(i, 0, xtwy.get(i, 0) + r.w * g[i] * r.y);
        for (let j = 0; j < 3; j++) xtwx.set(i, j, xtwx.get(i, j) + r.w * g[i] * g[j]);
      }
    }
    const beta = solve(xtwx, xtwy).getColumn(0);
    expect(rel(fit.coefficients.a, beta[0])).toBeLessThan(1e-8);
    expect(rel(fit.coefficients.b, beta[1] / 1e3)).toBeLessThan(1e-8);
    expect(rel(fit.coefficients.c, beta[2] / 1e6)).toBeLessThan(1e-8);
  });

  it('decays as data grow and is not used for a long, wide record', () => {
    const many = generateDailyLogs(createRng(10), { curve: CURVE, ratedKw: RATED_KW, days: 400 });
    expect(fitFuelCurve(many, { ratedKw: RATED_KW, shopTest: SHOP }).priorUsed).toBe(false);
    const w20 = fitFuelCurve(many.slice(0, 20), { ratedKw: RATED_KW, shopTest: SHOP }).priorWeightDays;
    const w5 = fitFuelCurve(many.slice(0, 5), { ratedKw: RATED_KW, shopTest: SHOP }).priorWeightDays;
    expect(w20).toBeLessThan(w5);
    expect(fitFuelCurve(few, { ratedKw: RATED_KW }).warnings.join(' ')).toContain('no shop-test prior');
  });
});

describe("within-day load variation (Jensen's inequality; E[P²] = Var P + (E P)², any probability text)", () => {
  it('c·σ² matches a seeded Monte Carlo mean of F over normally varying load', () => {
    const rng = createRng(12);
    const mu = 600;
    const sd = 150;
    const n = 200000;
    let sum = 0;
    let sum2 = 0;
    for (let i = 0; i < n; i++) {
      const f = fuelRateAt({ curve: CURVE }, rng.normal(mu, sd));
      sum += f;
      sum2 += f * f;
    }
    const mean = sum / n;
    const se = Math.sqrt((sum2 / n - mean * mean) / n);
    const bias = withinDayFuelBiasKgPerH(CURVE, sd);
    expect(bias).toBeCloseTo(1e-4 * 150 * 150, 12);
    // 4 Monte Carlo standard errors.
    expect(Math.abs(mean - fuelRateAt({ curve: CURVE }, mu) - bias)).toBeLessThan(4 * se);
  });
});

describe('bad input', () => {
  const ok = { loadKw: 500, fuelKgPerH: 100, hoursRun: 10 };
  it('throws with a message naming the requirement', () => {
    expect(() => fitFuelCurve([ok, ok, { ...ok, hoursRun: 0 }], { ratedKw: RATED_KW })).toThrow('fitFuelCurve requires at least 3 days with load');
    expect(() => fitFuelCurve([ok, ok, ok], { ratedKw: 0 })).toThrow('fitFuelCurve requires ratedKw > 0');
    expect(() => fitFuelCurve([ok, ok, { ...ok, fuelKgPerH: NaN }], { ratedKw: RATED_KW })).toThrow('fitFuelCurve requires finite fuelKgPerH');
    expect(() => fitFuelCurve([ok, ok, { ...ok, loadKw: -1 }], { ratedKw: RATED_KW })).toThrow('≥ 0');
    expect(() => fitFuelCurve([ok, ok, ok], { ratedKw: RATED_KW })).toThrow('fitFuelCurve requires at least 3 distinct loads');
  });

  it('exactly 3 days and no prior: no degrees of freedom, bands NaN, a warning', () => {
    const pts = [300, 600, 900].map((loadKw) => ({ loadKw, fuelKgPerH: fuelRateAt({ curve: CURVE }, loadKw), hoursRun: 10 }));
    const fit = fitFuelCurve(pts, { ratedKw: RATED_KW });
    expect(fit.dof).toBe(0);
    expect(Number.isNaN(fit.atLoads[0].upperGPerKwh)).toBe(true);
    expect(fit.warnings.join(' ')).toContain('no residual degrees of freedom');
    expect(rel(fit.coefficients.c, CURVE.c)).toBeLessThan(1e-8);
  });
});
