import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { fitFuelCurve, polynomialLeastSquares } from '../../optimizer/fit';

// NIST StRD linear least squares: certified values to 15 digits (tests/fixtures/nist-strd/certified.json).
/** Relative tolerance on estimates: at least 9 significant digits. */
const ESTIMATE_REL_TOL = 1e-9;
/** Relative tolerance on standard deviations and residual SD: at least 6 significant digits. */
const SD_REL_TOL = 1e-6;
/** Absolute tolerance on R². */
const R2_ABS_TOL = 1e-9;

interface Certified {
  estimates: number[];
  standardDeviations: number[];
  residualStandardDeviation: number;
  rSquared: number;
}
const certified = JSON.parse(readFileSync(new URL('../fixtures/nist-strd/certified.json', import.meta.url), 'utf8')) as {
  norris: Certified;
  pontius: Certified;
};

function readXy(name: string): { x: number[]; y: number[] } {
  const lines = readFileSync(new URL(`../fixtures/nist-strd/${name}.csv`, import.meta.url), 'utf8').trim().split('\n');
  expect(lines[0]).toBe('y,x');
  const rows = lines.slice(1).map((l) => l.split(',').map(Number));
  return { y: rows.map((r) => r[0]), x: rows.map((r) => r[1]) };
}

function rel(value: number, reference: number): number {
  return Math.abs(value - reference) / Math.abs(reference);
}

function expectCertified(
  got: { coefficients: number[]; standardErrors: number[]; residualSd: number; rSquared: number },
  cert: Certified,
): void {
  cert.estimates.forEach((b, j) => expect(rel(got.coefficients[j], b)).toBeLessThan(ESTIMATE_REL_TOL));
  cert.standardDeviations.forEach((sd, j) => expect(rel(got.standardErrors[j], sd)).toBeLessThan(SD_REL_TOL));
  expect(rel(got.residualSd, cert.residualStandardDeviation)).toBeLessThan(SD_REL_TOL);
  expect(Math.abs(got.rSquared - cert.rSquared)).toBeLessThan(R2_ABS_TOL);
}

const datasets = [
  { name: 'norris', label: 'NIST StRD Norris (linear)', powers: [0, 1], model: 'linear' as const, size: 36 },
  { name: 'pontius', label: 'NIST StRD Pontius (quadratic)', powers: [0, 1, 2], model: 'quadratic' as const, size: 40 },
];

describe.each(datasets)('$label', ({ name, powers, model, size }) => {
  const { x, y } = readXy(name);
  const cert = certified[name as 'norris' | 'pontius'];

  it(`has the ${size} observations of the NIST dataset`, () => {
    expect(x.length).toBe(size);
  });

  it('least-squares core reproduces the certified values (NIST StRD)', () => {
    const fit = polynomialLeastSquares(x, y, { powers });
    expect(fit.dof).toBe(size - powers.length);
    expectCertified(fit, cert);
  });

  it('fitFuelCurve in unweighted, unconstrained, non-robust mode reproduces the certified values (NIST StRD)', () => {
    const fit = fitFuelCurve(
      x.map((loadKw, i) => ({ loadKw, fuelKgPerH: y[i], hoursRun: 1 })),
      { ratedKw: Math.max(...x), model, weighting: 'equal', constrained: false, robust: 'none', prior: { use: 'never' } },
    );
    const coefficients = [fit.coefficients.a, fit.coefficients.b, fit.coefficients.c].slice(0, powers.length);
    const standardErrors = [fit.standardErrors.a, fit.standardErrors.b, fit.standardErrors.c].slice(0, powers.length);
    expectCertified({ coefficients, standardErrors, residualSd: fit.residualSdKgPerH, rSquared: fit.rSquared }, cert);
    expect(fit.priorUsed).toBe(false);
    expect(fit.outliers).toEqual([]);
  });
});

describe('NIST StRD Pontius: margin on the ill-conditioned quadratic term (x² up to 9e12)', () => {
  it('the certified B2 (NIST StRD Pontius) is recovered by the core to better than the 9-digit tolerance', () => {
    const { x, y } = readXy('pontius');
    const fit = polynomialLeastSquares(x, y);
    // The core must stay well inside the tolerance, not just at its edge.
    expect(rel(fit.coefficients[2], certified.pontius.estimates[2])).toBeLessThan(ESTIMATE_REL_TOL / 100);
  });
});
