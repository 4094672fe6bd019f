/**
 * Student t distribution: cumulative probability and quantile.
 *
 * simple-statistics has no t quantile, so it is computed here from the regularised incomplete beta function
 * I_x(a, b), evaluated by its continued fraction (Abramowitz & Stegun, Handbook of Mathematical Functions,
 * 26.5.8; modified Lentz evaluation as in Press et al., Numerical Recipes, 2nd ed., §5.2 and §6.4), with
 * ln Γ from simple-statistics. The t tail is P(T > t) = ½ I_{ν/(ν+t²)}(ν/2, ½) (A&S 26.7.1 with 26.5.27).
 */
import { gammaln, probit } from 'simple-statistics';

const CF_MAX_ITERATIONS = 300;
const CF_EPS = 1e-15;
const TINY = 1e-300;

/** Continued fraction of I_x(a, b) (A&S 26.5.8), modified Lentz. Converges fast for x < (a + 1) / (a + b + 2). */
function betaContinuedFraction(x: number, a: number, b: number): number {
  const qab = a + b;
  const qap = a + 1;
  const qam = a - 1;
  let c = 1;
  let d = 1 - (qab * x) / qap;
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= CF_MAX_ITERATIONS; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((qam + m2) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (qab + m) * x) / ((a + m2) * (qap + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < CF_EPS) return h;
  }
  throw new Error(`regularizedIncompleteBeta did not converge for a=${a}, b=${b}, x=${x}`);
}

/**
 * Regularised incomplete beta function I_x(a, b) = B(x; a, b) / B(a, b).
 *
 * Reference: Abramowitz & Stegun 26.5.8 (continued fraction) and the symmetry I_x(a,b) = 1 − I_{1−x}(b,a).
 * Cost: O(√max(a, b)) continued-fraction terms, typically < 50. Throws for a ≤ 0, b ≤ 0 or x outside [0, 1].
 *
 * @example regularizedIncompleteBeta(0.5, 2, 2) // 0.5
 */
export function regularizedIncompleteBeta(x: number, a: number, b: number): number {
  if (!(a > 0) || !(b > 0)) throw new Error('regularizedIncompleteBeta requires a > 0 and b > 0');
  if (!(x >= 0 && x <= 1)) throw new Error('regularizedIncompleteBeta requires 0 ≤ x ≤ 1');
  if (x === 0 || x === 1) return x;
  const lnFront = gammaln(a + b) - gammaln(a) - gammaln(b) + a * Math.log(x) + b * Math.log1p(-x);
  const front = Math.exp(lnFront);
  if (x < (a + 1) / (a + b + 2)) return (front * betaContinuedFraction(x, a, b)) / a;
  return 1 - (front * betaContinuedFraction(1 - x, b, a)) / b;
}

function checkDof(dof: number, name: string): void {
  if (!(dof > 0) || !Number.isFinite(dof)) throw new Error(`${name} requires degrees of freedom > 0`);
}

/** Upper tail P(T > t) for t ≥ 0, without cancellation. */
function studentTUpperTail(t: number, dof: number): number {
  return 0.5 * regularizedIncompleteBeta(dof / (dof + t * t), dof / 2, 0.5);
}

/**
 * Cumulative probability P(T ≤ t) of Student's t with `dof` degrees of freedom (dof may be fractional).
 *
 * Reference: A&S 26.7.1 via the incomplete beta function. Cost: one incomplete beta evaluation.
 * Throws when dof ≤ 0 or t is NaN.
 *
 * @example studentTCdf(2.228, 10) // ≈ 0.975
 */
export function studentTCdf(t: number, dof: number): number {
  checkDof(dof, 'studentTCdf');
  if (Number.isNaN(t)) throw new Error('studentTCdf requires a number t');
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  const upper = studentTUpperTail(Math.abs(t), dof);
  return t >= 0 ? 1 - upper : upper;
}

function studentTDensity(t: number, dof: number): number {
  const lnC = gammaln((dof + 1) / 2) - gammaln(dof / 2) - 0.5 * Math.log(dof * Math.PI);
  return Math.exp(lnC - ((dof + 1) / 2) * Math.log1p((t * t) / dof));
}

/**
 * Quantile t such that P(T ≤ t) = p for Student's t with `dof` degrees of freedom.
 *
 * Reference: inversion of A&S 26.7.1 by safeguarded Newton iteration (bracketing bisection fallback), solving
 * on the upper tail so that p near 1 keeps full relative precision. Cost: ~5–40 incomplete beta evaluations.
 * Throws when p is not strictly between 0 and 1 or dof ≤ 0.
 *
 * @example studentTQuantile(0.975, 10) // ≈ 2.228 (two-sided 95 % critical value)
 */
export function studentTQuantile(p: number, dof: number): number {
  checkDof(dof, 'studentTQuantile');
  if (!(p > 0 && p < 1)) throw new Error('studentTQuantile requires 0 < p < 1');
  if (p === 0.5) return 0;
  const sign = p > 0.5 ? 1 : -1;
  const q = p > 0.5 ? 1 - p : p; // target upper-tail probability of |t|
  // Bracket [lo, hi] with tail(lo) ≥ q ≥ tail(hi).
  let lo = 0;
  let hi = Math.max(1, Math.abs(probit(1 - q)));
  while (studentTUpperTail(hi, dof) > q) {
    lo = hi;
    hi *= 2;
    if (hi > 1e300) throw new Error('studentTQuantile: quantile too large to represent');
  }
  let t = Math.min(hi, Math.max(lo, Math.abs(probit(1 - q))));
  for (let iter = 0; iter < 200; iter++) {
    const f = studentTUpperTail(t, dof) - q; // decreasing in t
    if (f === 0) break;
    if (f > 0) lo = t;
    else hi = t;
    let next = t + f / studentTDensity(t, dof); // Newton on the decreasing tail
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - t) <= 1e-14 * Math.max(1, t)) {
      t = next;
      break;
    }
    t = next;
  }
  return sign * t;
}
