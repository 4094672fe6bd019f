import { beforeAll, describe, expect, it } from 'vitest';
import highsLoader from 'highs';
import { operatingGuideline } from '../../optimizer/dispatch';
import { solveSinglePointMilp, type LpSolver } from '../../optimizer/dispatch/milp';
import type { ReserveRule } from '../../optimizer/plant';
import { createRng } from '../../optimizer/random';
import { randomInstance } from '../fixtures/dispatch/random-plants';
import { quadraticSet } from '../fixtures/dispatch/textbook-units';

/** Fuel figures vs closed forms or HiGHS, relative. */
const FUEL_REL_TOL = 1e-6;

const rule: ReserveRule = { marginKw: 0, marginPct: 0, minSets: 1, nMinus1: false, busTieClosed: true };

// Two 2000 kW sets with the same incremental curve, S2 with 2 kg/h more no-load fuel (figures plausible,
// common practice). One set burns a1 + bL + cL²; two share equally and burn a1 + a2 + bL + cL²/2, so two sets
// pay off above L* = sqrt(2·a2/c) (closed form, by hand).
const a1 = 40;
const a2 = 42;
const b = 0.19;
const c = 4e-5;
const pair = () => [quadraticSet('S1', a1, b, c, 0, 2000), quadraticSet('S2', a2, b, c, 0, 2000)];
const switchKw = Math.sqrt((2 * a2) / c); // 1449.1 kW

describe('operatingGuideline', () => {
  it('band edge at the closed-form crossover sqrt(2·a2/c), to one step', () => {
    const g = operatingGuideline(pair(), rule, { stepPct: 1 });
    expect(g.stepKw).toBe(40);
    expect(g.bands.map((x) => x.unitIds.join('+'))).toEqual(['S1', 'S1+S2']);
    const [one, two] = g.bands;
    expect(one.fromKw).toBe(40);
    expect(one.toKw).toBeCloseTo(Math.floor(switchKw / 40) * 40, 9); // 1440
    expect(two.fromKw).toBeCloseTo(one.toKw + 40, 9);
    expect(two.toKw).toBe(4000);
    expect(g.gaps).toEqual([]);
    // Fuel per day at the band's middle against the next best there, from the closed forms.
    const mid = one.midKw; // 740 kW
    const single = (a: number, load: number): number => a + b * load + c * load * load;
    expect(Math.abs(one.fuelKgPerDay - 24 * single(a1, mid)) / one.fuelKgPerDay).toBeLessThan(FUEL_REL_TOL);
    expect(one.nextBest!.unitIds).toEqual(['S2']);
    expect(Math.abs(one.extraFuelNextBestKgPerDay! - 24 * (a2 - a1))).toBeLessThan(1e-6);
    const both = a1 + a2 + b * two.midKw + (c * two.midKw * two.midKw) / 2;
    expect(Math.abs(two.fuelKgPerDay - 24 * both) / two.fuelKgPerDay).toBeLessThan(FUEL_REL_TOL);
  });

  it('N-1 leaves a gap above the load the remaining set can carry, with the reason', () => {
    const g = operatingGuideline(pair(), { ...rule, nMinus1: true }, { stepKw: 100 });
    expect(g.bands.map((x) => x.unitIds.join('+'))).toEqual(['S1+S2']);
    expect([g.minFeasibleKw, g.maxFeasibleKw]).toEqual([100, 2000]);
    expect(g.gaps.map((x) => [x.fromKw, x.toKw])).toEqual([[2100, 4000]]);
    expect(g.gaps[0].reasons[0]).toMatch(/^N-1 cannot be met/);
  });

  it('bus tie open: needs the section shares; bad steps throw', () => {
    const split = pair().map((u, i) => ({ ...u, busSection: i === 0 ? 'A' : 'B' }));
    const open = { ...rule, busTieClosed: false };
    expect(() => operatingGuideline(split, open)).toThrow('requires sectionSharePct');
    const g = operatingGuideline(split, open, { sectionSharePct: { A: 50, B: 50 }, stepKw: 500 });
    expect(g.bands.map((x) => x.unitIds.join('+'))).toEqual(['S1+S2']);
    expect(() => operatingGuideline(pair(), rule, { stepKw: 0 })).toThrow('requires a step > 0 kW');
  });

  let highs: LpSolver;
  beforeAll(async () => {
    highs = (await highsLoader()) as unknown as LpSolver;
  });

  it('fuel at every band middle equals the HiGHS MILP optimum (seeded piecewise plants)', () => {
    // Reference: HiGHS (npm `highs`), general-purpose MILP solver.
    const rng = createRng(77);
    let checked = 0;
    for (let k = 0; k < 5; k++) {
      const { units } = randomInstance(rng, { minSets: 3, maxSets: 6, openTieProbability: 0 });
      const r: ReserveRule = { marginKw: 100, marginPct: 10, minSets: 1, nMinus1: k % 2 === 0, busTieClosed: true };
      const g = operatingGuideline(units, r, { stepPct: 2 });
      for (const band of g.bands) {
        const reference = solveSinglePointMilp(highs, units, band.midKw, r);
        expect(reference.feasible).toBe(true);
        if (!reference.feasible) continue;
        const best = Math.min(band.fuelKgPerDay, band.nextBest ? band.nextBest.fuelKgPerDay : Infinity);
        expect(Math.abs(best - 24 * reference.fuelKgPerH) / best).toBeLessThan(FUEL_REL_TOL);
        checked++;
      }
    }
    expect(checked).toBeGreaterThanOrEqual(10);
  });
});
