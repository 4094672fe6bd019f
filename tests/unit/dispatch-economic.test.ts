import { describe, expect, it } from 'vitest';
import { dispatchLoad, equalSplit } from '../../optimizer/dispatch';
import type { DispatchResult, DispatchFeasible } from '../../optimizer/dispatch';
import { chordCurve, type GensetUnit } from '../../optimizer/plant';
import { quadraticSet, saadat74Units, saadat76Units, woodWollenbergUnits } from '../fixtures/dispatch/textbook-units';

/** Book figures are printed to 0.1 MW and lambda to 0.001 $/MWh. */
const BOOK_MW_TOL = 0.05 + 1e-9;
const BOOK_LAMBDA_TOL = 0.0005 + 1e-9;
/** Loads of the exact dispatch must add up to the demand to this relative tolerance. */
const BALANCE_REL_TOL = 1e-9;

function ok(result: DispatchResult): DispatchFeasible {
  if (!result.feasible) throw new Error(`expected a feasible dispatch, got: ${result.reason}`);
  return result;
}

function loads(result: DispatchFeasible): number[] {
  return result.units.map((u) => u.loadKw);
}

function sumLoads(result: DispatchFeasible): number {
  return loads(result).reduce((s, x) => s + x, 0);
}

describe('dispatchLoad: Wood & Wollenberg, Power Generation, Operation and Control, 2nd ed.', () => {
  it('Example 3A: 850 MW -> lambda 9.148 $/MWh, 393.2 / 334.6 / 122.2 MW', () => {
    const result = ok(dispatchLoad(woodWollenbergUnits([1.1, 1.0, 1.0]), 850));
    // Book values (Example 3A).
    expect(Math.abs(result.lambdaKgPerKwh! - 9.148)).toBeLessThan(BOOK_LAMBDA_TOL);
    const [p1, p2, p3] = loads(result);
    expect(Math.abs(p1 - 393.2)).toBeLessThan(BOOK_MW_TOL);
    expect(Math.abs(p2 - 334.6)).toBeLessThan(BOOK_MW_TOL);
    expect(Math.abs(p3 - 122.2)).toBeLessThan(BOOK_MW_TOL);
    // Closed form of the same example (no limit binds): lambda = (P + Σ b/2c) / Σ 1/2c, from the book's §3.1.
    const bc = [
      [7.2 * 1.1, 0.00142 * 1.1],
      [7.85, 0.00194],
      [7.97, 0.00482],
    ];
    const lambda = (850 + bc.reduce((s, [b, c]) => s + b / (2 * c), 0)) / bc.reduce((s, [, c]) => s + 1 / (2 * c), 0);
    expect(Math.abs(result.lambdaKgPerKwh! - lambda) / lambda).toBeLessThan(1e-8);
    bc.forEach(([b, c], i) => expect(Math.abs(loads(result)[i] - (lambda - b) / (2 * c))).toBeLessThan(1e-6));
    expect(Math.abs(sumLoads(result) - 850) / 850).toBeLessThan(BALANCE_REL_TOL);
  });

  it('Example 3B: unit 1 fuel at 0.9 $/MBtu hits its 600 MW limit; 600 / 187.1 / 62.9 MW (book figures from memory)', () => {
    const result = ok(dispatchLoad(woodWollenbergUnits([0.9, 1.0, 1.0]), 850));
    const [p1, p2, p3] = loads(result);
    expect(p1).toBe(600);
    // Check by computation: units 2 and 3 share 250 MW at equal incremental cost.
    const lambda = (250 + 7.85 / 0.00388 + 7.97 / 0.00964) / (1 / 0.00388 + 1 / 0.00964);
    expect(Math.abs(p2 - (lambda - 7.85) / 0.00388)).toBeLessThan(1e-6);
    expect(Math.abs(p3 - (lambda - 7.97) / 0.00964)).toBeLessThan(1e-6);
    // Book (from memory): 187.1 and 62.9 MW.
    expect(Math.abs(p2 - 187.1)).toBeLessThan(BOOK_MW_TOL);
    expect(Math.abs(p3 - 62.9)).toBeLessThan(BOOK_MW_TOL);
    // Unit 1's incremental cost at its limit is below lambda: the limit binds (Kuhn–Tucker condition, §3.1).
    expect(6.48 + 2 * 0.001278 * 600).toBeLessThan(result.lambdaKgPerKwh!);
  });
});

describe('dispatchLoad: Saadat, Power System Analysis', () => {
  const cost = (a: number, b: number, c: number, p: number): number => a + b * p + c * p * p;
  const saadatCost = (p: number[]): number =>
    cost(500, 5.3, 0.004, p[0]) + cost(400, 5.5, 0.006, p[1]) + cost(200, 5.8, 0.009, p[2]);

  it('Example 7.4: 800 MW -> lambda 8.5, 400 / 250 / 150 MW, 6682.5 $/h', () => {
    const result = ok(dispatchLoad(saadat74Units, 800));
    expect(Math.abs(result.lambdaKgPerKwh! - 8.5)).toBeLessThan(1e-8);
    [400, 250, 150].forEach((p, i) => expect(Math.abs(loads(result)[i] - p)).toBeLessThan(1e-6));
    expect(Math.abs(result.fuelKgPerH - 6682.5) / 6682.5).toBeLessThan(1e-9);
    expect(Math.abs(result.sfocGPerKwh! - (6682.5 * 1000) / 800)).toBeLessThan(1e-6);
  });

  it('Example 7.6: limits, 975 MW -> lambda 9.4, 450 (at limit) / 325 / 200 MW, 8236.25 $/h', () => {
    const result = ok(dispatchLoad(saadat76Units, 975));
    expect(Math.abs(result.lambdaKgPerKwh! - 9.4)).toBeLessThan(1e-8);
    [450, 325, 200].forEach((p, i) => expect(Math.abs(loads(result)[i] - p)).toBeLessThan(1e-6));
    expect(Math.abs(result.fuelKgPerH - 8236.25) / 8236.25).toBeLessThan(1e-9);
  });

  it('equal split vs optimal on Example 7.4: cost difference from the book cost functions', () => {
    const split = ok(equalSplit(saadat74Units, 800));
    loads(split).forEach((p) => expect(Math.abs(p - 800 / 3)).toBeLessThan(1e-9));
    const third = 800 / 3;
    const equalCost = saadatCost([third, third, third]); // 6877.78 $/h by hand
    expect(Math.abs(split.fuelKgPerH - equalCost)).toBeLessThan(1e-9 * equalCost);
    const optimal = ok(dispatchLoad(saadat74Units, 800));
    const differencePerH = split.fuelKgPerH - optimal.fuelKgPerH;
    expect(Math.abs(differencePerH - (equalCost - 6682.5))).toBeLessThan(1e-6);
    expect(Math.abs(differencePerH - 195.28)).toBeLessThan(0.005); // 6877.78 - 6682.5, by hand
  });
});

describe('dispatchLoad: piecewise and linear curves', () => {
  const CHORDS = 400;
  it('chord approximation of Example 3A converges to the quadratic dispatch (chord width 1.5 MW or less)', () => {
    const units = woodWollenbergUnits([1.1, 1.0, 1.0]).map((u): GensetUnit => {
      if (u.curve.kind !== 'quadratic') throw new Error('fixture is quadratic');
      return { ...u, curve: chordCurve(u.curve, 0, u.ratedKw, CHORDS) };
    });
    const result = ok(dispatchLoad(units, 850));
    // Merit order of chords stops within one chord of the exact optimum (Example 3A): chord width ≤ 600/400 MW.
    [393.17, 334.6, 122.23].forEach((p, i) => expect(Math.abs(loads(result)[i] - p)).toBeLessThan(1.5 + 0.01));
    expect(Math.abs(sumLoads(result) - 850)).toBeLessThan(1e-9 * 850);
  });

  it('mixed quadratic and straight-line sets meet the Kuhn–Tucker conditions (Wood & Wollenberg §3.1)', () => {
    const units = [
      quadraticSet('Q', 10, 0.2, 0.0001, 100, 1000),
      quadraticSet('L', 5, 0.3, 0, 50, 800), // incremental fuel 0.3 everywhere
    ];
    // Q reaches incremental 0.3 at 500 kW; loads above 550 kW are taken by L at lambda 0.3 until L is full.
    const result = ok(dispatchLoad(units, 900));
    const [q, l] = loads(result);
    expect(Math.abs(q - 500)).toBeLessThan(1e-5);
    expect(Math.abs(l - 400)).toBeLessThan(1e-5);
    expect(Math.abs(result.lambdaKgPerKwh! - 0.3)).toBeLessThan(1e-8);
    const full = ok(dispatchLoad(units, 1500));
    expect(Math.abs(loads(full)[1] - 800)).toBeLessThan(1e-6);
    expect(Math.abs(loads(full)[0] - 700)).toBeLessThan(1e-6);
    expect(Math.abs(full.lambdaKgPerKwh! - (0.2 + 2 * 0.0001 * 700))).toBeLessThan(1e-8);
  });
});

describe('dispatchLoad: infeasible loads and bad input', () => {
  it('load below the sum of minima is a result with a reason, not an exception', () => {
    const result = dispatchLoad(saadat76Units, 400);
    expect(result.feasible).toBe(false);
    if (result.feasible) return;
    expect(result.rule).toBe('below-minimum');
    expect(result.reason).toBe('load 400 kW is below the 450 kW sum of minimum loads of G1 + G2 + G3');
  });

  it('load above the sum of maxima is a result with a reason', () => {
    const result = dispatchLoad(saadat76Units, 1100);
    expect(result.feasible).toBe(false);
    if (result.feasible) return;
    expect(result.rule).toBe('above-maximum');
    expect(result.reason).toBe('load 1100 kW exceeds the 1025 kW maximum continuous capacity of G1 + G2 + G3');
  });

  it('equal split outside one set’s limits names the set', () => {
    // 1000 kW set with 20 % minimum and 500 kW set with 50 % minimum: 500 kW is 33.3 % of the 1500 kW rating.
    const units = [quadraticSet('A', 10, 0.2, 1e-4, 200, 1000), quadraticSet('B', 5, 0.2, 1e-4, 250, 500)];
    expect(dispatchLoad(units, 500).feasible).toBe(true);
    const result = equalSplit(units, 500);
    expect(result.feasible).toBe(false);
    if (result.feasible) return;
    expect(result.rule).toBe('equal-split-limit');
    expect(result.reason).toBe("equal split at 33.3 % of rating is below B's 50 % minimum load");
  });

  it('throws on bad input', () => {
    expect(() => dispatchLoad(saadat74Units, -1)).toThrow('dispatchLoad requires a finite load ≥ 0 kW');
    expect(() => dispatchLoad([quadraticSet('X', 1, 1, -0.1, 0, 10)], 5)).toThrow('convex');
    const concave: GensetUnit = {
      ...quadraticSet('P', 0, 0, 0, 0, 100),
      curve: { kind: 'piecewise', breakpointsKw: [0, 50, 100], fuelKgPerH: [0, 20, 30] },
    };
    expect(() => dispatchLoad([concave], 60)).toThrow('convex');
    expect(() => dispatchLoad([saadat74Units[0], saadat74Units[0]], 60)).toThrow('unique unit ids');
  });
});
