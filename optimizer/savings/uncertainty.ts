/**
 * Uncertainty of savings from the fitted curves' coefficient covariance: the delta method on fixed operations,
 * and multivariate normal draws of the coefficients for the seeded sampling.
 */
import { CholeskyDecomposition, EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { studentTQuantile } from '../fit/index';
import type { Rng } from '../random';
import type { CurveUncertainty, FuelSensitivity, SavingsInterval } from './types';

/** Degrees of freedom above which the t quantile is taken at this value (normal to ~5e-7). */
const NORMAL_DOF = 1e9;

/**
 * Two-sided critical value of Student's t (normal for dof = Infinity) at a confidence level.
 *
 * Cost: one t quantile. Throws when level is not in (0, 1) or dof ≤ 0.
 *
 * @example criticalValue(0.95, Infinity) // ≈ 1.95996
 */
export function criticalValue(level: number, dof: number): number {
  if (!(level > 0 && level < 1)) throw new Error('criticalValue requires 0 < level < 1');
  if (!(dof > 0)) throw new Error('criticalValue requires dof > 0');
  return studentTQuantile((1 + level) / 2, Math.min(dof, NORMAL_DOF));
}

/** Σ of factor·sensitivity over several (e.g. the days of a month, weighted by Cf or price). */
export function addScaledSensitivity(target: FuelSensitivity, source: FuelSensitivity, factor: number): void {
  for (const [id, g] of Object.entries(source)) {
    const t = (target[id] ??= [0, 0, 0]);
    for (let k = 0; k < 3; k++) t[k] += factor * g[k];
  }
}

/**
 * Delta-method interval of a quantity linear in the curve coefficients, e.g. the avoidable fuel of fixed actual
 * and recommended operations: Var = Σ_u g_uᵀ Σ_u g_u over units u, with g_u = Σ h·(1, P, P²) its sensitivity.
 *
 * The quantity is exactly linear in (a, b, c) for fixed operations, so the variance is exact given the
 * covariances. Re-optimising the recommendation under another curve changes the optimum only to second order
 * (envelope theorem: the optimum's gradient in the parameters is the gradient at the fixed optimal loads).
 * Critical value: Student t with Welch–Satterthwaite effective dof ν = (Σ v_u)² / Σ (v_u² / ν_u)
 * (Satterthwaite, Biometrics Bulletin 2 (1946) 110–114), v_u = g_uᵀ Σ_u g_u; normal when every ν_u is infinite.
 * Units without a fit contribute nothing (their curve counts as known).
 *
 * Cost: O(units). Throws when level is not in (0, 1).
 *
 * @example deltaInterval(195.28, { G1: [1, 400, 160000] }, { G1: { curve, covariance, dof: 30 } }).upperKg
 */
export function deltaInterval(
  estimateKg: number,
  sensitivity: FuelSensitivity,
  fits: Record<string, CurveUncertainty> = {},
  level = 0.95,
): SavingsInterval {
  if (!(level > 0 && level < 1)) throw new Error('deltaInterval requires 0 < level < 1');
  let variance = 0;
  let dofDenominator = 0;
  for (const [id, g] of Object.entries(sensitivity)) {
    const fit = fits[id];
    if (!fit) continue;
    let v = 0;
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) v += g[i] * fit.covariance[i][j] * g[j];
    v = Math.max(0, v);
    variance += v;
    const dof = fit.dof ?? Infinity;
    if (Number.isFinite(dof)) dofDenominator += (v * v) / dof;
  }
  const effectiveDof = dofDenominator > 0 ? (variance * variance) / dofDenominator : Infinity;
  const sdKg = Math.sqrt(variance);
  const half = sdKg > 0 ? criticalValue(level, effectiveDof) * sdKg : 0;
  return { level, estimateKg, sdKg, lowerKg: estimateKg - half, upperKg: estimateKg + half, effectiveDof, method: 'delta' };
}

/**
 * Sampler of the multivariate normal N(mean, covariance): x = mean + L·z with z standard normal and L·Lᵀ = Σ.
 *
 * L = D·L_R with D the standard deviations and L_R the Cholesky factor (ml-matrix) of the correlation matrix when
 * that is positive definite; a correlation matrix that is only semi-definite (a coefficient held at its bound has
 * zero variance) is factored as V·√Λ from its symmetric eigen-decomposition (ml-matrix), round-off eigenvalues
 * above −1e-9 set to 0. Reference: Gentle, Random Number Generation and Monte
 * Carlo Methods, 2nd ed., §5.3.1 (multivariate normal by a square-root factor of Σ).
 *
 * Cost: O(d³) once, O(d²) per draw. Throws when the covariance is not square of the mean's size, not symmetric,
 * or has a clearly negative eigenvalue.
 *
 * @example const draw = multivariateNormalSampler([1, 2], [[1, 0], [0, 4]]); draw(createRng(7)); // [x, y]
 */
export function multivariateNormalSampler(mean: number[], covariance: number[][]): (rng: Rng) => number[] {
  const d = mean.length;
  if (covariance.length !== d || covariance.some((row) => row.length !== d)) {
    throw new Error('multivariateNormalSampler requires a square covariance of the mean size');
  }
  for (let i = 0; i < d; i++) {
    if (!(covariance[i][i] >= 0) || !covariance[i].every(Number.isFinite)) {
      throw new Error('multivariateNormalSampler requires a finite covariance with variances ≥ 0');
    }
    for (let j = 0; j < i; j++) {
      const tol = 1e-9 * Math.sqrt(covariance[i][i] * covariance[j][j]) + 1e-300;
      if (Math.abs(covariance[i][j] - covariance[j][i]) > tol) throw new Error('multivariateNormalSampler requires a symmetric covariance');
    }
  }
  // Factor the correlation matrix (scale-free tolerances), then scale back: Σ = D·R·D, L = D·L_R.
  const sd = covariance.map((row, i) => Math.sqrt(row[i]));
  const corr = new Matrix(d, d);
  for (let i = 0; i < d; i++) {
    for (let j = 0; j < d; j++) {
      const denominator = sd[i] * sd[j];
      corr.set(i, j, i === j ? (sd[i] > 0 ? 1 : 0) : denominator > 0 ? (covariance[i][j] + covariance[j][i]) / (2 * denominator) : 0);
    }
  }
  let factor: Matrix;
  const cholesky = new CholeskyDecomposition(corr);
  if (cholesky.isPositiveDefinite()) factor = cholesky.lowerTriangularMatrix;
  else {
    const eig = new EigenvalueDecomposition(corr, { assumeSymmetric: true });
    const values = eig.realEigenvalues;
    if (values.some((v) => v < -1e-9)) throw new Error('multivariateNormalSampler requires a positive semi-definite covariance');
    const vectors = eig.eigenvectorMatrix;
    factor = new Matrix(d, d);
    for (let i = 0; i < d; i++) for (let j = 0; j < d; j++) factor.set(i, j, vectors.get(i, j) * Math.sqrt(Math.max(0, values[j])));
  }
  for (let i = 0; i < d; i++) for (let j = 0; j < d; j++) factor.set(i, j, factor.get(i, j) * sd[i]);
  const l = factor.to2DArray();
  return (rng: Rng) => {
    const z = mean.map(() => rng.normal());
    return mean.map((m, i) => {
      let x = m;
      for (let j = 0; j < d; j++) x += l[i][j] * z[j];
      return x;
    });
  };
}
