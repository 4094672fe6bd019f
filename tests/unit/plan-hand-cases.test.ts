/**
 * Hand-checked voyage plans: each expected schedule and fuel is worked out from the curve formulas by hand
 * (arithmetic in the comments), plus the textbook three-unit commitment.
 */
import { describe, expect, it } from 'vitest';
import type { GensetUnit, QuadraticFuelCurve, ReserveRule } from '../../optimizer/plant';
import { baselinePlan } from '../../optimizer/plan/baseline-plan';
import { checkPlan } from '../../optimizer/plan/check-plan';
import { planVoyage } from '../../optimizer/plan/plan-voyage';
import type { PlanProblem } from '../../optimizer/plan/types';

/** Absolute tolerance on fuel totals, kg. */
const FUEL_TOL_KG = 1e-6;
/** Absolute tolerance on loads, kW (textbook figures are printed to 0.1 MW). */
const TEXTBOOK_LOAD_TOL = 0.1;

const closed: ReserveRule = { marginKw: 0, marginPct: 0, minSets: 1, nMinus1: false, busTieClosed: true };

function unit(id: string, a: number, extra: Partial<GensetUnit> = {}): GensetUnit {
  return {
    id,
    name: id.toUpperCase(),
    ratedKw: 1000,
    minLoadPct: 20,
    maxLoadPct: 100,
    curve: { kind: 'quadratic', a, b: 0.2, c: 2e-5 },
    busSection: 'A',
    available: true,
    mustRun: false,
    startCostKg: 0,
    minUpH: 0,
    minDownH: 0,
    ...extra,
  };
}

const F = (c: QuadraticFuelCurve, p: number) => c.a + c.b * p + c.c * p * p;

function problemOf(units: GensetUnit[], loadsKw: number[], extra: Partial<PlanProblem> = {}): PlanProblem {
  return { units, periods: loadsKw.map((loadKw) => ({ durationH: 1, rule: closed, loadKw })), ...extra };
}

const running = (plan: ReturnType<typeof planVoyage>) => plan.periods.map((p) => p.runningIds.join('+'));

describe('planVoyage hand-checked cases', () => {
  it('minimum up time keeps a started set on (hand check)', () => {
    // A (a = 20) has run for long; B (a = 30) starts for the 1500 kW peak and, with a minimum up time of
    // 3 h, must stay on in periods 1 to 3. With B held on, B alone is the cheapest way to carry 500 kW
    // (F_B(500) = 30 + 100 + 5 = 135 kg/h against F_A(250) + F_B(250) = 71.25 + 81.25 = 152.5 kg/h); A,
    // free to stop and start, comes back when B may stop (F_A(500) = 125 kg/h).
    const a = unit('a', 20);
    const b = unit('b', 30, { minUpH: 3 });
    const initialState = { a: { on: true, hoursInState: 100 }, b: { on: false, hoursInState: 100 } };
    const problem = problemOf([a, b], [1500, 500, 500, 500, 500], { initialState });
    const held = planVoyage(problem);
    expect(running(held)).toEqual(['a+b', 'b', 'b', 'a', 'a']);
    // Identical b and c: equal incremental cost means equal loads at the peak.
    const ca = a.curve as QuadraticFuelCurve;
    const cb = b.curve as QuadraticFuelCurve;
    const expected = F(ca, 750) + F(cb, 750) + 2 * F(cb, 500) + 2 * F(ca, 500);
    expect(Math.abs(held.totalFuelKg - expected)).toBeLessThan(FUEL_TOL_KG);
    expect(held.status).toBe('optimal');
    expect(checkPlan(problem, held).violations).toEqual([]);
    // Without the minimum up time B stops at once.
    const free = planVoyage(problemOf([a, { ...b, minUpH: 0 }], [1500, 500, 500, 500, 500], { initialState }));
    expect(running(free)).toEqual(['a+b', 'a', 'a', 'a', 'a']);
  });

  it('start fuel makes it cheaper to run through a short dip (hand check)', () => {
    // Stopping one of two equal sets (a = 30) for the 500 kW hour saves 2·F(250) − F(500)
    // = 2·(30 + 50 + 1.25) − (30 + 100 + 5) = 162.5 − 135 = 27.5 kg; the restart costs startCostKg.
    const loads = [1500, 500, 1500];
    const init = { a: { on: true, hoursInState: 100 }, b: { on: true, hoursInState: 100 } };
    const pair = (startCostKg: number) => [unit('a', 30, { startCostKg }), unit('b', 30, { startCostKg })];
    const dear = planVoyage(problemOf(pair(40), loads, { initialState: init }));
    expect(dear.periods.map((p) => p.runningIds.length)).toEqual([2, 2, 2]);
    const cheap = planVoyage(problemOf(pair(10), loads, { initialState: init }));
    expect(cheap.periods.map((p) => p.runningIds.length)).toEqual([2, 1, 2]);
    expect(Math.abs(cheap.startFuelKg - 10)).toBeLessThan(FUEL_TOL_KG);
    // The two plans differ by the 27.5 kg saved minus the 10 kg start.
    expect(Math.abs(dear.totalFuelKg - cheap.totalFuelKg - (27.5 - 10))).toBeLessThan(FUEL_TOL_KG);
  });

  it('a running-hour budget moves hours to the sister set (hand check)', () => {
    // One set carries 500 kW for 4 h; A (a = 20) is cheaper than B (a = 25) by 5 kg/h. A budget of 2 h on A
    // gives B the other 2 h: total 2·F_A(500) + 2·F_B(500) = 2·125 + 2·130 = 510 kg.
    const a = unit('a', 20);
    const b = unit('b', 25);
    const unlimited = planVoyage(problemOf([a, b], [500, 500, 500, 500]));
    expect(unlimited.units.map((u) => u.runningHours)).toEqual([4, 0]);
    const problem = problemOf([a, b], [500, 500, 500, 500], { maxRunningHours: { a: 2 } });
    const budgeted = planVoyage(problem);
    expect(budgeted.units.map((u) => u.runningHours)).toEqual([2, 2]);
    expect(budgeted.units[0].budgetH).toBe(2);
    expect(budgeted.totalFuelKg).toBeCloseTo(510, 9);
    expect(budgeted.status).toBe('optimal');
    expect(budgeted.lowerBoundKg! - 510).toBeLessThanOrEqual(FUEL_TOL_KG);
    expect(checkPlan(problem, budgeted).violations).toEqual([]);
  });

  it('infeasible periods and plans come back with reasons, not exceptions (hand check)', () => {
    const units = [unit('a', 20), unit('b', 20)];
    // Period 2 asks for 2500 kW of two 1000 kW sets.
    const over = planVoyage(problemOf(units, [800, 2500, 800]));
    expect(over.status).toBe('infeasible');
    expect(over.infeasiblePeriods).toHaveLength(1);
    expect(over.infeasiblePeriods[0].index).toBe(1);
    expect(over.infeasiblePeriods[0].reason).toContain('exceeds the maximum continuous capacity 2000 kW');
    // N-1 at 1200 kW: losing one 1000 kW set leaves 1000 kW.
    const n1 = planVoyage({ units, periods: [{ durationH: 1, rule: { ...closed, nMinus1: true }, loadKw: 1200 }] });
    expect(n1.infeasiblePeriods[0].reason).toContain('N-1');
    // Budgets: 3 h of load, 1 h budget on each set.
    const budgets = planVoyage(problemOf(units, [500, 500, 500], { maxRunningHours: { a: 1, b: 1 } }));
    expect(budgets.status).toBe('infeasible');
    expect(budgets.reasons.join(' ')).toContain('running-hour budgets');
    // The only set was stopped 1 h ago and has a 3 h minimum down time.
    const held = planVoyage(problemOf([unit('a', 20, { minDownH: 3 })], [500], { initialState: { a: { on: false, hoursInState: 1 } } }));
    expect(held.status).toBe('infeasible');
    expect(held.reasons.join(' ')).toContain('minimum up/down');
    // Malformed input is an exception.
    expect(() => planVoyage({ units, periods: [] })).toThrow('planVoyage requires at least one period');
  });

  it('open bus tie: each section carries its own load (hand check)', () => {
    // Sections A and B, one set each must run; the tie closed lets A alone carry both loads.
    const units = [unit('a', 20), unit('b', 20, { busSection: 'B' })];
    const open = planVoyage({ units, periods: [{ durationH: 1, rule: { ...closed, busTieClosed: false }, loadKw: 600, sectionLoadsKw: { A: 300, B: 300 } }] });
    expect(open.periods[0].runningIds).toEqual(['a', 'b']);
    open.periods[0].loadsKw.forEach((p) => expect(Math.abs(p - 300)).toBeLessThan(1e-6));
    const tie = planVoyage({ units, periods: [{ durationH: 1, rule: closed, loadKw: 600 }] });
    expect(tie.periods[0].runningIds).toHaveLength(1);
  });

  it('reports progress as non-decreasing fractions ending at 1', () => {
    const seen: number[] = [];
    planVoyage(problemOf([unit('a', 20), unit('b', 25)], [500, 900, 1500, 500], { maxRunningHours: { a: 2 } }), { onProgress: (f) => seen.push(f) });
    expect(seen.length).toBeGreaterThan(2);
    expect(seen.every((f, i) => i === 0 || f >= seen[i - 1])).toBe(true);
    expect(seen[seen.length - 1]).toBe(1);
  });
});

describe('Wood & Wollenberg, Power Generation, Operation and Control (2nd ed.), Examples 3A and 5A (from memory)', () => {
  // Three units (MW and $/h read as kW and kg/h), heat rates H1 = 510 + 7.2P + 0.00142P² on 150–600,
  // H2 = 310 + 7.85P + 0.00194P² on 100–400, H3 = 78 + 7.97P + 0.00482P² on 50–200 (MBtu/h); fuel costs
  // 1.1, 1.0, 1.0 $/MBtu in Example 3A and 1.1, 1.0, 1.2 in Example 5A (from memory).
  const mk = (id: string, minKw: number, maxKw: number, a: number, b: number, c: number): GensetUnit => ({
    ...unit(id, 0),
    ratedKw: 600,
    minLoadPct: (100 * minKw) / 600,
    maxLoadPct: (100 * maxKw) / 600,
    curve: { kind: 'quadratic', a, b, c },
  });
  const u1 = mk('u1', 150, 600, 1.1 * 510, 1.1 * 7.2, 1.1 * 0.00142);
  const u2 = mk('u2', 100, 400, 310, 7.85, 0.00194);
  const u3at1 = mk('u3', 50, 200, 78, 7.97, 0.00482);
  const u3at12 = mk('u3', 50, 200, 1.2 * 78, 1.2 * 7.97, 1.2 * 0.00482);
  const onePeriod = (units: GensetUnit[], loadKw: number, minSets = 1): PlanProblem => ({ units, periods: [{ durationH: 1, rule: { ...closed, minSets }, loadKw }] });

  it('Example 5A: for 550 MW the optimum commitment is unit 1 alone (textbook), 5389.5 $/h', () => {
    const plan = planVoyage(onePeriod([u1, u2, u3at12], 550));
    expect(plan.periods[0].runningIds).toEqual(['u1']);
    // F1(550) = 561 + 4356 + 472.505 = 5389.505.
    expect(Math.abs(plan.totalFuelKg - 5389.505)).toBeLessThan(1e-6);
    expect(plan.status).toBe('optimal');
    // The runner-up without unit 1: units 2 + 3 at 400 / 150, 3760.4 + 1658.34 = 5418.74.
    const without1 = planVoyage(onePeriod([{ ...u1, available: false }, u2, u3at12], 550));
    expect(without1.periods[0].loadsKw.slice(1).map((p) => Math.round(p * 1e6) / 1e6)).toEqual([400, 150]);
    expect(Math.abs(without1.totalFuelKg - 5418.74)).toBeLessThan(1e-6);
  });

  it('Example 3A: economic dispatch of all three at 850 MW is 393.2 / 334.6 / 122.2 MW at λ = 9.148 (textbook)', () => {
    const plan = planVoyage(onePeriod([u1, u2, u3at1], 850, 3));
    const [p1, p2, p3] = plan.periods[0].loadsKw;
    expect(Math.abs(p1 - 393.2)).toBeLessThan(TEXTBOOK_LOAD_TOL);
    expect(Math.abs(p2 - 334.6)).toBeLessThan(TEXTBOOK_LOAD_TOL);
    expect(Math.abs(p3 - 122.2)).toBeLessThan(TEXTBOOK_LOAD_TOL);
  });
});

describe('baselinePlan: load-dependent start/stop (hand check)', () => {
  it('starts above 85 %, stops below 50 % of online capacity, equal split; no better than the plan', () => {
    // Priority a, b, c (1000 kW each). 700 kW: a alone (70 %). 900 kW: 90 % > 85 % → b starts, 45 % each.
    // 1800 kW: 90 % of 2000 → c starts. 600 kW: 20 % of 3000 < 50 % → c stops (600 ≤ 85 % of 2000);
    // one stop per period, so b stops in the next 600 kW period (30 % of 2000 < 50 %, 600 ≤ 850).
    const units = [unit('a', 20), unit('b', 20), unit('c', 20)];
    const problem = problemOf(units, [700, 900, 1800, 600, 600]);
    const base = baselinePlan(problem, { startAbovePct: 85, stopBelowPct: 50 });
    expect(base.periods.map((p) => p.runningIds.join('+'))).toEqual(['a', 'a+b', 'a+b+c', 'a+b', 'a']);
    expect(base.periods[2].loadsKw).toEqual([600, 600, 600]);
    expect(checkPlan(problem, base).violations).toEqual([]);
    expect(planVoyage(problem).totalFuelKg).toBeLessThanOrEqual(base.totalFuelKg + FUEL_TOL_KG);
  });
});
