import { describe, expect, it } from 'vitest';
import { RATE_MARGIN_H_PER_DAY, proposeHourBudgets, type StaggerInput } from '../../optimizer/overhaul';
import { FOUR_SETS, FOUR_SETS_ANSWER } from '../fixtures/overhaul/stagger-four-sets';

/** Rates against the hand-computed ones, h/day (the solver reports to about 1e-8). */
const RATE_TOL = 1e-6;
/** Fuel against the enumeration's optimum, relative. */
const FUEL_REL_TOL = 1e-7;

interface Placement {
  days: number[];
  fuelKg: number;
}

/**
 * Reference written apart from the MILP: try every combination of due days inside the windows, keep those whose
 * days are minGapDays apart and whose rate intervals [H/k, H/(k−1)) can add up to the required set-hours, and
 * price each by filling the cheapest sets first (the exact LP optimum for fixed due days: a continuous knapsack).
 */
function enumeratePlacements(input: StaggerInput, fuelKgPerH: number[]): Placement[] {
  const day0 = Date.parse(`${input.fromDate}T00:00:00Z`) / 86_400_000;
  const dayOf = (d: string): number => Date.parse(`${d}T00:00:00Z`) / 86_400_000 - day0;
  const windowDays: number[] = [];
  for (const w of input.windows) for (let k = dayOf(w.startsOn); k <= dayOf(w.endsOn); k++) windowDays.push(k);
  const n = input.sets.length;
  const D = dayOf(input.untilDate);
  const out: Placement[] = [];
  const days: number[] = [];
  const visit = (i: number): void => {
    if (i === n) {
      for (let a = 0; a < n; a++) for (let b = a + 1; b < n; b++) if (Math.abs(days[a] - days[b]) < input.minGapDays) return;
      const lo = days.map((k, j) => input.sets[j].hoursLeftH / k);
      const hi = days.map((k, j) => Math.min(24, k === 1 ? 24 : input.sets[j].hoursLeftH / (k - 1) - RATE_MARGIN_H_PER_DAY));
      if (lo.some((l, j) => l > hi[j])) return;
      const N = input.requiredSetHoursPerDay;
      let slack = N - lo.reduce((s, x) => s + x, 0);
      if (slack < 0 || N > hi.reduce((s, x) => s + x, 0)) return;
      const rates = [...lo];
      for (const j of [...rates.keys()].sort((a, b) => fuelKgPerH[a] - fuelKgPerH[b])) {
        const add = Math.min(slack, hi[j] - lo[j]);
        rates[j] += add;
        slack -= add;
      }
      out.push({ days: [...days], fuelKg: rates.reduce((s, r, j) => s + fuelKgPerH[j] * r * D, 0) });
      return;
    }
    for (const k of windowDays) {
      days[i] = k;
      visit(i + 1);
    }
  };
  visit(0);
  return out;
}

function windowIndex(input: StaggerInput, day: number): number {
  const day0 = Date.parse(`${input.fromDate}T00:00:00Z`) / 86_400_000;
  return input.windows.findIndex((w) => day >= Date.parse(`${w.startsOn}T00:00:00Z`) / 86_400_000 - day0 && day <= Date.parse(`${w.endsOn}T00:00:00Z`) / 86_400_000 - day0);
}

describe('proposeHourBudgets on the four-set fixture (hand-computed, tests/fixtures/overhaul/stagger-four-sets.ts)', () => {
  const proposal = proposeHourBudgets(FOUR_SETS);
  const fuel = FOUR_SETS.sets.map((s) => FOUR_SETS_ANSWER.fuelKgPerH[s.gensetId]);

  it('the enumeration finds exactly one arrangement of the dues in the windows (the fixture is what it claims)', () => {
    const placements = enumeratePlacements(FOUR_SETS, fuel);
    const arrangements = new Set(placements.map((p) => p.days.map((k) => windowIndex(FOUR_SETS, k)).join(',')));
    expect([...arrangements]).toEqual(['3,0,1,2']);
  });

  it('puts every due in its window on the hand-computed day, at the hand-computed rates', () => {
    expect(proposal.status).toBe('in-windows');
    expect(proposal.proven).toBe(true);
    expect(proposal.reasons).toEqual([]);
    expect(proposal.horizonDays).toBe(FOUR_SETS_ANSWER.horizonDays);
    for (const b of proposal.budgets) {
      expect(b.windowId).toBe(FOUR_SETS_ANSWER.windowOf[b.gensetId]);
      expect(b.dueDate).toBe(FOUR_SETS_ANSWER.dueDate[b.gensetId]);
      expect(Math.abs(b.hPerDay - FOUR_SETS_ANSWER.rate[b.gensetId])).toBeLessThan(RATE_TOL);
      expect(Math.abs(b.budgetH - FOUR_SETS_ANSWER.rate[b.gensetId] * 181)).toBeLessThan(RATE_TOL * 181);
      expect(proposal.hourBudgets[b.gensetId]).toBe(b.budgetH);
    }
    const total = proposal.budgets.reduce((s, b) => s + b.hPerDay, 0);
    expect(Math.abs(total - 36)).toBeLessThan(RATE_TOL);
  });

  it('the fuel equals the enumeration optimum, and the delta is Σ f·181·(r − 9) (hand formula)', () => {
    const best = Math.min(...enumeratePlacements(FOUR_SETS, fuel).map((p) => p.fuelKg));
    expect(Math.abs(proposal.fuelKg - best) / best).toBeLessThan(FUEL_REL_TOL);
    const delta = proposal.budgets.reduce((s, b) => s + FOUR_SETS_ANSWER.fuelKgPerH[b.gensetId] * 181 * (FOUR_SETS_ANSWER.rate[b.gensetId] - 9), 0);
    expect(Math.abs(proposal.fuelDeltaKg - delta)).toBeLessThan(FUEL_REL_TOL * proposal.fuelKg);
    expect(proposal.baselineFuelKg).toBeCloseTo((220 + 235 + 228 + 241) * 9 * 181, 6);
  });

});

describe('proposeHourBudgets: infeasible windows and problems answer with reasons', () => {
  const base = { fromDate: '2027-01-01', untilDate: '2027-07-01', minGapDays: 14 };
  const W1 = { id: 'W1', startsOn: '2027-01-21', endsOn: '2027-01-23', label: 'port call A' };

  it('names the set that cannot make a window (1100 h by day 22 needs 50 h/day, hand) and places it nearest', () => {
    const p = proposeHourBudgets({
      ...base,
      requiredSetHoursPerDay: 33.5,
      windows: [W1],
      sets: [
        { gensetId: 'DG1', hoursLeftH: 200, usageHPerDay: 12, fuelKgPerH: 200 },
        { gensetId: 'DG2', hoursLeftH: 1100, usageHPerDay: 12, fuelKgPerH: 210 },
      ],
    });
    expect(p.status).toBe('nearest');
    expect(p.reasons).toEqual([
      'DG2 cannot make port call A (2027-01-21 to 2027-01-23): it would need at least 50 h/day, above its 24 h/day',
      'DG2 can make no window before 2027-07-01',
    ]);
    const [dg1, dg2] = p.budgets;
    expect(dg1.windowId).toBe('W1');
    expect(dg2.windowId).toBeNull();
    // DG2 at most 24 h/day falls due on day ⌈1100/24⌉ = 46 at the earliest: at least 24 days after the window (hand).
    expect(dg2.daysFromWindow).toBeGreaterThanOrEqual(24);
    expect(dg2.nearestWindowId).toBe('W1');
    expect(Math.abs(dg1.hPerDay + dg2.hPerDay - 33.5)).toBeLessThan(RATE_TOL);
  });

  it('windows 10 days apart cannot hold dues 14 days apart: nearest, with the gap as the reason', () => {
    const input = {
      ...base,
      requiredSetHoursPerDay: 20,
      windows: [W1, { id: 'W2', startsOn: '2027-01-31', endsOn: '2027-02-02', label: 'port call B' }],
      sets: [
        { gensetId: 'DG1', hoursLeftH: 200, usageHPerDay: 10, fuelKgPerH: 200 },
        { gensetId: 'DG2', hoursLeftH: 300, usageHPerDay: 10, fuelKgPerH: 210 },
      ],
    };
    expect(enumeratePlacements(input, [200, 210])).toEqual([]);
    const p = proposeHourBudgets(input);
    expect(p.status).toBe('nearest');
    expect(p.reasons).toContain('the windows cannot hold the due dates 14 days apart');
    const [a, b] = p.budgets.map((x) => Date.parse(`${x.dueDate}T00:00:00Z`) / 86_400_000);
    expect(Math.abs(a - b)).toBeGreaterThanOrEqual(14);
    expect(p.totalDaysFromWindows).toBeGreaterThan(0);
    expect(Math.abs(p.budgets[0].hPerDay + p.budgets[1].hPerDay - 20)).toBeLessThan(RATE_TOL);
  });

  it('too few set-hours, an overdue set and a set that cannot reach its due are infeasible with reasons', () => {
    const sets = [
      { gensetId: 'DG1', hoursLeftH: 200, usageHPerDay: 12, fuelKgPerH: 200 },
      { gensetId: 'DG2', hoursLeftH: -12, usageHPerDay: 12, fuelKgPerH: 210 },
      { gensetId: 'DG3', hoursLeftH: 9000, usageHPerDay: 12, fuelKgPerH: 210 },
    ];
    const p = proposeHourBudgets({ ...base, requiredSetHoursPerDay: 80, windows: [W1], sets });
    expect(p.status).toBe('infeasible');
    expect(p.budgets).toEqual([]);
    expect(p.reasons).toEqual([
      'DG2 is already due (-12 h left): record the work or leave it out',
      'DG3 cannot fall due by 2027-07-01: 9000 h left need 49.72 h/day, above its 24 h/day',
      'the sets give at most 72 set-hours per day; the plant needs 80',
    ]);
  });

  it('a gap the horizon cannot hold is infeasible with that reason', () => {
    const p = proposeHourBudgets({
      fromDate: '2027-01-01',
      untilDate: '2027-01-31',
      minGapDays: 40,
      requiredSetHoursPerDay: 30,
      windows: [],
      sets: [
        { gensetId: 'DG1', hoursLeftH: 300, usageHPerDay: 15, fuelKgPerH: 200 },
        { gensetId: 'DG2', hoursLeftH: 300, usageHPerDay: 15, fuelKgPerH: 200 },
      ],
    });
    expect(p).toMatchObject({ status: 'infeasible', reasons: ['no budgets keep the due dates 40 days apart while the sets share 30 set-hours per day'] });
  });

  it('a set allowed to stay short of its due runs without a due date or window', () => {
    const p = proposeHourBudgets({
      ...base,
      requiredSetHoursPerDay: 20,
      windows: [W1],
      sets: [
        { gensetId: 'DG1', hoursLeftH: 200, usageHPerDay: 10, fuelKgPerH: 200 },
        { gensetId: 'DG2', hoursLeftH: 8000, usageHPerDay: 10, fuelKgPerH: 190, mayFallDueAfterDate: true },
      ],
    });
    expect(p.status).toBe('in-windows');
    expect(p.budgets[1]).toMatchObject({ dueDate: null, windowId: null, daysFromWindow: null });
    // DG1 must make W1: rate in [200/22, 200/19); DG2 is cheaper, so DG1 takes the least, 200/22 h/day (hand).
    expect(Math.abs(p.budgets[0].hPerDay - 200 / 22)).toBeLessThan(RATE_TOL);
  });

  it('refuses bad input with messages naming the field', () => {
    expect(() => proposeHourBudgets({ ...FOUR_SETS, untilDate: FOUR_SETS.fromDate })).toThrow('proposeHourBudgets requires untilDate after fromDate');
    expect(() => proposeHourBudgets({ ...FOUR_SETS, minGapDays: 1.5 })).toThrow(/minGapDays/);
    expect(() => proposeHourBudgets({ ...FOUR_SETS, sets: [{ gensetId: 'X', hoursLeftH: 1, usageHPerDay: 1 }] })).toThrow(
      'proposeHourBudgets requires fuelKgPerH, or sfocGPerKwh and usualLoadKw, for X',
    );
  });
});
