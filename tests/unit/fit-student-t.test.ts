import { describe, expect, it } from 'vitest';
import { regularizedIncompleteBeta, studentTCdf, studentTQuantile } from '../../optimizer/fit';

/** Printed tables give 3 decimals: half a unit in the last place, plus round-off. */
const TABLE_TOL = 0.0005 + 1e-9;
/** Closed-form checks. */
const EXACT_TOL = 1e-11;

// Upper critical values t(1 − α, ν) from the NIST/SEMATECH e-Handbook of Statistical Methods, table of upper
// critical values of Student's t distribution (section 1.3.6.7.2 — section number from memory).
// Rows: [ν, 1 − α, t].
const NIST_HANDBOOK_T: [number, number, number][] = [
  [1, 0.9, 3.078], [1, 0.95, 6.314], [1, 0.975, 12.706], [1, 0.99, 31.821], [1, 0.995, 63.657],
  [2, 0.975, 4.303], [2, 0.99, 6.965],
  [3, 0.975, 3.182], [4, 0.975, 2.776], [5, 0.95, 2.015], [5, 0.975, 2.571],
  [8, 0.99, 2.896], [10, 0.9, 1.372], [10, 0.95, 1.812], [10, 0.975, 2.228], [10, 0.99, 2.764], [10, 0.995, 3.169],
  [15, 0.975, 2.131], [20, 0.995, 2.845], [25, 0.975, 2.06], [30, 0.975, 2.042],
  [40, 0.975, 2.021], [60, 0.975, 2.0], [100, 0.975, 1.984],
];

// The handbook's α = 0.001 column differs from the exact values in the last place for ν = 1 (318.313 against
// tan(0.499π) = 318.309) and ν = 10 (4.143 against 4.1437); that column is taken instead from the table of
// Quené & van den Bergh, Quantitative Methods and Statistics, appendix C (critical values for t), with the
// ν = 30 and ν = 100 entries of the handbook, which agree.
const QMS_T_0999: [number, number, number][] = [
  [1, 0.999, 318.309], [2, 0.999, 22.327], [5, 0.999, 5.893], [10, 0.999, 4.144], [30, 0.999, 3.385], [100, 0.999, 3.174],
];

describe('studentTQuantile against published t tables', () => {
  it.each([...NIST_HANDBOOK_T, ...QMS_T_0999])('t(ν = %d, p = %f) = %f', (dof, p, t) => {
    expect(Math.abs(studentTQuantile(p, dof) - t)).toBeLessThan(TABLE_TOL);
    // Symmetry: t(1 − p) = −t(p).
    expect(Math.abs(studentTQuantile(1 - p, dof) + t)).toBeLessThan(TABLE_TOL);
  });

  it('tends to the normal quantiles of the table\'s ∞ row (1.282, 1.645, 1.960, 2.326, 2.576, 3.090)', () => {
    const rows: [number, number][] = [[0.9, 1.282], [0.95, 1.645], [0.975, 1.96], [0.99, 2.326], [0.995, 2.576], [0.999, 3.09]];
    for (const [p, z] of rows) expect(Math.abs(studentTQuantile(p, 1e7) - z)).toBeLessThan(TABLE_TOL);
  });
});

describe('Student t closed forms (Johnson, Kotz & Balakrishnan, Continuous Univariate Distributions, vol. 2, ch. 28 — from memory)', () => {
  it('ν = 1 is the Cauchy distribution: t = tan(π(p − ½))', () => {
    for (const p of [0.01, 0.2, 0.6, 0.9, 0.975, 0.999]) {
      const exact = Math.tan(Math.PI * (p - 0.5));
      expect(Math.abs(studentTQuantile(p, 1) - exact)).toBeLessThan(EXACT_TOL * Math.max(1, Math.abs(exact)));
    }
  });

  it('ν = 2: t = (2p − 1) / √(2p(1 − p))', () => {
    for (const p of [0.001, 0.3, 0.55, 0.8, 0.975, 0.9999]) {
      const exact = (2 * p - 1) / Math.sqrt(2 * p * (1 - p));
      expect(Math.abs(studentTQuantile(p, 2) - exact)).toBeLessThan(EXACT_TOL * Math.max(1, Math.abs(exact)));
    }
  });

  it('ν = 2 cdf: F(t) = ½ + t / (2√(t² + 2))', () => {
    for (const t of [-30, -1.5, 0, 0.7, 4.303, 100]) {
      expect(Math.abs(studentTCdf(t, 2) - (0.5 + t / (2 * Math.sqrt(t * t + 2))))).toBeLessThan(EXACT_TOL);
    }
  });
});

describe('regularizedIncompleteBeta closed forms (Abramowitz & Stegun 26.5: I_x(a, 1) = x^a, I_x(1, b) = 1 − (1 − x)^b)', () => {
  it('matches x^a and 1 − (1 − x)^b', () => {
    for (const x of [0.01, 0.3, 0.5, 0.77, 0.99]) {
      for (const a of [0.5, 1, 3.5, 20]) {
        expect(Math.abs(regularizedIncompleteBeta(x, a, 1) - x ** a)).toBeLessThan(EXACT_TOL);
        expect(Math.abs(regularizedIncompleteBeta(x, 1, a) - (1 - (1 - x) ** a))).toBeLessThan(EXACT_TOL);
      }
    }
  });
});

describe('bad input', () => {
  it('throws on p outside (0, 1) or dof ≤ 0', () => {
    expect(() => studentTQuantile(1, 5)).toThrow('studentTQuantile requires 0 < p < 1');
    expect(() => studentTQuantile(0.5, 0)).toThrow('studentTQuantile requires degrees of freedom > 0');
    expect(() => studentTCdf(1, -1)).toThrow('studentTCdf requires degrees of freedom > 0');
  });
});
