import { linearRegression, weightedLinearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { boundedPolynomialLeastSquares, fitFuelCurve, type DailyFuelPoint } from '../../optimizer/fit';
import { createRng } from '../../optimizer/random';

const RATED_KW = 1000;
/** Agreement with closed-form / simple-statistics solutions (both exact up to round-off). */
const EXACT_REL_TOL = 1e-9;
/** Agreement with HiGHS' interior-point/active-set QP solution (its default optimality tolerance is ~1e-7). */
const HIGHS_REL_TOL = 1e-5;

function pointsFrom(f: (p: number) => number, seed: number, n = 200, noise = 1): DailyFuelPoint[] {
  const rng = createRng(seed);
  return Array.from({ length: n }, () => {
    const loadKw = RATED_KW * (0.3 + 0.7 * rng.uniform());
    return { loadKw, fuelKgPerH: f(loadKw) + rng.normal(0, noise), hoursRun: 2 + 22 * rng.uniform() };
  });
}

function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
}

describe('concave data: c ≥ 0 active, so the constrained optimum is the straight-line fit', () => {
  const points = pointsFrom((p) => 20 + 0.25 * p - 3e-5 * p * p, 21);

  it('equal weights: c = 0 exactly and (a, b) equal simple-statistics linearRegression', () => {
    const fit = fitFuelCurve(points, { ratedKw: RATED_KW, weighting: 'equal', robust: 'none' });
    expect(fit.coefficients.c).toBe(0);
    expect(fit.standardErrors.c).toBe(0);
    expect(fit.activeConstraints).toEqual(['c']);
    const line = linearRegression(points.map((p) => [p.loadKw, p.fuelKgPerH]));
    expect(rel(fit.coefficients.a, line.b)).toBeLessThan(EXACT_REL_TOL);
    expect(rel(fit.coefficients.b, line.m)).toBeLessThan(EXACT_REL_TOL);
    // The unconstrained fit is indeed concave (the bound had to act).
    expect(fitFuelCurve(points, { ratedKw: RATED_KW, weighting: 'equal', robust: 'none', constrained: false }).coefficients.c).toBeLessThan(0);
  });

  it('hours weights: (a, b) equal simple-statistics weightedLinearRegression', () => {
    const fit = fitFuelCurve(points, { ratedKw: RATED_KW, robust: 'none' });
    expect(fit.coefficients.c).toBe(0);
    const line = weightedLinearRegression(
      points.map((p) => [p.loadKw, p.fuelKgPerH]),
      points.map((p) => p.hoursRun),
    );
    expect(rel(fit.coefficients.a, line.b)).toBeLessThan(EXACT_REL_TOL);
    expect(rel(fit.coefficients.b, line.m)).toBeLessThan(EXACT_REL_TOL);
  });
});

describe('both bounds active: the optimum is the regression through the origin, b = Σwxy / Σwx² (least squares through the origin, any regression textbook — common practice)', () => {
  it('matches the closed form (straight line through the origin plus noise; seed 24 gives a < 0 and c < 0 unconstrained)', () => {
    const points = pointsFrom((p) => 0.2 * p, 24);
    const free = fitFuelCurve(points, { ratedKw: RATED_KW, robust: 'none', constrained: false });
    expect(free.coefficients.a).toBeLessThan(0);
    expect(free.coefficients.c).toBeLessThan(0);
    const fit = fitFuelCurve(points, { ratedKw: RATED_KW, robust: 'none' });
    expect([...fit.activeConstraints].sort()).toEqual(['a', 'c']);
    let sxy = 0;
    let sxx = 0;
    for (const p of points) {
      sxy += p.hoursRun * p.loadKw * p.fuelKgPerH;
      sxx += p.hoursRun * p.loadKw * p.loadKw;
    }
    expect(fit.coefficients.a).toBe(0);
    expect(fit.coefficients.c).toBe(0);
    expect(rel(fit.coefficients.b, sxy / sxx)).toBeLessThan(EXACT_REL_TOL);
  });
});

describe('not clipping: both a and c negative unconstrained, yet only c is active at the optimum', () => {
  it('the optimum is the straight-line fit with a > 0 (simple-statistics weightedLinearRegression)', () => {
    const points = pointsFrom((p) => 0.2 * p + 8 * Math.exp(-(((p - 650) / 120) ** 2)), 22);
    const free = fitFuelCurve(points, { ratedKw: RATED_KW, robust: 'none', constrained: false });
    expect(free.coefficients.a).toBeLessThan(0);
    expect(free.coefficients.c).toBeLessThan(0);
    const fit = fitFuelCurve(points, { ratedKw: RATED_KW, robust: 'none' });
    expect(fit.activeConstraints).toEqual(['c']);
    const line = weightedLinearRegression(
      points.map((p) => [p.loadKw, p.fuelKgPerH]),
      points.map((p) => p.hoursRun),
    );
    expect(line.b).toBeGreaterThan(0);
    expect(rel(fit.coefficients.a, line.b)).toBeLessThan(EXACT_REL_TOL);
    expect(rel(fit.coefficients.b, line.m)).toBeLessThan(EXACT_REL_TOL);
  });
});

/** HiGHS QP in CPLEX LP format: minimise Σ wᵢ(yᵢ − a − b·u − c·u²)² with u = P / 1000 (MW) for scaling. */
async function highsBoundedQuadratic(points: DailyFuelPoint[]): Promise<{ a: number; b: number; c: number }> {
  const highs = await (await import('highs')).default();
  const h = [
    [0, 0, 0],
    [0, 0, 0],
    [0, 0, 0],
  ];
  const g = [0, 0, 0];
  const n = points.length;
  for (const p of points) {
    const u = p.loadKw / 1000;
    const row = [1, u, u * u];
    for (let i = 0; i < 3; i++) {
      g[i] += (p.hoursRun * row[i] * p.fuelKgPerH) / n;
      for (let j = 0; j < 3; j++) h[i][j] += (p.hoursRun * row[i] * row[j]) / n;
    }
  }
  const num = (v: number) => v.toExponential(16);
  const names = ['a', 'b', 'c'];
  const linear = names.map((v, i) => `${-2 * g[i] >= 0 ? '+' : '-'} ${num(Math.abs(2 * g[i]))} ${v}`).join(' ');
  const quad: string[] = [];
  for (let i = 0; i < 3; i++) {
    quad.push(`+ ${num(2 * h[i][i])} ${names[i]}^2`);
    for (let j = i + 1; j < 3; j++) quad.push(`${h[i][j] >= 0 ? '+' : '-'} ${num(Math.abs(4 * h[i][j]))} ${names[i]} * ${names[j]}`);
  }
  const lp = `Minimize\n obj: ${linear} + [ ${quad.join(' ')} ] / 2\nSubject To\nBounds\n a >= 0\n b free\n c >= 0\nEnd\n`;
  const sol = highs.solve(lp);
  expect(sol.Status).toBe('Optimal');
  const col = sol.Columns as Record<string, { Primal: number }>;
  return { a: col.a.Primal, b: col.b.Primal / 1000, c: col.c.Primal / 1e6 };
}

describe('intercept bound active (a ≥ 0): against HiGHS as an independent QP solver', () => {
  const points = pointsFrom((p) => -15 + 0.22 * p + 1e-5 * p * p, 23);

  it('a = 0 exactly and (b, c) agree with HiGHS', async () => {
    const fit = fitFuelCurve(points, { ratedKw: RATED_KW, robust: 'none' });
    expect(fit.activeConstraints).toEqual(['a']);
    expect(fit.coefficients.a).toBe(0);
    const ref = await highsBoundedQuadratic(points);
    expect(Math.abs(ref.a)).toBeLessThan(1e-6);
    expect(rel(fit.coefficients.b, ref.b)).toBeLessThan(HIGHS_REL_TOL);
    expect(rel(fit.coefficients.c, ref.c)).toBeLessThan(HIGHS_REL_TOL);
  });

  it('satisfies the KKT conditions (Nocedal & Wright, Numerical Optimization, 2nd ed., Thm 12.1)', () => {
    const x = points.map((p) => p.loadKw / 1000);
    const y = points.map((p) => p.fuelKgPerH);
    const w = points.map((p) => p.hoursRun);
    const res = boundedPolynomialLeastSquares(x, y, { weights: w, nonNegative: [0, 2] });
    // Gradient of ½Σw r² w.r.t. β_j is −Σ w r x^j: zero for free coefficients, ≤ 0 (multiplier ≥ 0) for active ones.
    const grad = [0, 1, 2].map((j) => -x.reduce((s, xi, i) => s + w[i] * res.residuals[i] * xi ** j, 0));
    const scale = y.reduce((s, yi, i) => s + w[i] * Math.abs(yi), 0);
    expect(res.activeAtZero).toEqual([0]);
    expect(grad[0]).toBeGreaterThan(0);
    expect(Math.abs(grad[1]) / scale).toBeLessThan(1e-12);
    expect(Math.abs(grad[2]) / scale).toBeLessThan(1e-12);
  });
});
