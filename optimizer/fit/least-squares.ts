/**
 * Weighted polynomial least squares by QR on a centred and scaled abscissa, and its bound-constrained variant.
 *
 * The design columns are powers of z = (x − m) / s (m the weighted mean of x when the model has an intercept,
 * else 0; s the largest |x − m|), the system √W·Z·α ≈ √W·y is solved by Householder QR (ml-matrix), and the
 * coefficients and covariance are mapped back to powers of x. This is the method of Golub & Van Loan, Matrix
 * Computations, §5.3 (least squares by QR), which avoids squaring the condition number as the normal equations
 * do. The covariance is s²·(RᵀR)⁻¹ (Seber & Lee, Linear Regression Analysis, §3.3), transformed linearly.
 */
import { Matrix, QrDecomposition, inverse } from 'ml-matrix';

export interface LeastSquaresOptions {
  /** Powers of x in the model; default [0, 1, 2] (quadratic). Entries must be distinct whole numbers ≥ 0. */
  powers?: number[];
  /** Weight per observation (precision ∝ weight); default 1 each. Zero weight drops an observation. */
  weights?: number[];
}

export interface LeastSquaresResult {
  /** β_j of x^j for j = 0 … max power; powers absent from the model are exactly 0. */
  coefficients: number[];
  /** Covariance of the coefficients, σ̂²·(XᵀWX)⁻¹ in original units; rows/columns of absent powers are 0. */
  covariance: number[][];
  standardErrors: number[];
  /** √(Σ wᵢ rᵢ² / dof): the residual SD of an observation of weight 1. NaN when dof = 0. */
  residualSd: number;
  /** Σ wᵢ rᵢ² (weighted residual sum of squares). */
  residualSumSquares: number;
  /** Observations with weight > 0, minus the number of coefficients. */
  dof: number;
  /** 1 − RSS / Σ wᵢ (yᵢ − ȳ_w)², ȳ_w the weighted mean (centred R², also for models without intercept). */
  rSquared: number;
  fitted: number[];
  residuals: number[];
}

const RANK_TOLERANCE = 1e-10;

function binomial(n: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return r;
}

function checkPowers(powers: number[]): void {
  if (powers.length === 0) throw new Error('polynomialLeastSquares requires at least one power');
  const seen = new Set<number>();
  for (const p of powers) {
    if (!Number.isInteger(p) || p < 0) throw new Error('polynomialLeastSquares requires whole powers ≥ 0');
    if (seen.has(p)) throw new Error('polynomialLeastSquares requires distinct powers');
    seen.add(p);
  }
}

/**
 * Weighted least-squares fit of y ≈ Σ_j β_j x^j over the given powers, solved by QR on a centred, scaled x.
 *
 * Reference: Golub & Van Loan, Matrix Computations, §5.3; checked against NIST StRD Norris and Pontius.
 * Centring is used when the powers are 0, 1, …, d (the span is unchanged); otherwise x is only scaled.
 * Cost: O(n·p²) for n observations and p powers (one Householder QR), plus O(p³).
 * Throws on mismatched lengths, non-finite values, negative weights, fewer positive-weight observations than
 * powers, or a rank-deficient design (too few distinct x).
 *
 * @example polynomialLeastSquares([1, 2, 3, 4], [3, 5, 7, 9], { powers: [0, 1] }).coefficients // [1, 2]
 */
export function polynomialLeastSquares(x: number[], y: number[], options: LeastSquaresOptions = {}): LeastSquaresResult {
  const powers = options.powers ?? [0, 1, 2];
  checkPowers(powers);
  const n = x.length;
  if (y.length !== n) throw new Error('polynomialLeastSquares requires x and y of equal length');
  const w = options.weights ?? new Array<number>(n).fill(1);
  if (w.length !== n) throw new Error('polynomialLeastSquares requires one weight per observation');
  let sumW = 0;
  let sumWx = 0;
  let used = 0;
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(x[i]) || !Number.isFinite(y[i])) throw new Error('polynomialLeastSquares requires finite x and y');
    if (!(w[i] >= 0) || !Number.isFinite(w[i])) throw new Error('polynomialLeastSquares requires finite weights ≥ 0');
    if (w[i] > 0) used++;
    sumW += w[i];
    sumWx += w[i] * x[i];
  }
  const p = powers.length;
  if (used < p) throw new Error(`polynomialLeastSquares requires at least ${p} observations with weight > 0`);

  const degree = Math.max(...powers);
  const contiguous = powers.every((q) => q < p) && p === degree + 1;
  const m = contiguous ? sumWx / sumW : 0;
  let s = 0;
  for (let i = 0; i < n; i++) if (w[i] > 0) s = Math.max(s, Math.abs(x[i] - m));
  if (!(s > 0)) throw new Error('polynomialLeastSquares requires at least two distinct x values');

  // Augmented design [√W·Z | √W·y] in z = (x − m) / s. Its QR gives R (top-left p×p) and Qᵀ√W·y (top of the
  // last column) at once, so the tall Q is never applied (Golub & Van Loan §5.3.3 — from memory).
  const z = new Float64Array(n);
  for (let i = 0; i < n; i++) z[i] = (x[i] - m) / s;
  const aug = new Matrix(used, p + 1);
  let row = 0;
  for (let i = 0; i < n; i++) {
    if (w[i] === 0) continue;
    const sw = Math.sqrt(w[i]);
    for (let k = 0; k < p; k++) aug.set(row, k, sw * z[i] ** powers[k]);
    aug.set(row, p, sw * y[i]);
    row++;
  }
  const rAug = new QrDecomposition(aug).upperTriangularMatrix;
  const r = rAug.subMatrix(0, p - 1, 0, p - 1);
  let maxDiag = 0;
  for (let k = 0; k < p; k++) maxDiag = Math.max(maxDiag, Math.abs(r.get(k, k)));
  for (let k = 0; k < p; k++) {
    if (!(Math.abs(r.get(k, k)) > RANK_TOLERANCE * maxDiag)) {
      throw new Error('polynomialLeastSquares: the design is rank deficient (too few distinct x for the powers)');
    }
  }
  const rInv = inverse(r);
  const alpha = rInv.mmul(rAug.subMatrix(0, p - 1, p, p)).getColumn(0);

  const fitted = new Array<number>(n);
  const residuals = new Array<number>(n);
  let rss = 0;
  let sumWy = 0;
  for (let i = 0; i < n; i++) {
    let f = 0;
    for (let k = 0; k < p; k++) f += alpha[k] * z[i] ** powers[k];
    fitted[i] = f;
    residuals[i] = y[i] - f;
    rss += w[i] * residuals[i] * residuals[i];
    sumWy += w[i] * y[i];
  }
  const meanY = sumWy / sumW;
  let tss = 0;
  for (let i = 0; i < n; i++) tss += w[i] * (y[i] - meanY) ** 2;
  const dof = used - p;
  const sigma2 = dof > 0 ? rss / dof : NaN;

  // α-covariance (unit σ²): R⁻¹R⁻ᵀ. Map α → β with T[j][k] = C(q_k, j)(−m)^{q_k−j} / s^{q_k}.
  const covAlpha = rInv.mmul(rInv.transpose());
  const t = Matrix.zeros(degree + 1, p);
  for (let k = 0; k < p; k++) {
    const q = powers[k];
    for (let j = 0; j <= q; j++) t.set(j, k, (binomial(q, j) * (-m) ** (q - j)) / s ** q);
  }
  const beta = t.mmul(Matrix.columnVector(alpha)).getColumn(0);
  const cov = t.mmul(covAlpha).mmul(t.transpose()).mul(sigma2).to2DArray();
  // Absent powers are exactly zero (not round-off).
  for (let j = 0; j <= degree; j++) {
    if (!powers.includes(j)) {
      beta[j] = 0;
      for (let l = 0; l <= degree; l++) {
        cov[j][l] = 0;
        cov[l][j] = 0;
      }
    }
  }
  return {
    coefficients: beta,
    covariance: cov,
    standardErrors: cov.map((row, j) => Math.sqrt(row[j])),
    residualSd: Math.sqrt(sigma2),
    residualSumSquares: rss,
    dof,
    rSquared: tss > 0 ? 1 - rss / tss : 1,
    fitted,
    residuals,
  };
}

export interface BoundedLeastSquaresResult extends LeastSquaresResult {
  /** Powers whose coefficient was held at 0 by its bound (the active set of the solution). */
  activeAtZero: number[];
}

/**
 * Weighted polynomial least squares with β_j ≥ 0 for the listed powers (e.g. a ≥ 0 and c ≥ 0 of a fuel curve).
 *
 * Method: active-set enumeration. The problem is a convex quadratic programme with bounds; its solution, with
 * active set A, is the unconstrained least-squares solution on the face β_A = 0. Each subset A of the bounded
 * powers is solved with polynomialLeastSquares on the remaining powers, and the feasible solution with the
 * least weighted residual sum of squares is the constrained optimum (exact, no clipping; see Lawson & Hanson,
 * Solving Least Squares Problems, ch. 23, for the same characterisation). When the unconstrained fit is
 * feasible it is returned at once. The covariance is that of the chosen face (conditional on the active set):
 * coefficients held at 0 have standard error 0, and dof counts only the free coefficients.
 * Cost: at most 2^k QR solves for k bounded powers (4 for a fuel curve).
 * Throws as polynomialLeastSquares; also when a bounded power is not in the model.
 *
 * @example boundedPolynomialLeastSquares([1, 2, 3], [2, 3, 3.5], { nonNegative: [2] }).activeAtZero // [2]
 */
export function boundedPolynomialLeastSquares(
  x: number[],
  y: number[],
  options: LeastSquaresOptions & { nonNegative: number[] },
): BoundedLeastSquaresResult {
  const powers = options.powers ?? [0, 1, 2];
  const bounded = options.nonNegative;
  for (const q of bounded) {
    if (!powers.includes(q)) throw new Error(`boundedPolynomialLeastSquares: bounded power ${q} is not in the model`);
  }
  const feasible = (res: LeastSquaresResult, free: number[]) =>
    bounded.every((q) => !free.includes(q) || res.coefficients[q] >= 0);
  const full = polynomialLeastSquares(x, y, { powers, weights: options.weights });
  if (feasible(full, powers)) return { ...full, activeAtZero: [] };

  let best: BoundedLeastSquaresResult | null = null;
  for (let mask = 1; mask < 1 << bounded.length; mask++) {
    const active = bounded.filter((_, i) => mask & (1 << i));
    const free = powers.filter((q) => !active.includes(q));
    if (free.length === 0) continue;
    let res: LeastSquaresResult;
    try {
      res = polynomialLeastSquares(x, y, { powers: free, weights: options.weights });
    } catch {
      continue; // a face may be degenerate (e.g. too few points for it); others remain
    }
    if (!feasible(res, free)) continue;
    const degree = Math.max(...powers);
    // Pad to the full model's length so every candidate reports β_0 … β_degree.
    while (res.coefficients.length <= degree) {
      res.coefficients.push(0);
      res.standardErrors.push(0);
      for (const row of res.covariance) row.push(0);
      res.covariance.push(new Array<number>(degree + 1).fill(0));
    }
    if (best === null || res.residualSumSquares < best.residualSumSquares) best = { ...res, activeAtZero: active };
  }
  if (best === null) throw new Error('boundedPolynomialLeastSquares found no feasible solution (degenerate data)');
  return best;
}
