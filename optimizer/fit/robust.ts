/**
 * M-estimation weights for iteratively reweighted least squares (IRLS).
 *
 * Huber's ψ with k = 1.345 and Tukey's bisquare with c = 4.685 give 95 % asymptotic efficiency at the normal
 * distribution (Huber & Ronchetti, Robust Statistics, 2nd ed., §7; Fox & Weisberg, An R Companion to Applied
 * Regression, robust regression appendix). Residuals are standardised by the normalised median absolute
 * deviation, MAD / Φ⁻¹(3/4) (Hampel's estimator, Huber & Ronchetti §5.1).
 */
import { medianAbsoluteDeviation } from 'simple-statistics';

export type RobustMethod = 'huber' | 'tukey' | 'none';

/** Huber tuning constant for 95 % efficiency at the normal. */
export const HUBER_K = 1.345;
/** Tukey bisquare tuning constant for 95 % efficiency at the normal. */
export const TUKEY_C = 4.685;
/** Φ⁻¹(3/4): MAD / this estimates σ for normal data. */
const NORMAL_MAD_FACTOR = 0.6744897501960817;

/**
 * IRLS weight u(z) = ψ(z)/z of a standardised residual z.
 *
 * Huber: 1 for |z| ≤ k, else k/|z|. Tukey bisquare: (1 − (z/c)²)² for |z| < c, else 0. 'none': 1.
 * Reference: Huber & Ronchetti, Robust Statistics, §7.8 (IRLS). Cost: O(1). Throws on a non-positive tuning.
 *
 * @example robustWeight(2.69, 'huber') // 0.5
 */
export function robustWeight(z: number, method: RobustMethod, tuning?: number): number {
  if (method === 'none') return 1;
  const k = tuning ?? (method === 'huber' ? HUBER_K : TUKEY_C);
  if (!(k > 0)) throw new Error('robustWeight requires a tuning constant > 0');
  const a = Math.abs(z);
  if (method === 'huber') return a <= k ? 1 : k / a;
  if (a >= k) return 0;
  const u = z / k;
  return (1 - u * u) ** 2;
}

/**
 * Robust scale of residuals: MAD / Φ⁻¹(3/4) (≈ 1.4826·MAD), consistent for σ at the normal.
 *
 * Uses simple-statistics' medianAbsoluteDeviation (about the median). Cost: O(n log n).
 * Throws when the list is empty.
 *
 * @example robustScale([-1, 0, 1]) // 1.4826
 */
export function robustScale(residuals: number[]): number {
  if (residuals.length === 0) throw new Error('robustScale requires at least one residual');
  return medianAbsoluteDeviation(residuals) / NORMAL_MAD_FACTOR;
}

/**
 * Derivative ψ'(z) of the M-estimation ψ function, used by Huber's covariance correction.
 *
 * Huber: 1 for |z| ≤ k, else 0. Tukey bisquare: (1 − u²)(1 − 5u²) with u = z/c for |z| < c, else 0. 'none': 1.
 * Reference: Huber & Ronchetti, Robust Statistics, §7.6. Cost: O(1). Throws on a non-positive tuning.
 *
 * @example robustPsiDerivative(0, 'tukey') // 1
 */
export function robustPsiDerivative(z: number, method: RobustMethod, tuning?: number): number {
  if (method === 'none') return 1;
  const k = tuning ?? (method === 'huber' ? HUBER_K : TUKEY_C);
  if (!(k > 0)) throw new Error('robustPsiDerivative requires a tuning constant > 0');
  const a = Math.abs(z);
  if (method === 'huber') return a <= k ? 1 : 0;
  if (a >= k) return 0;
  const u2 = (z / k) ** 2;
  return (1 - u2) * (1 - 5 * u2);
}
