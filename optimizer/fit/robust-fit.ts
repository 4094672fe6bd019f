/**
 * Robust (M-estimation) weighted polynomial least squares by iteratively reweighted least squares, with
 * optional non-negativity bounds, shared by the fuel-curve fit and the drift regression.
 */
import {
  boundedPolynomialLeastSquares,
  polynomialLeastSquares,
  type BoundedLeastSquaresResult,
  type LeastSquaresResult,
} from './least-squares';
import { HUBER_K, TUKEY_C, robustPsiDerivative, robustScale, robustWeight, type RobustMethod } from './robust';

export interface RobustLeastSquaresOptions {
  /** Powers of x; default [0, 1, 2]. */
  powers?: number[];
  /** Base weights (precision ∝ weight); default 1 each. */
  weights?: number[];
  /** Powers whose coefficient must be ≥ 0 (solved exactly by boundedPolynomialLeastSquares). */
  nonNegative?: number[];
  /** Default 'huber'. */
  robust?: RobustMethod;
  /** Huber k (default 1.345) or Tukey c (default 4.685). */
  tuning?: number;
  /** Only the first `robustCount` observations are reweighted and enter the scale; default all. */
  robustCount?: number;
  /** Cap per stage; default 50. */
  maxIterations?: number;
}

export interface RobustLeastSquaresResult {
  /** The final weighted fit (base × robust weights). Its covariance is replaced below for robust fits. */
  fit: BoundedLeastSquaresResult;
  /** Covariance of β: Huber's M-estimate covariance for robust fits, the weighted fit's otherwise. */
  covariance: number[][];
  standardErrors: number[];
  /** Robust scale (normalised MAD) for robust fits, else the weighted residual SD; per unit base weight. */
  residualSd: number;
  robustWeights: number[];
  /** Base × robust weight per observation. */
  finalWeights: number[];
  /** Standardised residuals rᵢ·√wᵢ / scale of the robust observations (NaN for a non-robust fit). */
  standardizedResiduals: number[];
  iterations: number;
  converged: boolean;
}

/**
 * Huber's covariance of an M-estimate (Huber & Ronchetti, Robust Statistics, 2nd ed., §7.6, with the small-
 * sample factor K = 1 + (p/n)·Var(ψ')/E(ψ')²): K²·[Σψ²/(n−p)]/[Σψ'/n]²·σ̂²·(XᵀWX)⁻¹, W the base weights.
 * Null when no observation lies inside the support of ψ'.
 */
function huberCovariance(
  z: number[],
  p: number,
  scale: number,
  stage: { method: RobustMethod; k: number },
  baseFit: LeastSquaresResult,
): number[][] | null {
  const n = z.length;
  let sumPsi2 = 0;
  let sumD = 0;
  let sumD2 = 0;
  for (const zj of z) {
    const psi = zj * robustWeight(zj, stage.method, stage.k);
    const d = robustPsiDerivative(zj, stage.method, stage.k);
    sumPsi2 += psi * psi;
    sumD += d;
    sumD2 += d * d;
  }
  const meanD = sumD / n;
  if (!(meanD > 0) || !(baseFit.residualSd > 0) || n <= p) return null;
  const varD = sumD2 / n - meanD * meanD;
  const kFactor = 1 + ((p / n) * varD) / (meanD * meanD);
  const factor = (kFactor * kFactor * (sumPsi2 / (n - p))) / (meanD * meanD);
  const unit = (factor * scale * scale) / (baseFit.residualSd * baseFit.residualSd);
  return baseFit.covariance.map((row) => row.map((v) => v * unit));
}

/**
 * Robust weighted polynomial least squares by IRLS on MAD-scaled residuals.
 *
 * Method: Huber & Ronchetti, Robust Statistics, §7.8 (IRLS): weights u(zᵢ) = ψ(zᵢ)/zᵢ with zᵢ = rᵢ√wᵢ / ŝ, ŝ the
 * normalised MAD, re-estimated every step; stop when no weight changes by more than 1e-4. 'tukey' first runs
 * Huber to convergence (a redescending ψ needs a good start). Covariance: Huber's M-estimate covariance
 * (see huberCovariance above), conditional on the bounds' active set. An (almost) exact fit stops at once.
 * Cost: one (bounded) least-squares solve per iteration, typically 5–20 iterations.
 * Throws as polynomialLeastSquares.
 *
 * @example robustPolynomialLeastSquares([1, 2, 3, 4, 5], [1, 2, 3, 40, 5], { powers: [0, 1] }).robustWeights[3] // < 0.1
 */
export function robustPolynomialLeastSquares(x: number[], y: number[], options: RobustLeastSquaresOptions = {}): RobustLeastSquaresResult {
  const powers = options.powers ?? [0, 1, 2];
  const n = x.length;
  const baseW = options.weights ?? new Array<number>(n).fill(1);
  const bounded = options.nonNegative ?? [];
  const robust = options.robust ?? 'huber';
  const nRobust = options.robustCount ?? n;
  const maxIterations = options.maxIterations ?? 50;
  const solve = (weights: number[]): BoundedLeastSquaresResult =>
    bounded.length > 0
      ? boundedPolynomialLeastSquares(x, y, { powers, weights, nonNegative: bounded })
      : { ...polynomialLeastSquares(x, y, { powers, weights }), activeAtZero: [] };

  const stages: { method: RobustMethod; k: number }[] =
    robust === 'none'
      ? []
      : robust === 'huber'
        ? [{ method: 'huber', k: options.tuning ?? HUBER_K }]
        : [{ method: 'huber', k: HUBER_K }, { method: 'tukey', k: options.tuning ?? TUKEY_C }];
  const u = new Array<number>(n).fill(1);
  const w = baseW.slice();
  let fit = solve(w);
  let iterations = 0;
  let converged = true;
  let scale = NaN;
  let exact = false;
  let yScale = 0;
  for (const v of y) yScale = Math.max(yScale, Math.abs(v));
  const scaledResiduals = (): number[] => {
    const out: number[] = [];
    for (let j = 0; j < nRobust; j++) out.push(fit.residuals[j] * Math.sqrt(baseW[j]));
    return out;
  };
  for (const stage of stages) {
    converged = false;
    for (let it = 0; it < maxIterations; it++) {
      iterations++;
      const scaled = scaledResiduals();
      scale = robustScale(scaled);
      if (!(scale > 1e-12 * yScale)) {
        exact = true; // (near-)exact fit: nothing to down-weight
        u.fill(1);
        fit = solve(baseW);
        converged = true;
        break;
      }
      let change = 0;
      for (let j = 0; j < nRobust; j++) {
        const next = robustWeight(scaled[j] / scale, stage.method, stage.k);
        change = Math.max(change, Math.abs(next - u[j]));
        u[j] = next;
        w[j] = baseW[j] * next;
      }
      fit = solve(w);
      if (change < 1e-4) {
        converged = true;
        break;
      }
    }
    if (exact) break;
  }

  let covariance = fit.covariance;
  let residualSd = fit.residualSd;
  const standardizedResiduals = new Array<number>(nRobust).fill(NaN);
  const finalStage = stages[stages.length - 1];
  if (finalStage && !exact && fit.dof > 0) {
    const z = scaledResiduals().map((r) => r / scale);
    z.forEach((v, j) => (standardizedResiduals[j] = v));
    const free = powers.filter((q) => !fit.activeAtZero.includes(q));
    const base = polynomialLeastSquares(x, y, { powers: free, weights: baseW });
    const corrected = huberCovariance(z, free.length, scale, finalStage, base);
    if (corrected) {
      const size = fit.covariance.length;
      covariance = Array.from({ length: size }, (_, i) => Array.from({ length: size }, (_, j) => corrected[i]?.[j] ?? 0));
      residualSd = scale;
    }
  }
  return {
    fit,
    covariance,
    standardErrors: covariance.map((row, i) => Math.sqrt(row[i])),
    residualSd,
    robustWeights: u,
    finalWeights: w,
    standardizedResiduals,
    iterations,
    converged,
  };
}
