import { describe, expect, it } from 'vitest';
import { rankCombinations, type RankFeasible, type RankResult } from '../../optimizer/dispatch';
import type { GensetUnit, ReserveRule } from '../../optimizer/plant';
import { quadraticSet, saadat74Units, woodWollenbergUnits } from '../fixtures/dispatch/textbook-units';

/** Fuel rates compared with closed forms, relative. */
const FUEL_REL_TOL = 1e-9;

const baseRule: ReserveRule = { marginKw: 0, marginPct: 0, minSets: 1, nMinus1: false, busTieClosed: true };

function ok(result: RankResult): RankFeasible {
  if (!result.feasible) throw new Error(`expected a feasible ranking, got: ${result.reasons.join('; ')}`);
  return result;
}

function reasonOf(result: RankFeasible, id: string): string {
  return result.unitReasons.find((r) => r.id === id)!.reason;
}

/** Fuel of two quadratic sets a_i + b·P + c_i·P² with the same b sharing loadKw at equal incremental cost. */
function twoSetOptimum(a1: number, a2: number, b: number, c1: number, c2: number, loadKw: number): number {
  const p1 = (loadKw * c2) / (c1 + c2); // equal b: 2·c1·P1 = 2·c2·P2 (Wood & Wollenberg §3.1, equal lambda)
  const p2 = loadKw - p1;
  return a1 + b * p1 + c1 * p1 * p1 + a2 + b * p2 + c2 * p2 * p2;
}

describe('rankCombinations: Wood & Wollenberg, 2nd ed., Example 5A (unit commitment by enumeration)', () => {
  // Units of Example 3A with fuel costs 1.1, 1.0, 1.2 $/MBtu; load 550 MW (book data from memory).
  const units = woodWollenbergUnits([1.1, 1.0, 1.2]);
  const result = ok(rankCombinations(units, 550, baseRule));

  it('the cheapest combination is unit 1 alone (book, from memory), at F1(550) from the book curve', () => {
    expect(result.best.unitIds).toEqual(['U1']);
    const f1 = 1.1 * (510 + 7.2 * 550 + 0.00142 * 550 * 550); // 5389.5 $/h
    expect(Math.abs(result.best.fuelKgPerH - f1) / f1).toBeLessThan(FUEL_REL_TOL);
  });

  it('ranks all five feasible combinations (U2 alone and U3 alone cannot carry 550 MW; none is not allowed)', () => {
    expect(result.combinations.map((c) => c.unitIds.join('+'))).toEqual(['U1', 'U2+U3', 'U1+U2', 'U1+U3', 'U1+U2+U3']);
    // U1+U2 by the closed form of equal incremental cost (no limit binds): lambda = (P + Σ b/2c) / Σ 1/2c.
    const bc = [
      [1.1 * 7.2, 1.1 * 0.00142],
      [7.85, 0.00194],
    ];
    const lambda = (550 + bc.reduce((s, [b, c]) => s + b / (2 * c), 0)) / bc.reduce((s, [, c]) => s + 1 / (2 * c), 0);
    const [p1, p2] = bc.map(([b, c]) => (lambda - b) / (2 * c));
    const f12 = 1.1 * (510 + 7.2 * p1 + 0.00142 * p1 * p1) + 310 + 7.85 * p2 + 0.00194 * p2 * p2;
    const u12 = result.combinations.find((c) => c.unitIds.join('+') === 'U1+U2')!;
    expect(Math.abs(u12.fuelKgPerH - f12) / f12).toBeLessThan(FUEL_REL_TOL);
  });

  it('explains each set and lists the rejected combinations with their first failed rule', () => {
    expect(reasonOf(result, 'U1')).toBe('on: needed to carry the load');
    expect(reasonOf(result, 'U2')).toMatch(/^off: load met without it \(running it too adds [\d.]+ kg\/h\)$/);
    const listed = ok(rankCombinations(units, 550, baseRule, { listRejected: true }));
    expect(listed.rejected!.map((r) => [r.unitIds.join('+'), r.rule])).toEqual([
      ['', 'min-sets'],
      ['U2', 'above-maximum'],
      ['U3', 'above-maximum'],
    ]);
    expect(listed.rejected![1].reason).toBe('load 550 kW exceeds the 400 kW maximum continuous capacity of U2');
  });
});

// A four-set plant (figures are plausible, common practice): two 1200 kW and two 800 kW sets, all with b = 0.19
// or 0.2 kg/kWh so the two-set optimum has a closed form.
function plant(): GensetUnit[] {
  return [
    quadraticSet('DG1', 30, 0.19, 2e-5, 240, 1200),
    quadraticSet('DG2', 32, 0.19, 2.2e-5, 240, 1200),
    quadraticSet('DG3', 40, 0.2, 4e-5, 200, 800),
    quadraticSet('DG4', 42, 0.2, 4e-5, 200, 800),
  ];
}

describe('rankCombinations: reserve rules and reasons', () => {
  it('N-1 (SOLAS II-1/41, from memory: supply kept with any one generating set stopped): 1000 kW needs DG1 + DG2', () => {
    const result = ok(rankCombinations(plant(), 1000, { ...baseRule, nMinus1: true }));
    expect(result.best.unitIds).toEqual(['DG1', 'DG2']);
    const expected = twoSetOptimum(30, 32, 0.19, 2e-5, 2.2e-5, 1000);
    expect(Math.abs(result.best.fuelKgPerH - expected) / expected).toBeLessThan(FUEL_REL_TOL);
    // Losing either 1200 kW set leaves 1200 kW ≥ 1000 kW; DG1 + DG3 would leave 800 kW.
    expect(reasonOf(result, 'DG1')).toBe(
      'on: needed for N-1; without it losing DG2 (1200 kW) leaves 0 kW for the 1000 kW load ' +
        '(SOLAS II-1/41 asks that essential services survive the loss of any one generating set)',
    );
    expect(reasonOf(result, 'DG3')).toMatch(/^off: N-1 met without it \(running it too adds [\d.]+ kg\/h\)$/);
    // Reserve left: 2400 kW online for 1000 kW -> 1400 kW, 140 % of the load.
    expect(result.best.reserveKw).toBeCloseTo(1400, 9);
    expect(result.best.reservePct).toBeCloseTo(140, 9);
    // Every listed combination meets N-1.
    for (const c of result.combinations) {
      const caps = c.units.map((u) => plant().find((p) => p.id === u.id)!.ratedKw);
      expect(caps.reduce((s, x) => s + x, 0) - Math.max(...caps)).toBeGreaterThanOrEqual(1000);
    }
  });

  it('minimum two sets online: 600 kW runs DG1 + DG2 though DG1 alone would be cheaper', () => {
    const one = ok(rankCombinations(plant(), 600, baseRule));
    expect(one.best.unitIds).toEqual(['DG1']);
    const two = ok(rankCombinations(plant(), 600, { ...baseRule, minSets: 2 }));
    expect(two.best.unitIds).toEqual(['DG1', 'DG2']);
    expect(reasonOf(two, 'DG2')).toBe('on: minimum two sets online in this mode');
    const expected = twoSetOptimum(30, 32, 0.19, 2e-5, 2.2e-5, 600);
    expect(Math.abs(two.best.fuelKgPerH - expected) / expected).toBeLessThan(FUEL_REL_TOL);
  });

  it('spinning reserve: 1100 kW with a 200 kW margin cannot run on one 1200 kW set', () => {
    const result = ok(rankCombinations(plant(), 1100, { ...baseRule, marginKw: 200 }));
    expect(result.best.unitIds.length).toBeGreaterThanOrEqual(2);
    expect(result.best.reserveKw).toBeGreaterThanOrEqual(200);
    const without = ok(rankCombinations(plant(), 1100, baseRule));
    expect(without.best.unitIds).toEqual(['DG1']);
  });

  it('unavailable sets never run, must-run sets always do', () => {
    const units = plant();
    units[0] = { ...units[0], available: false };
    units[3] = { ...units[3], mustRun: true };
    const result = ok(rankCombinations(units, 600, baseRule));
    expect(result.best.unitIds).toContain('DG4');
    expect(result.combinations.every((c) => !c.unitIds.includes('DG1') && c.unitIds.includes('DG4'))).toBe(true);
    expect(reasonOf(result, 'DG1')).toBe('off: unavailable (maintenance or defect)');
    expect(reasonOf(result, 'DG4')).toBe('on: must run');
  });

  it('equal split vs optimal with Saadat Example 7.4 costs (all sets must run): saved fuel per day from the book functions', () => {
    const units = saadat74Units.map((u) => ({ ...u, mustRun: true }));
    const result = ok(rankCombinations(units, 800, baseRule));
    const cost = (a: number, b: number, c: number, p: number): number => a + b * p + c * p * p;
    const third = 800 / 3;
    const equal = cost(500, 5.3, 0.004, third) + cost(400, 5.5, 0.006, third) + cost(200, 5.8, 0.009, third);
    expect(Math.abs(result.equalSplitFuelKgPerH! - equal) / equal).toBeLessThan(FUEL_REL_TOL);
    expect(Math.abs(result.savedFuelKgPerDay! - (equal - 6682.5) * 24)).toBeLessThan(1e-6);
  });
});

describe('rankCombinations: bus sections', () => {
  function split(): GensetUnit[] {
    return plant().map((u) => ({ ...u, busSection: u.id === 'DG1' || u.id === 'DG3' ? 'A' : 'B' }));
  }

  it('bus tie open: each section carries its own load with its own sets and its own minimum sets', () => {
    const rule = { ...baseRule, minSets: 2, busTieClosed: false };
    const result = ok(rankCombinations(split(), { A: 700, B: 500 }, rule));
    expect(result.best.unitIds.sort()).toEqual(['DG1', 'DG2', 'DG3', 'DG4']);
    for (const s of result.best.sections) {
      const load = s.dispatch.units.reduce((x, u) => x + u.loadKw, 0);
      expect(Math.abs(load - s.loadKw)).toBeLessThan(1e-9 * s.loadKw);
      expect(s.unitIds.length).toBe(2);
    }
    expect(reasonOf(result, 'DG3')).toBe('on: minimum two sets online on bus section A in this mode');
    // Tie closed, the same 1200 kW: two sets are enough for the whole plant.
    const closed = ok(rankCombinations(split(), { A: 700, B: 500 }, { ...rule, busTieClosed: true }));
    expect(closed.best.unitIds).toEqual(['DG1', 'DG2']);
    expect(closed.best.fuelKgPerH).toBeLessThan(result.best.fuelKgPerH);
  });

  it('bus tie open: a section without sets, and a single load for two sections', () => {
    const units = split().filter((u) => u.busSection === 'A');
    const result = rankCombinations(units, { A: 500, B: 300 }, { ...baseRule, busTieClosed: false });
    expect(result.feasible).toBe(false);
    if (!result.feasible) expect(result.reasons).toEqual(['bus section B: load 300 kW but no available set']);
    expect(() => rankCombinations(split(), 800, { ...baseRule, busTieClosed: false })).toThrow(
      'rankCombinations requires a load per bus section when the bus tie is open',
    );
  });
});

describe('rankCombinations: infeasible inputs give the named reason, never an exception', () => {
  // Four 1200 kW sets at 100 % maximum continuous load and 50 % minimum: 4800 kW capacity.
  const four = (): GensetUnit[] => ['E1', 'E2', 'E3', 'E4'].map((id) => quadraticSet(id, 30, 0.19, 2e-5, 600, 1200));
  const reasons = (result: RankResult): string[] => (result.feasible ? [] : result.reasons);
  const SOLAS = '(SOLAS II-1/41 asks that essential services survive the loss of any one generating set)';

  it('load above the maximum continuous capacity', () => {
    expect(reasons(rankCombinations(four(), 5200, baseRule))).toEqual([
      'load 5200 kW exceeds the 4800 kW maximum continuous capacity of available sets',
    ]);
  });

  it('spinning reserve', () => {
    expect(reasons(rankCombinations(four(), 4500, { ...baseRule, marginPct: 10 }))).toEqual([
      'spinning reserve cannot be met: the 4500 kW load with a 450 kW margin needs 4950 kW online, available sets give 4800 kW',
    ]);
  });

  it('N-1', () => {
    expect(reasons(rankCombinations(four(), 4000, { ...baseRule, nMinus1: true }))).toEqual([
      `N-1 cannot be met: with all four available sets online, losing E1 (1200 kW) leaves 3600 kW for the 4000 kW load ${SOLAS}`,
    ]);
  });

  it('minimum number of sets', () => {
    const units = four();
    units[2] = { ...units[2], available: false };
    units[3] = { ...units[3], available: false };
    expect(reasons(rankCombinations(units, 1000, { ...baseRule, minSets: 3 }))).toEqual([
      'minimum three sets online cannot be met: only two available',
    ]);
  });

  it('must-run sets above the load', () => {
    const units = four().map((u, i) => ({ ...u, mustRun: i < 2 }));
    expect(reasons(rankCombinations(units, 1000, baseRule))).toEqual([
      'load 1000 kW is below the 1200 kW sum of minimum loads of the must-run sets (E1 + E2)',
    ]);
  });

  it('minimum loads conflict with N-1', () => {
    expect(reasons(rankCombinations(four(), 500, { ...baseRule, nMinus1: true }))).toEqual([
      'load 500 kW is below the 1200 kW sum of minimum loads of the smallest combination that meets the minimum ' +
        'number of sets, reserve and N-1 (E1 + E2)',
    ]);
  });

  it('throws on bad input only', () => {
    expect(() => rankCombinations(four(), -5, baseRule)).toThrow('rankCombinations requires a finite load ≥ 0 kW');
    const many = Array.from({ length: 13 }, (_, i) => quadraticSet(`M${i}`, 30, 0.19, 2e-5, 0, 1200));
    expect(() => rankCombinations(many, 1000, baseRule)).toThrow(
      'rankCombinations enumerates at most 12 sets that may start or stop (got 13)',
    );
    expect(() => rankCombinations(four(), 1000, { ...baseRule, minSets: 1.5 })).toThrow('whole minSets');
  });
});
